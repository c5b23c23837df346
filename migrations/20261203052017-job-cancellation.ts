import type { MigrationContext } from '../server/db/migrator';

// A Monte Carlo run can be cancelled by the person who started it.
export async function up({ context: { sequelize } }: { context: MigrationContext }): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    await sequelize.query(
      `
      ALTER TABLE evaluation_jobs DROP CONSTRAINT IF EXISTS evaluation_jobs_status_check;
      ALTER TABLE evaluation_jobs ADD CONSTRAINT evaluation_jobs_status_check
        CHECK (status IN ('queued', 'running', 'done', 'failed', 'cancelled'));
      CREATE INDEX evaluation_jobs_open_idx ON evaluation_jobs (user_id)
        WHERE status IN ('queued', 'running');
      `,
      { transaction },
    );
  });
}

export async function down({
  context: { sequelize },
}: {
  context: MigrationContext;
}): Promise<void> {
  await sequelize.query(`
    DROP INDEX IF EXISTS evaluation_jobs_open_idx;
    UPDATE evaluation_jobs SET status = 'failed' WHERE status = 'cancelled';
    ALTER TABLE evaluation_jobs DROP CONSTRAINT IF EXISTS evaluation_jobs_status_check;
    ALTER TABLE evaluation_jobs ADD CONSTRAINT evaluation_jobs_status_check
      CHECK (status IN ('queued', 'running', 'done', 'failed'));
  `);
}
