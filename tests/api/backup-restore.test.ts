/**
 * Backup and restore, as docs/deployment.md tells an operator to do it:
 * `npm run db:backup` (pg_dump, custom format), a wiped database,
 * `npm run db:restore`, and every draft and audit row reads back the same,
 * with the audit trail still append-only.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import pg from 'pg';
import { afterAll, describe, expect, it } from 'vitest';
import type { RouteDocumentInput } from '@shared/schemas/route';
import demoRoute from '../fixtures/routes/demo-amide-isolation.json';
import { useTestServer } from '../support/app';
import { buildMember, buildWorkspace, signIn } from '../support/factories';

const server = useTestServer();
const projectRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

const SNAPSHOTS = {
  drafts: `SELECT route_id, version, md5(document::text) AS document, md5(coalesce(totals::text, '')) AS totals, engine_version
           FROM route_drafts ORDER BY route_id`,
  audit: `SELECT id, workspace_id, actor_id, action, entity_type, entity_id,
                 md5(coalesce(before::text, '') || '|' || coalesce(after::text, '')) AS values, at
          FROM audit_events ORDER BY at, id`,
  routes: `SELECT id, workspace_id, name, archived_at FROM routes ORDER BY id`,
  users: `SELECT id, email, password_hash FROM users ORDER BY id`,
};

async function snapshot(url: string) {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    const out: Record<string, unknown[]> = {};
    for (const [name, sql] of Object.entries(SNAPSHOTS)) out[name] = (await client.query(sql)).rows;
    return out;
  } finally {
    await client.end();
  }
}

const npmScript = (script: string, args: string[], databaseUrl: string) =>
  execFileSync('bash', [`server/scripts/${script}.sh`, ...args], {
    cwd: projectRoot,
    env: { ...process.env, DATABASE_URL: databaseUrl, DATABASE_OWNER_URL: databaseUrl },
    stdio: ['ignore', 'pipe', 'pipe'],
    encoding: 'utf8',
  });

describe('backup and restore (npm run db:backup / db:restore)', () => {
  const restoredName = `phasewright_restore_${process.pid}`;
  // The cluster's superuser: it may create databases and restore any owner's objects.
  const superuser = (database: string) =>
    process.env
      .DATABASE_URL!.replace(/\/\/[^@]+@/, '//postgres@')
      .replace(/\/[^/]+$/, `/${database}`);
  const adminUrl = () => superuser('postgres');
  const liveUrl = () => superuser(new URL(process.env.DATABASE_URL!).pathname.slice(1));
  const restoredUrl = () => superuser(restoredName);
  const admin = async (sql: string) => {
    const client = new pg.Client({ connectionString: adminUrl() });
    await client.connect();
    await client.query(sql).finally(() => client.end());
  };

  afterAll(async () => {
    await admin(`DROP DATABASE IF EXISTS ${restoredName} WITH (FORCE)`);
  });

  it('dumps, restores into a wiped database, and every draft and audit row reads back the same', async () => {
    // Some history: a route with an evaluated draft saved twice, a compound, invitations.
    const workspace = await buildWorkspace();
    const chemist = await signIn(server.app, (await buildMember(workspace, ['chemist'])).email);
    const created = await chemist.agent
      .post(`/api/v1/workspaces/${workspace.id}/routes`)
      .set('X-CSRF-Token', chemist.csrfToken)
      .send({ name: 'Backed-up route (invented)', document: demoRoute as RouteDocumentInput });
    expect(created.status).toBe(201);
    const saved = await chemist.agent
      .put(`/api/v1/workspaces/${workspace.id}/routes/${created.body.id}/draft`)
      .set('X-CSRF-Token', chemist.csrfToken)
      .send({ document: demoRoute, baseVersion: 1 });
    expect(saved.status).toBe(200);

    const before = await snapshot(liveUrl());
    expect(before.drafts.length).toBeGreaterThan(0);
    expect(before.audit.length).toBeGreaterThan(2);

    const file = path.join(mkdtempSync(path.join(tmpdir(), 'phasewright-backup-')), 'db.dump');
    npmScript('backup', [file], liveUrl());

    // The wiped database: a new, empty one (the live test database stays in use).
    await admin(`DROP DATABASE IF EXISTS ${restoredName} WITH (FORCE)`);
    await admin(`CREATE DATABASE ${restoredName}`);
    npmScript('restore', [file], restoredUrl());

    const after = await snapshot(restoredUrl());
    expect(after).toEqual(before);

    // The restored audit trail is still append-only, and the migrations are recorded.
    const client = new pg.Client({ connectionString: restoredUrl() });
    await client.connect();
    try {
      await expect(client.query(`UPDATE audit_events SET action = 'tampered'`)).rejects.toThrow(
        /append-only/,
      );
      const migrations = await client.query(`SELECT name FROM "SequelizeMeta"`);
      expect(migrations.rowCount).toBeGreaterThan(3);
    } finally {
      await client.end();
    }

    // Restoring over a database that already has data is refused unless asked to replace it.
    expect(() => npmScript('restore', [file], restoredUrl())).toThrow();
    npmScript('restore', [file, '--replace'], restoredUrl());
    expect(await snapshot(restoredUrl())).toEqual(before);
  }, 180_000);
});
