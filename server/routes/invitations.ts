import { Router } from 'express';
import { z } from 'zod';
import { text } from '@shared/schemas/text';
import { apiErrorSchema } from '@shared/schemas/errors';
import { acceptInvitationSchema, invitationInfoSchema } from '@shared/schemas/members';
import { sessionSchema } from '@shared/schemas/session';
import { logIn } from '../auth/passport';
import type { AppConfig } from '../config';
import { AppError } from '../errors';
import type { Security } from '../http/security';
import { defineRoute } from '../http/route';
import { newCsrfToken } from '../middleware/csrf';
import { limitRequests } from '../middleware/rate-limit';
import { presentInvitationInfo, presentSession } from '../presenters';
import { loadActor } from '../services/actors';
import { acceptInvitation, loadOpenInvitation, userExists } from '../services/invitations';

const tokenParams = z.object({ token: text().min(20).max(200) });
const unusable = {
  404: { description: 'Unknown invitation.', schema: apiErrorSchema },
  410: { description: 'Already used or expired.', schema: apiErrorSchema },
};

export function invitationsRouter(config: AppConfig, security: Security): Router {
  const router = Router();
  // Accepting checks a password for existing accounts, so it is limited like sign-in.
  const acceptLimiter = limitRequests({
    pool: security.pool,
    name: 'sign-in',
    windowMinutes: config.rateLimits.windowMinutes,
    limit: config.rateLimits.signInPerWindow,
  });

  defineRoute(router, {
    method: 'get',
    path: '/invitations/{token}',
    summary: 'What an invitation link offers (public).',
    tags: ['invitations'],
    auth: false,
    params: tokenParams,
    responses: {
      200: { description: 'The invitation.', schema: invitationInfoSchema },
      ...unusable,
    },
    handle: async ({ params, transaction }) => {
      const invitation = await loadOpenInvitation(params.token, transaction);
      return {
        status: 200,
        body: presentInvitationInfo(invitation, await userExists(invitation.email, transaction)),
      };
    },
  });

  defineRoute(router, {
    method: 'post',
    path: '/invitations/{token}/accept',
    summary:
      'Accept an invitation: creates the account if new (name + password) or checks the existing password; signs in.',
    tags: ['invitations'],
    auth: false,
    params: tokenParams,
    body: acceptInvitationSchema,
    before: [acceptLimiter],
    responses: {
      200: { description: 'Joined and signed in.', schema: sessionSchema },
      401: { description: 'Wrong password for the existing account.', schema: apiErrorSchema },
      429: {
        description: 'Repeated wrong passwords: counted with sign-in failures (sign_in_throttled).',
        schema: apiErrorSchema,
      },
      ...unusable,
    },
    handle: async ({ req, params, body, transaction }) => {
      const invitation = await loadOpenInvitation(params.token, transaction);
      // The password of an existing account is checked here: counted exactly like a sign-in.
      const address = req.ip ?? 'unknown';
      await security.throttle.assertAllowed(invitation.email, address);
      const user = await acceptInvitation({
        invitation,
        name: body.name,
        password: body.password,
        transaction,
      }).catch(async (error: unknown) => {
        if (error instanceof AppError && error.code === 'invalid_credentials')
          await security.throttle.recordFailure(invitation.email, address);
        throw error;
      });
      await security.throttle.recordSuccess(invitation.email, address);
      await logIn(req, user);
      req.session.csrfToken = newCsrfToken();
      req.session.signedInAt = Date.now();
      const actor = await loadActor(user.id, transaction);
      return { status: 200, body: await presentSession(user, actor, req.session.csrfToken) };
    },
  });
  return router;
}
