import type { MigrationContext } from '../server/db/migrator';

// Each caught message records the workspaces it concerns, so the outbox shows an admin only
// the mail of workspaces they administer. Messages caught before carry none and are shown to
// nobody.
export async function up({ context: { sequelize } }: { context: MigrationContext }): Promise<void> {
  await sequelize.query(
    `ALTER TABLE outbox_messages ADD COLUMN workspace_ids uuid[] NOT NULL DEFAULT '{}';
     CREATE INDEX outbox_messages_workspaces_idx ON outbox_messages USING gin (workspace_ids);`,
  );
}

export async function down({
  context: { sequelize },
}: {
  context: MigrationContext;
}): Promise<void> {
  await sequelize.query(`ALTER TABLE outbox_messages DROP COLUMN IF EXISTS workspace_ids;`);
}
