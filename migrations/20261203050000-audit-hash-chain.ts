import type { MigrationContext } from '../server/db/migrator';

/**
 * The audit trail becomes a hash chain per workspace (account events such as
 * sign-ins form one more chain, "account"). A BEFORE INSERT trigger, running
 * with the owner's rights, sets the time from the database clock, takes the
 * next position in the chain under a row lock on the chain's head (so two
 * concurrent inserts queue instead of forking the chain) and stores the hash
 * of the previous row with the row's own hash. Whatever the inserting role
 * sends for these columns is overwritten, so nobody can back-date a row.
 *
 * The digest is SHA-256 over the previous hash followed by the row as a jsonb
 * object (jsonb prints keys in a fixed order with fixed spacing, so the text
 * is canonical), with the time in UTC to the microsecond.
 */
export async function up({ context: { sequelize } }: { context: MigrationContext }): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    await sequelize.query(
      `
      ALTER TABLE audit_events
        ADD COLUMN chain text,
        ADD COLUMN position bigint,
        ADD COLUMN prev_hash char(64),
        ADD COLUMN hash char(64);

      CREATE TABLE audit_chain_heads (
        chain text PRIMARY KEY,
        position bigint NOT NULL,
        hash char(64) NOT NULL
      );

      CREATE FUNCTION audit_event_digest(
        p_prev_hash text, p_id uuid, p_chain text, p_position bigint, p_workspace_id uuid,
        p_actor_id uuid, p_action text, p_entity_type text, p_entity_id text, p_before jsonb,
        p_after jsonb, p_at timestamptz
      ) RETURNS char(64) LANGUAGE sql IMMUTABLE AS $$
        SELECT encode(sha256(convert_to(p_prev_hash || jsonb_build_object(
          'id', p_id, 'chain', p_chain, 'position', p_position, 'workspaceId', p_workspace_id,
          'actorId', p_actor_id, 'action', p_action, 'entityType', p_entity_type,
          'entityId', p_entity_id, 'before', p_before, 'after', p_after,
          'at', to_char(p_at AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.US"Z"')
        )::text, 'UTF8')), 'hex')
      $$;

      -- Backfill the rows written before the chain existed, oldest first.
      ALTER TABLE audit_events DISABLE TRIGGER audit_events_append_only;
      DO $$
      DECLARE
        r record;
        previous text;
        last_chain text := NULL;
        n bigint := 0;
        digest char(64);
      BEGIN
        FOR r IN
          SELECT e.*, coalesce(e.workspace_id::text, 'account') AS the_chain
            FROM audit_events e ORDER BY coalesce(e.workspace_id::text, 'account'), e.at, e.id
        LOOP
          IF last_chain IS DISTINCT FROM r.the_chain THEN
            IF last_chain IS NOT NULL THEN
              INSERT INTO audit_chain_heads VALUES (last_chain, n, previous);
            END IF;
            last_chain := r.the_chain; n := 0; previous := repeat('0', 64);
          END IF;
          n := n + 1;
          digest := audit_event_digest(previous, r.id, r.the_chain, n, r.workspace_id, r.actor_id,
            r.action, r.entity_type, r.entity_id, r.before, r.after, r.at);
          UPDATE audit_events SET chain = r.the_chain, position = n, prev_hash = previous, hash = digest
            WHERE id = r.id;
          previous := digest;
        END LOOP;
        IF last_chain IS NOT NULL THEN
          INSERT INTO audit_chain_heads VALUES (last_chain, n, previous);
        END IF;
      END $$;
      ALTER TABLE audit_events ENABLE TRIGGER audit_events_append_only;

      ALTER TABLE audit_events
        ALTER COLUMN chain SET NOT NULL,
        ALTER COLUMN position SET NOT NULL,
        ALTER COLUMN prev_hash SET NOT NULL,
        ALTER COLUMN hash SET NOT NULL,
        ALTER COLUMN at DROP DEFAULT;
      CREATE UNIQUE INDEX audit_events_chain_position_key ON audit_events (chain, position);
      CREATE INDEX audit_events_actor_idx ON audit_events (actor_id, at DESC);

      CREATE FUNCTION audit_events_link() RETURNS trigger
        LANGUAGE plpgsql SECURITY DEFINER SET search_path = public, pg_temp AS $$
      DECLARE
        head audit_chain_heads%ROWTYPE;
      BEGIN
        NEW.chain := coalesce(NEW.workspace_id::text, 'account');
        INSERT INTO audit_chain_heads (chain, position, hash)
          VALUES (NEW.chain, 0, repeat('0', 64)) ON CONFLICT (chain) DO NOTHING;
        SELECT * INTO head FROM audit_chain_heads WHERE chain = NEW.chain FOR UPDATE;
        -- The clock is read after the lock, so times rise along the chain.
        NEW.at := clock_timestamp();
        NEW.position := head.position + 1;
        NEW.prev_hash := head.hash;
        NEW.hash := audit_event_digest(NEW.prev_hash, NEW.id, NEW.chain, NEW.position,
          NEW.workspace_id, NEW.actor_id, NEW.action, NEW.entity_type, NEW.entity_id,
          NEW.before, NEW.after, NEW.at);
        UPDATE audit_chain_heads SET position = NEW.position, hash = NEW.hash WHERE chain = NEW.chain;
        RETURN NEW;
      END;
      $$;
      REVOKE ALL ON FUNCTION audit_events_link() FROM PUBLIC;
      CREATE TRIGGER audit_events_link
        BEFORE INSERT ON audit_events
        FOR EACH ROW EXECUTE FUNCTION audit_events_link();
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
    DROP TRIGGER IF EXISTS audit_events_link ON audit_events;
    DROP FUNCTION IF EXISTS audit_events_link();
    DROP TABLE IF EXISTS audit_chain_heads;
    ALTER TABLE audit_events ALTER COLUMN at SET DEFAULT now();
    DROP INDEX IF EXISTS audit_events_chain_position_key, audit_events_actor_idx;
    ALTER TABLE audit_events DROP COLUMN chain, DROP COLUMN position, DROP COLUMN prev_hash, DROP COLUMN hash;
    DROP FUNCTION IF EXISTS audit_event_digest(text, uuid, text, bigint, uuid, uuid, text, text, text, jsonb, jsonb, timestamptz);
  `);
}
