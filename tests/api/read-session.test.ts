/**
 * The session of a signed-in read (GET, HEAD), served by the lean path
 * (server/auth/read-session.ts) instead of express-session and passport: it must refuse what
 * they refused and move the rolling expiry as they did, only less often.
 */
import { createHmac } from 'node:crypto';
import type { Express } from 'express';
import { Sequelize } from 'sequelize';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { User, Workspace } from '../../server/models';
import { SESSION_COOKIE } from '../../server/routes/session';
import { ownerDatabaseUrl, useTestServer } from '../support/app';
import { buildMember, buildWorkspace, DEFAULT_PASSWORD } from '../support/factories';

const server = useTestServer();

interface Client {
  /** `phasewright.sid=...`, as a browser sends it back. */
  cookie: string;
  csrfToken: string;
}

describe('the session of a signed-in read', () => {
  let workspace: Workspace;
  let chemist: User;
  let admin: User;
  let routePath: string;
  let owner: Sequelize;
  let other: Express;

  const signInOn = async (app: Express, user: User): Promise<Client> => {
    const reply = await request(app)
      .post('/api/v1/session')
      .send({ email: user.email, password: DEFAULT_PASSWORD });
    expect(reply.status).toBe(200);
    return { cookie: sessionCookie(reply.headers['set-cookie'])!, csrfToken: reply.body.csrfToken };
  };
  const read = (app: Express, path: string, client: Client) =>
    request(app).get(path).set('Cookie', client.cookie);

  beforeAll(async () => {
    workspace = await buildWorkspace();
    chemist = await buildMember(workspace, ['chemist']);
    admin = await buildMember(workspace, ['admin']);
    owner = new Sequelize(ownerDatabaseUrl(), { logging: false });
    other = server.anotherApp();
    const client = await signInOn(server.app, chemist);
    const created = await request(server.app)
      .post(`/api/v1/workspaces/${workspace.id}/routes`)
      .set('Cookie', client.cookie)
      .set('X-CSRF-Token', client.csrfToken)
      .send({ name: 'Read-session route (invented)' });
    expect(created.status).toBe(201);
    routePath = `/api/v1/workspaces/${workspace.id}/routes/${created.body.id}`;
  });
  afterAll(() => owner?.close());

  it('sends the cookie again only once its expiry would move by more than a minute', async () => {
    const client = await signInOn(server.app, chemist);
    const sid = sessionId(client);
    const signedInExpiry = await storedExpiry(sid);
    for (let i = 0; i < 3; i++) {
      const reply = await read(server.app, routePath, client);
      expect(reply.status).toBe(200);
      expect(sessionCookie(reply.headers['set-cookie'])).toBeUndefined();
    }
    expect(await storedExpiry(sid)).toEqual(signedInExpiry);

    // The last touch five minutes ago, as far as the database knows.
    await owner.query(
      `UPDATE session SET expire = expire - interval '5 minutes' WHERE sid = :sid`,
      {
        replacements: { sid },
      },
    );
    const moved = await expectEventually(async () => {
      const reply = await read(server.app, routePath, client);
      const sent: string[] | string | undefined = reply.headers['set-cookie'];
      const list = [sent ?? []].flat();
      return reply.status === 200 && sessionCookie(list) ? list : undefined;
    });
    const cookie = moved!.find((c) => c.startsWith(`${SESSION_COOKIE}=`))!;
    const idleMs = server.config.sessionIdleMinutes * 60_000;
    const expires = Date.parse(/Expires=([^;]+)/i.exec(cookie)![1]!);
    expect(expires - Date.now()).toBeGreaterThan(idleMs - 60_000);
    expect(expires - Date.now()).toBeLessThanOrEqual(idleMs + 1_000);
    expect(cookie).toMatch(/; HttpOnly/i);
    expect(cookie).toMatch(/; SameSite=Lax/i);
    // The same session, signed as express-session signs it: it keeps working, for writes too.
    expect(cookie.split(';')[0]).toBe(client.cookie);
    expect(Math.abs((await storedExpiry(sid)).getTime() - expires)).toBeLessThan(2_000);
    const again = await read(server.app, routePath, client);
    expect(again.status).toBe(200);
    expect(sessionCookie(again.headers['set-cookie'])).toBeUndefined();
  });

  it('refuses a session idle for longer than the idle time-out, cached or not', async () => {
    const client = await signInOn(server.app, chemist);
    expect((await read(server.app, routePath, client)).status).toBe(200);
    expect((await read(other, routePath, client)).status).toBe(200);
    await owner.query(`UPDATE session SET expire = now() - interval '1 second' WHERE sid = :sid`, {
      replacements: { sid: sessionId(client) },
    });
    for (const app of [server.app, other]) {
      await expectEventually(async () => (await read(app, routePath, client)).status === 401);
      expect((await read(app, '/api/v1/session', client)).status).toBe(401);
    }
  });

  it('ends a session at its absolute lifetime on a read, however recently it was used', async () => {
    const client = await signInOn(server.app, chemist);
    const sid = sessionId(client);
    expect((await read(server.app, routePath, client)).status).toBe(200);
    const hours = server.config.sessionMaxHours + 1;
    await owner.query(
      `UPDATE session SET sess = jsonb_set(sess::jsonb, '{signedInAt}', to_jsonb(:at::bigint))::json WHERE sid = :sid`,
      { replacements: { sid, at: Date.now() - hours * 3_600_000 } },
    );
    const reply = await expectEventually(async () => {
      const r = await read(server.app, routePath, client);
      return r.status === 401 ? r : undefined;
    });
    expect(reply!.body.error.message).toMatch(/hours after you signed in/);
    const [rows] = await owner.query(`SELECT 1 FROM session WHERE sid = :sid`, {
      replacements: { sid },
    });
    expect(rows).toHaveLength(0);
  });

  it('refuses a cookie whose signature was tampered with, or made with another secret', async () => {
    const client = await signInOn(server.app, chemist);
    expect((await read(server.app, routePath, client)).status).toBe(200);
    const value = decodeURIComponent(client.cookie.slice(SESSION_COOKIE.length + 1));
    const [sid, signature] = [
      value.slice(2, value.lastIndexOf('.')),
      value.slice(value.lastIndexOf('.') + 1),
    ];
    const flipped = signature.slice(0, -1) + (signature.endsWith('A') ? 'B' : 'A');
    const forgeries = [
      `s:${sid}.${flipped}`,
      `s:${sid}.${signature.slice(0, -1)}`,
      `s:${sid}`,
      sid,
      // Signed as the server signs, but with another secret.
      `s:${sid}.${createHmac('sha256', 'another-secret-invented').update(sid).digest('base64').replace(/=+$/, '')}`,
      // Another session's id under this session's signature.
      `s:${sid.slice(0, -1)}${sid.endsWith('a') ? 'b' : 'a'}.${signature}`,
    ];
    for (const forged of forgeries) {
      const cookie = `${SESSION_COOKIE}=${encodeURIComponent(forged)}`;
      for (const path of [routePath, '/api/v1/session']) {
        const reply = await request(server.app).get(path).set('Cookie', cookie);
        expect(reply.status, `${forged} ${path}`).toBe(401);
      }
    }
    // The genuine cookie beside a forged one of another name still works; a forged one first does not.
    expect(
      (await request(server.app).get(routePath).set('Cookie', `other=1; ${client.cookie}`)).status,
    ).toBe(200);
    expect(
      (
        await request(server.app)
          .get(routePath)
          .set(
            'Cookie',
            `${SESSION_COOKIE}=${encodeURIComponent(`s:${sid}.${flipped}`)}; ${client.cookie}`,
          )
      ).status,
    ).toBe(401);
  });

  it('refuses the cookie on the other instance as soon as the session is signed out on one', async () => {
    const client = await signInOn(server.app, chemist);
    // Twice through the other instance: the second read is answered from its cached session.
    for (let i = 0; i < 2; i++) expect((await read(other, routePath, client)).status).toBe(200);
    const out = await request(server.app)
      .delete('/api/v1/session')
      .set('Cookie', client.cookie)
      .set('X-CSRF-Token', client.csrfToken);
    expect(out.status).toBe(204);
    expect((await read(other, routePath, client)).status).toBe(401);
    expect((await read(server.app, routePath, client)).status).toBe(401);
  });

  it('sees a role change made through one instance on the next read through the other', async () => {
    const member = await buildMember(workspace, ['chemist']);
    const asMember = await signInOn(server.app, member);
    const asAdmin = await signInOn(server.app, admin);
    for (let i = 0; i < 2; i++) {
      const reply = await read(other, '/api/v1/session', asMember);
      expect(reply.body.workspaces[0].roles).toEqual(['chemist']);
    }
    const demoted = await request(server.app)
      .patch(`/api/v1/workspaces/${workspace.id}/members/${member.id}`)
      .set('Cookie', asAdmin.cookie)
      .set('X-CSRF-Token', asAdmin.csrfToken)
      .send({ roles: ['reviewer'] });
    expect(demoted.status).toBe(200);
    // Each instance learns of it from the database's change notification, within moments
    // (an instance that missed it would answer from its cache for 30 s).
    await expectEventually(async () => {
      const reply = await read(other, '/api/v1/session', asMember);
      return reply.body.workspaces[0].roles[0] === 'reviewer';
    });
    const refused = await request(other)
      .patch(routePath)
      .set('Cookie', asMember.cookie)
      .set('X-CSRF-Token', asMember.csrfToken)
      .send({ name: 'Renamed by a reviewer (invented)', baseVersion: 1 });
    expect(refused.status).toBe(403);
    const removed = await request(server.app)
      .delete(`/api/v1/workspaces/${workspace.id}/members/${member.id}`)
      .set('Cookie', asAdmin.cookie)
      .set('X-CSRF-Token', asAdmin.csrfToken);
    expect(removed.status).toBe(204);
    await expectEventually(async () => (await read(other, routePath, asMember)).status === 404);
  });

  function sessionId(client: Client): string {
    const value = decodeURIComponent(client.cookie.slice(SESSION_COOKIE.length + 1));
    return value.slice(2, value.lastIndexOf('.'));
  }

  async function storedExpiry(sid: string): Promise<Date> {
    const [rows] = await owner.query(`SELECT expire FROM session WHERE sid = :sid`, {
      replacements: { sid },
    });
    return new Date((rows[0] as { expire: string }).expire);
  }
});

/** The session cookie (`name=value`) among Set-Cookie headers, if one was sent. */
function sessionCookie(headers: string[] | string | undefined): string | undefined {
  const list = headers === undefined ? [] : Array.isArray(headers) ? headers : [headers];
  return list.find((c) => c.startsWith(`${SESSION_COOKIE}=`))?.split(';')[0];
}

/**
 * A change made straight in the database reaches each server's session cache through the
 * database's change notification, within moments (not the cache's 30 s): poll for it.
 */
async function expectEventually<T>(probe: () => Promise<T>): Promise<T> {
  let value: T | undefined;
  await expect
    .poll(
      async () => {
        value = await probe();
        return Boolean(value);
      },
      { timeout: 3_000, interval: 25 },
    )
    .toBe(true);
  return value!;
}
