import type { MigrationContext } from '../server/db/migrator';

// In-process-control samples attached to a step of a route: the original file
// sits in the file storage (storage_key); a parsed trace is kept beside it as
// packed little-endian float64 arrays, with its peak table, hand-set
// integration limits and the peaks' assignments to route components.
export async function up({ context: { sequelize } }: { context: MigrationContext }): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    await sequelize.query(
      `
      CREATE TABLE chromatograms (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        workspace_id uuid NOT NULL REFERENCES workspaces (id) ON DELETE CASCADE,
        route_id uuid NOT NULL REFERENCES routes (id) ON DELETE CASCADE,
        step_id varchar(100) NOT NULL,
        revision integer CONSTRAINT chromatograms_revision_positive CHECK (revision > 0),
        sample_name varchar(200) NOT NULL,
        taken_at timestamptz,
        method_note text NOT NULL DEFAULT '',
        kind varchar(10) NOT NULL CONSTRAINT chromatograms_kind_valid CHECK (kind IN ('trace', 'document')),
        content_type varchar(100) NOT NULL,
        file_name varchar(255) NOT NULL,
        size_bytes integer NOT NULL CONSTRAINT chromatograms_size_positive CHECK (size_bytes > 0),
        storage_key varchar(300) NOT NULL UNIQUE,
        format varchar(20) NOT NULL,
        signal_name varchar(200),
        signals jsonb NOT NULL DEFAULT '[]',
        trace_time bytea,
        trace_signal bytea,
        points integer NOT NULL DEFAULT 0,
        peaks jsonb NOT NULL DEFAULT '[]',
        processing jsonb,
        integration jsonb,
        assignments jsonb NOT NULL DEFAULT '{}',
        created_by_id uuid REFERENCES users (id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT chromatograms_trace_present CHECK (
          (kind = 'trace') = (trace_time IS NOT NULL AND trace_signal IS NOT NULL)
        )
      );
      CREATE INDEX chromatograms_route_step_idx ON chromatograms (route_id, step_id, created_at, id);
      CREATE INDEX chromatograms_route_idx ON chromatograms (route_id, created_at, id);
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
  await sequelize.query('DROP TABLE IF EXISTS chromatograms;');
}
