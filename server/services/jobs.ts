import PgBoss from 'pg-boss';
import type { PoolClient } from 'pg';
import type { Transaction } from 'sequelize';

/**
 * The job queue, kept in PostgreSQL by pg-boss (schema "pgboss").
 * Register a queue name in QUEUES, send with `enqueue()`, and add its worker
 * in startWorkers() (server/services/workers.ts).
 */
export const QUEUES = {
  mailSend: 'mail.send',
  monteCarlo: 'evaluation.monte-carlo',
  optimise: 'evaluation.optimise',
} as const;

/** Settings a queue is created with (pg-boss defaults otherwise). */
const QUEUE_SETTINGS: Partial<Record<keyof typeof QUEUES, Omit<PgBoss.Queue, 'name'>>> = {
  monteCarlo: { retryLimit: 1, expireInSeconds: 30 * 60 },
  optimise: { retryLimit: 1, expireInSeconds: 30 * 60 },
};

let boss: PgBoss | null = null;

/**
 * Creates or upgrades the queue's schema and its queues (pg-boss makes a
 * table per queue), as the schema owner: the server's own role may not
 * create tables.
 */
export async function prepareJobQueue(ownerDatabaseUrl: string): Promise<void> {
  const instance = new PgBoss({
    connectionString: ownerDatabaseUrl,
    max: 1,
    application_name: 'phasewright-jobs-setup',
    supervise: false,
    schedule: false,
  });
  instance.on('error', (error) => console.error('[jobs]', error));
  await instance.start();
  try {
    for (const [key, name] of Object.entries(QUEUES)) {
      const settings = QUEUE_SETTINGS[key as keyof typeof QUEUES] ?? {};
      if (!(await instance.getQueue(name))) await instance.createQueue(name, { name, ...settings });
    }
  } finally {
    await instance.stop({ graceful: false, wait: true });
  }
}

export async function startJobQueue(databaseUrl: string): Promise<PgBoss> {
  if (boss) return boss;
  const instance = new PgBoss({
    connectionString: databaseUrl,
    max: 4,
    application_name: 'phasewright-jobs',
    // prepareJobQueue() made the schema; the server's role only checks its version.
    migrate: false,
  });
  instance.on('error', (error) => console.error('[jobs]', error));
  await instance.start();
  boss = instance;
  return instance;
}

export function jobQueue(): PgBoss {
  if (!boss) throw new Error('startJobQueue() has not been called');
  return boss;
}

export async function stopJobQueue(): Promise<void> {
  if (!boss) return;
  const stopping = boss;
  boss = null;
  await stopping.stop({ graceful: true, timeout: 5_000, wait: true });
}

/**
 * Adds a job. Given the request's transaction, the job row is written on the
 * same connection, so it exists exactly when the change that caused it
 * commits: no mail for a rolled-back invitation, no lost mail for a committed one.
 */
export async function enqueue(
  name: string,
  data: object,
  options: PgBoss.SendOptions,
  transaction: Transaction | null,
): Promise<string | null> {
  const queue = jobQueue();
  if (!transaction) return queue.send(name, data, options);
  // Sequelize exposes the pg client of a transaction as `connection`; it is not in its typings.
  const client = (transaction as unknown as { connection: PoolClient }).connection;
  const db: PgBoss.Db = { executeSql: (text, values) => client.query(text, values) };
  return queue.send(name, data, { ...options, db });
}
