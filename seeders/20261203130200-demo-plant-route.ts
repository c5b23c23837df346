import type { MigrationContext } from '../server/db/migrator';
import type { DraftDocument } from '@shared/schemas/routes';
import { DEFAULT_SIGNATURE_MEANING } from '@shared/schemas/revisions';
import {
  ReviewDecision,
  ReviewRequest,
  ReviewRequestReviewer,
  Route,
  RouteRevision,
  User,
  Workspace,
} from '../server/models';
import { evaluateDraft } from '../server/services/draft-evaluation';
import { storeRevision } from '../server/services/revisions';
import { createRoute } from '../server/services/routes';
import { DEMO_WORKSPACES } from './data/demo-accounts';
import { demoAmideIsolation as demoRoute } from './data/demo-route';
import { DEMO_PROJECT_NAME } from './20261203000000-demo-route';

/** The approved copy of the demo route that the demo engineer turns into a plant step list. */
export const DEMO_PLANT_ROUTE_NAME = 'PW-417 plant transfer: amide isolation (demo, invented)';

/**
 * Gives the demo workspace an approved route for the plant (invented demo
 * history): the demo route saved as revision 1 by the demo chemist, sent to
 * the demo reviewer and approved with their signature. The review records are
 * written directly: no mail and no audit rows of their own for seeded history
 * (the revision's creation is audited as usual). The demo route
 * itself stays unsubmitted, for the review walkthrough. Leaves a route of the
 * same name alone.
 */
export async function up({ context: { sequelize } }: { context: MigrationContext }): Promise<void> {
  const demo = DEMO_WORKSPACES.find((w) => w.key === 'demo')!;
  await sequelize.transaction(async (transaction) => {
    const workspace = await Workspace.findOne({ where: { slug: demo.slug }, transaction });
    const chemist = await User.findOne({ where: { email: 'chemist@example.com' }, transaction });
    const reviewer = await User.findOne({ where: { email: 'reviewer@example.com' }, transaction });
    if (!workspace || !chemist || !reviewer) return;
    if (
      await Route.findOne({
        where: { workspaceId: workspace.id, name: DEMO_PLANT_ROUTE_NAME },
        transaction,
      })
    )
      return;
    const document = structuredClone(demoRoute) as unknown as DraftDocument;
    const route = await createRoute(
      {
        workspaceId: workspace.id,
        ownerId: chemist.id,
        name: DEMO_PLANT_ROUTE_NAME,
        projectName: DEMO_PROJECT_NAME,
        document,
        // Seeding runs before the server takes requests, so the engine may run here.
        evaluation: evaluateDraft(document),
      },
      transaction,
    );
    await storeRevision(
      route,
      structuredClone(document),
      {
        message: 'Route for the first plant batch (invented demo history).',
        draftVersion: 1,
      },
      chemist.id,
      transaction,
    );
    const revision = await RouteRevision.findOne({
      where: { routeId: route.id, number: 1 },
      transaction,
    });
    if (!revision) return;
    const review = await ReviewRequest.create(
      {
        revisionId: revision.id,
        routeId: route.id,
        workspaceId: workspace.id,
        submittedById: chemist.id,
        note: 'Ready for the plant: please review (invented demo history).',
      },
      { transaction },
    );
    await ReviewRequestReviewer.create(
      { reviewRequestId: review.id, reviewerId: reviewer.id },
      { transaction },
    );
    await ReviewDecision.create(
      {
        reviewRequestId: review.id,
        revisionId: revision.id,
        decision: 'approve',
        signerId: reviewer.id,
        signerName: reviewer.name,
        signerEmail: reviewer.email,
        meaning: DEFAULT_SIGNATURE_MEANING.approve,
        reason: null,
        contentHash: revision.contentHash,
      },
      { transaction },
    );
    await review.update({ status: 'approved', closedAt: new Date() }, { transaction });
  });
}
