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

const projectRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

// Migrations are TypeScript; import() loads them under tsx, vitest and the
// server alike, where a require()-based loader would not.
function buildUmzug(sequelize: Sequelize, folder: 'migrations' | 'seeders', tableName: string) {
  return new Umzug<MigrationContext>({
    migrations: {
      glob: [`${folder}/*.ts`, { cwd: projectRoot, ignore: ['**/*.test.ts', '**/*.d.ts'] }],
      resolve: ({ name, path: filePath, context }) => {
        const load = async () => (await import(pathToFileURL(filePath!).href)) as MigrationModule;
        return {
          name,
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

export async function runMigrations(sequelize: Sequelize): Promise<string[]> {
  const applied = await buildUmzug(sequelize, 'migrations', 'SequelizeMeta').up();
  return applied.map((migration) => migration.name);
}

/** Seeds the invented demo data; each seeder runs once (recorded in SequelizeData). */
export async function runSeeders(sequelize: Sequelize, env: string): Promise<string[]> {
  if (env === 'production') throw new Error('Refusing to seed demo data when NODE_ENV=production.');
  const applied = await buildUmzug(sequelize, 'seeders', 'SequelizeData').up();
  return applied.map((seeder) => seeder.name);
}
