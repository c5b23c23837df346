import type pg from 'pg';
import { database } from './sequelize';

interface ConnectionManager {
  getConnection(options: { type: 'read' | 'write' }): Promise<pg.Client>;
  releaseConnection(connection: pg.Client): Promise<void>;
}

/**
 * One statement of a hot read (a route, the routes list), straight on a connection of
 * Sequelize's pool: the same connections, limits and type parsers as every other query, without
 * Sequelize's query pipeline (options, hooks, row formatting), which was a large share of such a
 * read's work. `name` prepares a fixed statement text once per connection. Errors are the
 * driver's own (the error handler knows an unreachable database from them too). Not for use in
 * a transaction: pass the transaction's queries through Sequelize.
 */
export async function hotRead<Row>(text: string, values: unknown[], name?: string): Promise<Row[]> {
  const sequelize = database();
  // Sequelize's `logging` option sees these statements too, in its own format: the lists
  // benchmark (tests/bench/list-plans.ts) explains the SQL it captures there.
  const logging = (sequelize as unknown as { options: { logging?: unknown } }).options.logging;
  if (typeof logging === 'function') logging(`Executing (default): ${text}`, { bind: values });
  const manager = sequelize.connectionManager as unknown as ConnectionManager;
  const connection = await manager.getConnection({ type: 'read' });
  try {
    const result = await connection.query<Row & pg.QueryResultRow>({ text, values, name });
    return result.rows;
  } finally {
    await manager.releaseConnection(connection);
  }
}

/** Nests `a.b.c` column names into objects, as Sequelize's `nest: true` does. */
export function nested<T>(row: Record<string, unknown>): T {
  const out: Record<string, unknown> = {};
  for (const key in row) {
    const path = key.split('.');
    let at = out;
    for (let i = 0; i < path.length - 1; i++) at = (at[path[i]!] ??= {}) as Record<string, unknown>;
    at[path[path.length - 1]!] = row[key];
  }
  return out as T;
}
