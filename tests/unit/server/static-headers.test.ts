import express from 'express';
import helmet from 'helmet';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { staticHeaders } from '../../../server/http/static-headers';

const options = {
  contentSecurityPolicy: {
    useDefaults: true,
    directives: { defaultSrc: ["'self'"], upgradeInsecureRequests: null },
  },
};

async function headersOf(middleware: express.RequestHandler): Promise<Record<string, unknown>> {
  const app = express();
  app.use(middleware);
  app.get('/', (_req, res) => res.json({ ok: true }));
  const response = await request(app).get('/');
  const headers = { ...response.headers };
  delete headers.date;
  delete headers.etag;
  return headers;
}

describe('security headers worked out once', () => {
  it('sets exactly the headers the security middleware sets on every response', async () => {
    const fixed = await headersOf(staticHeaders(helmet(options)));
    expect(fixed).toEqual(await headersOf(helmet(options)));
    expect(fixed['content-security-policy']).toContain("default-src 'self'");
    expect(fixed['x-powered-by']).toBeUndefined();
  });

  it('refuses a middleware whose headers depend on the request or the response', () => {
    expect(() =>
      staticHeaders((req, res, next) => {
        res.setHeader('x-path', String(req.url));
        next();
      }),
    ).toThrow(/req\.url/);
    expect(() =>
      staticHeaders((_req, res, next) => {
        if (!res.headersSent) res.setHeader('x-late', '1');
        next();
      }),
    ).toThrow(/res\.headersSent/);
    expect(() =>
      staticHeaders(
        helmet({
          contentSecurityPolicy: {
            directives: { scriptSrc: ["'self'", (_req, res) => `'nonce-${String(res)}'`] },
          },
        }) as never,
      ),
    ).toThrow();
  });
});
