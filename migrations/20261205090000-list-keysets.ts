import type { MigrationContext } from '../server/db/migrator';

// Lists page by keyset (the last row's sort key and id) and search in SQL, each served by an
// index. A route's last change is the later of its own change and its draft's: kept in
// routes.changed_at by triggers, so the routes list sorts and pages on one indexed column.
// Search uses trigram indexes (pg_trgm, a trusted extension the database owner may create),
// which serve ILIKE '%text%'.
export async function up({ context: { sequelize } }: { context: MigrationContext }): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    await sequelize.query(
      `
      CREATE EXTENSION IF NOT EXISTS pg_trgm;

      ALTER TABLE routes ADD COLUMN changed_at timestamptz;
      UPDATE routes r SET changed_at = GREATEST(r.updated_at, d.updated_at)
        FROM route_drafts d WHERE d.route_id = r.id;
      UPDATE routes SET changed_at = updated_at WHERE changed_at IS NULL;
      ALTER TABLE routes ALTER COLUMN changed_at SET NOT NULL,
        ALTER COLUMN changed_at SET DEFAULT now();

      CREATE FUNCTION routes_changed_at_on_write() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        IF TG_OP = 'INSERT' THEN
          NEW.changed_at := NEW.updated_at;
        ELSE
          NEW.changed_at := GREATEST(OLD.changed_at, NEW.updated_at);
        END IF;
        RETURN NEW;
      END $$;
      CREATE TRIGGER routes_changed_at BEFORE INSERT OR UPDATE OF updated_at ON routes
        FOR EACH ROW EXECUTE FUNCTION routes_changed_at_on_write();

      CREATE FUNCTION routes_changed_at_from_draft() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        UPDATE routes SET changed_at = NEW.updated_at
          WHERE id = NEW.route_id AND changed_at < NEW.updated_at;
        RETURN NULL;
      END $$;
      CREATE TRIGGER route_drafts_changed_at AFTER INSERT OR UPDATE OF updated_at ON route_drafts
        FOR EACH ROW EXECUTE FUNCTION routes_changed_at_from_draft();

      CREATE INDEX routes_current_changed_idx ON routes (workspace_id, changed_at DESC, id DESC)
        WHERE archived_at IS NULL;
      CREATE INDEX routes_archived_changed_idx ON routes (workspace_id, changed_at DESC, id DESC)
        WHERE archived_at IS NOT NULL;
      CREATE INDEX routes_current_name_idx ON routes (workspace_id, lower(name), id)
        WHERE archived_at IS NULL;
      CREATE INDEX routes_archived_name_idx ON routes (workspace_id, lower(name), id)
        WHERE archived_at IS NOT NULL;
      CREATE INDEX routes_name_trgm_idx ON routes USING gin (name gin_trgm_ops);
      CREATE INDEX projects_name_trgm_idx ON projects USING gin (name gin_trgm_ops);
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
    DROP INDEX IF EXISTS routes_current_changed_idx, routes_archived_changed_idx,
      routes_current_name_idx, routes_archived_name_idx, routes_name_trgm_idx, projects_name_trgm_idx;
    DROP TRIGGER IF EXISTS route_drafts_changed_at ON route_drafts;
    DROP TRIGGER IF EXISTS routes_changed_at ON routes;
    DROP FUNCTION IF EXISTS routes_changed_at_from_draft();
    DROP FUNCTION IF EXISTS routes_changed_at_on_write();
    ALTER TABLE routes DROP COLUMN IF EXISTS changed_at;
  `);
}
