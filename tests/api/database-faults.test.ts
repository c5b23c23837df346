/**
 * Database faults, against a PostgreSQL of this test's own (never the shared
 * test cluster): the server survives the database going away (no unhandled
 * 'error' event from any pool), answers 503 with a plain message meanwhile,
 * recovers by itself when the database is back, and never leaves a
 * half-written record when the database fails in the middle of a write.
 */
import { execFileSync } from 'node:child_process';
import net from 'node:net';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Express } from 'express';
import pg from 'pg';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp, type PhasewrightApp } from '../../server/app';
import { database } from '../../server/db/sequelize';
import { isDatabaseUnavailable } from '../../server/middleware/error-handler';
import { startRuntime, type Runtime } from '../../server/runtime';
import { Route } from '../../server/models';
import { testConfig } from '../support/app';
import { buildMember, buildWorkspace, signIn, type SignedIn } from '../support/factories';

const projectRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const CLUSTER = 'pg-fault';

function cluster(command: string): void {
  execFileSync(
    'bash',
    ['-c', `source server/scripts/lib.sh; ensure_postgres_binaries; ${command}`],
    { cwd: projectRoot, stdio: ['ignore', 'ignore', 'inherit'] },
  );
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as net.AddressInfo;
      server.close(() => resolve(port));
    });
  });
}

const stopDatabase = () => cluster(`pg_down "$(pg_cluster_dir ${CLUSTER})"`);
let port = 0;
const startDatabase = () => cluster(`pg_up ${CLUSTER} ${port} "-c fsync=off"`);

async function until<T>(probe: () => Promise<T>, done: (value: T) => boolean): Promise<T> {
  const deadline = Date.now() + 60_000;
  for (;;) {
    const value = await probe();
    if (done(value) || Date.now() > deadline) return value;
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
}

describe('database faults', () => {
  let runtime: Runtime;
  let built: PhasewrightApp;
  let app: Express;
  let asChemist: SignedIn;
  let workspaceId: string;
  const logged: unknown[] = [];

  beforeAll(async () => {
    port = await freePort();
    startDatabase();
    const admin = new pg.Client({
      connectionString: `postgres://postgres@127.0.0.1:${port}/postgres`,
    });
    await admin.connect();
    await admin.query('DROP DATABASE IF EXISTS phasewright_fault WITH (FORCE)');
    await admin.query('CREATE DATABASE phasewright_fault');
    await admin.end();
    const config = testConfig({
      DATABASE_URL: `postgres://postgres@127.0.0.1:${port}/phasewright_fault`,
      DATABASE_OWNER_URL: `postgres://postgres@127.0.0.1:${port}/phasewright_fault`,
      ENGINE_WORKERS: '1',
    });
    runtime = await startRuntime(config);
    built = createApp(config, { log: (error) => logged.push(error) });
    app = built.app;
    const workspace = await buildWorkspace();
    workspaceId = workspace.id;
    asChemist = await signIn(app, (await buildMember(workspace, ['chemist'])).email);
  }, 120_000);

  afterAll(async () => {
    await built?.close();
    await runtime?.close();
    stopDatabase();
  }, 60_000);

  const createRoute = (name: string) =>
    asChemist.agent
      .post(`/api/v1/workspaces/${workspaceId}/routes`)
      .set('X-CSRF-Token', asChemist.csrfToken)
      .send({ name });

  it('answers 503 while the database is away, and recovers by itself when it is back', async () => {
    expect((await asChemist.agent.get('/api/v1/session')).status).toBe(200);
    stopDatabase();

    const session = await asChemist.agent.get('/api/v1/session');
    expect(session.status).toBe(503);
    expect(session.body.error.code).toBe('database_unavailable');
    expect(session.body.error.message).toMatch(/database cannot be reached/);
    expect(session.headers['retry-after']).toBeDefined();
    const write = await createRoute('Written while the database is away (invented)');
    expect(write.status).toBe(503);
    const signedOut = await request(app).post('/api/v1/session').send({
      email: 'someone@example.com',
      password: 'whatever-it-is',
    });
    expect(signedOut.status).toBe(503);
    const health = await request(app).get('/api/v1/health');
    expect(health.status).toBe(503);
    expect(health.body).toEqual({ status: 'error', db: 'unreachable' });
    // Let the job queue's pollers and the pools meet the outage too.
    await new Promise((resolve) => setTimeout(resolve, 3000));

    startDatabase();
    const recovered = await until(
      () => request(app).get('/api/v1/health'),
      (response) => response.status === 200,
    );
    expect(recovered.status).toBe(200);
    // The same session (its row survived the restart) works again, and so do writes.
    const again = await until(
      () => asChemist.agent.get('/api/v1/session'),
      (response) => response.status === 200,
    );
    expect(again.status).toBe(200);
    const created = await createRoute('Written after the restart (invented)');
    expect(created.status).toBe(201);
    // Everything logged meanwhile was the outage itself, never a server fault.
    const unexplained = logged.flat().filter((error) => !isDatabaseUnavailable(error));
    expect(unexplained).toEqual([]);
  }, 120_000);

  it('leaves no half-written record when the database fails in the middle of a write', async () => {
    // The audit row is written last when a route is created; make that insert fail as a
    // connection lost by an administrator's shutdown would.
    await database().query(`
      CREATE FUNCTION fail_route_audit() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        IF NEW.action = 'route.create' THEN
          RAISE EXCEPTION 'simulated loss of the database' USING ERRCODE = 'admin_shutdown';
        END IF;
        RETURN NEW;
      END $$;
      CREATE TRIGGER fail_route_audit BEFORE INSERT ON audit_events
        FOR EACH ROW EXECUTE FUNCTION fail_route_audit();
    `);
    try {
      const name = 'Half-written route (invented)';
      const response = await createRoute(name);
      expect(response.status).toBe(503);
      expect(await Route.count({ where: { name } })).toBe(0);
      const [drafts] = await database().query(
        `SELECT count(*)::int AS n FROM route_drafts d LEFT JOIN routes r ON r.id = d.route_id WHERE r.id IS NULL`,
      );
      expect((drafts as { n: number }[])[0].n).toBe(0);
    } finally {
      await database().query(
        'DROP TRIGGER fail_route_audit ON audit_events; DROP FUNCTION fail_route_audit();',
      );
    }
  });
});
