import PgBoss from 'pg-boss';
import type { PoolClient } from 'pg';
import type { Transaction } from 'sequelize';

/**
 * The job queue, kept in PostgreSQL by pg-boss (schema "pgboss").
 * Register a queue name in QUEUES, send with `enqueue()`, and add its worker
 * in startWorkers() (server/services/workers.ts).
 */
export const QUEUES = { mailSend: 'mail.send' } as const;

let boss: PgBoss | null = null;

export async function startJobQueue(databaseUrl: string): Promise<PgBoss> {
  if (boss) return boss;
  const instance = new PgBoss({
    connectionString: databaseUrl,
    max: 4,
    application_name: 'phasewright-jobs',
  });
  instance.on('error', (error) => console.error('[jobs]', error));
  await instance.start();
  for (const name of Object.values(QUEUES)) await instance.createQueue(name);
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
