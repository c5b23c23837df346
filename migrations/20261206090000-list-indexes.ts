import type { MigrationContext } from '../server/db/migrator';

// Every list pages by keyset and sorts and searches in SQL: each order has an index whose
// columns are the list's filter, then its sort key, then the id; each substring search a
// trigram index (pg_trgm, created by "list-keysets"). Indexes the new ones cover are dropped.
// Equipment lists vessels, then filters, then dryers: the kind's rank is an expression so that
// every key column runs in one direction (a row comparison pages it).
const KIND_RANK = `(CASE kind WHEN 'vessel' THEN 0 WHEN 'filter' THEN 1 ELSE 2 END)`;

export async function up({ context: { sequelize } }: { context: MigrationContext }): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    await sequelize.query(
      `
      CREATE INDEX projects_workspace_name_id_idx ON projects (workspace_id, lower(name), id);

      DROP INDEX compounds_workspace_name_idx;
      CREATE INDEX compounds_workspace_name_id_idx ON compounds (workspace_id, lower(name), id);
      CREATE INDEX compounds_workspace_created_idx ON compounds (workspace_id, created_at DESC, id DESC);
      CREATE INDEX compounds_name_trgm_idx ON compounds USING gin (name gin_trgm_ops);
      CREATE INDEX compounds_formula_trgm_idx ON compounds USING gin (formula gin_trgm_ops);

      CREATE INDEX users_name_id_idx ON users (lower(name), id);
      CREATE INDEX users_name_trgm_idx ON users USING gin (name gin_trgm_ops);
      CREATE INDEX users_email_trgm_idx ON users USING gin (email gin_trgm_ops);

      DROP INDEX review_comments_revision_idx;
      CREATE INDEX review_comments_revision_created_idx ON review_comments (revision_id, created_at, id);
      CREATE INDEX review_comments_body_trgm_idx ON review_comments USING gin (body gin_trgm_ops);

      CREATE INDEX equipment_workspace_kind_name_idx
        ON equipment (workspace_id, ${KIND_RANK}, lower(name), id);
      CREATE INDEX equipment_workspace_kind_size_idx
        ON equipment (workspace_id, ${KIND_RANK}, (-coalesce(max_working_l, capacity_l)), id);
      CREATE INDEX equipment_name_trgm_idx ON equipment USING gin (name gin_trgm_ops);

      DROP INDEX audit_events_workspace_at_idx;
      CREATE INDEX audit_events_workspace_at_id_idx ON audit_events (workspace_id, at DESC, id DESC);
      CREATE INDEX audit_events_action_trgm_idx
        ON audit_events USING gin ((action || ' ' || entity_type) gin_trgm_ops);

      CREATE INDEX chromatograms_sample_name_trgm_idx
        ON chromatograms USING gin (sample_name gin_trgm_ops);

      DROP INDEX evaluation_jobs_user_idx;
      CREATE INDEX evaluation_jobs_user_created_idx
        ON evaluation_jobs (user_id, created_at DESC, id DESC);
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
    DROP INDEX IF EXISTS projects_workspace_name_id_idx, compounds_workspace_name_id_idx,
      compounds_workspace_created_idx, compounds_name_trgm_idx, compounds_formula_trgm_idx,
      users_name_id_idx, users_name_trgm_idx, users_email_trgm_idx,
      review_comments_revision_created_idx, review_comments_body_trgm_idx,
      equipment_workspace_kind_name_idx, equipment_workspace_kind_size_idx, equipment_name_trgm_idx,
      audit_events_workspace_at_id_idx, audit_events_action_trgm_idx,
      chromatograms_sample_name_trgm_idx, evaluation_jobs_user_created_idx;
    CREATE INDEX IF NOT EXISTS compounds_workspace_name_idx ON compounds (workspace_id, name);
    CREATE INDEX IF NOT EXISTS review_comments_revision_idx ON review_comments (revision_id, created_at);
    CREATE INDEX IF NOT EXISTS audit_events_workspace_at_idx ON audit_events (workspace_id, at DESC);
    CREATE INDEX IF NOT EXISTS evaluation_jobs_user_idx ON evaluation_jobs (user_id, created_at DESC);
  `);
}
