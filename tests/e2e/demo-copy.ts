import type { DraftDocument } from '@shared/schemas/routes';
import { User, Workspace } from '../../server/models';
import { evaluateDraft } from '../../server/services/draft-evaluation';
import { createRoute } from '../../server/services/routes';
import { DEMO_PROJECT_NAME, DEMO_ROUTE_NAME } from '../../seeders/20261203000000-demo-route';
import { DEMO_WORKSPACES } from '../../seeders/data/demo-accounts';
import { demoAmideIsolation } from '../../seeders/data/demo-route';

/**
 * A fresh copy of the demo route as seeded, owned by the demo chemist in the demo workspace,
 * for a flow that changes the route. The e2e files share one database, so a flow that edited
 * the demo route itself would change what the next file finds; a copy of the seed document
 * leaves the demo route as seeded and does not see what other files did to it.
 * Returns the copy's name (unique), by which the flow opens it from the routes list.
 */
export async function demoRouteCopy(purpose: string): Promise<string> {
  const slug = DEMO_WORKSPACES.find((w) => w.key === 'demo')!.slug;
  const workspace = await Workspace.findOne({ where: { slug } });
  const chemist = await User.findOne({ where: { email: 'chemist@example.com' } });
  if (!workspace || !chemist) throw new Error('The demo seed has not run.');
  const name = `${DEMO_ROUTE_NAME} — ${purpose} ${Date.now().toString(36)}`;
  const document = structuredClone(demoAmideIsolation) as unknown as DraftDocument;
  await createRoute(
    {
      workspaceId: workspace.id,
      ownerId: chemist.id,
      name,
      projectName: DEMO_PROJECT_NAME,
      document,
      evaluation: evaluateDraft(document),
    },
    null,
  );
  return name;
}
