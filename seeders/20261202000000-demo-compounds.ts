import type { MigrationContext } from '../server/db/migrator';
import { Compound, User, Workspace } from '../server/models';
import { createCompound } from '../server/services/compounds';
import type { CompoundCreateInput } from '@shared/schemas/compounds';
import { DEMO_WORKSPACES } from './data/demo-accounts';

import type { CompoundSnapshot } from '@shared/schemas/route';
import { demoAmideIsolation } from './data/demo-route';

const INVENTED =
  'Invented demo compound: the structure is used for illustration and every entered value is invented, not measured.';

function toCreateInput(c: CompoundSnapshot): CompoundCreateInput {
  return {
    name: c.name,
    smiles: c.smiles,
    role: c.role,
    // Measured (here: invented) values only; estimates are the server's to make.
    pKa: c.pKa
      ?.filter((p) => p.source !== 'estimated')
      .map((p) => ({ value: p.value, type: p.type })),
    logP: c.logP === undefined ? undefined : { value: c.logP, method: 'invented demo value' },
    meltingPointC: c.meltingPointC,
    enthalpyFusionKJmol: c.enthalpyFusionKJmol,
    solubility: c.solubility?.map((p) => ({ ...p, source: p.source ?? 'invented demo value' })),
    partition: c.partition?.map((p) => ({ ...p, source: p.source ?? 'invented demo value' })),
    notes: c.note ? `${c.note} ${INVENTED}` : INVENTED,
    specLimitPct: c.specLimitPct,
    solidIncorporation: c.solidIncorporation,
  };
}

/**
 * The invented compounds of the demo route (the amide product, its acid and
 * amine coupling partners, an impurity and a by-product), so that the
 * compounds page and the demo route speak of the same substances.
 */
export const DEMO_COMPOUNDS: CompoundCreateInput[] = demoAmideIsolation.components
  .filter((c): c is CompoundSnapshot & { kind: 'compound' } => c.kind === 'compound')
  .map(toCreateInput);

/** Adds the invented compounds to the demo workspace; a compound already there (by name) is left alone. */
export async function up({ context: { sequelize } }: { context: MigrationContext }): Promise<void> {
  const demo = DEMO_WORKSPACES.find((w) => w.key === 'demo')!;
  await sequelize.transaction(async (transaction) => {
    const workspace = await Workspace.findOne({ where: { slug: demo.slug }, transaction });
    if (!workspace) return;
    const chemist = await User.findOne({ where: { email: 'chemist@example.com' }, transaction });
    for (const input of DEMO_COMPOUNDS) {
      const existing = await Compound.findOne({
        where: { workspaceId: workspace.id, name: input.name },
        transaction,
      });
      if (existing) continue;
      await createCompound(
        { workspaceId: workspace.id, actorId: chemist?.id ?? null, input },
        transaction,
      );
    }
  });
}
