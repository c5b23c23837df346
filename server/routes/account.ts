import { Router } from 'express';
import { changePasswordSchema } from '@shared/schemas/session';
import { apiErrorSchema } from '@shared/schemas/errors';
import { AppError } from '../errors';
import { defineRoute } from '../http/route';
import type { Security } from '../http/security';
import { authorize } from '../policies';
import { changePassword } from '../services/credentials';

export function accountRouter(security: Security): Router {
  const router = Router();
  defineRoute(router, {
    method: 'post',
    path: '/account/password',
    summary: 'Change your password (needs the current one).',
    tags: ['account'],
    auth: true,
    body: changePasswordSchema,
    responses: {
      204: {
        description:
          'Changed. Every other session, every API token and every reset link of the account end.',
      },
      429: {
        description: 'Repeated wrong current passwords, counted like sign-in failures.',
        schema: apiErrorSchema,
      },
    },
    handle: async ({ req, actor, body, transaction }) => {
      authorize(actor, 'account.changePassword', null);
      const email = req.user!.email;
      const address = req.ip ?? 'unknown';
      await security.throttle.assertAllowed(email, address);
      const keep = req.authMethod === 'session' ? req.sessionID : null;
      await changePassword(
        req.user!,
        body.currentPassword,
        body.newPassword,
        keep,
        transaction,
      ).catch(async (error: unknown) => {
        if (error instanceof AppError && error.code === 'validation_failed')
          await security.throttle.recordFailure(email, address);
        throw error;
      });
      return { status: 204 };
    },
  });
  return router;
}
