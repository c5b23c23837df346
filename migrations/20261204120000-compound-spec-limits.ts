import type { MigrationContext } from '../server/db/migrator';

// The chemist's specification limit of an impurity in the isolated product
// (%, solvent-free) and its incorporation into the product's crystals
// (distribution coefficient); both optional.
export async function up({ context: { sequelize } }: { context: MigrationContext }): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    await sequelize.query(
      `
      ALTER TABLE compounds
        ADD COLUMN spec_limit_pct double precision
          CONSTRAINT compounds_spec_limit_range CHECK (spec_limit_pct >= 0 AND spec_limit_pct <= 100),
        ADD COLUMN solid_incorporation double precision
          CONSTRAINT compounds_solid_incorporation_range CHECK (solid_incorporation >= 0 AND solid_incorporation <= 10);
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
    'ALTER TABLE compounds DROP COLUMN IF EXISTS spec_limit_pct, DROP COLUMN IF EXISTS solid_incorporation;',
  );
}
