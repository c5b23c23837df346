/**
 * Saved revisions: an immutable snapshot of the route's current draft with
 * the server's own evaluation, the engine version, the author, a message and
 * a content hash, numbered per route. Saving leaves the draft as it is.
 * A revision's status follows from its latest review request.
 */
import { Op, literal, type Transaction } from 'sequelize';
import type { DraftDocument } from '@shared/schemas/routes';
import type {
  RevisionStatus,
  RevisionSummary,
  RevisionTotals,
  Signature,
} from '@shared/schemas/revisions';
import { evaluateRoute } from '@shared/engine/route/evaluate';
import { apiError, conflict, notFound, type AppError } from '../errors';
import {
  ReviewDecision,
  ReviewRequest,
  Route,
  RouteRevision,
  User,
  type RouteDraft,
} from '../models';
import { database } from '../db/sequelize';
import { recordAudit } from './audit';
import {
  afterCursor,
  containsPattern,
  keyAttributes,
  keyOrder,
  pageOf,
  type KeysetOrder,
} from './keyset';
import { revisionContentHash } from './content-hash';
import { lockDraft } from './drafts';
import { describeFailure, ENGINE_VERSION } from './evaluation';

// ---------------------------------------------------------------- saving

interface RevisionEvaluation {
  result: Record<string, unknown> | null;
  evaluationError: { code: string; message: string; details: unknown[] } | null;
  totals: RevisionTotals | null;
}

/** The server's own evaluation of the document, as plain JSON (what is stored is what is hashed). */
function evaluateForRevision(document: DraftDocument): RevisionEvaluation {
  if (document.steps.length === 0 || document.components.length === 0) {
    return {
      result: null,
      totals: null,
      evaluationError: {
        code: 'route_incomplete',
        message: 'The route has no steps or no components yet, so it has no results.',
        details: [],
      },
    };
  }
  try {
    const result = JSON.parse(JSON.stringify(evaluateRoute(document))) as Record<string, unknown>;
    return { result, totals: result.totals as RevisionTotals, evaluationError: null };
  } catch (error) {
    const failure = describeFailure(error, document as Parameters<typeof describeFailure>[1]);
    if (!failure) throw error;
    return {
      result: null,
      totals: null,
      evaluationError: JSON.parse(JSON.stringify(failure)) as RevisionEvaluation['evaluationError'],
    };
  }
}

export function staleDraft(draft: RouteDraft): AppError {
  return apiError(
    'stale_draft',
    `The draft has changed since you looked at it: it is now at version ${draft.version}. Review the current draft, then save the revision again.`,
    {
      draftVersion: draft.version,
      updatedAt: draft.updatedAt.toISOString(),
      updatedBy: draft.updatedBy
        ? { id: draft.updatedBy.id, name: draft.updatedBy.name }
        : { id: draft.updatedById as string, name: 'someone' },
    },
  );
}

/**
 * Saves the route's current draft as the next revision. The draft row is
 * locked for the whole transaction, so two saves (and a draft save) queue:
 * every revision gets its own number and holds exactly the draft version it
 * names. A newer revision supersedes the open reviews of older ones.
 */
export async function saveRevision(
  route: Route,
  input: { message: string; baseDraftVersion: number },
  actorId: string,
  transaction: Transaction | null,
): Promise<RouteRevision> {
  if (route.archivedAt)
    throw conflict('route_archived', 'This route is archived; unarchive it to save a revision.');
  const draft = await lockDraft(route.id, transaction);
  if (draft.version !== input.baseDraftVersion) throw staleDraft(draft);
  return storeRevision(
    route,
    draft.document as DraftDocument,
    { message: input.message, draftVersion: draft.version },
    actorId,
    transaction,
  );
}

/**
 * Stores a document as the route's next revision with the server's own
 * evaluation and content hash (the caller holds the draft lock, or seeds).
 */
export async function storeRevision(
  route: Route,
  source: DraftDocument,
  input: { message: string; draftVersion: number },
  actorId: string,
  transaction: Transaction | null,
): Promise<RouteRevision> {
  const document = JSON.parse(JSON.stringify(source)) as DraftDocument;
  const evaluation = evaluateForRevision(document);
  const contentHash = revisionContentHash({
    document,
    result: evaluation.result,
    engineVersion: ENGINE_VERSION,
  });
  const last = (await RouteRevision.max('number', {
    where: { routeId: route.id },
    transaction,
  })) as number | null;
  const revision = await RouteRevision.create(
    {
      routeId: route.id,
      workspaceId: route.workspaceId as string,
      number: (last ?? 0) + 1,
      message: input.message,
      document,
      result: evaluation.result,
      evaluationError: evaluation.evaluationError,
      totals: evaluation.totals,
      engineVersion: ENGINE_VERSION,
      contentHash,
      draftVersion: input.draftVersion,
      authorId: actorId,
    },
    { transaction },
  );
  await recordAudit(
    {
      workspaceId: route.workspaceId as string,
      actorId,
      action: 'revision.create',
      entityType: 'revision',
      entityId: revision.id,
      after: {
        routeId: route.id,
        number: revision.number,
        message: revision.message,
        contentHash,
        engineVersion: ENGINE_VERSION,
        draftVersion: input.draftVersion,
      },
    },
    transaction,
  );
  await supersedeOpenReviews(route, revision, actorId, transaction);
  revision.author = (await User.findByPk(actorId, { transaction }))!;
  return revision;
}

async function supersedeOpenReviews(
  route: Route,
  newer: RouteRevision,
  actorId: string,
  transaction: Transaction | null,
): Promise<void> {
  const open = await ReviewRequest.findAll({
    where: { routeId: route.id, status: 'in_review', revisionId: { [Op.ne]: newer.id } },
    include: [{ model: RouteRevision, as: 'revision', attributes: ['number'] }],
    transaction,
  });
  for (const review of open) {
    await review.update({ status: 'superseded', closedAt: new Date() }, { transaction });
    await recordAudit(
      {
        workspaceId: route.workspaceId as string,
        actorId,
        action: 'review.superseded',
        entityType: 'review',
        entityId: review.id,
        before: { status: 'in_review', revision: review.revision?.number },
        after: { status: 'superseded', byRevision: newer.number },
      },
      transaction,
    );
  }
}

// ---------------------------------------------------------------- reading

const reviewIncludes = [
  { model: User, as: 'submittedBy', attributes: ['id', 'name'] },
  {
    model: User,
    as: 'reviewers',
    attributes: ['id', 'name', 'email'],
    through: { attributes: [] },
  },
  { model: ReviewDecision, as: 'decisions' },
];

export type RevisionWithReviews = RouteRevision & { reviews?: ReviewRequest[] };

/** The status in plain words, from the latest review request. */
export function revisionStatus(revision: RevisionWithReviews): RevisionStatus {
  const latest = [...(revision.reviews ?? [])].sort(
    (a, b) => b.createdAt.getTime() - a.createdAt.getTime(),
  )[0];
  return latest ? latest.status : 'draft';
}

export async function loadRevision(
  route: Route,
  number: number,
  transaction: Transaction | null,
  options: { withContent?: boolean; lock?: boolean } = {},
): Promise<RevisionWithReviews> {
  const revision = await RouteRevision.findOne({
    where: { routeId: route.id, number },
    attributes: options.withContent ? undefined : { exclude: ['document', 'result'] },
    include: [{ model: User, as: 'author', attributes: ['id', 'name', 'email'] }],
    transaction,
  });
  if (!revision) throw notFound('The revision');
  (revision as RevisionWithReviews).reviews = await ReviewRequest.findAll({
    where: { revisionId: revision.id },
    include: reviewIncludes,
    order: [['createdAt', 'DESC']],
    transaction,
    lock:
      options.lock && transaction
        ? { level: transaction.LOCK.UPDATE, of: ReviewRequest }
        : undefined,
  });
  return revision;
}

/** A route's revisions by number; the number is unique within the route. */
const REVISION_ORDERS: Record<'newest' | 'oldest', KeysetOrder> = {
  newest: {
    name: 'newest',
    columns: [{ sql: '"RouteRevision"."number"', type: 'int' }],
    direction: 'DESC',
  },
  oldest: {
    name: 'oldest',
    columns: [{ sql: '"RouteRevision"."number"', type: 'int' }],
    direction: 'ASC',
  },
};

/**
 * One page of the route's revisions, newest first by default; only approved ones when
 * `approvedOnly` (scale-up engineers). `q` matches part of the message or the author's name.
 */
export async function listRevisions(
  route: Route,
  page: { limit: number; cursor?: string; q?: string; sort?: 'newest' | 'oldest' },
  approvedOnly: boolean,
  transaction: Transaction | null,
): Promise<{ items: RevisionWithReviews[]; nextCursor: string | null }> {
  const order = REVISION_ORDERS[page.sort ?? 'newest'];
  // Keyset on the route's revision number (route_revisions_route_number_key serves both
  // directions); one row beyond the page says whether there is a next one. A search filters
  // the route's own revisions on that walk: a route has hundreds of revisions, not millions.
  // An engineer sees approved revisions only: those whose latest review request is approved,
  // decided in SQL so pages stay full.
  const pattern = page.q ? database().escape(containsPattern(page.q)) : null;
  const revisions = await RouteRevision.findAll({
    where: {
      [Op.and]: [
        { routeId: route.id },
        ...(page.cursor ? [afterCursor(order, page.cursor)] : []),
        ...(pattern
          ? [
              literal(
                `("RouteRevision"."message" ILIKE ${pattern} OR "RouteRevision"."author_id" IN (SELECT u.id FROM users u WHERE u.name ILIKE ${pattern}))`,
              ),
            ]
          : []),
        ...(approvedOnly
          ? [
              literal(
                `(SELECT rr.status FROM review_requests rr WHERE rr.revision_id = "RouteRevision"."id" ORDER BY rr.created_at DESC LIMIT 1) = 'approved'`,
              ),
            ]
          : []),
      ],
    },
    attributes: { exclude: ['document', 'result'], include: keyAttributes(order) },
    include: [{ model: User, as: 'author', attributes: ['id', 'name', 'email'] }],
    order: keyOrder(order),
    limit: page.limit + 1,
    transaction,
  });
  const reviews = await ReviewRequest.findAll({
    where: { revisionId: revisions.map((r) => r.id) },
    attributes: ['id', 'revisionId', 'status', 'createdAt'],
    transaction,
  });
  for (const revision of revisions as RevisionWithReviews[])
    revision.reviews = reviews.filter((r) => r.revisionId === revision.id);
  const visible = approvedOnly
    ? revisions.filter((r) => revisionStatus(r as RevisionWithReviews) === 'approved')
    : revisions;
  return pageOf(visible as RevisionWithReviews[], page.limit, order);
}

// ---------------------------------------------------------------- presenting

export function presentSignature(decision: ReviewDecision): Signature {
  return {
    id: decision.id,
    decision: decision.decision,
    signer: {
      id: decision.signerId as string,
      name: decision.signerName,
      email: decision.signerEmail,
    },
    signedAt: decision.signedAt.toISOString(),
    meaning: decision.meaning,
    reason: decision.reason,
    contentHash: decision.contentHash,
  };
}

export function presentRevisionSummary(revision: RevisionWithReviews): RevisionSummary {
  return {
    number: revision.number,
    contentHash: revision.contentHash,
    message: revision.message,
    status: revisionStatus(revision),
    author: { id: revision.author!.id, name: revision.author!.name },
    createdAt: revision.createdAt.toISOString(),
    totals: (revision.totals ?? null) as RevisionTotals | null,
  };
}

/** The approving signatures of an approved revision (of its approving review), else null. */
export function approvalOf(revision: RevisionWithReviews): { signatures: Signature[] } | null {
  const approved = (revision.reviews ?? []).find((review) => review.status === 'approved');
  if (!approved) return null;
  const signatures = (approved.decisions ?? [])
    .filter((d) => d.decision === 'approve')
    .sort((a, b) => a.signedAt.getTime() - b.signedAt.getTime())
    .map(presentSignature);
  return { signatures };
}

// ---------------------------------------------------------------- for exports

export interface ApprovedRevision {
  routeId: string;
  workspaceId: string;
  number: number;
  message: string;
  document: DraftDocument;
  result: Record<string, unknown> | null;
  totals: RevisionTotals | null;
  engineVersion: string;
  contentHash: string;
  author: { id: string; name: string };
  createdAt: string;
  approval: { signatures: Signature[] };
}

/**
 * A revision with its approval, for anything that may only use approved
 * revisions (the plant step list): null unless the revision exists in this
 * workspace's route and is approved. Without `number`, the newest approved
 * revision of the route.
 */
export async function findApprovedRevision(
  workspaceId: string,
  routeId: string,
  number: number | null,
  transaction: Transaction | null = null,
): Promise<ApprovedRevision | null> {
  const approvedRequests = await ReviewRequest.findAll({
    where: { workspaceId, routeId, status: 'approved' },
    include: [{ model: RouteRevision, as: 'revision', attributes: ['id', 'number'] }],
    transaction,
  });
  const numbers = approvedRequests
    .map((r) => r.revision!.number)
    .filter((n) => number === null || n === number);
  if (numbers.length === 0) return null;
  const route = await Route.findOne({ where: { id: routeId, workspaceId }, transaction });
  if (!route) return null;
  const revision = await loadRevision(route, Math.max(...numbers), transaction, {
    withContent: true,
  });
  const approval = approvalOf(revision);
  if (!approval) return null;
  return {
    routeId,
    workspaceId,
    number: revision.number,
    message: revision.message,
    document: revision.document as DraftDocument,
    result: (revision.result ?? null) as Record<string, unknown> | null,
    totals: (revision.totals ?? null) as RevisionTotals | null,
    engineVersion: revision.engineVersion,
    contentHash: revision.contentHash,
    author: { id: revision.author!.id, name: revision.author!.name },
    createdAt: revision.createdAt.toISOString(),
    approval,
  };
}

/** True when the stored content still hashes to the stored content hash (used by restore checks). */
export function revisionHashIntact(revision: RouteRevision): boolean {
  return (
    revisionContentHash({
      document: revision.document,
      result: revision.result,
      engineVersion: revision.engineVersion,
    }) === revision.contentHash
  );
}
