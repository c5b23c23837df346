/**
 * Graceful shutdown: on SIGTERM the server stops taking connections, finishes
 * the requests in flight, then releases the engine pool, the job queue and the
 * database, and exits 0. Runs the real server process (npm start's command).
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

function startServer(): Promise<{ child: ChildProcess; base: string; output: () => string }> {
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
});
