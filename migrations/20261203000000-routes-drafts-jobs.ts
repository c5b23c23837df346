import type { MigrationContext } from '../server/db/migrator';

// Projects group a workspace's routes; each route has one draft (the document
// being edited, with an optimistic version number) and evaluation jobs hold
// background Monte Carlo runs with their progress.
export async function up({ context: { sequelize } }: { context: MigrationContext }): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    await sequelize.query(
      `
      CREATE TABLE projects (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        workspace_id uuid NOT NULL REFERENCES workspaces (id) ON DELETE CASCADE,
        name varchar(120) NOT NULL CHECK (length(btrim(name)) > 0),
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      );
      CREATE UNIQUE INDEX projects_workspace_name_key ON projects (workspace_id, lower(name));

      CREATE TABLE routes (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        workspace_id uuid NOT NULL REFERENCES workspaces (id) ON DELETE CASCADE,
        project_id uuid REFERENCES projects (id) ON DELETE SET NULL,
        name varchar(200) NOT NULL CHECK (length(btrim(name)) > 0),
        owner_id uuid NOT NULL REFERENCES users (id) ON DELETE RESTRICT,
        archived_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      );
      CREATE INDEX routes_workspace_idx ON routes (workspace_id, archived_at, updated_at DESC);
      CREATE INDEX routes_project_idx ON routes (project_id);

      CREATE TABLE route_drafts (
        route_id uuid PRIMARY KEY REFERENCES routes (id) ON DELETE CASCADE,
        document jsonb NOT NULL,
        version integer NOT NULL CHECK (version >= 1),
        totals jsonb,
        evaluation_error jsonb,
        engine_version varchar(40),
        step_count integer NOT NULL DEFAULT 0,
        updated_by_id uuid NOT NULL REFERENCES users (id) ON DELETE RESTRICT,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      );

      CREATE TABLE evaluation_jobs (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        user_id uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
        kind varchar(40) NOT NULL CHECK (kind IN ('monte-carlo')),
        status varchar(20) NOT NULL DEFAULT 'queued' CHECK (status IN ('queued', 'running', 'done', 'failed')),
        progress double precision NOT NULL DEFAULT 0 CHECK (progress >= 0 AND progress <= 1),
        input jsonb NOT NULL,
        result jsonb,
        error jsonb,
        started_at timestamptz,
        finished_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      );
      CREATE INDEX evaluation_jobs_user_idx ON evaluation_jobs (user_id, created_at DESC);
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
  await sequelize.query(
    'DROP TABLE IF EXISTS evaluation_jobs, route_drafts, routes, projects CASCADE;',
  );
}
