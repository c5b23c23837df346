import type { MigrationContext } from '../server/db/migrator';
import { Route, User, Workspace } from '../server/models';
import { evaluateDraft } from '../server/services/draft-evaluation';
import { createRoute } from '../server/services/routes';
import type { DraftDocument } from '@shared/schemas/routes';
import { demoAmideIsolation as demoRoute } from './data/demo-route';
import { DEMO_WORKSPACES } from './data/demo-accounts';

/** Project of the demo route; invented, like every compound in the route. */
export const DEMO_PROJECT_NAME = 'PW-417 programme (invented)';
/** The route's name in the list: the fixture's own name, which says it is invented. */
export const DEMO_ROUTE_NAME = (demoRoute as { name: string }).name;

/**
 * Gives the demo workspace the complete invented isolation route (acid, base
 * and brine washes, solvent swap, antisolvent and cooling crystallisation,
 * filtration with cake washes, drying), owned by the demo chemist, with its
 * draft evaluated. Leaves a route of the same name alone, so running it again
 * changes nothing.
 */
export async function up({ context: { sequelize } }: { context: MigrationContext }): Promise<void> {
  const demo = DEMO_WORKSPACES.find((w) => w.key === 'demo')!;
  await sequelize.transaction(async (transaction) => {
    const workspace = await Workspace.findOne({ where: { slug: demo.slug }, transaction });
    const chemist = await User.findOne({ where: { email: 'chemist@example.com' }, transaction });
    if (!workspace || !chemist) return;
    const existing = await Route.findOne({
      where: { workspaceId: workspace.id, name: DEMO_ROUTE_NAME },
      transaction,
    });
    if (existing) return;
    const document = structuredClone(demoRoute) as unknown as DraftDocument;
    await createRoute(
      {
        workspaceId: workspace.id,
        ownerId: chemist.id,
        name: DEMO_ROUTE_NAME,
        projectName: DEMO_PROJECT_NAME,
        document,
        // Seeding runs before the server takes requests, so the engine may run here.
        evaluation: evaluateDraft(document),
      },
      transaction,
    );
  });
}
