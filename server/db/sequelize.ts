import { Sequelize } from 'sequelize';
import { initModels } from '../models';

let current: Sequelize | null = null;

/**
 * Opens the process-wide Sequelize connection and binds the models to it.
 * Models bind to one instance (Model.init is static), so a process holds one
 * connection; calling again with the same URL returns it.
 */
export function connectDatabase(databaseUrl: string, poolMax = 10): Sequelize {
  if (current) return current;
  const sequelize = new Sequelize(databaseUrl, {
    dialect: 'postgres',
    logging: false,
    // A database that is away fails fast (503) instead of holding requests for a minute.
    pool: { max: poolMax, idle: 10_000, acquire: 10_000 },
    dialectOptions: { connectionTimeoutMillis: 5_000 },
    define: { underscored: false },
  });
  initModels(sequelize);
  current = sequelize;
  return sequelize;
}

export function database(): Sequelize {
  if (!current) throw new Error('connectDatabase() has not been called');
  return current;
}

export async function closeDatabase(): Promise<void> {
  if (!current) return;
  const closing = current;
  current = null;
  await closing.close();
}
