import { readdirSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import type { QueryInterface, Sequelize } from 'sequelize';

export interface MigrationContext {
  queryInterface: QueryInterface;
  sequelize: Sequelize;
}

/** A demo sign-in a seeder made: printed at start so a reader can sign in. */
export interface SeedSignIn {
  email: string;
  password: string;
  description: string;
}

/** What a file in migrations/ or seeders/ exports. */
export interface MigrationModule {
  up(params: { context: MigrationContext }): Promise<void>;
  down?(params: { context: MigrationContext }): Promise<void>;
  /** A seeder that makes accounts: those of its accounts the database holds. */
  signIns?(params: { context: MigrationContext }): Promise<SeedSignIn[]>;
}

export interface SeedResult {
  /** The seeders run now (empty when the demo data was seeded before). */
  applied: string[];
  /** The demo sign-ins the seeders made, now or on an earlier run. */
  signIns: SeedSignIn[];
}

const here = path.dirname(fileURLToPath(import.meta.url));
// The compiled server (dist-server/, server/build/server.mjs) carries its migrations and
// seeders as JavaScript beside it; from source they are the TypeScript files of the project.
const compiled = !import.meta.url.endsWith('.ts');
const scriptsRoot = compiled ? here : path.resolve(here, '../..');
const scriptExtension = compiled ? 'js' : 'ts';

// Migrations are TypeScript; import() loads them under tsx, vitest and the
// server alike, where a require()-based loader would not. The migration runner itself is loaded
// only when there is something to run (it stays in memory for the life of the process).
async function buildUmzug(
  sequelize: Sequelize,
  folder: 'migrations' | 'seeders',
  tableName: string,
) {
  const { SequelizeStorage, Umzug } = await import('umzug');
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

/** The migrations this build carries, under the names SequelizeMeta records them by. */
function migrationNames(): string[] {
  return readdirSync(path.join(scriptsRoot, 'migrations'))
    .filter((name) => name.endsWith(`.${scriptExtension}`) && !/\.(test|d)\./.test(name))
    .map((name) => name.replace(/\.js$/, '.ts'));
}

/** Whether every migration of this build is recorded as applied (two short reads). */
async function allMigrationsApplied(sequelize: Sequelize): Promise<boolean> {
  const [[table]] = (await sequelize.query(
    `SELECT to_regclass('public."SequelizeMeta"') IS NOT NULL AS present`,
  )) as [Array<{ present: boolean }>, unknown];
  if (!table?.present) return false;
  const [rows] = (await sequelize.query('SELECT name FROM "SequelizeMeta"')) as [
    Array<{ name: string }>,
    unknown,
  ];
  const applied = new Set(rows.map((row) => row.name));
  return migrationNames().every((name) => applied.has(name));
}

export async function runMigrations(sequelize: Sequelize): Promise<string[]> {
  // The common start (an up-to-date database) does not load the migration runner.
  if (await allMigrationsApplied(sequelize)) return [];
  const umzug = await buildUmzug(sequelize, 'migrations', 'SequelizeMeta');
  const applied = await withMigrationLock(sequelize, () => umzug.up());
  return applied.map((migration) => migration.name);
}

/**
 * Seeds the invented demo data; each seeder runs once (recorded in SequelizeData).
 * The seeders are loaded here only, by path: the server's own module graph holds
 * no seeder, so a production build without seeders/ starts.
 */
export async function runSeeders(sequelize: Sequelize, env: string): Promise<SeedResult> {
  if (env === 'production') throw new Error('Refusing to seed demo data when NODE_ENV=production.');
  const umzug = await buildUmzug(sequelize, 'seeders', 'SequelizeData');
  const applied = await withMigrationLock(sequelize, () => umzug.up());
  const context: MigrationContext = { queryInterface: sequelize.getQueryInterface(), sequelize };
  const signIns: SeedSignIn[] = [];
  for (const seeder of await umzug.executed()) {
    const module = (await import(pathToFileURL(seeder.path!).href)) as MigrationModule;
    if (module.signIns) signIns.push(...(await module.signIns({ context })));
  }
  return { applied: applied.map((seeder) => seeder.name), signIns };
}

/** Prints the demo sign-ins a seed run returned (invented accounts). */
export function printSignIns(signIns: SeedSignIn[]): void {
  if (signIns.length === 0) return;
  console.log('Demo sign-ins, invented data:');
  for (const s of signIns)
    console.log(`  ${s.email.padEnd(24)} password ${s.password.padEnd(18)} ${s.description}`);
}
