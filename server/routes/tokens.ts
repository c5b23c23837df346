import { Router } from 'express';
import { z } from 'zod';
import { apiErrorSchema } from '@shared/schemas/errors';
import { apiTokenListSchema, createdTokenSchema, createTokenSchema } from '@shared/schemas/tokens';
import { defineRoute } from '../http/route';
import { authorize } from '../policies';
import { presentToken } from '../presenters';
import { createToken, findActiveToken, listTokens, revokeToken } from '../services/tokens';

export function tokensRouter(): Router {
  const router = Router();

  defineRoute(router, {
    method: 'get',
    path: '/tokens',
    summary: 'Your personal API tokens (never their secrets).',
    tags: ['tokens'],
    auth: true,
    responses: { 200: { description: 'Active tokens.', schema: apiTokenListSchema } },
    handle: async ({ actor, transaction }) => {
      authorize(actor, 'token.list', null);
      return { status: 200, body: (await listTokens(actor.userId, transaction)).map(presentToken) };
    },
  });

  defineRoute(router, {
    method: 'post',
    path: '/tokens',
    summary:
      'Create a personal API token: read-only (default) or read-write, working for expiresInDays (default 90, at most 365). The secret is in this reply only.',
    tags: ['tokens'],
    auth: true,
    body: createTokenSchema,
    responses: { 201: { description: 'Created.', schema: createdTokenSchema } },
    handle: async ({ actor, body, transaction }) => {
      authorize(actor, 'token.create', null);
      const { record, token } = await createToken(actor.userId, body, transaction);
      return { status: 201, body: { ...presentToken(record), token } };
    },
  });

  defineRoute(router, {
    method: 'delete',
    path: '/tokens/{id}',
    summary: 'Revoke one of your tokens.',
    tags: ['tokens'],
    auth: true,
    params: z.object({ id: z.uuid() }),
    responses: {
      204: { description: 'Revoked.' },
      404: { description: 'No such token of yours.', schema: apiErrorSchema },
    },
    handle: async ({ actor, params, transaction }) => {
      const record = await findActiveToken(params.id, transaction);
      authorize(actor, 'token.revoke', { userId: record.userId as string });
      await revokeToken(record, actor.userId, transaction);
      return { status: 204 };
    },
  });
  return router;
}
