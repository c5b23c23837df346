// `npm run db:migrate` and `npm run db:seed`.
import { loadConfig } from '../config';
import { closeDatabase, connectDatabase } from './sequelize';
import { runMigrations, runSeeders } from './migrator';

const command = process.argv[2];
const config = loadConfig();
const sequelize = connectDatabase(config.databaseUrl);
try {
  if (command === 'migrate') {
    const applied = await runMigrations(sequelize);
    console.log(applied.length ? `Applied: ${applied.join(', ')}` : 'Migrations are up to date.');
  } else if (command === 'seed') {
    await runMigrations(sequelize);
    const applied = await runSeeders(sequelize, config.env);
    console.log(
      applied.length ? `Seeded: ${applied.join(', ')}` : 'The demo data is already seeded.',
    );
  } else {
    console.error('Usage: node --import tsx server/db/cli.ts migrate|seed');
    process.exitCode = 2;
  }
} catch (error) {
  console.error(error instanceof Error ? error.message : error);
  process.exitCode = 1;
} finally {
  await closeDatabase();
}
