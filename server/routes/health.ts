import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { healthSchema } from '@shared/schemas/health';
import { defineRoute } from '../http/route';

export function healthRouter(sequelize: Sequelize): Router {
  const router = Router();
  defineRoute(router, {
    method: 'get',
    path: '/health',
    summary: 'Is the server up and can it reach its database?',
    tags: ['health'],
    auth: false,
    transaction: false,
    responses: {
      200: { description: 'Healthy.', schema: healthSchema },
      503: { description: 'The database cannot be reached.', schema: healthSchema },
    },
    handle: async () => {
      try {
        await sequelize.query('SELECT 1');
        return { status: 200, body: { status: 'ok', db: 'ok' } };
      } catch {
        return { status: 503, body: { status: 'error', db: 'unreachable' } };
      }
    },
  });
  return router;
}
