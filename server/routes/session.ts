import { Router } from 'express';
import { sessionSchema, signInSchema } from '@shared/schemas/session';
import { apiErrorSchema } from '@shared/schemas/errors';
import { authenticatePassword, logIn, logOut } from '../auth/passport';
import type { AppConfig } from '../config';
import { AppError } from '../errors';
import type { Security } from '../http/security';
import { defineRoute } from '../http/route';
import { newCsrfToken } from '../middleware/csrf';
import { limitRequests } from '../middleware/rate-limit';
import { presentSession } from '../presenters';
import { loadActor } from '../services/actors';
import { recordSignOut } from '../services/sign-in';

export function sessionRouter(config: AppConfig, security: Security): Router {
  const router = Router();
  const signInLimiter = limitRequests({
    pool: security.pool,
    name: 'sign-in',
    windowMinutes: config.rateLimits.windowMinutes,
    limit: config.rateLimits.signInPerWindow,
  });

  defineRoute(router, {
    method: 'post',
    path: '/session',
    summary: 'Sign in with e-mail and password; sets the session cookie and returns a CSRF token.',
    tags: ['session'],
    auth: false,
    body: signInSchema,
    before: [signInLimiter],
    // Failed attempts must be counted even though the request fails.
    transaction: false,
    responses: {
      200: { description: 'Signed in.', schema: sessionSchema },
      401: { description: 'E-mail or password is incorrect.', schema: apiErrorSchema },
      429: {
        description:
          'rate_limited: too many attempts from this address; sign_in_throttled: repeated failures for this e-mail or from this address, wait Retry-After seconds (the same for known and unknown e-mails).',
        schema: apiErrorSchema,
      },
    },
    handle: async ({ req, res, body }) => {
      req.body = body; // the strategy reads the normalised e-mail
      const address = req.ip ?? 'unknown';
      await security.throttle.assertAllowed(body.email, address);
      const user = await authenticatePassword(req, res).catch(async (error: unknown) => {
        if (error instanceof AppError && error.code === 'invalid_credentials')
          await security.throttle.recordFailure(body.email, address);
        throw error;
      });
      await security.throttle.recordSuccess(body.email, address);
      await logIn(req, user);
      req.session.csrfToken = newCsrfToken();
      req.session.signedInAt = Date.now();
      return {
        status: 200,
        body: await presentSession(user, await loadActor(user.id), req.session.csrfToken),
      };
    },
  });

  defineRoute(router, {
    method: 'get',
    path: '/session',
    summary: 'The signed-in user, their workspaces and roles, abilities and CSRF token.',
    tags: ['session'],
    auth: true,
    responses: { 200: { description: 'Signed in.', schema: sessionSchema } },
    handle: async ({ req, actor }) => {
      // Token-authenticated calls have no session and need no CSRF token.
      let csrfToken = '';
      if (req.authMethod === 'session') csrfToken = req.session.csrfToken ??= newCsrfToken();
      return { status: 200, body: await presentSession(req.user!, actor, csrfToken) };
    },
  });

  defineRoute(router, {
    method: 'delete',
    path: '/session',
    summary: 'Sign out.',
    tags: ['session'],
    auth: true,
    transaction: false,
    responses: { 204: { description: 'Signed out.' } },
    handle: async ({ req, res, actor }) => {
      if (req.authMethod === 'session') {
        await logOut(req);
        res.clearCookie(SESSION_COOKIE);
        await recordSignOut(actor.userId);
      }
      return { status: 204 };
    },
  });
  return router;
}

export const SESSION_COOKIE = 'phasewright.sid';
