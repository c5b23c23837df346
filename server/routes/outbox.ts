import { Router } from 'express';
import { apiErrorSchema } from '@shared/schemas/errors';
import { outboxMessageListSchema } from '@shared/schemas/outbox';
import type { AppConfig } from '../config';
import { notFound } from '../errors';
import { defineRoute } from '../http/route';
import { authorize } from '../policies';
import { presentOutboxMessage } from '../presenters';
import { listOutbox } from '../services/outbox';

export function outboxRouter(config: AppConfig): Router {
  const router = Router();
  defineRoute(router, {
    method: 'get',
    path: '/outbox',
    summary:
      'Mail caught by the built-in mail fake that concerns only workspaces you administer, newest first (outside production only; admins).',
    tags: ['outbox'],
    auth: true,
    responses: {
      200: { description: 'Messages.', schema: outboxMessageListSchema },
      403: { description: 'Admins only.', schema: apiErrorSchema },
      404: { description: 'Not available in production.', schema: apiErrorSchema },
    },
    handle: async ({ actor, transaction }) => {
      if (!config.outboxEnabled) throw notFound('The outbox');
      authorize(actor, 'outbox.read', null);
      return {
        status: 200,
        body: (await listOutbox(actor, transaction)).map(presentOutboxMessage),
      };
    },
  });
  return router;
}
