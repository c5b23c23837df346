import pg from 'pg';
import { Sequelize } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { User, Workspace } from '../../server/models';
import { ownerDatabaseUrl, useTestServer } from '../support/app';
import { buildMember, buildWorkspace, signIn, type SignedIn } from '../support/factories';

const server = useTestServer();

/**
 * Every statement the request path sends (Sequelize and the session store both go
 * through pg's Client) while `work` runs; the job queue's polling is not counted.
 */
async function statementsDuring(work: () => Promise<unknown>): Promise<string[]> {
  const seen: string[] = [];
  const original = pg.Client.prototype.query;
  pg.Client.prototype.query = function (this: pg.Client, ...args: unknown[]) {
    // The job queue's own polling runs on its own connections, whatever the request does.
    const client = this as unknown as { connectionParameters?: { application_name?: string } };
    if (client.connectionParameters?.application_name?.startsWith('phasewright-jobs'))
      return (original as (...a: unknown[]) => unknown).apply(this, args);
    const first = args[0];
    const text = typeof first === 'string' ? first : (first as { text?: string })?.text;
    seen.push(
      String(text ?? first)
        .replace(/\s+/g, ' ')
        .slice(0, 2000),
    );
    return (original as (...a: unknown[]) => unknown).apply(this, args);
  } as typeof original;
  try {
    await work();
  } finally {
    pg.Client.prototype.query = original;
  }
  return seen;
}

describe('the cost of a signed-in read', () => {
  let workspace: Workspace;
  let chemist: User;
  let asChemist: SignedIn;
  let asAdmin: SignedIn;
  let routePath: string;
  let owner: Sequelize;

  beforeAll(async () => {
    workspace = await buildWorkspace();
    chemist = await buildMember(workspace, ['chemist']);
    const admin = await buildMember(workspace, ['admin']);
    [asChemist, asAdmin] = await Promise.all([
      signIn(server.app, chemist.email),
      signIn(server.app, admin.email),
    ]);
    const created = await asChemist.agent
      .post(`/api/v1/workspaces/${workspace.id}/routes`)
      .set('X-CSRF-Token', asChemist.csrfToken)
      .send({ name: 'Counted route (invented)' });
    expect(created.status).toBe(201);
    routePath = `/api/v1/workspaces/${workspace.id}/routes/${created.body.id}`;
    owner = new Sequelize(ownerDatabaseUrl(), { logging: false });
  });
  afterAll(() => owner?.close());

  it('reads a route with two statements, the session with its user and roles, then the route; then with the route alone', async () => {
    await forgetCachedSessions(asChemist);
    let status = 0;
    const statements = await statementsDuring(async () => {
      status = (await asChemist.agent.get(routePath)).status;
    });
    expect(status).toBe(200);
    expect(statements, statements.join('\n')).toHaveLength(2);
    expect(statements[0]).toMatch(/FROM session/);
    expect(statements.join('\n')).not.toMatch(/\b(BEGIN|START TRANSACTION|COMMIT|UPDATE)\b/);
    // The session read is cached now (server/auth/session-cache.ts).
    const cached = await statementsDuring(async () => {
      status = (await asChemist.agent.get(routePath)).status;
    });
    expect(status).toBe(200);
    expect(cached, cached.join('\n')).toHaveLength(1);
    expect(cached[0]).toMatch(/route_drafts/);
  });

  it('reads the session afresh for every write, cached or not', async () => {
    expect((await asChemist.agent.get(routePath)).status).toBe(200);
    const statements = await statementsDuring(() =>
      asChemist.agent
        .post(`/api/v1/workspaces/${workspace.id}/routes`)
        .set('X-CSRF-Token', asChemist.csrfToken)
        .send({ name: 'Another counted route (invented)' }),
    );
    expect(statements.filter((s) => /FROM session/.test(s))).toHaveLength(1);
  });

  it('reads the first page of every list with one statement once the session is cached, and no transaction', async () => {
    const ws = `/api/v1/workspaces/${workspace.id}`;
    for (const path of [
      `${ws}/routes`,
      `${ws}/projects`,
      `${ws}/compounds`,
      `${ws}/members?q=a`,
      `${ws}/equipment`,
      '/api/v1/jobs',
    ]) {
      expect((await asChemist.agent.get(path)).status).toBe(200);
      let status = 0;
      const statements = await statementsDuring(async () => {
        status = (await asChemist.agent.get(path)).status;
      });
      expect(status, path).toBe(200);
      expect(statements, `${path}\n${statements.join('\n')}`).toHaveLength(1);
      expect(statements[0]).not.toMatch(/FROM session/);
      expect(statements.join('\n')).not.toMatch(/\b(BEGIN|START TRANSACTION|COMMIT|UPDATE)\b/);
    }
  });

  it('a search of three letters or more costs one statement more: the look-up of its trigram matches', async () => {
    const ws = `/api/v1/workspaces/${workspace.id}`;
    for (const path of [`${ws}/routes?sort=name&q=invented`, `${ws}/members?q=chem`]) {
      expect((await asChemist.agent.get(path)).status).toBe(200);
      let status = 0;
      const statements = await statementsDuring(async () => {
        status = (await asChemist.agent.get(path)).status;
      });
      expect(status, path).toBe(200);
      expect(statements, `${path}\n${statements.join('\n')}`).toHaveLength(2);
      expect(statements[0]).toMatch(/ILIKE/);
      expect(statements[0]).toMatch(/LIMIT 501/);
      expect(statements.join('\n')).not.toMatch(/\b(BEGIN|START TRANSACTION|COMMIT|UPDATE)\b/);
    }
  });

  it('pushes the stored expiry forward when it is more than a minute old, then not again', async () => {
    const sid = await sessionIdOf(asChemist);
    await owner.query(
      `UPDATE session SET expire = expire - interval '5 minutes' WHERE sid = :sid RETURNING expire`,
      { replacements: { sid } },
    );
    const before = await storedExpiry(sid);
    const first = await statementsDuring(() => asChemist.agent.get(routePath));
    expect(first.filter((s) => /UPDATE "?session"?/i.test(s))).toHaveLength(1);
    const after = await storedExpiry(sid);
    expect(after.getTime() - before.getTime()).toBeGreaterThan(4 * 60_000);
    const second = await statementsDuring(() => asChemist.agent.get(routePath));
    expect(second.filter((s) => /UPDATE "?session"?/i.test(s))).toHaveLength(0);
  });

  it('applies a role change and a removal from the next request on', async () => {
    const membersPath = `/api/v1/workspaces/${workspace.id}/members/${chemist.id}`;
    const rename = () =>
      asChemist.agent
        .get(routePath)
        .then((current) =>
          asChemist.agent
            .patch(routePath)
            .set('X-CSRF-Token', asChemist.csrfToken)
            .send({ name: 'Renamed (invented)', baseVersion: current.body.version }),
        );
    const demoted = await asAdmin.agent
      .patch(membersPath)
      .set('X-CSRF-Token', asAdmin.csrfToken)
      .send({ roles: ['reviewer'] });
    expect(demoted.status).toBe(200);
    expect((await rename()).status).toBe(403);
    const session = await asChemist.agent.get('/api/v1/session');
    expect(session.body.workspaces[0].roles).toEqual(['reviewer']);

    const removed = await asAdmin.agent.delete(membersPath).set('X-CSRF-Token', asAdmin.csrfToken);
    expect(removed.status).toBe(204);
    // A write reads the session afresh; a read drops its cached session once the database's
    // change notification arrives (asynchronous: within moments, not the cache's 30 s).
    const write = await asChemist.agent
      .patch(routePath)
      .set('X-CSRF-Token', asChemist.csrfToken)
      .send({ name: 'Renamed again (invented)', baseVersion: 1 });
    expect(write.status).toBe(404);
    await expect
      .poll(async () => (await asChemist.agent.get(routePath)).status, {
        timeout: 3_000,
        interval: 25,
      })
      .toBe(404);
  });

  /** Ends the cached reads of the user's sessions the way any change does: a notification. */
  async function forgetCachedSessions(who: SignedIn): Promise<void> {
    await owner.query(`SELECT pg_notify('phasewright_auth_changes', :payload)`, {
      replacements: { payload: `u:${who.session.user.id}` },
    });
    await new Promise((resolve) => setTimeout(resolve, 100));
  }

  async function sessionIdOf(who: SignedIn): Promise<string> {
    const [rows] = await owner.query(
      `SELECT sid FROM session WHERE sess -> 'passport' ->> 'user' = :userId AND sess ->> 'csrfToken' = :csrf`,
      { replacements: { userId: who.session.user.id, csrf: who.csrfToken } },
    );
    expect(rows).toHaveLength(1);
    return (rows[0] as { sid: string }).sid;
  }

  async function storedExpiry(sid: string): Promise<Date> {
    const [rows] = await owner.query(`SELECT expire FROM session WHERE sid = :sid`, {
      replacements: { sid },
    });
    return new Date((rows[0] as { expire: string }).expire);
  }
});
