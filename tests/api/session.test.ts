import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { sessionSchema } from '@shared/schemas/session';
import { User, Workspace } from '../../server/models';
import { useTestServer } from '../support/app';
import {
  buildMember,
  buildUser,
  buildWorkspace,
  DEFAULT_PASSWORD,
  signIn,
} from '../support/factories';

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

  it('locks the account for 15 minutes after 5 failed sign-ins, even for the right password', async () => {
    const victim = await buildUser();
    for (let attempt = 1; attempt <= 5; attempt++) {
      const response = await request(server.app)
        .post('/api/v1/session')
        .send({ email: victim.email, password: `wrong-${attempt}` });
      expect(response.status).toBe(401);
    }
    const locked = await request(server.app)
      .post('/api/v1/session')
      .send({ email: victim.email, password: DEFAULT_PASSWORD });
    expect(locked.status).toBe(423);
    expect(locked.body.error.code).toBe('account_locked');
    expect(locked.body.error.message).toMatch(/try again in 1[45] minutes/);
    await victim.reload();
    expect(victim.lockedUntil!.getTime() - Date.now()).toBeGreaterThan(14 * 60_000);

    // Once the lock has run out the right password works again.
    await victim.update({ lockedUntil: new Date(Date.now() - 1_000) });
    const after = await request(server.app)
      .post('/api/v1/session')
      .send({ email: victim.email, password: DEFAULT_PASSWORD });
    expect(after.status).toBe(200);
  });

  it('a successful sign-in resets the failure count', async () => {
    const user = await buildUser();
    for (let attempt = 0; attempt < 4; attempt++) {
      await request(server.app)
        .post('/api/v1/session')
        .send({ email: user.email, password: 'wrong-password' });
    }
    await signIn(server.app, user.email);
    await user.reload();
    expect(user.failedSignIns).toBe(0);
    const again = await request(server.app)
      .post('/api/v1/session')
      .send({ email: user.email, password: 'wrong-password' });
    expect(again.status).toBe(401);
  });

  it('rate-limits sign-in attempts from one address', async () => {
    const strict = server.anotherApp({
      ...server.config,
      rateLimits: { ...server.config.rateLimits, signInPerWindow: 3 },
    });
    for (let attempt = 0; attempt < 3; attempt++) {
      const response = await request(strict)
        .post('/api/v1/session')
        .send({ email: 'limit@example.com', password: 'wrong-password' });
      expect(response.status).toBe(401);
    }
    const limited = await request(strict)
      .post('/api/v1/session')
      .send({ email: 'limit@example.com', password: 'wrong-password' });
    expect(limited.status).toBe(429);
    expect(limited.body.error.code).toBe('rate_limited');
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

  it('uses a rolling idle timeout: every request pushes the cookie expiry forward', async () => {
    const { agent } = await signIn(server.app, chemist.email);
    const response = await agent.get('/api/v1/session');
    const cookie = response.headers['set-cookie']?.[0] ?? '';
    const expires = Date.parse(/Expires=([^;]+)/i.exec(cookie)?.[1] ?? '');
    const idleMs = server.config.sessionIdleMinutes * 60_000;
    expect(expires - Date.now()).toBeGreaterThan(idleMs - 60_000);
    expect(expires - Date.now()).toBeLessThanOrEqual(idleMs + 1_000);
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
