import type { MigrationContext } from '../server/db/migrator';

// Credentials that end when they should:
// - rate_limits: request rate limits and failed sign-in counts, in the layout of
//   rate-limiter-flexible's PostgreSQL store, so every server instance shares them;
// - API tokens get a scope (read or read-write) and an expiry (existing ones keep working
//   for 90 days, read-write as before);
// - the per-account lock (a fixed 15 minutes anyone could trigger) is gone: failed sign-ins
//   now slow down by account and address in rate_limits.
export async function up({ context: { sequelize } }: { context: MigrationContext }): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    await sequelize.query(
      `
      CREATE TABLE rate_limits (
        key varchar(255) PRIMARY KEY,
        points integer NOT NULL DEFAULT 0,
        expire bigint
      );
      CREATE INDEX rate_limits_expire_idx ON rate_limits (expire);

      ALTER TABLE api_tokens
        ADD COLUMN scope varchar(20) NOT NULL DEFAULT 'read-write'
          CONSTRAINT api_tokens_scope_valid CHECK (scope IN ('read', 'read-write')),
        ADD COLUMN expires_at timestamptz;
      UPDATE api_tokens SET expires_at = now() + interval '90 days' WHERE expires_at IS NULL;
      ALTER TABLE api_tokens ALTER COLUMN expires_at SET NOT NULL;
      ALTER TABLE api_tokens ALTER COLUMN scope SET DEFAULT 'read';

      ALTER TABLE users DROP COLUMN failed_sign_ins, DROP COLUMN locked_until;
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
    DROP TABLE IF EXISTS rate_limits;
    ALTER TABLE api_tokens DROP COLUMN IF EXISTS scope, DROP COLUMN IF EXISTS expires_at;
    ALTER TABLE users
      ADD COLUMN IF NOT EXISTS failed_sign_ins integer NOT NULL DEFAULT 0,
      ADD COLUMN IF NOT EXISTS locked_until timestamptz;
  `);
}
