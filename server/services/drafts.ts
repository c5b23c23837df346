/**
 * Route drafts: the document being edited, saved with optimistic versions.
 * Every save names the version it started from; when someone else (or the
 * same person in another tab) saved in between, the save is refused with the
 * current draft and who changed it, never written over. Each saved document
 * is evaluated so the routes list can show its totals; a document the engine
 * cannot evaluate is still saved, with totals null and the reason.
 */
import type { Transaction } from 'sequelize';
import type { RouteEvaluationError } from '@shared/schemas/evaluate';
import type { DraftDocument } from '@shared/schemas/routes';
import type { EngineWarning } from '@shared/schemas/route';
import { evaluateRoute, type RouteTotals } from '@shared/engine/route/evaluate';
import { apiError, type AppError, conflict } from '../errors';
import { Route, RouteDraft, User } from '../models';
import { recordAudit } from './audit';
import { describeFailure, ENGINE_VERSION, PROCESS_SAFETY_NOTE } from './evaluation';

export interface DraftEvaluation {
  totals: RouteTotals | null;
  evaluationError: RouteEvaluationError | { code: string; message: string; details: [] } | null;
  warnings: Array<EngineWarning & { stepId: string | null }>;
  stepCount: number;
}

/** What the engine says about a draft document; never throws for a document the engine rejects. */
export function evaluateDraft(document: DraftDocument): DraftEvaluation {
  const stepCount = document.steps.length;
  if (document.steps.length === 0 || document.components.length === 0) {
    return {
      totals: null,
      evaluationError: {
        code: 'route_incomplete',
        message: 'Add the components and at least one step to evaluate the route.',
        details: [],
      },
      warnings: [],
      stepCount,
    };
  }
  try {
    const result = evaluateRoute(document);
    return { totals: result.totals, evaluationError: null, warnings: result.warnings, stepCount };
  } catch (error) {
    const failure = describeFailure(error, document as Parameters<typeof describeFailure>[1]);
    if (!failure) throw error;
    return { totals: null, evaluationError: failure, warnings: [], stepCount };
  }
}

export async function createDraft(
  routeId: string,
  document: DraftDocument,
  userId: string,
  transaction: Transaction | null,
): Promise<RouteDraft> {
  const evaluation = evaluateDraft(document);
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
  input: { document: DraftDocument; baseVersion: number },
  actorId: string,
  transaction: Transaction | null,
): Promise<{ draft: RouteDraft; evaluation: DraftEvaluation }> {
  if (route.archivedAt)
    throw conflict('route_archived', 'This route is archived; unarchive it to edit its draft.');
  const draft = await lockDraft(route.id, transaction);
  if (draft.version !== input.baseVersion) throw draftConflict(draft);
  const evaluation = evaluateDraft(input.document);
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
