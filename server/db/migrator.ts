import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import type { QueryInterface, Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';

export interface MigrationContext {
  queryInterface: QueryInterface;
  sequelize: Sequelize;
}

/** What a file in migrations/ or seeders/ exports. */
export interface MigrationModule {
  up(params: { context: MigrationContext }): Promise<void>;
  down?(params: { context: MigrationContext }): Promise<void>;
}

const here = path.dirname(fileURLToPath(import.meta.url));
// The compiled server (dist-server/, server/build/server.mjs) carries its migrations and
// seeders as JavaScript beside it; from source they are the TypeScript files of the project.
const compiled = !import.meta.url.endsWith('.ts');
const scriptsRoot = compiled ? here : path.resolve(here, '../..');
const scriptExtension = compiled ? 'js' : 'ts';

// Migrations are TypeScript; import() loads them under tsx, vitest and the
// server alike, where a require()-based loader would not.
function buildUmzug(sequelize: Sequelize, folder: 'migrations' | 'seeders', tableName: string) {
  return new Umzug<MigrationContext>({
    migrations: {
      glob: [
        `${folder}/*.${scriptExtension}`,
        { cwd: scriptsRoot, ignore: ['**/*.test.*', '**/*.d.ts'] },
      ],
      resolve: ({ name, path: filePath, context }) => {
        const load = async () => (await import(pathToFileURL(filePath!).href)) as MigrationModule;
        return {
          // Recorded under the source file's name, however it runs.
          name: name.replace(/\.js$/, '.ts'),
          up: async () => (await load()).up({ context }),
          down: async () => {
            const module = await load();
            if (!module.down) throw new Error(`${name} cannot be undone`);
            await module.down({ context });
          },
        };
      },
    },
    context: { queryInterface: sequelize.getQueryInterface(), sequelize },
    // modelName must differ per table: SequelizeStorage reuses an already defined model of the same name.
    storage: new SequelizeStorage({ sequelize, tableName, modelName: tableName }),
    logger: undefined,
  });
}

// Arbitrary but fixed: identifies "schema changes of this database" among advisory locks.
const MIGRATION_LOCK_KEY = 724_551_901;

/**
 * Holds a PostgreSQL advisory lock while `work` runs, so two server instances
 * starting at once do not apply the same migration twice: the second waits,
 * then finds nothing left to do.
 */
async function withMigrationLock<T>(sequelize: Sequelize, work: () => Promise<T>): Promise<T> {
  const manager = sequelize.connectionManager as unknown as {
    getConnection(): Promise<{ query(sql: string): Promise<unknown> }>;
    releaseConnection(connection: unknown): Promise<void>;
  };
  const connection = await manager.getConnection();
  try {
    await connection.query(`SELECT pg_advisory_lock(${MIGRATION_LOCK_KEY})`);
    try {
      return await work();
    } finally {
      await connection.query(`SELECT pg_advisory_unlock(${MIGRATION_LOCK_KEY})`);
    }
  } finally {
    await manager.releaseConnection(connection);
  }
}

export async function runMigrations(sequelize: Sequelize): Promise<string[]> {
  const applied = await withMigrationLock(sequelize, () =>
    buildUmzug(sequelize, 'migrations', 'SequelizeMeta').up(),
  );
  return applied.map((migration) => migration.name);
}

/** Seeds the invented demo data; each seeder runs once (recorded in SequelizeData). */
export async function runSeeders(sequelize: Sequelize, env: string): Promise<string[]> {
  if (env === 'production') throw new Error('Refusing to seed demo data when NODE_ENV=production.');
  const applied = await withMigrationLock(sequelize, () =>
    buildUmzug(sequelize, 'seeders', 'SequelizeData').up(),
  );
  return applied.map((seeder) => seeder.name);
}
