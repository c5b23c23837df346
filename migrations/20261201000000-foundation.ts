import type { MigrationContext } from '../server/db/migrator';

// Written as SQL so the constraints, indexes and the audit trigger read as
// what PostgreSQL enforces.
const ROLE_CHECK = `cardinality(roles) > 0 AND roles <@ ARRAY['admin','chemist','reviewer','engineer']::text[]`;

export async function up({ context: { sequelize } }: { context: MigrationContext }): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const run = (sql: string) => sequelize.query(sql, { transaction });
    await run(`
      CREATE TABLE users (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        email varchar(254) NOT NULL,
        name varchar(120) NOT NULL,
        password_hash text NOT NULL,
        failed_sign_ins integer NOT NULL DEFAULT 0,
        locked_until timestamptz,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT users_email_lower CHECK (email = lower(email))
      );
      CREATE UNIQUE INDEX users_email_key ON users (email);

      CREATE TABLE workspaces (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        name varchar(120) NOT NULL,
        slug varchar(80) NOT NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      );
      CREATE UNIQUE INDEX workspaces_slug_key ON workspaces (slug);

      CREATE TABLE memberships (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        user_id uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
        workspace_id uuid NOT NULL REFERENCES workspaces (id) ON DELETE CASCADE,
        roles text[] NOT NULL CONSTRAINT memberships_roles_valid CHECK (${ROLE_CHECK}),
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      );
      CREATE UNIQUE INDEX memberships_user_workspace_key ON memberships (user_id, workspace_id);
      CREATE INDEX memberships_workspace_idx ON memberships (workspace_id);

      CREATE TABLE invitations (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        workspace_id uuid NOT NULL REFERENCES workspaces (id) ON DELETE CASCADE,
        invited_by_id uuid REFERENCES users (id) ON DELETE SET NULL,
        email varchar(254) NOT NULL,
        roles text[] NOT NULL CONSTRAINT invitations_roles_valid CHECK (${ROLE_CHECK}),
        token_hash char(64) NOT NULL,
        expires_at timestamptz NOT NULL,
        accepted_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      );
      CREATE UNIQUE INDEX invitations_token_hash_key ON invitations (token_hash);
      CREATE INDEX invitations_workspace_email_idx ON invitations (workspace_id, email);

      CREATE TABLE password_resets (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        user_id uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
        token_hash char(64) NOT NULL,
        expires_at timestamptz NOT NULL,
        used_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now()
      );
      CREATE UNIQUE INDEX password_resets_token_hash_key ON password_resets (token_hash);
      CREATE INDEX password_resets_user_idx ON password_resets (user_id);

      CREATE TABLE api_tokens (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        user_id uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
        name varchar(80) NOT NULL,
        token_hash char(64) NOT NULL,
        last_used_at timestamptz,
        revoked_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now()
      );
      CREATE UNIQUE INDEX api_tokens_token_hash_key ON api_tokens (token_hash);
      CREATE INDEX api_tokens_user_idx ON api_tokens (user_id);

      CREATE TABLE outbox_messages (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        "to" text NOT NULL,
        subject text NOT NULL,
        text text NOT NULL,
        html text,
        received_at timestamptz NOT NULL DEFAULT now()
      );
      CREATE INDEX outbox_messages_received_idx ON outbox_messages (received_at DESC);

      CREATE TABLE audit_events (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        workspace_id uuid REFERENCES workspaces (id) ON DELETE RESTRICT,
        actor_id uuid REFERENCES users (id) ON DELETE RESTRICT,
        action varchar(80) NOT NULL,
        entity_type varchar(80) NOT NULL,
        entity_id varchar(80),
        before jsonb,
        after jsonb,
        at timestamptz NOT NULL DEFAULT now()
      );
      CREATE INDEX audit_events_workspace_at_idx ON audit_events (workspace_id, at DESC);
      CREATE INDEX audit_events_entity_idx ON audit_events (entity_type, entity_id);

      -- The audit trail is append-only: nobody, the server included, may rewrite it.
      CREATE FUNCTION audit_events_refuse_change() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        RAISE EXCEPTION 'audit_events is append-only: % refused', TG_OP USING ERRCODE = 'insufficient_privilege';
      END;
      $$;
      CREATE TRIGGER audit_events_append_only
        BEFORE UPDATE OR DELETE ON audit_events
        FOR EACH ROW EXECUTE FUNCTION audit_events_refuse_change();
      CREATE TRIGGER audit_events_no_truncate
        BEFORE TRUNCATE ON audit_events
        FOR EACH STATEMENT EXECUTE FUNCTION audit_events_refuse_change();

      -- Sessions (connect-pg-simple's layout), created here so that several
      -- server instances never race to create it on first use.
      CREATE TABLE session (
        sid varchar NOT NULL PRIMARY KEY,
        sess json NOT NULL,
        expire timestamp(6) NOT NULL
      );
      CREATE INDEX session_expire_idx ON session (expire);
    `);
  });
}

export async function down({
  context: { sequelize },
}: {
  context: MigrationContext;
}): Promise<void> {
  await sequelize.query(`
    DROP TABLE IF EXISTS session, audit_events, outbox_messages, api_tokens, password_resets, invitations,
      memberships, workspaces, users CASCADE;
    DROP FUNCTION IF EXISTS audit_events_refuse_change();
  `);
}
