import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import net from 'node:net';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import pg from 'pg';
import type { TestProject } from 'vitest/node';

declare module 'vitest' {
  export interface ProvidedContext {
    /** The server's own role (owns nothing). */
    databaseUrl: string;
    /** The role that owns the schema and runs migrations. */
    databaseOwnerUrl: string;
  }
}

const projectRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const port = Number(process.env.TEST_PGPORT ?? 54330);
const adminUrl = `postgres://postgres@127.0.0.1:${port}/postgres`;

function answers(host: string, tcpPort: number): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = net.connect({ host, port: tcpPort });
    socket.setTimeout(1_000);
    socket.once('connect', () => {
      socket.destroy();
      resolve(true);
    });
    socket.once('timeout', () => {
      socket.destroy();
      resolve(false);
    });
    socket.once('error', () => resolve(false));
  });
}

function clusterScript(body: string): void {
  execFileSync('bash', ['-c', `source server/scripts/lib.sh; ensure_postgres_binaries; ${body}`], {
    cwd: projectRoot,
    stdio: ['ignore', 'inherit', 'inherit'],
  });
}

async function adminQuery(sql: string): Promise<void> {
  const client = new pg.Client({ connectionString: adminUrl });
  await client.connect();
  try {
    await client.query(sql);
  } finally {
    await client.end();
  }
}

/**
 * Gives every test run its own database on the test cluster (starting the
 * cluster when nothing answers), so several people can run the suites at once
 * and the demo data is never touched.
 */
export default async function setup(project: TestProject) {
  let startedCluster = false;
  if (!(await answers('127.0.0.1', port))) {
    clusterScript(
      `pg_up pg-test ${port} "-c fsync=off -c synchronous_commit=off -c max_connections=200"`,
    );
    startedCluster = true;
  }
  const databaseName = `phasewright_test_${process.pid}_${randomBytes(4).toString('hex')}`;
  // The same two roles as `npm start` makes: the owner runs migrations, the server's role owns nothing.
  await adminQuery(readFileSync(path.join(projectRoot, 'server/scripts/roles.sql'), 'utf8'));
  await adminQuery(`CREATE DATABASE ${databaseName} OWNER phasewright_owner`);
  const databaseUrl = `postgres://phasewright_app@127.0.0.1:${port}/${databaseName}`;
  const databaseOwnerUrl = `postgres://phasewright_owner@127.0.0.1:${port}/${databaseName}`;

  // Migrate once here so each test file starts from the current schema.
  const { openRoleConnection, grantServerRole } = await import('../../server/db/roles');
  const { runMigrations } = await import('../../server/db/migrator');
  const { prepareJobQueue } = await import('../../server/services/jobs');
  const owner = openRoleConnection(databaseOwnerUrl);
  await runMigrations(owner);
  await prepareJobQueue(databaseOwnerUrl);
  await grantServerRole(owner, databaseUrl);
  await owner.close();

  project.provide('databaseUrl', databaseUrl);
  project.provide('databaseOwnerUrl', databaseOwnerUrl);

  return async () => {
    // With several projects in one run, the project that started the cluster may have stopped it
    // already; the throwaway cluster then took this database with it.
    if (await answers('127.0.0.1', port))
      await adminQuery(`DROP DATABASE IF EXISTS ${databaseName} WITH (FORCE)`);
    if (startedCluster) clusterScript(`pg_down "$(pg_cluster_dir pg-test)"`);
  };
}
