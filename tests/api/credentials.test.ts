/**
 * Credentials that end when they should: failed sign-ins slow down by account
 * and by address with growing waits (no fixed lock that anyone can trigger),
 * known and unknown accounts answer alike, the invitation password counts like
 * a sign-in, a password change or reset ends every other session and token and
 * older reset links, tokens expire and carry a scope, sessions have an
 * absolute lifetime, and TRUST_PROXY decides the client address and Secure
 * cookies. Rate limits live in PostgreSQL, so two instances share them.
 */
import { randomBytes } from 'node:crypto';
import type { Express } from 'express';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { apiTokenListSchema, createdTokenSchema } from '@shared/schemas/tokens';
import { ApiToken, type User, type Workspace } from '../../server/models';
import { DEFAULT_THROTTLE } from '../../server/services/sign-in-throttle';
import { useTestServer } from '../support/app';
import {
  buildMember,
  buildUser,
  buildWorkspace,
  DEFAULT_PASSWORD,
  signIn,
} from '../support/factories';
import { tokenFromLink, waitForMail } from '../support/mail';

const server = useTestServer();

/** A fresh documentation address (RFC 5737) per call, so tests never share a budget. */
const addresses = new Set<string>();
function freshAddress(): string {
  for (;;) {
    const candidate = `192.0.2.${randomBytes(1)[0]}`;
    if (!addresses.has(candidate)) {
      addresses.add(candidate);
      return candidate;
    }
  }
}

/** The production numbers, with one-second first waits so the test can watch them grow. */
const STRICT = {
  ...DEFAULT_THROTTLE,
  pair: { free: 3, minSeconds: 1, maxSeconds: 900 },
  account: { free: 6, minSeconds: 1, maxSeconds: 60 },
  address: { free: 8, minSeconds: 1, maxSeconds: 900 },
};

describe('credentials', () => {
  let strict: Express;
  let workspace: Workspace;

  beforeAll(async () => {
    strict = server.anotherApp({ ...server.config, trustProxy: 1, signInThrottle: STRICT });
    workspace = await buildWorkspace();
  });

  const attempt = (app: Express, from: string, email: string, password: string) =>
    request(app).post('/api/v1/session').set('X-Forwarded-For', from).send({ email, password });

  it('slows down the address that fails, with growing waits, while the owner signs in from elsewhere', async () => {
    const victim = await buildUser();
    const attacker = freshAddress();
    for (let i = 1; i <= 4; i++)
      expect((await attempt(strict, attacker, victim.email, `wrong-${i}`)).status).toBe(401);
    // The fourth failure (one past the free three) asks for a 1 s wait; the right password is not even checked.
    const waiting = await attempt(strict, attacker, victim.email, DEFAULT_PASSWORD);
    expect(waiting.status).toBe(429);
    expect(waiting.body.error.code).toBe('sign_in_throttled');
    expect(waiting.headers['retry-after']).toBe('1');

    // No lock: the owner, from another address, signs in at once.
    expect((await attempt(strict, freshAddress(), victim.email, DEFAULT_PASSWORD)).status).toBe(
      200,
    );

    // The next failure from the attacker's address doubles the wait.
    await new Promise((resolve) => setTimeout(resolve, 1100));
    expect((await attempt(strict, attacker, victim.email, 'wrong-5')).status).toBe(401);
    const longer = await attempt(strict, attacker, victim.email, 'wrong-6');
    expect(longer.status).toBe(429);
    expect(longer.headers['retry-after']).toBe('2');
  });

  it('answers a known and an unknown account exactly alike', async () => {
    const known = await buildUser();
    const unknown = `nobody-${randomBytes(4).toString('hex')}@example.com`;
    const run = async (email: string) => {
      const from = freshAddress();
      const replies: unknown[] = [];
      for (let i = 0; i < 6; i++) {
        const response = await attempt(strict, from, email, 'not-the-password');
        replies.push([response.status, response.body, response.headers['retry-after']]);
      }
      return replies;
    };
    const [forKnown, forUnknown] = [await run(known.email), await run(unknown)];
    expect(forKnown).toEqual(forUnknown);
    expect(forKnown.map((r) => (r as [number])[0])).toEqual([401, 401, 401, 401, 429, 429]);
  });

  it('counts the password given when accepting an invitation like a sign-in', async () => {
    const existing = await buildMember(workspace, ['chemist']);
    const other = await buildWorkspace();
    const admin = await buildMember(other, ['admin']);
    const asAdmin = await signIn(server.app, admin.email);
    const before = new Date();
    await asAdmin.agent
      .post(`/api/v1/workspaces/${other.id}/invitations`)
      .set('X-CSRF-Token', asAdmin.csrfToken)
      .send({ email: existing.email, roles: ['reviewer'] });
    const mail = await waitForMail(existing.email, { after: before, subject: /invited/ });
    const token = tokenFromLink(mail.text, 'invitations');
    const from = freshAddress();
    const accept = (password: string) =>
      request(strict)
        .post(`/api/v1/invitations/${token}/accept`)
        .set('X-Forwarded-For', from)
        .send({ password });
    for (let i = 1; i <= 4; i++) expect((await accept(`wrong-password-${i}`)).status).toBe(401);
    const refused = await accept(DEFAULT_PASSWORD);
    expect(refused.status).toBe(429);
    expect(refused.body.error.code).toBe('sign_in_throttled');
    // The same count holds for signing in from that address.
    expect((await attempt(strict, from, existing.email, DEFAULT_PASSWORD)).status).toBe(429);
  });

  it('a password change ends every other session and every token; the session that changed it stays', async () => {
    const user = await buildMember(workspace, ['chemist']);
    const here = await signIn(server.app, user.email);
    const elsewhere = await signIn(server.app, user.email);
    const created = await here.agent
      .post('/api/v1/tokens')
      .set('X-CSRF-Token', here.csrfToken)
      .send({ name: 'Export script', scope: 'read-write' });
    const { token } = createdTokenSchema.parse(created.body);
    const changed = await here.agent
      .post('/api/v1/account/password')
      .set('X-CSRF-Token', here.csrfToken)
      .send({ currentPassword: DEFAULT_PASSWORD, newPassword: 'a-new-password-123' });
    expect(changed.status).toBe(204);
    expect((await here.agent.get('/api/v1/session')).status).toBe(200);
    expect((await elsewhere.agent.get('/api/v1/session')).status).toBe(401);
    const withToken = await request(server.app)
      .get('/api/v1/session')
      .set('Authorization', `Bearer ${token}`);
    expect(withToken.status).toBe(401);
    expect(withToken.body.error.code).toBe('invalid_token');
  });

  it('a reset ends every session and token, and an older reset link dies when a newer one is used', async () => {
    const user: User = await buildMember(workspace, ['chemist']);
    const session = await signIn(server.app, user.email);
    const created = await session.agent
      .post('/api/v1/tokens')
      .set('X-CSRF-Token', session.csrfToken)
      .send({ name: 'Nightly report' });
    const { token } = createdTokenSchema.parse(created.body);

    const first = new Date();
    await request(server.app).post('/api/v1/password-resets').send({ email: user.email });
    const older = tokenFromLink(
      (await waitForMail(user.email, { after: first })).text,
      'reset-password',
    );
    const second = new Date();
    await request(server.app).post('/api/v1/password-resets').send({ email: user.email });
    const newer = tokenFromLink(
      (await waitForMail(user.email, { after: second })).text,
      'reset-password',
    );
    expect(newer).not.toBe(older);

    const used = await request(server.app)
      .post(`/api/v1/password-resets/${newer}`)
      .send({ password: 'fresh-password-456' });
    expect(used.status).toBe(204);
    const stale = await request(server.app)
      .post(`/api/v1/password-resets/${older}`)
      .send({ password: 'attacker-password-789' });
    expect(stale.status).toBe(410);
    expect((await session.agent.get('/api/v1/session')).status).toBe(401);
    const withToken = await request(server.app)
      .get('/api/v1/session')
      .set('Authorization', `Bearer ${token}`);
    expect(withToken.status).toBe(401);
    expect((await signIn(server.app, user.email, 'fresh-password-456')).session.user.id).toBe(
      user.id,
    );
  });

  it('tokens carry a scope and an expiry: read-only tokens change nothing, expired ones are refused', async () => {
    const user = await buildMember(workspace, ['chemist']);
    const session = await signIn(server.app, user.email);
    const make = async (body: object) =>
      createdTokenSchema.parse(
        (
          await session.agent
            .post('/api/v1/tokens')
            .set('X-CSRF-Token', session.csrfToken)
            .send(body)
        ).body,
      );
    const reader = await make({ name: 'Dashboard' });
    expect(reader.scope).toBe('read');
    const days = (Date.parse(reader.expiresAt) - Date.now()) / 86_400_000;
    expect(days).toBeGreaterThan(89);
    expect(days).toBeLessThanOrEqual(90);
    const writer = await make({ name: 'Import script', scope: 'read-write', expiresInDays: 7 });

    const as = (token: string) => ({
      get: (path: string) =>
        request(server.app).get(`/api/v1${path}`).set('Authorization', `Bearer ${token}`),
      post: (path: string, body: object) =>
        request(server.app)
          .post(`/api/v1${path}`)
          .set('Authorization', `Bearer ${token}`)
          .send(body),
    });
    expect((await as(reader.token).get(`/workspaces/${workspace.id}/routes`)).status).toBe(200);
    const refused = await as(reader.token).post(`/workspaces/${workspace.id}/routes`, {
      name: 'Written with a read-only token',
    });
    expect(refused.status).toBe(403);
    expect(refused.body.error.code).toBe('token_read_only');
    // Calculations store nothing: a read-only token may run them.
    const calc = await as(reader.token).post('/calc/vapour-pressure', {
      component: { smiles: 'CCO' },
      temperatureC: 25,
    });
    expect(calc.status).toBe(200);
    expect(
      (
        await as(writer.token).post(`/workspaces/${workspace.id}/routes`, {
          name: 'Written with a read-write token',
        })
      ).status,
    ).toBe(201);

    const listed = apiTokenListSchema.parse((await session.agent.get('/api/v1/tokens')).body);
    expect(listed.find((t) => t.id === writer.id)?.scope).toBe('read-write');

    await ApiToken.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { id: writer.id } });
    const expired = await as(writer.token).get('/session');
    expect(expired.status).toBe(401);
    expect(expired.body.error.code).toBe('invalid_token');

    const tooLong = await session.agent
      .post('/api/v1/tokens')
      .set('X-CSRF-Token', session.csrfToken)
      .send({ name: 'Forever', expiresInDays: 10_000 });
    expect(tooLong.status).toBe(400);
    expect(tooLong.body.error.details[0].path).toBe('expiresInDays');
  });

  it('ends a session at its absolute lifetime, however active it is', async () => {
    const shortLived = server.anotherApp({ ...server.config, sessionMaxHours: 1.5 / 3600 });
    const user = await buildMember(workspace, ['reviewer']);
    const session = await signIn(shortLived, user.email);
    expect((await session.agent.get('/api/v1/session')).status).toBe(200);
    await new Promise((resolve) => setTimeout(resolve, 1700));
    const ended = await session.agent.get('/api/v1/session');
    expect(ended.status).toBe(401);
    expect(ended.body.error.message).toMatch(/sign in again/);
  });

  describe('behind a reverse proxy (TRUST_PROXY)', () => {
    it('marks the session cookie Secure only when the proxy is trusted to say HTTPS', async () => {
      const user = await buildUser();
      const signInOver = (app: Express) =>
        request(app)
          .post('/api/v1/session')
          .set('X-Forwarded-Proto', 'https')
          .set('X-Forwarded-For', freshAddress())
          .send({ email: user.email, password: DEFAULT_PASSWORD });
      const untrusted = await signInOver(server.app);
      expect(untrusted.status).toBe(200);
      expect(untrusted.headers['set-cookie'][0]).not.toMatch(/;\s*Secure/i);
      const trusted = await signInOver(strict);
      expect(trusted.status).toBe(200);
      expect(trusted.headers['set-cookie'][0]).toMatch(/;\s*Secure/i);
    });

    it('limits requests per client address from X-Forwarded-For, shared by every instance through PostgreSQL', async () => {
      const limited = {
        ...server.config,
        trustProxy: 1,
        rateLimits: { ...server.config.rateLimits, signInPerWindow: 3 },
      };
      const [first, second] = [server.anotherApp(limited), server.anotherApp(limited)];
      const from = freshAddress();
      const email = `limits-${randomBytes(4).toString('hex')}@example.com`;
      expect((await attempt(first, from, email, 'wrong-password')).status).toBe(401);
      expect((await attempt(second, from, email, 'wrong-password')).status).toBe(401);
      expect((await attempt(first, from, email, 'wrong-password')).status).toBe(401);
      // The fourth request of the window, on the other instance: refused.
      const refused = await attempt(second, from, email, 'wrong-password');
      expect(refused.status).toBe(429);
      expect(refused.body.error.code).toBe('rate_limited');
      expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0);
      // Another client address has its own budget.
      expect((await attempt(second, freshAddress(), email, 'wrong-password')).status).toBe(401);
    });
  });
});
