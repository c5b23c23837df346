/**
 * More than one server: two real server processes on two ports against one database, as
 * behind a load balancer. A session made on one works on the other, rate limits are one
 * budget, each queued job (mail, Monte Carlo) runs exactly once, and a draft saved through
 * one is read through the other.
 */
import { Sequelize } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import demoRoute from '../fixtures/routes/demo-amide-isolation.json';
import { OutboxMessage, type User, type Workspace } from '../../server/models';
import { ownerDatabaseUrl, useTestServer } from '../support/app';
import { buildMember, buildWorkspace, DEFAULT_PASSWORD } from '../support/factories';
import { startServerProcess, type ServerProcess } from '../support/server-process';

// Gives this file the database; the servers under test are separate processes on it.
useTestServer();

const RESET_LIMIT = 4;
const instanceEnv = {
  // Each request names its client address, so this file's budgets are its own.
  TRUST_PROXY: 'loopback',
  RESET_RATE_LIMIT: String(RESET_LIMIT),
  MONTE_CARLO_JOBS_PER_USER: '20',
  JOB_POLL_SECONDS: '0.5',
};

interface Client {
  cookie: string;
  csrfToken: string;
}

const address = () =>
  `198.51.100.${Math.floor(Math.random() * 250) + 1}, 203.0.113.${Math.floor(Math.random() * 250) + 1}`;

describe('two server instances on one database', () => {
  let a: ServerProcess;
  let b: ServerProcess;
  let workspace: Workspace;
  let chemist: User;
  let owner: Sequelize;

  beforeAll(async () => {
    [a, b] = await Promise.all([
      startServerProcess({ env: instanceEnv }),
      startServerProcess({ env: instanceEnv }),
    ]);
    workspace = await buildWorkspace();
    chemist = await buildMember(workspace, ['chemist']);
    owner = new Sequelize(ownerDatabaseUrl(), { logging: false });
  }, 120_000);
  afterAll(async () => {
    await Promise.all([a?.stop(), b?.stop()]);
    await owner?.close();
  });

  const call = (
    on: ServerProcess,
    method: string,
    path: string,
    options: { as?: Client; body?: unknown; from?: string } = {},
  ) =>
    fetch(`${on.base}/api/v1${path}`, {
      method,
      headers: {
        'content-type': 'application/json',
        'x-forwarded-for': options.from ?? address(),
        ...(options.as ? { cookie: options.as.cookie, 'x-csrf-token': options.as.csrfToken } : {}),
      },
      body: options.body === undefined ? undefined : JSON.stringify(options.body),
    });

  /**
   * A read through B shows `expected` at once or within the moment the database's change
   * notification takes to reach B (it is asynchronous; on a busy machine it can lose a race
   * with the next request). A server that missed it would answer from its cache for 30 s.
   */
  async function settles(read: () => Promise<unknown>, expected: unknown): Promise<void> {
    await expect.poll(read, { timeout: 3_000, interval: 25 }).toEqual(expected);
  }

  async function signInOn(on: ServerProcess, user: User): Promise<Client> {
    const response = await call(on, 'POST', '/session', {
      body: { email: user.email, password: DEFAULT_PASSWORD },
    });
    expect(response.status).toBe(200);
    const { csrfToken } = (await response.json()) as { csrfToken: string };
    return { cookie: response.headers.get('set-cookie')!.split(';')[0], csrfToken };
  }

  it('runs two processes on two ports', () => {
    expect(a.base).not.toBe(b.base);
    expect(a.child.pid).not.toBe(b.child.pid);
  });

  it('accepts a session made on one instance on the other, and ends it on both', async () => {
    const client = await signInOn(a, chemist);
    const onB = await call(b, 'GET', '/session', { as: client });
    expect(onB.status).toBe(200);
    expect(((await onB.json()) as { user: { email: string } }).user.email).toBe(chemist.email);
    // The CSRF token travels with the session too: a write through B is accepted.
    const created = await call(b, 'POST', `/workspaces/${workspace.id}/routes`, {
      as: client,
      body: { name: 'Made through the second server (invented)' },
    });
    expect(created.status).toBe(201);

    expect((await call(b, 'DELETE', '/session', { as: client })).status).toBe(204);
    expect((await call(a, 'GET', '/session', { as: client })).status).toBe(401);
  });

  it('ends a session on the other instance, though that one had it cached', async () => {
    const client = await signInOn(a, chemist);
    // Read twice through B: the second read is answered from B's cached session.
    for (let i = 0; i < 2; i++)
      expect((await call(b, 'GET', '/session', { as: client })).status).toBe(200);
    expect((await call(a, 'DELETE', '/session', { as: client })).status).toBe(204);
    expect((await call(b, 'GET', '/session', { as: client })).status).toBe(401);
    expect(
      (await call(b, 'GET', `/workspaces/${workspace.id}/routes`, { as: client })).status,
    ).toBe(401);
  });

  it('applies a role change, a removal and a password change made through one instance on the other, though it had the session cached', async () => {
    const member = await buildMember(workspace, ['chemist']);
    const admin = await buildMember(workspace, ['admin']);
    const asMember = await signInOn(a, member);
    const asAdmin = await signInOn(a, admin);
    const rolesOnB = async () => {
      const reply = await call(b, 'GET', '/session', { as: asMember });
      if (reply.status !== 200) return reply.status;
      return ((await reply.json()) as { workspaces: { roles: string[] }[] }).workspaces[0]?.roles;
    };
    expect(await rolesOnB()).toEqual(['chemist']);
    expect(await rolesOnB()).toEqual(['chemist']);

    const memberPath = `/workspaces/${workspace.id}/members/${member.id}`;
    const demoted = await call(a, 'PATCH', memberPath, {
      as: asAdmin,
      body: { roles: ['reviewer'] },
    });
    expect(demoted.status).toBe(200);
    await settles(rolesOnB, ['reviewer']);
    // Behind every server's back too: the database announces the change, not the service.
    await owner.query(`UPDATE memberships SET roles = ARRAY['chemist'] WHERE user_id = :id`, {
      replacements: { id: member.id },
    });
    await settles(rolesOnB, ['chemist']);

    expect((await call(a, 'DELETE', memberPath, { as: asAdmin })).status).toBe(204);
    await settles(rolesOnB, undefined);
    expect(
      (await call(b, 'GET', `/workspaces/${workspace.id}/routes`, { as: asMember })).status,
    ).toBe(404);

    // A password change through A ends the admin's other sessions, cached on B or not.
    const other = await signInOn(b, admin);
    expect((await call(b, 'GET', '/session', { as: other })).status).toBe(200);
    const changed = await call(a, 'POST', '/account/password', {
      as: asAdmin,
      body: { currentPassword: DEFAULT_PASSWORD, newPassword: 'a-new-password-invented-42' },
    });
    expect(changed.status).toBe(204);
    await settles(async () => (await call(b, 'GET', '/session', { as: other })).status, 401);
  });

  it('saves a draft through one instance and reads it through the other', async () => {
    const client = await signInOn(a, chemist);
    const created = await call(a, 'POST', `/workspaces/${workspace.id}/routes`, {
      as: client,
      body: { name: 'Shared draft (invented)' },
    });
    const route = (await created.json()) as { id: string; draft: { version: number } };
    const path = `/workspaces/${workspace.id}/routes/${route.id}`;
    const saved = await call(a, 'PUT', `${path}/draft`, {
      as: client,
      body: { document: demoRoute, baseVersion: route.draft.version },
    });
    expect(saved.status).toBe(200);
    const version = ((await saved.json()) as { version: number }).version;

    const read = await call(b, 'GET', path, { as: client });
    expect(read.status).toBe(200);
    const detail = (await read.json()) as {
      draft: { version: number; document: { steps: { id: string }[] } };
    };
    expect(detail.draft.version).toBe(version);
    expect(detail.draft.document.steps.map((s) => s.id)).toEqual(demoRoute.steps.map((s) => s.id));
    // And a save through B based on A's version is the next one, not a conflict.
    const next = await call(b, 'PUT', `${path}/draft`, {
      as: client,
      body: { document: demoRoute, baseVersion: version },
    });
    expect(next.status).toBe(200);
    const stale = await call(a, 'PUT', `${path}/draft`, {
      as: client,
      body: { document: demoRoute, baseVersion: version },
    });
    expect(stale.status).toBe(409);
  });

  it('counts one rate-limit budget across both instances', async () => {
    const from = address();
    const statuses: number[] = [];
    for (let i = 0; i < RESET_LIMIT + 2; i++) {
      const on = i % 2 === 0 ? a : b;
      const response = await call(on, 'POST', '/password-resets', {
        from,
        body: { email: `nobody-${i}@example.com` },
      });
      statuses.push(response.status);
    }
    expect(statuses.slice(0, RESET_LIMIT)).toEqual(Array(RESET_LIMIT).fill(202));
    expect(statuses.slice(RESET_LIMIT)).toEqual([429, 429]);
  });

  it('sends each queued mail exactly once, whichever instance queued it', async () => {
    const people = await Promise.all(
      Array.from({ length: 6 }, (_, i) =>
        buildMember(workspace, ['reviewer'], { email: `twice-${i}-${Date.now()}@example.com` }),
      ),
    );
    const after = new Date(Date.now() - 1000);
    await Promise.all(
      people.map(async (person, i) => {
        const response = await call(i % 2 ? b : a, 'POST', '/password-resets', {
          body: { email: person.email },
        });
        expect(response.status).toBe(202);
      }),
    );
    const emails = people.map((p) => p.email);
    await until(async () => (await OutboxMessage.count({ where: { to: emails } })) >= 6);
    // Give a second delivery the time to show up, were there one.
    await new Promise((resolve) => setTimeout(resolve, 3000));
    const messages = await OutboxMessage.findAll({ where: { to: emails } });
    expect(
      messages
        .filter((m) => m.receivedAt >= after)
        .map((m) => m.to)
        .sort(),
    ).toEqual([...emails].sort());
  }, 60_000);

  it('runs each queued Monte Carlo job exactly once', async () => {
    const client = await signInOn(a, chemist);
    const started = await Promise.all(
      [a, b, a, b].map(async (on, i) => {
        const response = await call(on, 'POST', '/evaluate/monte-carlo', {
          as: client,
          body: { document: demoRoute, draws: 30, seed: i + 1 },
        });
        expect(response.status).toBe(202);
        return ((await response.json()) as { jobId: string }).jobId;
      }),
    );
    const finished = await until(async () => {
      const states = await Promise.all(
        started.map(async (jobId, i) => {
          const response = await call(i % 2 ? a : b, 'GET', `/jobs/${jobId}`, { as: client });
          return ((await response.json()) as { status: string }).status;
        }),
      );
      return states.every((s) => s === 'done' || s === 'failed') ? states : null;
    }, 90_000);
    expect(finished).toEqual(['done', 'done', 'done', 'done']);
    // The queue's own record: one attempt each, none retried or duplicated.
    const [rows] = await owner.query(
      `SELECT data ->> 'jobId' AS "jobId", state, retry_count AS "retries"
         FROM pgboss.job WHERE name = 'evaluation.monte-carlo' AND data ->> 'jobId' IN (:ids)`,
      { replacements: { ids: started } },
    );
    expect(rows).toHaveLength(4);
    for (const row of rows as { state: string; retries: number }[]) {
      expect(row).toMatchObject({ state: 'completed', retries: 0 });
    }
  }, 120_000);
});

async function until<T>(probe: () => Promise<T>, timeoutMs = 30_000): Promise<NonNullable<T>> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await probe();
    if (value) return value as NonNullable<T>;
    if (Date.now() > deadline) throw new Error('gave up waiting');
    await new Promise((resolve) => setTimeout(resolve, 300));
  }
}
