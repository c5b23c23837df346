/**
 * Route drafts: the document being edited, saved with optimistic versions.
 * Every save names the version it started from; when someone else (or the
 * same person in another tab) saved in between, the save is refused with the
 * current draft and who changed it, never written over. Each saved document
 * is evaluated so the routes list can show its totals; a document the engine
 * cannot evaluate is still saved, with totals null and the reason.
 */
import type { Transaction } from 'sequelize';
import type { DraftDocument } from '@shared/schemas/routes';
import { apiError, type AppError, conflict } from '../errors';
import { Route, RouteDraft, User } from '../models';
import { enginePool } from '../pool';
import { recordAudit } from './audit';
import { incomplete, type DraftEvaluation } from './draft-evaluation';
import { inUserSlot, type EvaluationLimits } from './evaluation-limits';
import { ENGINE_VERSION, PROCESS_SAFETY_NOTE } from './evaluation';

export type { DraftEvaluation };

/**
 * Evaluates a draft in the engine pool (never on the web thread), within the
 * step limit; a draft over the limit is saved without totals, with the reason.
 */
export async function evaluateDraftInPool(
  document: DraftDocument,
  userId: string,
  limits: EvaluationLimits,
): Promise<DraftEvaluation> {
  if (document.steps.length === 0 || document.components.length === 0)
    return incomplete(
      document.steps.length,
      'route_incomplete',
      'Add the components and at least one step to evaluate the route.',
    );
  if (document.steps.length > limits.maxSteps) {
    return incomplete(
      document.steps.length,
      'route_too_large',
      `This route has ${document.steps.length} steps; the server evaluates at most ${limits.maxSteps}. The draft is saved without totals.`,
    );
  }
  return inUserSlot(userId, limits, () => enginePool().run('route.evaluateDraft', { document }));
}

export async function createDraft(
  routeId: string,
  document: DraftDocument,
  evaluation: DraftEvaluation,
  userId: string,
  transaction: Transaction | null,
): Promise<RouteDraft> {
  return RouteDraft.create(
    {
      routeId,
      document,
      version: 1,
      totals: evaluation.totals,
      evaluationError: evaluation.evaluationError,
      engineVersion: ENGINE_VERSION,
      stepCount: evaluation.stepCount,
      updatedById: userId,
    },
    { transaction },
  );
}

/** Loads the draft row locked for update, so two saves of one draft run one after the other. */
export async function lockDraft(
  routeId: string,
  transaction: Transaction | null,
): Promise<RouteDraft> {
  const draft = await RouteDraft.findByPk(routeId, {
    include: [{ model: User, as: 'updatedBy', attributes: ['id', 'name'] }],
    transaction,
    lock: transaction ? { level: transaction.LOCK.UPDATE, of: RouteDraft } : undefined,
  });
  if (!draft) throw new Error(`route ${routeId} has no draft`);
  return draft;
}

export function draftConflict(current: RouteDraft): AppError {
  const who = current.updatedBy?.name ?? 'someone';
  const when = current.updatedAt.toISOString();
  return apiError(
    'draft_conflict',
    `This draft was changed by ${who} at ${when} (version ${current.version}) after you started editing. Your edit was not saved; review their version, then apply your change to it.`,
    {
      current: {
        version: current.version,
        updatedAt: when,
        updatedBy: { id: current.updatedBy?.id ?? (current.updatedById as string), name: who },
        document: current.document as DraftDocument,
      },
    },
  );
}

export async function saveDraft(
  route: Route,
  input: { document: DraftDocument; baseVersion: number; evaluation: DraftEvaluation },
  actorId: string,
  transaction: Transaction | null,
): Promise<{ draft: RouteDraft; evaluation: DraftEvaluation }> {
  if (route.archivedAt)
    throw conflict('route_archived', 'This route is archived; unarchive it to edit its draft.');
  const draft = await lockDraft(route.id, transaction);
  if (draft.version !== input.baseVersion) throw draftConflict(draft);
  const { evaluation } = input;
  const before = { version: draft.version, stepCount: draft.stepCount };
  draft.set({
    document: input.document,
    version: draft.version + 1,
    totals: evaluation.totals,
    evaluationError: evaluation.evaluationError,
    engineVersion: ENGINE_VERSION,
    stepCount: evaluation.stepCount,
    updatedById: actorId,
  });
  // A save of an identical document still counts as a change of version.
  draft.changed('document', true);
  await draft.save({ transaction });
  route.changed('updatedAt', true);
  await route.save({ transaction });
  await recordAudit(
    {
      workspaceId: route.workspaceId as string,
      actorId,
      action: 'route.draft.save',
      entityType: 'route',
      entityId: route.id,
      before,
      after: {
        version: draft.version,
        stepCount: draft.stepCount,
        evaluated: evaluation.evaluationError === null,
      },
    },
    transaction,
  );
  return { draft, evaluation };
}

export { PROCESS_SAFETY_NOTE };
