import type { MigrationContext } from '../server/db/migrator';

// Route optimisations run as background jobs beside the Monte Carlo runs.
export async function up({ context: { sequelize } }: { context: MigrationContext }): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    await sequelize.query(
      `
      ALTER TABLE evaluation_jobs DROP CONSTRAINT IF EXISTS evaluation_jobs_kind_check;
      ALTER TABLE evaluation_jobs ADD CONSTRAINT evaluation_jobs_kind_check
        CHECK (kind IN ('monte-carlo', 'optimise'));
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
    DELETE FROM evaluation_jobs WHERE kind = 'optimise';
    ALTER TABLE evaluation_jobs DROP CONSTRAINT IF EXISTS evaluation_jobs_kind_check;
    ALTER TABLE evaluation_jobs ADD CONSTRAINT evaluation_jobs_kind_check
      CHECK (kind IN ('monte-carlo'));
  `);
}
