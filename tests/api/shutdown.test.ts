/**
 * Graceful shutdown: on SIGTERM the server stops taking connections, finishes
 * the requests in flight, then releases the engine pool, the job queue and the
 * database, and exits 0; handlers whose clients hung up finish before the
 * session and data pools close. Runs the real server process (npm start's command).
 */
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import demoRoute from '../fixtures/routes/demo-amide-isolation.json';
import { generateRoute } from '../fixtures/routes/generate';
import { buildMember, buildWorkspace } from '../support/factories';
import { useTestServer } from '../support/app';

const projectRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
// Gives this file the database (the server under test is a separate process on the same one).
const server = useTestServer();

function startServer(
  extraEnv: Record<string, string> = {},
): Promise<{ child: ChildProcess; base: string; output: () => string }> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: projectRoot,
    env: {
      ...process.env,
      NODE_ENV: 'test',
      HOST: '127.0.0.1',
      PORT: '0',
      DATABASE_URL: process.env.DATABASE_URL,
      SMTP_FAKE_PORT: '0',
      ENGINE_WORKERS: '1',
      SHUTDOWN_GRACE_SECONDS: '60',
      // Every test file signs in from 127.0.0.1 and the limits are kept in the shared database.
      SIGN_IN_RATE_LIMIT: '100000',
      SIGN_IN_FREE_FAILURES_PAIR: '100000',
      SIGN_IN_FREE_FAILURES_ACCOUNT: '100000',
      SIGN_IN_FREE_FAILURES_ADDRESS: '100000',
      ...extraEnv,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout!.on('data', (chunk: Buffer) => (output += chunk.toString()));
  child.stderr!.on('data', (chunk: Buffer) => (output += chunk.toString()));
  return new Promise((resolve, reject) => {
    const timer = setInterval(() => {
      const match = /running at (http:\/\/[\d.]+:\d+)/.exec(output);
      if (match) {
        clearInterval(timer);
        resolve({ child, base: match[1], output: () => output });
      }
    }, 100);
    child.once('exit', (code) => {
      clearInterval(timer);
      reject(new Error(`the server exited (${code}) before it was ready:\n${output}`));
    });
  });
}

describe('graceful shutdown', () => {
  let child: ChildProcess | null = null;
  afterAll(() => {
    if (child && child.exitCode === null) child.kill('SIGKILL');
  });

  it('finishes the request in flight, refuses new connections, and exits 0', async () => {
    const workspace = await buildWorkspace();
    const chemist = await buildMember(workspace, ['chemist']);
    const started = await startServer();
    child = started.child;
    const { base } = started;

    const signIn = await fetch(`${base}/api/v1/session`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: chemist.email, password: 'correct-horse-battery' }),
    });
    expect(signIn.status).toBe(200);
    const cookie = signIn.headers.get('set-cookie')!.split(';')[0];
    const { csrfToken } = (await signIn.json()) as { csrfToken: string };

    // A few seconds of engine work: 20 draws of a 60-step route.
    const inFlight = fetch(`${base}/api/v1/evaluate/monte-carlo`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', cookie, 'x-csrf-token': csrfToken },
      body: JSON.stringify({
        document: generateRoute({ seed: 4, steps: 60, compounds: 3 }),
        draws: 20,
        seed: 3,
      }),
    });
    await new Promise((resolve) => setTimeout(resolve, 500));
    const exited = new Promise<number | null>((resolve) => child!.once('exit', resolve));
    child.kill('SIGTERM');
    await new Promise((resolve) => setTimeout(resolve, 300));

    // Stopped listening: a new connection is refused.
    await expect(fetch(`${base}/api/v1/health`)).rejects.toThrow();
    // The request in flight was answered in full.
    const response = await inFlight;
    expect(response.status).toBe(202);
    expect(((await response.json()) as { jobId: string }).jobId).toMatch(/^[0-9a-f-]{36}$/);
    expect(await exited).toBe(0);
    expect(started.output()).toMatch(/SIGTERM received/);
    void demoRoute;
    void server;
  }, 120_000);

  it('under load, lets the handlers of clients that hung up finish before the database connections close', async () => {
    const workspace = await buildWorkspace();
    const chemists = await Promise.all(
      Array.from({ length: 4 }, () => buildMember(workspace, ['chemist'])),
    );
    // One session connection: the sign-ins queue for it, as they do under load.
    const started = await startServer({ SESSION_POOL_MAX: '1', SHUTDOWN_GRACE_SECONDS: '20' });
    child = started.child;
    const { base } = started;

    // A background run keeps the engine busy, so stopping the engine pool takes a while
    // after the session pool has been released.
    const signedIn = await fetch(`${base}/api/v1/session`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: chemists[0].email, password: 'correct-horse-battery' }),
    });
    const cookie = signedIn.headers.get('set-cookie')!.split(';')[0];
    const { csrfToken } = (await signedIn.json()) as { csrfToken: string };
    const run = await fetch(`${base}/api/v1/evaluate/monte-carlo`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', cookie, 'x-csrf-token': csrfToken },
      body: JSON.stringify({
        document: generateRoute({ seed: 5, steps: 60, compounds: 3 }),
        draws: 40,
        seed: 3,
      }),
    });
    expect(run.status).toBe(202);

    // Sign-ins hash a password, then write the new session: a client that hangs up in
    // between leaves a handler that still needs the session store.
    const controller = new AbortController();
    const requests = Array.from({ length: 24 }, (_, index) =>
      fetch(`${base}/api/v1/session`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({
          email: chemists[index % chemists.length].email,
          password: 'correct-horse-battery',
        }),
        signal: controller.signal,
      }).catch(() => null),
    );
    await new Promise((resolve) => setTimeout(resolve, 150));
    controller.abort();
    await Promise.all(requests);
    const exited = new Promise<number | null>((resolve) => child!.once('exit', resolve));
    child.kill('SIGTERM');

    expect(await exited).toBe(0);
    expect(started.output()).toMatch(/SIGTERM received/);
    expect(started.output()).not.toMatch(/after calling end on the pool|still running after/);
  }, 120_000);
});
