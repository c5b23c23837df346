import { Router } from 'express';
import { changePasswordSchema } from '@shared/schemas/session';
import { defineRoute } from '../http/route';
import { authorize } from '../policies';
import { changePassword } from '../services/credentials';

export function accountRouter(): Router {
  const router = Router();
  defineRoute(router, {
    method: 'post',
    path: '/account/password',
    summary: 'Change your password (needs the current one).',
    tags: ['account'],
    auth: true,
    body: changePasswordSchema,
    responses: { 204: { description: 'Changed.' } },
    handle: async ({ req, actor, body, transaction }) => {
      authorize(actor, 'account.changePassword', null);
      await changePassword(req.user!, body.currentPassword, body.newPassword, transaction);
      return { status: 204 };
    },
  });
  return router;
}
