/**
 * Load benchmark: `npm run bench:load` (node --import tsx tests/bench/load.ts).
 *
 * Runs the compiled server as production runs it (`node --max-semi-space-size=4 --expose-gc
 * dist-server/index.js`, NODE_ENV production) against a database of its own on the test
 * cluster (TEST_PGPORT, default 54330; dropped first, never the demo data), signs in 50 chemists (one session each) and measures
 * with autocannon, 50 connections, one per signed-in user:
 *
 * - a bare Express endpoint (GET returning a small JSON object) in its own process, the
 *   baseline every figure is also given as a ratio to, measured in the same run;
 * - the health check with a session cookie; reading the 30-step route; the first page of the
 *   routes list (60 routes); POST /api/v1/evaluate of the 30-step route, once the same route
 *   again and again (its steps come from each worker's step memo) and once a route no worker has
 *   seen on every request (all 30 steps evaluated; the figure the 150 requests/s target is for);
 * - the same three with two server processes on two ports against the one database (25
 *   connections each, rates summed);
 * - the resident memory (RSS) of an idle server and of the bare process: before its first
 *   evaluation, idle once it has evaluated, after the load, and once its engine threads have
 *   been retired for idleness (ENGINE_IDLE_SECONDS, LOAD_IDLE_SECONDS here, default 60).
 *
 * Prints the figures and rewrites the "load" section of docs/performance.md and the figures
 * block of docs/deployment.md. Targets (issue): route and list ≥ 30 % of the bare rate with
 * p99 ≤ 100 ms and no errors; evaluate ≥ 150 requests/s; idle RSS ≤ 120 MB.
 * LOAD_SECONDS sets the length of each measurement (default 10).
 *
 * For finding where the time goes: LOAD_ONLY=health,route,list measures only those loads on one
 * instance (and rewrites no document; the names are the keys of `loads` below: bare, health,
 * route, list, evaluate, evaluateNew), each with the server's processor time per request (and the
 * bare process's), which a loaded machine disturbs less than the rates, split between its main
 * thread and its other threads (the engine pool's, garbage collection's) beside the load
 * generator's, each failure's status and error code, and the server's RSS before and after;
 * `idle` in the list also waits for the engine threads to retire and prints the RSS then;
 * LOAD_HEAPSNAPSHOT=folder writes a heap snapshot of the server's main thread there at the end;
 * LOAD_PROFILE=folder starts the server with --cpu-prof and
 * writes its CPU profile (.cpuprofile, open in a browser's developer tools) there on shutdown;
 * LOAD_SERVER_ROOT=folder measures the server of another checkout of the product (compiled there).
 */
import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import { existsSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import autocannon from 'autocannon';
import pg from 'pg';
import { hashPassword } from '../../server/services/passwords';
import { BENCH_WEIGHTS, generateRoute } from '../fixtures/routes/generate';
import { useTestCluster, type TestCluster } from './test-cluster';

const here = dirname(fileURLToPath(import.meta.url));
const root = join(here, '..', '..');
const pgPort = Number(process.env.TEST_PGPORT ?? 54330);
const DB = 'phasewright_bench_load';
const USERS = 50;
const ROUTES = 60;
const SECONDS = Number(process.env.LOAD_SECONDS ?? 10);
const BASE_PORT = Number(process.env.LOAD_PORT ?? 3900);
const PASSWORD = 'bench-password-invented';
/** The engine threads' idle time before retirement (the server's default). */
const IDLE_SECONDS = Number(process.env.LOAD_IDLE_SECONDS ?? 60);
/**
 * The V8 flags of the start command (server/scripts/start.sh, docs/deployment.md): the server is
 * measured as it is run.
 */
const NODE_FLAGS = ['--max-semi-space-size=4', '--expose-gc'];
const ONLY = process.env.LOAD_ONLY?.split(',').filter(Boolean);
const PROFILE_DIR = process.env.LOAD_PROFILE;
/**
 * A folder: the server is started with --heapsnapshot-signal=SIGUSR2 and, at the end of a
 * LOAD_ONLY run, writes a heap snapshot of its main thread there (open it in a browser's
 * developer tools, Memory tab) to see what it keeps.
 */
const SNAPSHOT_DIR = process.env.LOAD_HEAPSNAPSHOT;
/** Measure the server compiled in another checkout (its dist-server/), e.g. the previous commit. */
const SERVER_ROOT = process.env.LOAD_SERVER_ROOT ?? root;

const adminUrl = (db = 'postgres') => `postgres://postgres@127.0.0.1:${pgPort}/${db}`;
const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

function shell(script: string): void {
  execFileSync('bash', ['-c', `source server/scripts/lib.sh; ${script}`], {
    cwd: root,
    stdio: ['ignore', 'ignore', 'inherit'],
  });
}

async function adminQuery(sql: string, db = 'postgres'): Promise<pg.QueryResult> {
  const client = new pg.Client({ connectionString: adminUrl(db) });
  await client.connect();
  try {
    return await client.query(sql);
  } finally {
    await client.end();
  }
}

const children: ChildProcess[] = [];
function stopChildren(): void {
  for (const child of children) if (child.exitCode === null) child.kill('SIGTERM');
}
process.on('exit', stopChildren);

async function waitFor(url: string, child: ChildProcess): Promise<void> {
  for (let i = 0; i < 600; i++) {
    if (child.exitCode !== null) throw new Error(`${url}: the process exited (${child.exitCode})`);
    try {
      if ((await fetch(url)).ok) return;
    } catch {
      // not listening yet
    }
    await sleep(100);
  }
  throw new Error(`${url} did not answer within 60 s`);
}

function startServer(port: number): ChildProcess {
  const profile = PROFILE_DIR ? ['--cpu-prof', `--cpu-prof-dir=${PROFILE_DIR}`] : [];
  const snapshot = SNAPSHOT_DIR
    ? ['--heapsnapshot-signal=SIGUSR2', `--diagnostic-dir=${SNAPSHOT_DIR}`]
    : [];
  const child = spawn('node', [...NODE_FLAGS, ...profile, ...snapshot, 'dist-server/index.js'], {
    cwd: SERVER_ROOT,
    env: {
      ...process.env,
      NODE_ENV: 'production',
      PORT: String(port),
      HOST: '127.0.0.1',
      DATABASE_URL: `postgres://phasewright_app@127.0.0.1:${pgPort}/${DB}`,
      DATABASE_OWNER_URL: `postgres://phasewright_owner@127.0.0.1:${pgPort}/${DB}`,
      SESSION_SECRET: 'bench-session-secret-invented-0123456789',
      // 50 sign-ins from one address in a few seconds: the bench signs in, it does not attack.
      SIGN_IN_RATE_LIMIT: '100000',
      PHASEWRIGHT_SEED_DEMO: '',
      STORAGE_DRIVER: 'local',
      FILES_DIR: join(root, '.data', 'bench-load-files'),
      ENGINE_IDLE_SECONDS: String(IDLE_SECONDS),
    },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  children.push(child);
  return child;
}

function startBare(port: number): ChildProcess {
  const source = `
    import express from 'express';
    const app = express();
    app.get('/bare', (req, res) => res.json({ ok: true, at: Date.now() }));
    app.listen(${port}, '127.0.0.1');
  `;
  const child = spawn('node', ['--input-type=module', '-e', source], {
    cwd: root,
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  children.push(child);
  return child;
}

/** SIGTERM and wait for the exit (the server writes its CPU profile as it exits). */
async function stopAndWait(child: ChildProcess): Promise<void> {
  if (child.exitCode !== null) return;
  const exited = new Promise((resolve) => child.once('exit', resolve));
  child.kill('SIGTERM');
  await exited;
}

/** Asks the server for a heap snapshot (SIGUSR2) and waits until it is written. */
async function heapSnapshot(child: ChildProcess): Promise<void> {
  const count = () => readdirSync(SNAPSHOT_DIR!).filter((f) => f.endsWith('.heapsnapshot'));
  const before = count().length;
  child.kill('SIGUSR2');
  for (let i = 0; i < 600 && count().length === before; i++) await sleep(100);
  // The file appears when writing starts; its size settles when it is done.
  let size = -1;
  for (let i = 0; i < 600; i++) {
    const files = count().map((f) => statSync(join(SNAPSHOT_DIR!, f)).size);
    const now = files.reduce((a, b) => a + b, 0);
    if (now === size) break;
    size = now;
    await sleep(500);
  }
  console.log(`heap snapshot written to ${SNAPSHOT_DIR}`);
}

/** CPU time of each thread of a process so far, ms, by thread id (Linux /proc). */
function threadCpuMs(pid: number): Map<number, number> {
  const tick = 1000 / 100; // USER_HZ is 100 on Linux
  const threads = new Map<number, number>();
  for (const tid of readdirSync(`/proc/${pid}/task`)) {
    try {
      const stat = readFileSync(`/proc/${pid}/task/${tid}/stat`, 'utf8');
      const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
      threads.set(Number(tid), (Number(fields[11]) + Number(fields[12])) * tick);
    } catch {
      // the thread ended meanwhile
    }
  }
  return threads;
}

/** Waits (up to a minute) until the process uses less than a tenth of a core. */
async function quiet(pid: number): Promise<void> {
  const sum = () => [...threadCpuMs(pid).values()].reduce((a, b) => a + b, 0);
  let last = sum();
  for (let i = 0; i < 120; i++) {
    await sleep(500);
    const now = sum();
    if (now - last < 50) return;
    last = now;
  }
}

/**
 * Where the CPU went per request during one load: the server's main thread (HTTP, session,
 * validation, hand-off), its other threads by use (the engine pool's workers are the busiest;
 * then V8's garbage-collection helpers and libuv's pool) and the load generator (this process).
 */
function cpuPerRequest(
  before: Map<number, number>,
  after: Map<number, number>,
  pid: number,
  generatorMs: number,
  requests: number,
): string {
  const per = (ms: number) => (ms / Math.max(1, requests)).toFixed(1);
  const used = [...after].map(([tid, ms]) => [tid, ms - (before.get(tid) ?? 0)] as const);
  const main = used.find(([tid]) => tid === pid)?.[1] ?? 0;
  const others = used
    .filter(([tid, ms]) => tid !== pid && ms > 0)
    .map(([, ms]) => ms)
    .sort((a, b) => b - a);
  const total = main + others.reduce((a, b) => a + b, 0);
  return `CPU per request: server ${per(total)} ms (main thread ${per(main)} ms; other threads ${others.map(per).join(' + ')} ms), load generator ${per(generatorMs)} ms`;
}

const rssMb = (pid: number) => {
  const status = readFileSync(`/proc/${pid}/status`, 'utf8');
  return Number(/VmRSS:\s+(\d+) kB/.exec(status)![1]) / 1024;
};

/** User plus system processor time of a process so far (ms), from /proc. */
const cpuMs = (pid: number) => {
  const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1]!.split(' ');
  // utime and stime are fields 14 and 15 of the line (11 and 12 after the command name).
  return ((Number(fields[11]) + Number(fields[12])) * 1000) / CLOCK_TICKS;
};
/** The kernel's clock ticks per second (USER_HZ), 100 on Linux. */
const CLOCK_TICKS = 100;

interface User {
  cookie: string;
  csrf: string;
}

async function signIn(base: string, email: string): Promise<User> {
  const reply = await fetch(`${base}/api/v1/session`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email, password: PASSWORD }),
  });
  if (!reply.ok) throw new Error(`sign-in ${email}: ${reply.status} ${await reply.text()}`);
  const cookie = reply.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');
  const body = (await reply.json()) as { csrfToken: string };
  return { cookie, csrf: body.csrfToken };
}

interface Figure {
  name: string;
  rps: number;
  p50: number;
  p99: number;
  errors: number;
  non2xx: number;
  requests: number;
  /** Requests sent (those still unanswered when the run ended included). */
  sent: number;
  /** What the failures were: "timed out", or each refusal's status and error code, with counts. */
  failures: string;
}

interface Load {
  name: string;
  method: 'GET' | 'POST';
  path: string;
  body?: string;
  /** A new body for each request (instead of `body`). */
  bodyFor?: () => string;
  signedIn: boolean;
}

/** One autocannon run; each connection keeps one user's session. */
async function measure(
  load: Load,
  targets: Array<{ base: string; users: User[] }>,
  connections = USERS,
  seconds = SECONDS,
): Promise<Figure> {
  const perTarget = Math.round(connections / targets.length);
  // Each refusal by its status and error code (the body of an error reply names it).
  const refusals = new Map<string, number>();
  const onResponse = (status: number, body: string) => {
    if (status < 400) return;
    let code = '';
    try {
      code = (JSON.parse(body) as { error?: { code?: string } }).error?.code ?? '';
    } catch {
      // not an error reply of the API
    }
    const key = code ? `${status} ${code}` : String(status);
    refusals.set(key, (refusals.get(key) ?? 0) + 1);
  };
  const results = await Promise.all(
    targets.map(({ base, users }) => {
      let next = 0;
      return autocannon({
        url: base,
        connections: perTarget,
        duration: seconds,
        requests: [
          {
            method: load.method,
            path: load.path,
            ...(load.body ? { body: load.body } : {}),
            onResponse,
            setupRequest: (request: autocannon.Request) => {
              if (!load.signedIn) return request;
              // One user per connection, for the whole run: autocannon clears a connection's
              // context after every request (its list of requests has one), so the user's
              // number is kept in the connection's own copy of the request headers, which it
              // carries from one request to the next. (Picking a user per request instead gives
              // a slow user a second and third calculation at once, which the per-person limit
              // refuses with 429 too_many_evaluations: not what 50 chemists at their desks do.)
              const headers = request.headers as Record<string, string>;
              headers['x-load-user'] ??= String(next++ % users.length);
              const user = users[Number(headers['x-load-user'])]!;
              return {
                ...request,
                ...(load.bodyFor ? { body: load.bodyFor() } : {}),
                headers: {
                  ...headers,
                  cookie: user.cookie,
                  'x-csrf-token': user.csrf,
                  ...(load.body || load.bodyFor ? { 'content-type': 'application/json' } : {}),
                },
              };
            },
          },
        ],
      });
    }),
  );
  const total = (pick: (r: autocannon.Result) => number) =>
    results.reduce((sum, r) => sum + pick(r), 0);
  const worst = (pick: (r: autocannon.Result) => number) => Math.max(...results.map(pick));
  return {
    name: load.name,
    rps: total((r) => r.requests.average),
    p50: worst((r) => r.latency.p50),
    p99: worst((r) => r.latency.p99),
    // autocannon counts a timeout among its errors too.
    errors: total((r) => r.errors),
    non2xx: total((r) => r.non2xx),
    requests: total((r) => r.requests.total),
    sent: total((r) => r.requests.sent),
    failures: [
      ...(total((r) => r.timeouts) ? [`${total((r) => r.timeouts)} timed out`] : []),
      ...(total((r) => r.errors - r.timeouts)
        ? [`${total((r) => r.errors - r.timeouts)} connection errors`]
        : []),
      ...[...refusals].map(([key, count]) => `${count} × ${key}`),
    ].join(', '),
  };
}

let cluster: TestCluster | undefined;

async function prepareDatabase(): Promise<void> {
  cluster = await useTestCluster(pgPort);
  await adminQuery(`DROP DATABASE IF EXISTS ${DB} WITH (FORCE)`);
  shell(`ensure_postgres_binaries; pg_createdb ${pgPort} ${DB}`);
}

async function seedPeople(): Promise<{ workspaceId: string; emails: string[] }> {
  const hash = await hashPassword(PASSWORD);
  const client = new pg.Client({ connectionString: adminUrl(DB) });
  await client.connect();
  try {
    const workspace = await client.query(
      `INSERT INTO workspaces (name, slug) VALUES ('Load test group (invented)', 'load-test') RETURNING id`,
    );
    const workspaceId = workspace.rows[0].id as string;
    const emails = Array.from({ length: USERS }, (_, i) => `load-chemist-${i}@example.com`);
    for (const [i, email] of emails.entries()) {
      const user = await client.query(
        `INSERT INTO users (email, name, password_hash) VALUES ($1, $2, $3) RETURNING id`,
        [email, `Load Chemist ${i} (invented)`, hash],
      );
      await client.query(
        `INSERT INTO memberships (user_id, workspace_id, roles) VALUES ($1, $2, ARRAY['chemist'])`,
        [user.rows[0].id, workspaceId],
      );
    }
    return { workspaceId, emails };
  } finally {
    await client.end();
  }
}

const fmt = (n: number, digits = 0) => n.toFixed(digits);

async function main(): Promise<void> {
  console.log('preparing the database and compiling the server');
  await prepareDatabase();
  execFileSync('node', ['server/build/server.mjs'], { cwd: SERVER_ROOT, stdio: 'ignore' });

  const ports = [BASE_PORT, BASE_PORT + 1];
  const barePort = BASE_PORT + 2;
  const bases = ports.map((p) => `http://127.0.0.1:${p}`);
  const first = startServer(ports[0]!);
  await waitFor(`${bases[0]}/api/v1/health`, first);
  const bare = startBare(barePort);
  const bareBase = `http://127.0.0.1:${barePort}`;
  await waitFor(`${bareBase}/bare`, bare);

  const { workspaceId, emails } = await seedPeople();
  const users: User[] = [];
  for (const email of emails) users.push(await signIn(bases[0]!, email));

  // The 30-step route of the engine benchmark (tests/bench/route.bench.ts), 10 components.
  const make = (compounds: number) =>
    generateRoute({ seed: 11, steps: 30, compounds, weights: BENCH_WEIGHTS });
  const document = make(Math.max(1, 10 - (make(1).components.length - 1)));
  let fresh = 0;
  const freshBody = firstVolumeBodies(document);
  let routeId = '';
  for (let i = 0; i < ROUTES; i++) {
    const user = users[i % users.length]!;
    const reply = await fetch(`${bases[0]}/api/v1/workspaces/${workspaceId}/routes`, {
      method: 'POST',
      headers: {
        'content-type': 'application/json',
        cookie: user.cookie,
        'x-csrf-token': user.csrf,
      },
      body: JSON.stringify({ name: `Load route ${i} (invented)`, document }),
    });
    if (reply.status !== 201)
      throw new Error(`create route: ${reply.status} ${await reply.text()}`);
    routeId ||= ((await reply.json()) as { id: string }).id;
  }

  // Idle after seeding, before any load: creating the routes evaluated them, so the engine
  // threads are up.
  await sleep(5000);
  const idleRss = rssMb(first.pid!);
  const bareRss = rssMb(bare.pid!);

  const loads: Record<string, Load> = {
    bare: { name: 'Bare Express GET', method: 'GET', path: '/bare', signedIn: false },
    health: {
      name: 'Health check with a session cookie',
      method: 'GET',
      path: '/api/v1/health',
      signedIn: true,
    },
    route: {
      name: 'Read the 30-step route',
      method: 'GET',
      path: `/api/v1/workspaces/${workspaceId}/routes/${routeId}`,
      signedIn: true,
    },
    list: {
      name: 'Routes list, first page',
      method: 'GET',
      path: `/api/v1/workspaces/${workspaceId}/routes`,
      signedIn: true,
    },
    // The same route again and again: each engine worker answers its steps from its step memo.
    evaluate: {
      name: 'POST /evaluate, 30-step route, repeated (steps reused)',
      method: 'POST',
      path: '/api/v1/evaluate',
      body: JSON.stringify({ document }),
      signedIn: true,
    },
    // Each request a route no worker has seen: the first charge's solvent volume moves by a
    // hair, so every stream differs and all 30 steps are evaluated.
    evaluateNew: {
      name: 'POST /evaluate, 30-step route, every step new',
      method: 'POST',
      path: '/api/v1/evaluate',
      bodyFor: () => freshBody(++fresh),
      signedIn: true,
    },
  };
  const one = [{ base: bases[0]!, users }];
  const bareTarget = [{ base: bareBase, users: [] }];

  if (ONLY) {
    const measured = ONLY.filter((key) => key !== 'idle');
    console.log(`server RSS ${fmt(rssMb(first.pid!))} MB idle before the load`);
    await measure(loads[measured[0]!]!, one, USERS, 2);
    const bareCpu = cpuMs(bare.pid!);
    const bareOnly = await measure(loads.bare!, bareTarget);
    console.log(
      `${bareOnly.name}: ${fmt(bareOnly.rps)}/s, p99 ${fmt(bareOnly.p99)} ms, CPU ${fmt((cpuMs(bare.pid!) - bareCpu) / bareOnly.requests, 3)} ms per request`,
    );
    for (const key of measured) {
      const threadsBefore = threadCpuMs(first.pid!);
      const generatorBefore = process.cpuUsage();
      const figure = await measure(loads[key]!, one);
      const generator = process.cpuUsage(generatorBefore);
      // The requests still unanswered when the run ended are worked on after it: wait for the
      // server to go quiet, then share its CPU among every request sent.
      await quiet(first.pid!);
      console.log(
        cpuPerRequest(
          threadsBefore,
          threadCpuMs(first.pid!),
          first.pid!,
          (generator.user + generator.system) / 1000,
          figure.sent,
        ),
      );
      console.log(
        `${figure.name}: ${fmt(figure.rps)}/s (${fmt((100 * figure.rps) / bareOnly.rps, 1)} % of bare ${fmt(bareOnly.rps)}/s), p50 ${fmt(figure.p50)} ms, p99 ${fmt(figure.p99)} ms, ${figure.errors + figure.non2xx} errors of ${figure.requests}${figure.failures ? ` (${figure.failures})` : ''}`,
      );
    }
    console.log(`server RSS ${fmt(rssMb(first.pid!))} MB after the load`);
    if (ONLY.includes('idle')) {
      // Every 5 s until well past the engine threads' retirement.
      const series: string[] = [];
      for (let s = 5; s <= IDLE_SECONDS + 30; s += 5) {
        await sleep(5000);
        series.push(`${s} s ${fmt(rssMb(first.pid!))}`);
      }
      console.log(
        `server RSS while idle (engine threads retire after ${IDLE_SECONDS} s), MB: ${series.join(', ')}`,
      );
    }
    if (SNAPSHOT_DIR) await heapSnapshot(first);
    await stopAndWait(first);
    stopChildren();
    await adminQuery(`DROP DATABASE IF EXISTS ${DB} WITH (FORCE)`);
    cluster?.stop();
    return;
  }

  console.log('warming up');
  await measure(loads.route!, one, USERS, 2);
  await measure(loads.evaluate!, one, USERS, 2);
  await measure(loads.evaluateNew!, one, USERS, 2);

  const oneInstance: Figure[] = [];
  const bareOne = await measure(loads.bare!, bareTarget);
  for (const key of ['health', 'route', 'list', 'evaluate', 'evaluateNew'])
    oneInstance.push(await measure(loads[key]!, one));
  const busyRss = rssMb(first.pid!);

  console.log('starting the second instance');
  const second = startServer(ports[1]!);
  await waitFor(`${bases[1]}/api/v1/health`, second);
  // Idle and never asked for an evaluation: the engine pool has not started its threads.
  await sleep(3000);
  const freshRss = rssMb(second.pid!);
  const two = bases.map((base) => ({ base, users }));
  // A session made on one instance works on the other: the same users, the same cookies.
  const twoInstances: Figure[] = [];
  const bareTwo = await measure(loads.bare!, bareTarget);
  for (const key of ['route', 'list', 'evaluate', 'evaluateNew'])
    twoInstances.push(await measure(loads[key]!, two));

  // Idle past the engine threads' idle time: both instances retire their threads. The idle time
  // counts from the last calculation, which can end seconds after the load (requests the load
  // generator gave up on are still worked on): wait for both servers to go quiet first.
  await Promise.all([quiet(first.pid!), quiet(second.pid!)]);
  console.log(`idle for ${IDLE_SECONDS + 5} s (engine threads retire after ${IDLE_SECONDS} s)`);
  await sleep((IDLE_SECONDS + 5) * 1000);
  const retiredRss = rssMb(first.pid!);

  stopChildren();
  await sleep(500);
  await adminQuery(`DROP DATABASE IF EXISTS ${DB} WITH (FORCE)`);
  cluster?.stop();

  const ratio = (f: Figure, base: Figure) => (100 * f.rps) / base.rps;
  const line = (f: Figure, base: Figure, target: string, met: boolean | null) =>
    `| ${f.name} | ${fmt(f.rps)} | ${fmt(ratio(f, base), 1)} % | ${fmt(f.p50)} | ${fmt(f.p99)} | ${f.errors + f.non2xx} of ${f.requests}${f.failures ? ` (${f.failures})` : ''} | ${target} | ${met === null ? '' : met ? 'yes' : 'NO'} |`;
  const readMet = (f: Figure, base: Figure) =>
    ratio(f, base) >= 30 && f.p99 <= 100 && f.errors + f.non2xx === 0;
  const header = [
    '| Load (50 connections) | Requests/s | Of bare | p50 (ms) | p99 (ms) | Errors | Target | Met |',
    '|---|---:|---:|---:|---:|---|---|---|',
  ];
  const [health, route, list, evaluate, evaluateNew] = oneInstance as [
    Figure,
    Figure,
    Figure,
    Figure,
    Figure,
  ];
  const [route2, list2, evaluate2, evaluateNew2] = twoInstances as [Figure, Figure, Figure, Figure];
  const date = new Date().toISOString().slice(0, 16).replace('T', ' ');
  const cpu = os.cpus()[0]?.model?.trim() ?? 'unknown CPU';
  const machine = `${os.type()} ${os.release()}, ${cpu} × ${os.cpus().length}, Node ${process.version}, load average ${os.loadavg()[0]!.toFixed(1)} at the end`;
  const oneTable = [
    ...header,
    line(bareOne, bareOne, 'baseline', null),
    line(health, bareOne, '', null),
    line(route, bareOne, '≥ 30 % of bare, p99 ≤ 100 ms, no errors', readMet(route, bareOne)),
    line(list, bareOne, '≥ 30 % of bare, p99 ≤ 100 ms, no errors', readMet(list, bareOne)),
    line(evaluate, bareOne, '', null),
    line(evaluateNew, bareOne, '≥ 150 requests/s', evaluateNew.rps >= 150),
  ];
  const twoTable = [
    ...header,
    line(bareTwo, bareTwo, 'baseline', null),
    line(route2, bareTwo, '', null),
    line(list2, bareTwo, '', null),
    line(evaluate2, bareTwo, '', null),
    line(evaluateNew2, bareTwo, '', null),
  ];
  const memory = `Idle server RSS ${fmt(freshRss)} MB before its first evaluation (target ≤ 120 MB: ${freshRss <= 120 ? 'met' : 'NOT met'}), ${fmt(idleRss)} MB idle once it has evaluated (creating the ${ROUTES} routes starts the engine threads); after the load ${fmt(busyRss)} MB; ${fmt(retiredRss)} MB ${IDLE_SECONDS + 5} s after the server went quiet (engine threads retired after ${IDLE_SECONDS} s, ENGINE_IDLE_SECONDS); the bare Express process ${fmt(bareRss)} MB.`;
  const performance = [
    `Run ${date} UTC on ${machine}. \`npm run bench:load\` (tests/bench/load.ts): the compiled server (\`node ${NODE_FLAGS.join(' ')} dist-server/index.js\`, production), its own database on the test cluster (fsync off), ${USERS} chemists signed in (one session per connection), ${ROUTES} routes of 30 steps, autocannon for ${SECONDS} s per line; the bare Express endpoint runs in its own process in the same run.`,
    '',
    '### One instance',
    '',
    ...oneTable,
    '',
    '### Two instances (two processes, two ports, one database; 25 connections each)',
    '',
    ...twoTable,
    '',
    memory,
  ].join('\n');
  const deployment = [
    `Measured ${date} UTC with \`npm run bench:load\` on this machine (${os.cpus().length} cores shared by everything, including PostgreSQL and the load generator): requests per second with ${USERS} signed-in users.`,
    '',
    '| Load | One instance | Two instances | Bare Express (same run) |',
    '|---|---:|---:|---:|',
    `| Read the 30-step route | ${fmt(route.rps)} (p99 ${fmt(route.p99)} ms) | ${fmt(route2.rps)} (p99 ${fmt(route2.p99)} ms) | ${fmt(bareOne.rps)} / ${fmt(bareTwo.rps)} |`,
    `| Routes list, first page | ${fmt(list.rps)} (p99 ${fmt(list.p99)} ms) | ${fmt(list2.rps)} (p99 ${fmt(list2.p99)} ms) | ${fmt(bareOne.rps)} / ${fmt(bareTwo.rps)} |`,
    `| POST /evaluate, 30 steps, repeated (steps reused) | ${fmt(evaluate.rps)} (p99 ${fmt(evaluate.p99)} ms) | ${fmt(evaluate2.rps)} (p99 ${fmt(evaluate2.p99)} ms) | |`,
    `| POST /evaluate, 30 steps, every step new | ${fmt(evaluateNew.rps)} (p99 ${fmt(evaluateNew.p99)} ms) | ${fmt(evaluateNew2.rps)} (p99 ${fmt(evaluateNew2.p99)} ms) | |`,
    '',
    memory,
  ].join('\n');
  console.log(`\n${performance}\n`);
  rewrite(join(root, 'docs', 'performance.md'), 'load', performance, '## load');
  rewrite(join(root, 'docs', 'deployment.md'), 'load', deployment, '## Measured figures');
  console.log(
    'Wrote the load section of docs/performance.md and the figures in docs/deployment.md.',
  );
}

function rewrite(file: string, name: string, body: string, heading: string): void {
  const start = `<!-- bench:${name}:start -->`;
  const end = `<!-- bench:${name}:end -->`;
  const block = `${start}\n${body}\n${end}`;
  let text = existsSync(file) ? readFileSync(file, 'utf8') : '';
  const i = text.indexOf(start);
  const j = text.indexOf(end);
  text =
    i >= 0 && j > i
      ? text.slice(0, i) + block + text.slice(j + end.length)
      : `${text.trimEnd()}\n\n${heading}\n\n${block}\n`;
  writeFileSync(file, text);
}

main().catch((error: unknown) => {
  console.error(error);
  stopChildren();
  cluster?.stop();
  process.exit(1);
});

/**
 * Request bodies of the route with its first charge's first volume moved by n × 10⁻⁷ of itself: a
 * route no step memo has seen, for measuring evaluations that reuse nothing. The body is put
 * together from text around the one number (not a copy of the document serialised each time):
 * the load generator shares the machine's cores with the server it measures.
 */
function firstVolumeBodies<T extends { steps: Array<{ params: unknown }> }>(
  document: T,
): (n: number) => string {
  const copy = structuredClone(document);
  const contents = (copy.steps[0]!.params as { contents?: Array<{ amount: unknown }> }).contents;
  const first = contents?.[0];
  if (!first || typeof first.amount !== 'number')
    throw new Error('the load route must open with a charge of a plain volume');
  const amount = first.amount;
  const marker = -1.25e-300; // a number no route holds
  first.amount = marker;
  const parts = JSON.stringify({ document: copy }).split(JSON.stringify(marker));
  if (parts.length !== 2) throw new Error('the load route holds the marker number');
  const [head, tail] = parts as [string, string];
  return (n) => `${head}${JSON.stringify(amount * (1 + (n % 1_000_000) * 1e-7))}${tail}`;
}
