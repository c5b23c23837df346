import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { apiErrorSchema } from '@shared/schemas/errors';
import { useTestServer } from '../support/app';

const server = useTestServer();

describe('error replies', () => {
  it('an unknown /api path is a JSON 404', async () => {
    for (const path of ['/api/v1/no-such-thing', '/api/v2/session', '/api']) {
      const response = await request(server.app).get(path);
      expect(response.status).toBe(404);
      expect(response.type).toBe('application/json');
      expect(apiErrorSchema.parse(response.body).error.code).toBe('not_found');
    }
  });

  it('malformed JSON is a 400 in the error shape, without a stack trace', async () => {
    const response = await request(server.app)
      .post('/api/v1/session')
      .set('Content-Type', 'application/json')
      .send('{"email": ');
    expect(response.status).toBe(400);
    expect(response.body).toEqual({
      error: { code: 'malformed_json', message: 'The request body is not valid JSON.' },
    });
    expect(response.text).not.toMatch(/at .*\.(ts|js):\d+/);
  });

  it('a body over 1 MB is a JSON 413', async () => {
    const response = await request(server.app)
      .post('/api/v1/password-resets')
      .set('Content-Type', 'application/json')
      .send(JSON.stringify({ email: 'a@example.com', padding: 'x'.repeat(1_100_000) }));
    expect(response.status).toBe(413);
    expect(response.body.error.code).toBe('payload_too_large');
  });

  it('validation lists every zod issue with its dotted path', async () => {
    const response = await request(server.app)
      .post('/api/v1/password-resets/a-token-that-is-long-enough')
      .send({ password: 12 });
    expect(response.status).toBe(400);
    expect(apiErrorSchema.parse(response.body).error).toMatchObject({
      code: 'validation_failed',
      details: [{ path: 'password', message: expect.any(String) }],
    });
  });

  it('sets security headers with a CSP the built client works under', async () => {
    const response = await request(server.app).get('/api/v1/health');
    const csp = response.headers['content-security-policy'];
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("script-src 'self'");
    expect(csp).toContain("style-src 'self' 'unsafe-inline'");
    expect(csp).toContain("img-src 'self' data: blob:");
    expect(csp).toContain("worker-src 'self' blob:");
    expect(csp).not.toContain('upgrade-insecure-requests');
    expect(response.headers['x-content-type-options']).toBe('nosniff');
    expect(response.headers['x-powered-by']).toBeUndefined();
  });

  it('serves the built client for non-API paths (SPA fallback) and keeps /api answers JSON', async () => {
    const staticDir = mkdtempSync(path.join(tmpdir(), 'phasewright-static-'));
    try {
      writeFileSync(
        path.join(staticDir, 'index.html'),
        '<!doctype html><title>Phasewright client</title>',
      );
      mkdirSync(path.join(staticDir, 'assets'));
      writeFileSync(path.join(staticDir, 'assets', 'app-1234.js'), 'console.log(1)');
      const app = server.anotherApp({ ...server.config, staticDir });
      const deep = await request(app).get('/workspaces/some/route');
      expect(deep.status).toBe(200);
      expect(deep.type).toBe('text/html');
      expect(deep.text).toContain('Phasewright client');
      const asset = await request(app).get('/assets/app-1234.js');
      expect(asset.status).toBe(200);
      expect(asset.headers['cache-control']).toContain('immutable');
      expect((await request(app).get('/assets/missing.js')).status).toBe(404);
      const api = await request(app).get('/api/v1/nothing-here');
      expect(api.type).toBe('application/json');
    } finally {
      rmSync(staticDir, { recursive: true, force: true });
    }
  });
});

describe('GET /api/v1/openapi.json', () => {
  it('documents every public path from the route schemas', async () => {
    const response = await request(server.app).get('/api/v1/openapi.json');
    expect(response.status).toBe(200);
    expect(response.body.openapi).toMatch(/^3\./);
    const paths = Object.keys(response.body.paths);
    for (const path of [
      '/api/v1/health',
      '/api/v1/session',
      '/api/v1/account/password',
      '/api/v1/workspaces/{workspaceId}/members',
      '/api/v1/workspaces/{workspaceId}/invitations',
      '/api/v1/workspaces/{workspaceId}/members/{userId}',
      '/api/v1/invitations/{token}',
      '/api/v1/invitations/{token}/accept',
      '/api/v1/password-resets',
      '/api/v1/password-resets/{token}',
      '/api/v1/tokens',
      '/api/v1/tokens/{id}',
      '/api/v1/outbox',
    ]) {
      expect(paths).toContain(path);
    }
    expect(Object.keys(response.body.paths['/api/v1/session'])).toEqual(
      expect.arrayContaining(['get', 'post', 'delete']),
    );
    // The sign-in body comes from the shared schema.
    const signIn =
      response.body.paths['/api/v1/session'].post.requestBody.content['application/json'].schema;
    expect(signIn.properties).toHaveProperty('email');
    expect(signIn.required).toEqual(expect.arrayContaining(['email', 'password']));
    const invite = response.body.paths['/api/v1/workspaces/{workspaceId}/invitations'].post;
    expect(invite.parameters).toEqual([
      expect.objectContaining({ name: 'workspaceId', in: 'path' }),
    ]);
    expect(
      invite.requestBody.content['application/json'].schema.properties.roles.items.enum,
    ).toEqual(['admin', 'chemist', 'reviewer', 'engineer']);
  });
});
