import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { sessionSchema } from '@shared/schemas/session';
import { User, Workspace } from '../../server/models';
import { useTestServer } from '../support/app';
import { buildMember, buildWorkspace, DEFAULT_PASSWORD, signIn } from '../support/factories';

const server = useTestServer();

describe('session', () => {
  let workspace: Workspace;
  let chemist: User;

  beforeAll(async () => {
    workspace = await buildWorkspace({ name: 'Kilo lab (invented)' });
    chemist = await buildMember(workspace, ['chemist', 'reviewer'], {
      email: 'session-chemist@example.com',
      name: 'Session Chemist',
    });
  });

  it('requires authentication to read the session', async () => {
    const response = await request(server.app).get('/api/v1/session');
    expect(response.status).toBe(401);
    expect(response.body.error.code).toBe('unauthenticated');
  });

  it('signs in with e-mail and password and returns user, workspaces, roles, CSRF token and abilities', async () => {
    const response = await request(server.app)
      .post('/api/v1/session')
      .send({ email: '  Session-Chemist@Example.com ', password: DEFAULT_PASSWORD });
    expect(response.status).toBe(200);
    const session = sessionSchema.parse(response.body);
    expect(session.user).toEqual({
      id: chemist.id,
      email: 'session-chemist@example.com',
      name: 'Session Chemist',
    });
    expect(session.workspaces).toEqual([
      {
        id: workspace.id,
        name: workspace.name,
        slug: workspace.slug,
        roles: ['chemist', 'reviewer'],
      },
    ]);
    expect(session.csrfToken.length).toBeGreaterThan(20);
    expect(session.abilities.workspaces[workspace.id]).toMatchObject({
      'member.list': true,
      'member.invite': false,
    });
    const cookie = response.headers['set-cookie']?.[0] ?? '';
    expect(cookie).toMatch(/^phasewright\.sid=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/Secure/i); // plain http here; Secure applies behind HTTPS
  });

  it('keeps the user signed in across requests and returns the same CSRF token', async () => {
    const { agent, csrfToken } = await signIn(server.app, chemist.email);
    const response = await agent.get('/api/v1/session');
    expect(response.status).toBe(200);
    expect(response.body.user.id).toBe(chemist.id);
    expect(response.body.csrfToken).toBe(csrfToken);
  });

  it('rejects a wrong password with a plain 401', async () => {
    const response = await request(server.app)
      .post('/api/v1/session')
      .send({ email: chemist.email, password: 'not-the-password' });
    expect(response.status).toBe(401);
    expect(response.body).toEqual({
      error: { code: 'invalid_credentials', message: 'E-mail or password is incorrect.' },
    });
    expect(response.headers['set-cookie']).toBeUndefined();
  });

  it('answers an unknown e-mail exactly like a wrong password', async () => {
    const response = await request(server.app)
      .post('/api/v1/session')
      .send({ email: 'nobody@example.com', password: 'whatever-it-is' });
    expect(response.status).toBe(401);
    expect(response.body.error.message).toBe('E-mail or password is incorrect.');
  });

  it('signs out with DELETE (CSRF token required) and the cookie stops working', async () => {
    const { agent, csrfToken } = await signIn(server.app, chemist.email);
    const out = await agent.delete('/api/v1/session').set('X-CSRF-Token', csrfToken);
    expect(out.status).toBe(204);
    const after = await agent.get('/api/v1/session');
    expect(after.status).toBe(401);
  });

  it('survives a server restart: a second app on the same database accepts the cookie', async () => {
    const first = server.anotherApp();
    const signInResponse = await request(first)
      .post('/api/v1/session')
      .send({ email: chemist.email, password: DEFAULT_PASSWORD });
    expect(signInResponse.status).toBe(200);
    const cookie = signInResponse.headers['set-cookie']![0].split(';')[0];

    const second = server.anotherApp();
    const response = await request(second).get('/api/v1/session').set('Cookie', cookie);
    expect(response.status).toBe(200);
    expect(response.body.user.id).toBe(chemist.id);
    expect(response.body.csrfToken).toBe(signInResponse.body.csrfToken);
  });

  it('marks the cookie Secure behind an HTTPS proxy when trust proxy is set', async () => {
    const proxied = server.anotherApp({ ...server.config, trustProxy: 1 });
    const response = await request(proxied)
      .post('/api/v1/session')
      .set('X-Forwarded-Proto', 'https')
      .send({ email: chemist.email, password: DEFAULT_PASSWORD });
    expect(response.status).toBe(200);
    expect(response.headers['set-cookie']?.[0]).toMatch(/;\s*Secure/i);
  });

  it('validates the sign-in payload and lists every field problem', async () => {
    const response = await request(server.app)
      .post('/api/v1/session')
      .send({ email: 'not-an-email' });
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('validation_failed');
    const paths = response.body.error.details.map((d: { path: string }) => d.path).sort();
    expect(paths).toEqual(['email', 'password']);
  });
});
