/**
 * The throwaway test cluster (.data/pg-test) for benchmarks that need a
 * database: started when nothing answers on its port, and stopped again by
 * the same benchmark only when it started it, so no PostgreSQL is left running
 * and a cluster someone else started is never stopped under them.
 */
import { execFileSync } from 'node:child_process';
import net from 'node:net';

function answers(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = net.connect({ host: '127.0.0.1', port });
    socket.setTimeout(1_000);
    socket.once('connect', () => (socket.destroy(), resolve(true)));
    socket.once('timeout', () => (socket.destroy(), resolve(false)));
    socket.once('error', () => resolve(false));
  });
}

// pg_up and pg_down need the binaries' folder (PGBIN) that ensure_postgres_binaries sets.
const lib = (body: string) =>
  execFileSync(
    'bash',
    ['-c', `set -e; source server/scripts/lib.sh; ensure_postgres_binaries; ${body}`],
    {
      stdio: ['ignore', 'ignore', 'inherit'],
    },
  );

export interface TestCluster {
  /** Stops the cluster if this benchmark started it; a failure to stop is thrown, not hidden. */
  stop(): void;
}

export async function useTestCluster(port: number): Promise<TestCluster> {
  const started = !(await answers(port));
  if (started) lib(`pg_up pg-test ${port} "-c fsync=off -c synchronous_commit=off"`);
  let stopped = false;
  const stop = () => {
    if (!started || stopped) return;
    stopped = true;
    lib('pg_down "$(pg_cluster_dir pg-test)"');
  };
  return { stop };
}
