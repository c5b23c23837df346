import type { MigrationContext } from '../server/db/migrator';

// Plant equipment of a workspace: vessels with their volumes, temperature and
// pressure range and material; filters and dryers with area and capacity. The
// checks repeat the payload schema's rules, so no path around the API can store
// a vessel whose minimum stirrable volume lies above its working volume.
export async function up({ context: { sequelize } }: { context: MigrationContext }): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    await sequelize.query(
      `
      CREATE TABLE equipment (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        workspace_id uuid NOT NULL REFERENCES workspaces (id) ON DELETE CASCADE,
        kind varchar(20) NOT NULL CONSTRAINT equipment_kind_valid CHECK (kind IN ('vessel','filter','dryer')),
        name varchar(120) NOT NULL,
        nominal_l double precision,
        min_stirrable_l double precision,
        max_working_l double precision,
        min_c double precision,
        max_c double precision,
        min_mbar double precision,
        max_mbar double precision,
        material varchar(120),
        area_m2 double precision,
        capacity_l double precision,
        created_by_id uuid REFERENCES users (id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT equipment_vessel_complete CHECK (kind <> 'vessel' OR (
          nominal_l > 0 AND min_stirrable_l >= 0 AND max_working_l > min_stirrable_l
          AND min_c <= max_c AND min_mbar >= 0 AND min_mbar <= max_mbar AND material IS NOT NULL
          AND area_m2 IS NULL AND capacity_l IS NULL)),
        CONSTRAINT equipment_unit_complete CHECK (kind = 'vessel' OR (
          area_m2 > 0 AND capacity_l > 0 AND nominal_l IS NULL AND min_stirrable_l IS NULL
          AND max_working_l IS NULL AND min_c IS NULL AND max_c IS NULL AND min_mbar IS NULL
          AND max_mbar IS NULL AND material IS NULL))
      );
      CREATE UNIQUE INDEX equipment_workspace_name_idx ON equipment (workspace_id, lower(name));
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
  await sequelize.query('DROP TABLE IF EXISTS equipment;');
}
