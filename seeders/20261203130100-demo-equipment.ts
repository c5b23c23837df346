import type { EquipmentCreateInput } from '@shared/schemas/equipment';
import type { MigrationContext } from '../server/db/migrator';
import { Equipment, User, Workspace } from '../server/models';
import { createEquipment } from '../server/services/equipment';
import { DEMO_WORKSPACES } from './data/demo-accounts';

/**
 * Invented demo equipment (tags, sizes and ranges are made up for the demo,
 * not taken from any plant): two reactors of different size, so a 50 kg batch
 * of the demo route fits one and overfills the other, a filter and a dryer.
 */
export const DEMO_EQUIPMENT: EquipmentCreateInput[] = [
  {
    kind: 'vessel',
    name: 'R-101 (invented)',
    nominalL: 1600,
    minStirrableL: 150,
    maxWorkingL: 1400,
    minC: -20,
    maxC: 150,
    minMbar: 20,
    maxMbar: 4000,
    material: 'Glass-lined steel',
  },
  {
    kind: 'vessel',
    name: 'R-102 (invented)',
    nominalL: 630,
    minStirrableL: 60,
    maxWorkingL: 560,
    minC: -20,
    maxC: 150,
    minMbar: 20,
    maxMbar: 4000,
    material: 'Stainless steel 316L',
  },
  {
    kind: 'vessel',
    name: 'R-201 (invented)',
    nominalL: 4000,
    minStirrableL: 400,
    maxWorkingL: 3600,
    minC: -10,
    maxC: 160,
    minMbar: 50,
    maxMbar: 6000,
    material: 'Hastelloy C-22',
  },
  { kind: 'filter', name: 'F-301 Nutsche filter (invented)', areaM2: 0.6, capacityL: 250 },
  { kind: 'dryer', name: 'D-401 Conical vacuum dryer (invented)', areaM2: 2.5, capacityL: 300 },
];

/** Adds the invented equipment to the demo workspace; an item already there (by name) is left alone. */
export async function up({ context: { sequelize } }: { context: MigrationContext }): Promise<void> {
  const demo = DEMO_WORKSPACES.find((w) => w.key === 'demo')!;
  await sequelize.transaction(async (transaction) => {
    const workspace = await Workspace.findOne({ where: { slug: demo.slug }, transaction });
    const engineer = await User.findOne({ where: { email: 'engineer@example.com' }, transaction });
    if (!workspace || !engineer) return;
    for (const input of DEMO_EQUIPMENT) {
      if (
        await Equipment.findOne({
          where: { workspaceId: workspace.id, name: input.name },
          transaction,
        })
      )
        continue;
      await createEquipment(workspace.id, engineer.id, input, transaction);
    }
  });
}
