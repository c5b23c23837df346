/**
 * List plans at scale: `npm run bench:lists` (node --import tsx tests/bench/list-plans.ts).
 *
 * Seeds a benchmark database (never the demo data: its own database on the test cluster,
 * dropped first) with one workspace holding 10,000 routes in 100 projects and 100,000
 * revisions (10 per route; one route carries 1,000), then runs the list queries exactly as
 * the services issue them (their SQL is captured from Sequelize), prints EXPLAIN (ANALYZE,
 * BUFFERS) for each and the median and p95 of 30 runs, and rewrites the "lists" section of
 * docs/performance.md. The plans must name the indexes; the script fails when one scans the
 * table instead.
 *
 * Needs the test cluster: TEST_PGPORT (default 54330); started like `npm test` does if it is
 * not running (server/scripts/lib.sh).
 */
import { execFileSync } from 'node:child_process';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { Sequelize } from 'sequelize';
import { runMigrations } from '../../server/db/migrator';
import { connectDatabase, closeDatabase, database } from '../../server/db/sequelize';
import { Route } from '../../server/models';
import { listRoutes } from '../../server/services/routes';
import { listRevisions } from '../../server/services/revisions';

const here = dirname(fileURLToPath(import.meta.url));
const root = join(here, '..', '..');
const port = Number(process.env.TEST_PGPORT ?? 54330);
const NAME = 'phasewright_bench_lists';
const ROUTES = 10_000;
const REVISIONS_PER_ROUTE = 10;
const BIG_ROUTE_REVISIONS = 1_000;
const RUNS = 30;

const adminUrl = (db = 'postgres') => `postgres://postgres@127.0.0.1:${port}/${db}`;

function ensureCluster(): void {
  execFileSync(
    'bash',
    [
      '-c',
      `source server/scripts/lib.sh; ensure_postgres_binaries; pg_up pg-test ${port} "-c fsync=off -c synchronous_commit=off"`,
    ],
    { cwd: root, stdio: ['ignore', 'ignore', 'inherit'] },
  );
}

async function seed(sequelize: Sequelize): Promise<{ workspaceId: string; bigRouteId: string }> {
  const one = async <T>(sql: string) => ((await sequelize.query(sql))[0] as T[])[0]!;
  const { id: workspaceId } = await one<{ id: string }>(
    `INSERT INTO workspaces (name, slug) VALUES ('Benchmark site (invented)', 'bench') RETURNING id`,
  );
  const { id: userId } = await one<{ id: string }>(
    `INSERT INTO users (email, name, password_hash) VALUES ('bench@example.com', 'Bench Chemist (invented)', 'x') RETURNING id`,
  );
  await sequelize.query(`
    INSERT INTO projects (workspace_id, name)
      SELECT '${workspaceId}', 'Project ' || lpad(g::text, 3, '0') || ' (invented)' FROM generate_series(1, 100) g;
    -- Every tenth route archived; names from a small vocabulary so searches hit a few hundred.
    INSERT INTO routes (workspace_id, project_id, name, owner_id, archived_at, created_at, updated_at)
      SELECT '${workspaceId}',
             (SELECT id FROM projects WHERE name = 'Project ' || lpad((1 + g % 100)::text, 3, '0') || ' (invented)'),
             (ARRAY['Amide', 'Ester', 'Salt', 'Acid', 'Base', 'Urea', 'Nitrile', 'Ketone'])[1 + g % 8]
               || ' isolation ' || g || ' (invented)',
             '${userId}',
             CASE WHEN g % 10 = 0 THEN now() ELSE NULL END,
             now() - (g || ' minutes')::interval, now() - (g || ' minutes')::interval
        FROM generate_series(1, ${ROUTES}) g;
    INSERT INTO route_drafts (route_id, document, version, step_count, updated_by_id, created_at, updated_at)
      SELECT id, '{}'::jsonb, 1, 0, '${userId}', created_at, updated_at FROM routes;
  `);
  const { id: bigRouteId } = await one<{ id: string }>(
    `SELECT id FROM routes WHERE archived_at IS NULL ORDER BY changed_at DESC LIMIT 1`,
  );
  await sequelize.query(`
    INSERT INTO route_revisions (route_id, workspace_id, number, message, document, engine_version, content_hash, draft_version, author_id)
      SELECT r.id, r.workspace_id, n, 'Revision ' || n || ' (invented)', '{}'::jsonb, 'bench', repeat('0', 64), 1, '${userId}'
        FROM routes r
        CROSS JOIN LATERAL generate_series(1, CASE WHEN r.id = '${bigRouteId}' THEN ${BIG_ROUTE_REVISIONS} ELSE ${REVISIONS_PER_ROUTE} END) n;
    ANALYZE;
  `);
  return { workspaceId, bigRouteId };
}

interface Case {
  name: string;
  run: () => Promise<unknown>;
  /** The indexes that may serve it: the plan must use one of them. */
  indexes: string[];
}

async function measure(c: Case, captured: string[]) {
  captured.length = 0;
  await c.run();
  const statements = captured.filter((sql) => /^Executing \(default\): SELECT/.test(sql));
  const sql = statements[0]!.replace(/^Executing \(default\): /, '');
  const [rows] = await database().query(`EXPLAIN (ANALYZE, BUFFERS) ${sql}`);
  const plan = (rows as Array<{ 'QUERY PLAN': string }>).map((r) => r['QUERY PLAN']).join('\n');
  const times: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    const start = process.hrtime.bigint();
    await c.run();
    times.push(Number(process.hrtime.bigint() - start) / 1e6);
  }
  times.sort((a, b) => a - b);
  const median = times[Math.floor(times.length / 2)]!;
  const p95 = times[Math.min(times.length - 1, Math.ceil(times.length * 0.95) - 1)]!;
  const used = c.indexes.find((index) => plan.includes(index));
  const sqlMs = Number(/Execution Time: ([\d.]+) ms/.exec(plan)?.[1] ?? NaN);
  return { plan, median, p95, used, sqlMs };
}

async function main(): Promise<void> {
  ensureCluster();
  const admin = new Sequelize(adminUrl(), { dialect: 'postgres', logging: false });
  await admin.query(`DROP DATABASE IF EXISTS ${NAME} WITH (FORCE)`);
  await admin.query(`CREATE DATABASE ${NAME}`);
  await admin.close();

  const captured: string[] = [];
  const sequelize = connectDatabase(adminUrl(NAME));
  await runMigrations(sequelize);
  const seedStart = Date.now();
  const { workspaceId, bigRouteId } = await seed(sequelize);
  const seedSeconds = (Date.now() - seedStart) / 1000;
  // Sequelize reads its logging option at each query: capture the SQL the services issue.
  const options = (sequelize as unknown as { options: { logging: unknown } }).options;
  options.logging = (sql: string) => captured.push(sql);

  const firstByName = await listRoutes(
    workspaceId,
    { archived: false, sort: 'name', limit: 50 },
    null,
  );
  const firstByChange = await listRoutes(
    workspaceId,
    { archived: false, sort: 'changed', limit: 50 },
    null,
  );
  const bigRoute = (await Route.findByPk(bigRouteId))!;
  const firstRevisions = await listRevisions(bigRoute, { limit: 50 }, false, null);

  const cases: Case[] = [
    {
      name: 'Routes, first page by last change',
      run: () => listRoutes(workspaceId, { archived: false, sort: 'changed', limit: 50 }, null),
      indexes: ['routes_current_changed_idx'],
    },
    {
      name: 'Routes, second page by last change (cursor)',
      run: () =>
        listRoutes(
          workspaceId,
          { archived: false, sort: 'changed', limit: 50, cursor: firstByChange.nextCursor! },
          null,
        ),
      indexes: ['routes_current_changed_idx'],
    },
    {
      name: 'Routes, first page by name',
      run: () => listRoutes(workspaceId, { archived: false, sort: 'name', limit: 50 }, null),
      indexes: ['routes_current_name_idx'],
    },
    {
      name: 'Routes, second page by name (cursor)',
      run: () =>
        listRoutes(
          workspaceId,
          { archived: false, sort: 'name', limit: 50, cursor: firstByName.nextCursor! },
          null,
        ),
      indexes: ['routes_current_name_idx'],
    },
    {
      name: 'Routes, archived, by last change',
      run: () => listRoutes(workspaceId, { archived: true, sort: 'changed', limit: 50 }, null),
      indexes: ['routes_archived_changed_idx'],
    },
    {
      name: 'Routes, search "isolation 77" by last change',
      run: () =>
        listRoutes(
          workspaceId,
          { archived: false, sort: 'changed', limit: 50, q: 'isolation 77' },
          null,
        ),
      indexes: ['routes_name_trgm_idx', 'routes_current_changed_idx'],
    },
    {
      name: 'Revisions of a route with 1,000, first page',
      run: () => listRevisions(bigRoute, { limit: 50 }, false, null),
      indexes: ['route_revisions_route_number_key'],
    },
    {
      name: 'Revisions of a route with 1,000, second page (cursor)',
      run: () =>
        listRevisions(bigRoute, { limit: 50, cursor: firstRevisions.nextCursor! }, false, null),
      indexes: ['route_revisions_route_number_key'],
    },
  ];

  const results = [];
  for (const c of cases) {
    const r = await measure(c, captured);
    results.push({ ...c, ...r });
    console.log(
      `\n## ${c.name}\n${r.plan}\nmedian ${r.median.toFixed(2)} ms, p95 ${r.p95.toFixed(2)} ms`,
    );
  }
  options.logging = false;
  await closeDatabase();

  const date = new Date().toISOString().slice(0, 10);
  const cpu = os.cpus()[0]?.model?.trim() ?? 'unknown CPU';
  const body = [
    `Run ${date} (load average ${os.loadavg()[0]!.toFixed(1)} when it ended) on ${os.type()} ${os.release()}, ${cpu} × ${os.cpus().length}, Node ${process.version}, PostgreSQL on loopback (fsync off), while other work shared the machine.`,
    `Benchmark database: one workspace, ${ROUTES.toLocaleString('en')} routes in 100 projects (every tenth archived), ${(ROUTES * REVISIONS_PER_ROUTE + BIG_ROUTE_REVISIONS - REVISIONS_PER_ROUTE).toLocaleString('en')} revisions (one route with ${BIG_ROUTE_REVISIONS.toLocaleString('en')}); seeded in ${seedSeconds.toFixed(0)} s. Times are the service call (SQL and row building, page of 50), ${RUNS} runs; target p95 ≤ 50 ms.`,
    '',
    '| List query | Index in the plan | SQL execution (ms, EXPLAIN ANALYZE) | Service median (ms) | Service p95 (ms) | p95 ≤ 50 ms |',
    '|---|---|---:|---:|---:|---|',
    ...results.map(
      (r) =>
        `| ${r.name} | ${r.used ?? `none of ${r.indexes.join(', ')}`} | ${r.sqlMs.toFixed(2)} | ${r.median.toFixed(1)} | ${r.p95.toFixed(1)} | ${r.p95 <= 50 ? 'yes' : 'NO'} |`,
    ),
    '',
    ...results.flatMap((r) => [
      `<details><summary>${r.name}</summary>`,
      '',
      '```',
      r.plan,
      '```',
      '',
      '</details>',
      '',
    ]),
  ].join('\n');
  // PERFORMANCE_DOC names another file to write (the doc itself by default).
  const doc = process.env.PERFORMANCE_DOC ?? join(root, 'docs', 'performance.md');
  const start = '<!-- bench:lists:start -->';
  const end = '<!-- bench:lists:end -->';
  const block = `${start}\n${body.trimEnd()}\n${end}`;
  let text = existsSync(doc) ? readFileSync(doc, 'utf8') : '# Performance\n';
  const i = text.indexOf(start);
  const j = text.indexOf(end);
  text =
    i >= 0 && j > i
      ? text.slice(0, i) + block + text.slice(j + end.length)
      : `${text.trimEnd()}\n\n## lists\n\nWritten by \`npm run bench:lists\` (tests/bench/list-plans.ts): the list queries at 10,000 routes and 100,000 revisions, with their plans.\n\n${block}\n`;
  writeFileSync(doc, text);
  console.log(`\nWrote the lists section of docs/performance.md.`);

  const admin2 = new Sequelize(adminUrl(), { dialect: 'postgres', logging: false });
  await admin2.query(`DROP DATABASE IF EXISTS ${NAME} WITH (FORCE)`);
  await admin2.close();
  if (results.some((r) => !r.used)) {
    console.error('A list query does not use its index: see the plans above.');
    process.exitCode = 1;
  }
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
