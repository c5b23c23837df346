import { Router } from 'express';
import { z } from 'zod';
import { text } from '@shared/schemas/text';
import { apiErrorSchema } from '@shared/schemas/errors';
import { completeResetSchema, requestResetSchema } from '@shared/schemas/password-reset';
import type { AppConfig } from '../config';
import type { Security } from '../http/security';
import { defineRoute } from '../http/route';
import { limitRequests } from '../middleware/rate-limit';
import { completePasswordReset, requestPasswordReset } from '../services/credentials';

export function passwordResetsRouter(config: AppConfig, security: Security): Router {
  const router = Router();
  const resetLimiter = limitRequests({
    pool: security.pool,
    name: 'password-reset',
    windowMinutes: config.rateLimits.windowMinutes,
    limit: config.rateLimits.resetPerWindow,
  });

  defineRoute(router, {
    method: 'post',
    path: '/password-resets',
    summary:
      'Ask for a reset link by e-mail. Always 202, whether or not the address has an account.',
    tags: ['password resets'],
    auth: false,
    body: requestResetSchema,
    before: [resetLimiter],
    responses: { 202: { description: 'If the address has an account, a link is on its way.' } },
    handle: async ({ body, transaction }) => {
      await requestPasswordReset(body.email, config.appUrl, transaction);
      return { status: 202 };
    },
  });

  defineRoute(router, {
    method: 'post',
    path: '/password-resets/{token}',
    summary:
      'Set a new password with the link from the e-mail (single use, 1 hour). Ends every session, every API token and every other reset link of the account.',
    tags: ['password resets'],
    auth: false,
    params: z.object({ token: text().min(20).max(200) }),
    body: completeResetSchema,
    before: [resetLimiter],
    responses: {
      204: { description: 'Password set.' },
      404: { description: 'Unknown link.', schema: apiErrorSchema },
      410: { description: 'Used or expired link.', schema: apiErrorSchema },
    },
    handle: async ({ params, body, transaction }) => {
      const email = await completePasswordReset(params.token, body.password, transaction);
      // Proving control of the mailbox lifts the sign-in waits of the account.
      await security.throttle.forgetAccount(email);
      return { status: 204 };
    },
  });
  return router;
}
