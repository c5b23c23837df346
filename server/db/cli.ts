// `npm run db:migrate` and `npm run db:seed`.
import { loadConfig } from '../config';
import { closeDatabase, connectDatabase } from './sequelize';
import { printSignIns, runMigrations, runSeeders } from './migrator';
import { grantServerRole, openRoleConnection } from './roles';
import { prepareJobQueue } from '../services/jobs';

const command = process.argv[2];
const config = loadConfig();
// The seeders write through the models, which bind to the server's connection.
connectDatabase(config.databaseUrl);
// Schema changes run as the owner of the schema (DATABASE_OWNER_URL).
const owner = openRoleConnection(config.databaseOwnerUrl);
const migrate = async () => {
  const applied = await runMigrations(owner);
  await prepareJobQueue(config.databaseOwnerUrl);
  await grantServerRole(owner, config.databaseUrl);
  return applied;
};
try {
  if (command === 'migrate') {
    const applied = await migrate();
    console.log(applied.length ? `Applied: ${applied.join(', ')}` : 'Migrations are up to date.');
  } else if (command === 'seed') {
    await migrate();
    const { applied, signIns } = await runSeeders(owner, config.env);
    console.log(
      applied.length ? `Seeded: ${applied.join(', ')}` : 'The demo data is already seeded.',
    );
    printSignIns(signIns);
  } else {
    console.error('Usage: node --import tsx server/db/cli.ts migrate|seed');
    process.exitCode = 2;
  }
} catch (error) {
  console.error(error instanceof Error ? error.message : error);
  process.exitCode = 1;
} finally {
  await owner.close();
  await closeDatabase();
}
