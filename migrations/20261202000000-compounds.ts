import type { MigrationContext } from '../server/db/migrator';

// Workspace compounds: the structure as given (SMILES or molfile), what the
// server derived from it, the chemist's measured data, and estimates marked as such.
export async function up({ context: { sequelize } }: { context: MigrationContext }): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    await sequelize.query(
      `
      CREATE TABLE compounds (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        workspace_id uuid NOT NULL REFERENCES workspaces (id) ON DELETE CASCADE,
        name varchar(200) NOT NULL,
        role varchar(20) NOT NULL CONSTRAINT compounds_role_valid CHECK (role IN ('product','impurity','reagent','by-product')),
        smiles text,
        molfile text,
        canonical_smiles text NOT NULL,
        formula varchar(200) NOT NULL,
        molar_mass_gmol double precision NOT NULL CONSTRAINT compounds_molar_mass_positive CHECK (molar_mass_gmol > 0),
        svg text NOT NULL,
        pka jsonb NOT NULL DEFAULT '[]',
        log_p jsonb,
        melting_point_c double precision,
        enthalpy_fusion_kjmol double precision,
        hansen jsonb,
        unifac jsonb NOT NULL,
        estimate_notes jsonb NOT NULL DEFAULT '[]',
        solubility jsonb NOT NULL DEFAULT '[]',
        partition jsonb NOT NULL DEFAULT '[]',
        notes text NOT NULL DEFAULT '',
        created_by_id uuid REFERENCES users (id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT compounds_structure_present CHECK (smiles IS NOT NULL OR molfile IS NOT NULL)
      );
      CREATE INDEX compounds_workspace_name_idx ON compounds (workspace_id, name);
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
  await sequelize.query('DROP TABLE IF EXISTS compounds;');
}
