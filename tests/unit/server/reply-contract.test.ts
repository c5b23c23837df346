import express, { Router } from 'express';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { AppError } from '../../../server/errors';
import { defineRoute } from '../../../server/http/route';
import { errorHandler } from '../../../server/middleware/error-handler';

/** An app with one operation whose handler answers `body`, declared with a {name} reply. */
function appAnswering(body: unknown, checkReplies = true) {
  const logged: unknown[] = [];
  const router = Router();
  defineRoute(router, {
    method: 'get',
    path: '/reply-contract-check',
    summary: 'Test operation.',
    tags: ['test'],
    auth: false,
    transaction: false,
    responses: { 200: { description: 'A name.', schema: z.object({ name: z.string() }) } },
    handle: async () => ({ status: 200, body }),
  });
  router.get('/raw-error', () => {
    throw new AppError({ code: 'not_found', message: 'Missing.', details: [] } as never);
  });
  const app = express();
  app.locals.checkReplies = checkReplies;
  app.use(router);
  app.use(errorHandler((error) => logged.push(error), { checkReplies }));
  return { app, logged };
}

describe('replies are checked against their declared schemas outside production', () => {
  it('a reply that matches its schema exactly is sent', async () => {
    const response = await request(appAnswering({ name: 'Ada' }).app).get('/reply-contract-check');
    expect(response.status).toBe(200);
    expect(response.body).toEqual({ name: 'Ada' });
  });

  it('a reply with an undeclared field is a server defect: 500, logged with the field', async () => {
    const { app, logged } = appAnswering({ name: 'Ada', passwordHash: 'x' });
    const response = await request(app).get('/reply-contract-check');
    expect(response.status).toBe(500);
    expect(response.body.error.code).toBe('internal_error');
    expect(String(logged[0])).toMatch(/does not match its declared schema.*passwordHash/);
  });

  it('an error reply outside the error contract is logged and answered as an internal error', async () => {
    const { app, logged } = appAnswering({ name: 'Ada' });
    const response = await request(app).get('/raw-error');
    expect(response.status).toBe(500);
    expect(String(logged[0])).toMatch(/does not match the error contract/);
  });

  it('in production the reply goes out unchecked', async () => {
    const response = await request(appAnswering({ name: 'Ada', extra: 1 }, false).app).get(
      '/reply-contract-check',
    );
    expect(response.status).toBe(200);
  });
});
