import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export const projectRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

export interface ServerProcess {
  child: ChildProcess;
  /** http://127.0.0.1:<port> */
  base: string;
  output: () => string;
  /** SIGTERM, then waits for the exit. */
  stop(): Promise<void>;
}

/**
 * Starts a real server process on a free port against the test database, the way
 * `npm start` does: from the TypeScript sources through tsx, or `node <file>` for a
 * compiled server. Resolves once it listens.
 */
export function startServerProcess(
  options: { entry?: string; env?: Record<string, string> } = {},
): Promise<ServerProcess> {
  const args = options.entry ? [options.entry] : ['--import', 'tsx', 'server/index.ts'];
  const child = spawn(process.execPath, args, {
    cwd: projectRoot,
    env: {
      ...process.env,
      NODE_ENV: 'test',
      HOST: '127.0.0.1',
      PORT: '0',
      DATABASE_URL: process.env.DATABASE_URL,
      SMTP_FAKE_PORT: '0',
      ENGINE_WORKERS: '1',
      // Every test file signs in from 127.0.0.1 and the limits are kept in the shared database.
      SIGN_IN_RATE_LIMIT: '100000',
      RESET_RATE_LIMIT: '100000',
      SIGN_IN_FREE_FAILURES_PAIR: '100000',
      SIGN_IN_FREE_FAILURES_ACCOUNT: '100000',
      SIGN_IN_FREE_FAILURES_ADDRESS: '100000',
      ...options.env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout!.on('data', (chunk: Buffer) => (output += chunk.toString()));
  child.stderr!.on('data', (chunk: Buffer) => (output += chunk.toString()));
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  return new Promise((resolve, reject) => {
    const timer = setInterval(() => {
      const match = /running at (http:\/\/[\d.]+:\d+)/.exec(output);
      if (match) {
        clearInterval(timer);
        resolve({
          child,
          base: match[1],
          output: () => output,
          stop: async () => {
            if (child.exitCode === null && child.signalCode === null) child.kill('SIGTERM');
            await exited;
          },
        });
      }
    }, 100);
    child.once('exit', (code) => {
      clearInterval(timer);
      reject(new Error(`the server exited (${code}) before it was ready:\n${output}`));
    });
  });
}
