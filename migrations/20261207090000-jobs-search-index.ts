import type { MigrationContext } from '../server/db/migrator';

// The jobs list's search (`q`, part of the kind or the status) starts from a trigram index of
// the same expression, like every other list's search (matchingRows() in server/services/keyset.ts).
export async function up({ context: { sequelize } }: { context: MigrationContext }): Promise<void> {
  await sequelize.query(
    `CREATE INDEX evaluation_jobs_search_trgm_idx
       ON evaluation_jobs USING gin ((kind || ' ' || status) gin_trgm_ops)`,
  );
}

export async function down({
  context: { sequelize },
}: {
  context: MigrationContext;
}): Promise<void> {
  await sequelize.query(`DROP INDEX IF EXISTS evaluation_jobs_search_trgm_idx`);
}
