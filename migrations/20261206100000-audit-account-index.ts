import type { MigrationContext } from '../server/db/migrator';

// The audit trail of a workspace merges its own events with the account events (no workspace)
// of its members; each is read in time order on its own index, so a page never sorts the trail.
export async function up({ context: { sequelize } }: { context: MigrationContext }): Promise<void> {
  await sequelize.query(
    `CREATE INDEX audit_events_account_at_idx ON audit_events (at DESC, id DESC) WHERE workspace_id IS NULL`,
  );
}

export async function down({
  context: { sequelize },
}: {
  context: MigrationContext;
}): Promise<void> {
  await sequelize.query(`DROP INDEX IF EXISTS audit_events_account_at_idx`);
}
