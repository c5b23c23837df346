import type { MigrationContext } from '../server/db/migrator';
import { Compound, User, Workspace } from '../server/models';
import { createCompound } from '../server/services/compounds';
import type { CompoundCreateInput } from '@shared/schemas/compounds';
import { DEMO_WORKSPACES } from './data/demo-accounts';

const INVENTED = 'Invented demo compound: the structure is used for illustration and every entered value is invented, not measured.';

/** The invented amide product of the demo workspace, its acid and amine starting materials and a dimer by-product. */
export const DEMO_COMPOUNDS: CompoundCreateInput[] = [
  {
    name: 'Velmorane amide (invented)',
    smiles: 'COc1ccc(CC(=O)NCc2ccccc2)cc1',
    role: 'product',
    logP: { value: 2.4, method: 'invented demo value' },
    meltingPointC: 121,
    enthalpyFusionKJmol: 31,
    solubility: [
      { solventId: 'ethyl-acetate', temperatureC: 20, value: 38, unit: 'g/L', source: 'invented demo value' },
      { solventId: 'ethyl-acetate', temperatureC: 60, value: 140, unit: 'g/L', source: 'invented demo value' },
      { solventId: 'n-heptane', temperatureC: 20, value: 0.4, unit: 'g/L', source: 'invented demo value' },
    ],
    partition: [{ organicSolventId: 'ethyl-acetate', pH: 7, temperatureC: 20, D: 180, source: 'invented demo value' }],
    notes: INVENTED,
  },
  {
    name: 'Velmoric acid (invented)',
    smiles: 'COc1ccc(CC(=O)O)cc1',
    role: 'impurity',
    pKa: [{ value: 4.4, type: 'acid' }],
    meltingPointC: 86,
    enthalpyFusionKJmol: 25,
    notes: `Unreacted acid. ${INVENTED}`,
  },
  {
    name: 'Amine B (invented)',
    smiles: 'NCc1ccccc1',
    role: 'reagent',
    pKa: [{ value: 9.3, type: 'base' }],
    notes: `Amine starting material, used in excess. ${INVENTED}`,
  },
  {
    name: 'Dibenzyl dimer (invented)',
    smiles: 'COc1ccc(CC(=O)N(Cc2ccccc2)Cc2ccccc2)cc1',
    role: 'by-product',
    meltingPointC: 98,
    enthalpyFusionKJmol: 34,
    notes: `Over-alkylation by-product. ${INVENTED}`,
  },
];

/** Adds the invented compounds to the demo workspace; a compound already there (by name) is left alone. */
export async function up({ context: { sequelize } }: { context: MigrationContext }): Promise<void> {
  const demo = DEMO_WORKSPACES.find((w) => w.key === 'demo')!;
  await sequelize.transaction(async (transaction) => {
    const workspace = await Workspace.findOne({ where: { slug: demo.slug }, transaction });
    if (!workspace) return;
    const chemist = await User.findOne({ where: { email: 'chemist@example.com' }, transaction });
    for (const input of DEMO_COMPOUNDS) {
      const existing = await Compound.findOne({ where: { workspaceId: workspace.id, name: input.name }, transaction });
      if (existing) continue;
      await createCompound({ workspaceId: workspace.id, actorId: chemist?.id ?? null, input }, transaction);
    }
  });
}
