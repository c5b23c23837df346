import type { MigrationContext } from '../server/db/migrator';
import type { DraftDocument } from '@shared/schemas/routes';
import { Route, RouteRevision, User, Workspace } from '../server/models';
import { storeRevision } from '../server/services/revisions';
import { DEMO_WORKSPACES } from './data/demo-accounts';
import { demoAmideIsolation as demoRoute } from './data/demo-route';
import { DEMO_ROUTE_NAME } from './20261203000000-demo-route';

/**
 * Gives the demo route an invented history of two revisions, so History and
 * Compare have something to show: revision 1, an earlier version (cooled only
 * to 15 °C, one cake wash), and revision 2, the route as it stands. Neither is
 * submitted: the demo chemist sends revision 2 for review. Leaves a route that
 * already has revisions alone.
 */
export function earlierDemoDocument(): DraftDocument {
  const document = structuredClone(demoRoute) as unknown as DraftDocument;
  const steps = document.steps as unknown as Array<{
    id: string;
    name: string;
    params: Record<string, unknown>;
  }>;
  const cool = steps.find((s) => s.id === 'cool')!;
  cool.name = 'Cool to 15 °C and age';
  cool.params = {
    ...cool.params,
    mode: { kind: 'cooling', startC: 60, endC: { value: 15, plusMinus: 2 } },
  };
  const filter = steps.find((s) => s.id === 'filter')!;
  const cakeWash = filter.params.cakeWash as Record<string, unknown>;
  filter.params = { ...filter.params, cakeWash: { ...cakeWash, washes: 1 } };
  return document;
}

export async function up({ context: { sequelize } }: { context: MigrationContext }): Promise<void> {
  const demo = DEMO_WORKSPACES.find((w) => w.key === 'demo')!;
  await sequelize.transaction(async (transaction) => {
    const workspace = await Workspace.findOne({ where: { slug: demo.slug }, transaction });
    const chemist = await User.findOne({ where: { email: 'chemist@example.com' }, transaction });
    if (!workspace || !chemist) return;
    const route = await Route.findOne({
      where: { workspaceId: workspace.id, name: DEMO_ROUTE_NAME },
      transaction,
    });
    if (!route) return;
    if ((await RouteRevision.count({ where: { routeId: route.id }, transaction })) > 0) return;
    await storeRevision(
      route,
      earlierDemoDocument(),
      {
        message: 'First complete isolation: cool to 15 °C, one cake wash (invented demo history).',
        draftVersion: 1,
      },
      chemist.id,
      transaction,
    );
    await storeRevision(
      route,
      structuredClone(demoRoute) as unknown as DraftDocument,
      {
        message:
          'Cool to 5 °C and wash the cake twice: more yield, better purge of the des-chloro amide.',
        draftVersion: 1,
      },
      chemist.id,
      transaction,
    );
  });
}
