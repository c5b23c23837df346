/**
 * List plans at scale: `npm run bench:lists` (node --import tsx tests/bench/list-plans.ts).
 *
 * Seeds a benchmark database (never the demo data: its own database on the test cluster,
 * dropped first) with one workspace holding 10,000 routes in 100 projects and 100,000
 * revisions (10 per route; one route carries 1,000), 2,000 members, 3,000 compounds, 1,000
 * pieces of equipment, 10,000 comments and 2,000 samples on the large route's revisions,
 * 20,000 audit events and 5,000 jobs of one user, then runs the list queries exactly as
 * the services issue them (their SQL is captured from Sequelize), prints EXPLAIN (ANALYZE,
 * BUFFERS) for each and the median and p95 of 30 runs, and rewrites the "lists" section of
 * docs/performance.md. The plans must name the indexes; the script fails when one scans the
 * table instead, and when a search (`q`) does not start from its trigram index.
 *
 * Needs the test cluster: TEST_PGPORT (default 54330); started like `npm test` does if it is
 * not running (server/scripts/lib.sh).
 */
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { Sequelize } from 'sequelize';
import { runMigrations } from '../../server/db/migrator';
import { connectDatabase, closeDatabase, database } from '../../server/db/sequelize';
import { Route, RouteRevision } from '../../server/models';
import { listAudit } from '../../server/services/audit';
import { listChromatograms } from '../../server/services/chromatograms';
import { listCompounds } from '../../server/services/compounds';
import { listEquipment } from '../../server/services/equipment';
import { listJobs } from '../../server/services/job-list';
import { listMembers } from '../../server/services/members';
import { listComments } from '../../server/services/reviews';
import { listProjects, listRoutes } from '../../server/services/routes';
import { listRevisions } from '../../server/services/revisions';
import { useTestCluster, type TestCluster } from './test-cluster';

const here = dirname(fileURLToPath(import.meta.url));
const root = join(here, '..', '..');
const port = Number(process.env.TEST_PGPORT ?? 54330);
const NAME = 'phasewright_bench_lists';
const ROUTES = 10_000;
const REVISIONS_PER_ROUTE = 10;
const BIG_ROUTE_REVISIONS = 1_000;
const RUNS = 30;
const MEMBERS = 10_000;
const EXTRA_PROJECTS = 5_000;
const COMPOUNDS = 20_000;
const EQUIPMENT = 1_000;
const COMMENTS = 50_000;
const SAMPLES = 2_000;
const AUDIT_EVENTS = 20_000;
const JOBS = 5_000;

const adminUrl = (db = 'postgres') => `postgres://postgres@127.0.0.1:${port}/${db}`;

async function seed(
  sequelize: Sequelize,
): Promise<{ workspaceId: string; bigRouteId: string; userId: string }> {
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

    INSERT INTO projects (workspace_id, name)
      SELECT '${workspaceId}', 'Closed project ' || g || ' (invented)' FROM generate_series(1, ${EXTRA_PROJECTS}) g;
    INSERT INTO users (email, name, password_hash)
      SELECT 'member' || g || '@example.com',
             (ARRAY['Ana', 'Bo', 'Chen', 'Dara', 'Eli'])[1 + g % 5] || ' Member ' || g || ' (invented)', 'x'
        FROM generate_series(1, ${MEMBERS}) g;
    INSERT INTO memberships (user_id, workspace_id, roles)
      SELECT id, '${workspaceId}', CASE WHEN random() < 0.2 THEN ARRAY['reviewer'] ELSE ARRAY['chemist'] END
        FROM users WHERE email LIKE 'member%';
    INSERT INTO memberships (user_id, workspace_id, roles) VALUES ('${userId}', '${workspaceId}', ARRAY['admin']);

    INSERT INTO compounds (workspace_id, name, role, smiles, canonical_smiles, formula, molar_mass_gmol, svg, unifac)
      SELECT '${workspaceId}', (ARRAY['Amide', 'Ester', 'Salt', 'Acid'])[1 + g % 4] || ' impurity ' || g || ' (invented)',
             'impurity', 'CCO', 'CCO', 'C2H6O', 46.07, '<svg/>', '{}'::jsonb
        FROM generate_series(1, ${COMPOUNDS}) g;

    INSERT INTO equipment (workspace_id, kind, name, area_m2, capacity_l)
      SELECT '${workspaceId}', CASE WHEN g % 2 = 0 THEN 'filter' ELSE 'dryer' END,
             'Unit ' || g || ' (invented)', 1 + g % 7, 100 + g % 900
        FROM generate_series(1, ${EQUIPMENT}) g;

    INSERT INTO review_comments (revision_id, workspace_id, author_id, body, created_at)
      SELECT (SELECT id FROM route_revisions WHERE route_id = '${bigRouteId}' AND number = ${BIG_ROUTE_REVISIONS}),
             '${workspaceId}', '${userId}', 'Check the wash volume of step ' || g || ' (invented)',
             now() - (g || ' seconds')::interval
        FROM generate_series(1, ${COMMENTS}) g;

    INSERT INTO chromatograms (workspace_id, route_id, step_id, sample_name, kind, content_type, file_name, size_bytes, storage_key, format, created_at)
      SELECT '${workspaceId}', '${bigRouteId}', 'step-' || (g % 10), 'IPC ' || g || ' (invented)', 'document',
             'application/pdf', 'ipc-' || g || '.pdf', 1000, 'bench/' || g, 'pdf', now() - (g || ' seconds')::interval
        FROM generate_series(1, ${SAMPLES}) g;

    INSERT INTO audit_events (workspace_id, actor_id, action, entity_type, entity_id)
      SELECT '${workspaceId}', '${userId}', (ARRAY['route.rename', 'route.create', 'compound.update', 'draft.save'])[1 + g % 4],
             (ARRAY['route', 'route', 'compound', 'route'])[1 + g % 4], g::text
        FROM generate_series(1, ${AUDIT_EVENTS}) g;

    -- Account events (sign-ins) of the members and of people of other workspaces.
    INSERT INTO audit_events (actor_id, action, entity_type, entity_id)
      SELECT id, 'session.signed_in', 'user', id::text FROM users;
    INSERT INTO evaluation_jobs (user_id, kind, status, input, created_at)
      SELECT '${userId}', CASE WHEN g % 3 = 0 THEN 'optimise' ELSE 'monte-carlo' END,
             CASE WHEN g % 50 = 0 THEN 'failed' WHEN g % 7 = 0 THEN 'cancelled' ELSE 'done' END, '{}'::jsonb,
             now() - (g || ' seconds')::interval
        FROM generate_series(1, ${JOBS}) g;
  `);
  // As autovacuum leaves a live database: statistics, and the trigram indexes' pending
  // entries merged and their own statistics written (the planner prices a GIN scan from them;
  // an index built empty and filled by inserts looks far dearer than it is until then).
  await sequelize.query('VACUUM ANALYZE');
  return { workspaceId, bigRouteId, userId };
}

interface Case {
  name: string;
  run: () => Promise<unknown>;
  /** The indexes that may serve it: the plan must use one of them. */
  indexes: string[];
  /** The table of the statement to explain, when the service issues more than one. */
  table?: string;
}

async function measure(c: Case, captured: string[]) {
  captured.length = 0;
  await c.run();
  const statements = captured
    .filter(
      (sql) =>
        /^Executing \(default\): SELECT/.test(sql) &&
        (!c.table || sql.includes(`FROM "${c.table}"`) || sql.includes('SELECT m.id FROM')),
    )
    .map((sql) => sql.replace(/^Executing \(default\): /, ''));
  // A search's look-up of its trigram matches (if any) and the list query that follows it;
  // otherwise the list query alone.
  const probe = statements.findIndex((sql) => sql.startsWith('SELECT m.id FROM'));
  const explained = probe >= 0 ? statements.slice(probe, probe + 2) : statements.slice(0, 1);
  const plans: string[] = [];
  for (const sql of explained) {
    const [rows] = await database().query(`EXPLAIN (ANALYZE, BUFFERS) ${sql}`);
    plans.push((rows as Array<{ 'QUERY PLAN': string }>).map((r) => r['QUERY PLAN']).join('\n'));
  }
  const plan = plans.join('\n-- then --\n');
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
  const sqlMs = [...plan.matchAll(/Execution Time: ([\d.]+) ms/g)].reduce(
    (sum, m) => sum + Number(m[1]),
    0,
  );
  return { plan, median, p95, used, sqlMs };
}

let cluster: TestCluster | undefined;

async function main(): Promise<void> {
  cluster = await useTestCluster(port);
  const admin = new Sequelize(adminUrl(), { dialect: 'postgres', logging: false });
  await admin.query(`DROP DATABASE IF EXISTS ${NAME} WITH (FORCE)`);
  await admin.query(`CREATE DATABASE ${NAME}`);
  await admin.close();

  const captured: string[] = [];
  const sequelize = connectDatabase(adminUrl(NAME));
  await runMigrations(sequelize);
  const seedStart = Date.now();
  const { workspaceId, bigRouteId, userId } = await seed(sequelize);
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
  const lastRevision = (await RouteRevision.findOne({
    where: { routeId: bigRouteId, number: BIG_ROUTE_REVISIONS },
  }))!;
  const page = { limit: 50 };
  const second = async <Q extends { limit: number; cursor?: string }>(
    list: (query: Q) => Promise<{ nextCursor: string | null }>,
    query: Q,
  ) => {
    const cursor = (await list(query)).nextCursor!;
    return () => list({ ...query, cursor });
  };
  const projects = (q: { limit: number; q?: string; cursor?: string }) =>
    listProjects(workspaceId, q, null);
  const compounds = (q: { limit: number; sort: 'name' | 'created'; q?: string; cursor?: string }) =>
    listCompounds(workspaceId, q, null);
  const members = (q: { limit: number; q?: string; role?: 'reviewer'; cursor?: string }) =>
    listMembers(workspaceId, q, null);
  const equipment = (q: { limit: number; sort: 'name' | 'size'; q?: string; cursor?: string }) =>
    listEquipment(workspaceId, q, null);
  const comments = (q: { limit: number; sort: 'oldest' | 'newest'; q?: string; cursor?: string }) =>
    listComments(lastRevision, q, null);
  const samples = (q: { limit: number; sort: 'oldest' | 'newest'; q?: string; cursor?: string }) =>
    listChromatograms(bigRoute, q, null);
  const audit = (q: { limit: number; q?: string; cursor?: string }) => listAudit(workspaceId, q);
  const jobs = (q: { limit: number; sort: 'newest' | 'oldest'; q?: string; cursor?: string }) =>
    listJobs(userId, q, null);
  const more: Case[] = [
    {
      name: 'Projects, second page by name (cursor)',
      run: await second(projects, page),
      indexes: ['projects_workspace_name_id_idx'],
    },
    {
      name: 'Projects, search "project 04"',
      run: () => projects({ ...page, q: 'project 04' }),
      // At 5,100 projects the planner may read the whole table for the look-up (a few ms)
      // rather than the trigram index; that is the one search allowed to.
      indexes: ['projects_name_trgm_idx', 'Seq Scan on projects s'],
    },
    {
      name: 'Compounds, second page by name (cursor)',
      run: await second(compounds, { ...page, sort: 'name' }),
      indexes: ['compounds_workspace_name_id_idx'],
    },
    {
      name: 'Compounds, second page newest first (cursor)',
      run: await second(compounds, { ...page, sort: 'created' }),
      indexes: ['compounds_workspace_created_idx'],
    },
    {
      name: 'Compounds, search "impurity 12"',
      run: () => compounds({ ...page, sort: 'name', q: 'impurity 12' }),
      // 1,111 matches: dense, so the page comes from the order walk.
      indexes: ['compounds_name_trgm_idx', 'compounds_workspace_name_id_idx'],
    },
    {
      name: 'Members, second page by name (cursor)',
      run: await second(members, page),
      indexes: ['users_name_id_idx', 'memberships_workspace_idx'],
    },
    {
      name: 'Members, search "member 77"',
      run: () => members({ ...page, q: 'member 77' }),
      indexes: ['users_name_trgm_idx', 'users_email_trgm_idx'],
    },
    {
      name: 'Equipment, second page by name (cursor)',
      run: await second(equipment, { ...page, sort: 'name' }),
      indexes: ['equipment_workspace_kind_name_idx'],
    },
    {
      name: 'Equipment, second page largest first (cursor)',
      run: await second(equipment, { ...page, sort: 'size' }),
      indexes: ['equipment_workspace_kind_size_idx'],
    },
    {
      name: 'Comments on a revision with 50,000, second page (cursor)',
      run: await second(comments, { ...page, sort: 'oldest' }),
      indexes: ['review_comments_revision_created_idx'],
    },
    {
      name: 'Comments, search "step 77"',
      run: () => comments({ ...page, sort: 'oldest', q: 'step 77' }),
      indexes: ['review_comments_body_trgm_idx'],
    },
    {
      name: 'Comments, search "wash" (every one of the 50,000 matches)',
      run: () => comments({ ...page, sort: 'oldest', q: 'wash' }),
      indexes: ['review_comments_revision_created_idx'],
    },
    {
      name: 'Samples of a route with 2,000, second page newest first (cursor)',
      run: await second(samples, { ...page, sort: 'newest' }),
      indexes: ['chromatograms_route_idx'],
    },
    {
      name: 'Audit trail of 20,000 events, second page (cursor)',
      run: await second(audit, page),
      indexes: ['audit_events_workspace_at_id_idx', 'audit_events_account_at_idx'],
      table: 'audit_events',
    },
    {
      name: 'Audit trail, search "rename"',
      run: () => audit({ ...page, q: 'rename' }),
      // 5,000 matches: dense, so the page comes from the order walk.
      indexes: ['audit_events_action_trgm_idx', 'audit_events_workspace_at_id_idx'],
      table: 'audit_events',
    },
    {
      name: 'Jobs of a user with 5,000, second page (cursor)',
      run: await second(jobs, { ...page, sort: 'newest' }),
      indexes: ['evaluation_jobs_user_created_idx'],
    },
    {
      name: 'Jobs of a user with 5,000, search "failed"',
      // 100 matches: few, so the page starts from the trigram matches.
      run: () => jobs({ ...page, sort: 'newest', q: 'failed' }),
      indexes: ['evaluation_jobs_search_trgm_idx'],
      table: 'evaluation_jobs',
    },
  ];

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
      indexes: ['routes_name_trgm_idx'],
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
    ...more,
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
    `Benchmark database: one workspace, ${ROUTES.toLocaleString('en')} routes in 100 projects (every tenth archived), ${(ROUTES * REVISIONS_PER_ROUTE + BIG_ROUTE_REVISIONS - REVISIONS_PER_ROUTE).toLocaleString('en')} revisions (one route with ${BIG_ROUTE_REVISIONS.toLocaleString('en')}), ${MEMBERS.toLocaleString('en')} members, ${COMPOUNDS.toLocaleString('en')} compounds, ${(100 + EXTRA_PROJECTS).toLocaleString('en')} projects, ${EQUIPMENT.toLocaleString('en')} filters and dryers, ${COMMENTS.toLocaleString('en')} comments and ${SAMPLES.toLocaleString('en')} samples on the large route, ${AUDIT_EVENTS.toLocaleString('en')} audit events and a sign-in of each person, ${JOBS.toLocaleString('en')} jobs of one user; seeded in ${seedSeconds.toFixed(0)} s. Times are the service call (SQL and row building, page of 50), ${RUNS} runs; target p95 ≤ 50 ms.`,
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
  cluster.stop();
  if (results.some((r) => !r.used)) {
    console.error('A list query does not use its index: see the plans above.');
    process.exitCode = 1;
  }
}

main().catch((error: unknown) => {
  console.error(error);
  cluster?.stop();
  process.exit(1);
});
