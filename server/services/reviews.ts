/**
 * Peer review of saved revisions: submitting to named reviewers, comment
 * threads on the route or one step, and signed decisions. A revision is
 * approved when every requested reviewer has signed an approval; one signed
 * return sends it back to its author. Every change is audited and the people
 * it concerns are told by e-mail (through the job queue, in the same
 * transaction as the change).
 */
import { Op, type Transaction, type WhereOptions } from 'sequelize';
import {
  DEFAULT_SIGNATURE_MEANING,
  type AttentionItem,
  type CommentPayload,
  type ReviewRequestPayload,
  type RevisionStatus,
} from '@shared/schemas/revisions';
import { apiError, conflict, forbidden, notFound, validationFailed } from '../errors';
import { afterCursor, matchingRows, keyAttributes, keyOrder, pageOf, byCreation } from './keyset';
import {
  Membership,
  ReviewComment,
  ReviewDecision,
  ReviewRequest,
  ReviewRequestReviewer,
  Route,
  RouteRevision,
  User,
} from '../models';
import { recordAudit } from './audit';
import { queueMail } from './mail';
import { commentMail, decisionMail, reviewRequestMail } from './review-mail';
import { presentSignature, revisionStatus, type RevisionWithReviews } from './revisions';

export interface ReviewContext {
  appUrl: string;
  workspaceId: string;
  workspaceName: string;
}

export const revisionUrl = (appUrl: string, route: Route, number: number) =>
  `${appUrl}/w/${route.workspaceId as string}/routes/${route.id}/revisions/${number}`;

const invalidReviewers = (message: string, index: number | null) =>
  apiError('invalid_reviewers', message, [
    { path: index === null ? 'reviewerIds' : `reviewerIds.${index}`, message },
  ]);

export function presentReviewRequest(review: ReviewRequest): ReviewRequestPayload {
  const decisions = [...(review.decisions ?? [])].sort(
    (a, b) => a.signedAt.getTime() - b.signedAt.getTime(),
  );
  return {
    id: review.id,
    status: review.status,
    note: review.note,
    submittedBy: { id: review.submittedBy!.id, name: review.submittedBy!.name },
    reviewers: (review.reviewers ?? [])
      .map((user) => ({
        id: user.id,
        name: user.name,
        email: user.email,
        decision: decisions.find((d) => d.signerId === user.id)?.decision ?? null,
      }))
      .sort((a, b) => a.name.localeCompare(b.name)),
    decisions: decisions.map(presentSignature),
    createdAt: review.createdAt.toISOString(),
    closedAt: review.closedAt ? review.closedAt.toISOString() : null,
  };
}

/** The open review of a revision, if any. */
export const openReviewOf = (revision: RevisionWithReviews) =>
  (revision.reviews ?? []).find((review) => review.status === 'in_review') ?? null;

// ---------------------------------------------------------------- submitting

export async function submitForReview(
  route: Route,
  revision: RevisionWithReviews,
  input: { reviewerIds: string[]; note: string },
  actor: User,
  context: ReviewContext,
  transaction: Transaction | null,
): Promise<ReviewRequest> {
  const ids = [...new Set(input.reviewerIds)];
  const members = await Membership.findAll({
    where: { workspaceId: route.workspaceId as string, userId: ids },
    include: [{ model: User, as: 'user', attributes: ['id', 'name', 'email'] }],
    transaction,
  });
  const byId = new Map(members.map((m) => [m.userId as string, m]));
  ids.forEach((id, index) => {
    if (id === (revision.authorId as string) || id === actor.id)
      throw invalidReviewers(
        'The author cannot review their own revision; choose another reviewer.',
        input.reviewerIds.indexOf(id) ?? index,
      );
    const member = byId.get(id);
    if (!member || !member.roles.includes('reviewer'))
      throw invalidReviewers(
        'Choose a member of this workspace who has the reviewer role.',
        input.reviewerIds.indexOf(id),
      );
  });

  const status = revisionStatus(revision);
  if (status === 'in_review') throw conflict('review_open', 'This revision is already in review.');
  if (status === 'approved') throw conflict('review_closed', 'This revision is already approved.');
  const newer = await RouteRevision.count({
    where: { routeId: route.id, number: { [Op.gt]: revision.number } },
    transaction,
  });
  if (newer > 0)
    throw conflict(
      'revision_superseded',
      `A newer revision of this route exists; submit revision ${revision.number + newer} instead.`,
    );

  const review = await ReviewRequest.create(
    {
      revisionId: revision.id,
      routeId: route.id,
      workspaceId: route.workspaceId as string,
      submittedById: actor.id,
      note: input.note,
    },
    { transaction },
  );
  await ReviewRequestReviewer.bulkCreate(
    ids.map((reviewerId) => ({ reviewRequestId: review.id, reviewerId })),
    { transaction },
  );
  await recordAudit(
    {
      workspaceId: route.workspaceId as string,
      actorId: actor.id,
      action: 'review.submit',
      entityType: 'review',
      entityId: review.id,
      after: {
        routeId: route.id,
        revision: revision.number,
        contentHash: revision.contentHash,
        reviewers: ids.map((id) => byId.get(id)!.user!.email),
        note: input.note,
      },
    },
    transaction,
  );
  const url = revisionUrl(context.appUrl, route, revision.number);
  for (const id of ids) {
    const reviewer = byId.get(id)!.user!;
    await queueMail(
      reviewRequestMail({
        to: reviewer.email,
        reviewerName: reviewer.name,
        authorName: actor.name,
        routeName: route.name,
        revisionNumber: revision.number,
        note: input.note,
        workspaceId: context.workspaceId,
        workspaceName: context.workspaceName,
        url,
      }),
      transaction,
    );
  }
  return (await ReviewRequest.findByPk(review.id, {
    include: [
      { model: User, as: 'submittedBy', attributes: ['id', 'name'] },
      {
        model: User,
        as: 'reviewers',
        attributes: ['id', 'name', 'email'],
        through: { attributes: [] },
      },
      { model: ReviewDecision, as: 'decisions' },
    ],
    transaction,
  }))!;
}

// ---------------------------------------------------------------- deciding

/**
 * Records a signed decision. The caller has already checked the password
 * (outside this transaction, so a wrong one counts as a failed sign-in and
 * nothing here is written). The open review is locked, so two reviewers
 * signing at once cannot both close it or both miss closing it.
 */
export async function recordDecision(
  route: Route,
  revision: RevisionWithReviews,
  input: { decision: 'approve' | 'return'; meaning?: string; reason?: string },
  signer: User,
  context: ReviewContext,
  transaction: Transaction | null,
): Promise<{ decision: ReviewDecision; status: RevisionStatus }> {
  const review = openReviewOf(revision);
  if (!review) {
    const status = revisionStatus(revision);
    throw conflict(
      'review_closed',
      status === 'draft'
        ? 'This revision has not been submitted for review.'
        : `This revision's review is closed (${status.replace('_', ' ')}); there is nothing to sign.`,
    );
  }
  if (!(review.reviewers ?? []).some((r) => r.id === signer.id))
    throw forbidden('Only the reviewers this revision was sent to can decide on it.');
  if (signer.id === (revision.authorId as string))
    throw forbidden('The author cannot sign a decision on their own revision.');
  if ((review.decisions ?? []).some((d) => d.signerId === signer.id))
    throw conflict('already_decided', 'You have already signed a decision on this review.');

  const meaning = input.meaning ?? DEFAULT_SIGNATURE_MEANING[input.decision];
  const decision = await ReviewDecision.create(
    {
      reviewRequestId: review.id,
      revisionId: revision.id,
      decision: input.decision,
      signerId: signer.id,
      signerName: signer.name,
      signerEmail: signer.email,
      meaning,
      reason: input.reason ?? null,
      contentHash: revision.contentHash,
    },
    { transaction },
  );
  await decision.reload({ transaction });

  const decisions = [...(review.decisions ?? []), decision];
  let status: RevisionStatus = 'in_review';
  if (input.decision === 'return') status = 'returned';
  else if (
    (review.reviewers ?? []).every((r) =>
      decisions.some((d) => d.signerId === r.id && d.decision === 'approve'),
    )
  )
    status = 'approved';
  if (status !== 'in_review')
    await review.update({ status, closedAt: new Date() }, { transaction });

  await recordAudit(
    {
      workspaceId: route.workspaceId as string,
      actorId: signer.id,
      action: input.decision === 'approve' ? 'review.approve' : 'review.return',
      entityType: 'review',
      entityId: review.id,
      before: { status: 'in_review' },
      after: {
        status,
        routeId: route.id,
        revision: revision.number,
        signature: {
          id: decision.id,
          signer: signer.name,
          email: signer.email,
          signedAt: decision.signedAt.toISOString(),
          meaning,
          contentHash: revision.contentHash,
        },
        reason: input.reason ?? null,
      },
    },
    transaction,
  );

  const author =
    revision.author ?? (await User.findByPk(revision.authorId as string, { transaction }));
  if (author && author.id !== signer.id)
    await queueMail(
      decisionMail({
        to: author.email,
        authorName: author.name,
        signerName: signer.name,
        decision: input.decision,
        status,
        routeName: route.name,
        revisionNumber: revision.number,
        reason: input.reason ?? null,
        signedAt: decision.signedAt,
        workspaceId: context.workspaceId,
        workspaceName: context.workspaceName,
        url: revisionUrl(context.appUrl, route, revision.number),
      }),
      transaction,
    );
  return { decision, status };
}

// ---------------------------------------------------------------- comments

export function presentComment(comment: ReviewComment): CommentPayload {
  return {
    id: comment.id,
    body: comment.body,
    stepId: comment.stepId,
    parentId: comment.parentId,
    author: { id: comment.author!.id, name: comment.author!.name },
    createdAt: comment.createdAt.toISOString(),
    resolved: comment.resolvedAt !== null,
    resolvedAt: comment.resolvedAt ? comment.resolvedAt.toISOString() : null,
    resolvedBy: comment.resolvedBy
      ? { id: comment.resolvedBy.id, name: comment.resolvedBy.name }
      : null,
  };
}

const commentIncludes = [
  { model: User, as: 'author', attributes: ['id', 'name'] },
  { model: User, as: 'resolvedBy', attributes: ['id', 'name'] },
];

const COMMENT_ORDERS = byCreation('ReviewComment');

/**
 * One page of a revision's comments, oldest first by default so threads read
 * top to bottom (review_comments_revision_created_idx serves both orders); `q`
 * matches part of the text (review_comments_body_trgm_idx).
 */
export async function listComments(
  revision: RouteRevision,
  query: { q?: string; sort: 'oldest' | 'newest'; limit: number; cursor?: string },
  transaction: Transaction | null,
): Promise<{ items: ReviewComment[]; nextCursor: string | null }> {
  const order = COMMENT_ORDERS[query.sort];
  const conditions: WhereOptions[] = [{ revisionId: revision.id }];
  if (query.q)
    conditions.push(
      await matchingRows(
        { model: 'ReviewComment', table: 'review_comments', expressions: [(t) => `${t}.body`] },
        query.q,
        transaction,
      ),
    );
  if (query.cursor) conditions.push(afterCursor(order, query.cursor));
  const rows = await ReviewComment.findAll({
    where: { [Op.and]: conditions },
    attributes: { include: keyAttributes(order) },
    include: commentIncludes,
    order: keyOrder(order),
    limit: query.limit + 1,
    subQuery: false,
    transaction,
  });
  return pageOf(rows, query.limit, order);
}

export async function addComment(
  route: Route,
  revision: RevisionWithReviews,
  input: { body: string; stepId?: string; parentId?: string },
  author: User,
  context: ReviewContext,
  transaction: Transaction | null,
): Promise<ReviewComment> {
  let stepId = input.stepId ?? null;
  let parentId: string | null = null;
  if (input.parentId) {
    const parent = await ReviewComment.findOne({
      where: { id: input.parentId, revisionId: revision.id },
      transaction,
    });
    if (!parent)
      throw validationFailed([
        { path: 'parentId', message: 'The comment you reply to is not on this revision.' },
      ]);
    // Replies join the thread of the first comment, on its step.
    parentId = parent.parentId ?? parent.id;
    const root = parent.parentId
      ? await ReviewComment.findByPk(parent.parentId, { transaction })
      : parent;
    stepId = root!.stepId;
  } else if (stepId) {
    const steps = ((revision.document as { steps?: Array<{ id: string }> })?.steps ?? []).map(
      (s) => s.id,
    );
    if (!steps.includes(stepId))
      throw validationFailed([{ path: 'stepId', message: 'This revision has no such step.' }]);
  }
  const comment = await ReviewComment.create(
    {
      revisionId: revision.id,
      workspaceId: route.workspaceId as string,
      parentId,
      stepId,
      authorId: author.id,
      body: input.body,
    },
    { transaction },
  );
  await recordAudit(
    {
      workspaceId: route.workspaceId as string,
      actorId: author.id,
      action: 'comment.create',
      entityType: 'comment',
      entityId: comment.id,
      after: { routeId: route.id, revision: revision.number, stepId, parentId, body: input.body },
    },
    transaction,
  );
  // The revision's author hears of comments by others; in a thread, so does whoever started it.
  const recipients = new Map<string, User>();
  const revisionAuthor = await User.findByPk(revision.authorId as string, { transaction });
  if (revisionAuthor) recipients.set(revisionAuthor.id, revisionAuthor);
  if (parentId) {
    const root = await ReviewComment.findByPk(parentId, {
      include: [{ model: User, as: 'author' }],
      transaction,
    });
    if (root?.author) recipients.set(root.author.id, root.author);
  }
  recipients.delete(author.id);
  const stepName =
    stepId === null
      ? null
      : ((
          (revision.document as { steps?: Array<{ id: string; name?: string }> })?.steps ?? []
        ).find((s) => s.id === stepId)?.name ?? stepId);
  for (const recipient of recipients.values())
    await queueMail(
      commentMail({
        to: recipient.email,
        recipientName: recipient.name,
        authorName: author.name,
        routeName: route.name,
        revisionNumber: revision.number,
        stepName,
        body: input.body,
        reply: parentId !== null,
        workspaceId: context.workspaceId,
        workspaceName: context.workspaceName,
        url: revisionUrl(context.appUrl, route, revision.number),
      }),
      transaction,
    );
  return (await ReviewComment.findByPk(comment.id, { include: commentIncludes, transaction }))!;
}

export async function setCommentResolved(
  route: Route,
  revision: RouteRevision,
  commentId: string,
  resolved: boolean,
  actorId: string,
  transaction: Transaction | null,
): Promise<ReviewComment> {
  const comment = await ReviewComment.findOne({
    where: { id: commentId, revisionId: revision.id },
    include: commentIncludes,
    transaction,
    lock: transaction ? { level: transaction.LOCK.UPDATE, of: ReviewComment } : undefined,
  });
  if (!comment) throw notFound('The comment');
  if (comment.parentId)
    throw validationFailed([
      { path: 'resolved', message: 'Resolve or reopen the thread at its first comment.' },
    ]);
  const wasResolved = comment.resolvedAt !== null;
  if (wasResolved !== resolved) {
    await comment.update(
      { resolvedAt: resolved ? new Date() : null, resolvedById: resolved ? actorId : null },
      { transaction },
    );
    await recordAudit(
      {
        workspaceId: route.workspaceId as string,
        actorId,
        action: resolved ? 'comment.resolve' : 'comment.reopen',
        entityType: 'comment',
        entityId: comment.id,
        before: { resolved: wasResolved },
        after: { resolved },
      },
      transaction,
    );
  }
  return (await ReviewComment.findByPk(comment.id, { include: commentIncludes, transaction }))!;
}

// ---------------------------------------------------------------- attention

/**
 * The items matching `q` (part of the route's name, the text or the name of the person it
 * comes from, case-insensitive), in the asked order. The list is one person's (a few
 * hundred items at most), built in full by attentionFor(), so it is filtered here.
 */
export function pickAttention(
  items: AttentionItem[],
  query: { q?: string; sort: 'newest' | 'oldest' },
): AttentionItem[] {
  const needle = query.q?.toLocaleLowerCase();
  const kept = needle
    ? items.filter((item) =>
        [item.routeName, item.text, item.from.name].some((field) =>
          field.toLocaleLowerCase().includes(needle),
        ),
      )
    : items;
  const sign = query.sort === 'oldest' ? 1 : -1;
  return [...kept].sort((a, b) => sign * (a.at < b.at ? -1 : a.at > b.at ? 1 : 0));
}

/**
 * What needs the person in this workspace, newest first: reviews waiting for
 * their decision, their revisions returned or approved in the last 30 days,
 * and open comment threads by others on their revisions in review.
 */
export async function attentionFor(
  workspaceId: string,
  userId: string,
  transaction: Transaction | null,
): Promise<AttentionItem[]> {
  const items: AttentionItem[] = [];
  const revisionRoute = {
    model: RouteRevision,
    as: 'revision',
    attributes: ['id', 'number', 'authorId', 'routeId'],
    include: [{ model: Route, as: 'route', attributes: ['id', 'name', 'archivedAt'] }],
  };

  const waiting = await ReviewRequest.findAll({
    where: { workspaceId, status: 'in_review' },
    include: [
      revisionRoute,
      { model: User, as: 'submittedBy', attributes: ['id', 'name'] },
      {
        model: User,
        as: 'reviewers',
        attributes: ['id'],
        through: { attributes: [] },
        where: { id: userId },
      },
      { model: ReviewDecision, as: 'decisions', attributes: ['signerId'] },
    ],
    transaction,
  });
  for (const review of waiting) {
    if ((review.decisions ?? []).some((d) => d.signerId === userId)) continue;
    const revision = review.revision!;
    const route = (revision as RouteRevision & { route?: Route }).route!;
    items.push({
      kind: 'review_requested',
      routeId: route.id,
      routeName: route.name,
      revisionNumber: revision.number,
      from: { id: review.submittedBy!.id, name: review.submittedBy!.name },
      at: review.createdAt.toISOString(),
      text: review.note
        ? `Asks for your review: ${review.note}`
        : 'Asks for your review and signature.',
    });
  }

  const since = new Date(Date.now() - 30 * 24 * 3600_000);
  const closed = await ReviewRequest.findAll({
    where: { workspaceId, status: ['returned', 'approved'], closedAt: { [Op.gte]: since } },
    include: [
      { ...revisionRoute, where: { authorId: userId } },
      { model: ReviewDecision, as: 'decisions' },
    ],
    transaction,
  });
  for (const review of closed) {
    const revision = review.revision!;
    const route = (revision as RouteRevision & { route?: Route }).route!;
    const signed = [...(review.decisions ?? [])].sort(
      (a, b) => b.signedAt.getTime() - a.signedAt.getTime(),
    );
    const last =
      signed.find((d) => d.decision === (review.status === 'returned' ? 'return' : 'approve')) ??
      signed[0];
    if (!last) continue;
    items.push({
      kind: review.status === 'returned' ? 'returned' : 'approved',
      routeId: route.id,
      routeName: route.name,
      revisionNumber: revision.number,
      from: { id: last.signerId as string, name: last.signerName },
      at: last.signedAt.toISOString(),
      text:
        review.status === 'returned'
          ? `Returned: ${last.reason ?? ''}`.trim()
          : 'Approved and signed.',
    });
  }

  const openThreads = await ReviewComment.findAll({
    where: { workspaceId, parentId: null, resolvedAt: null, authorId: { [Op.ne]: userId } },
    include: [
      { model: User, as: 'author', attributes: ['id', 'name'] },
      {
        model: RouteRevision,
        as: 'revision',
        attributes: ['id', 'number', 'authorId', 'routeId'],
        where: { authorId: userId },
        include: [
          { model: Route, as: 'route', attributes: ['id', 'name'] },
          {
            model: ReviewRequest,
            as: 'reviews',
            attributes: ['status'],
            where: { status: 'in_review' },
          },
        ],
      },
    ],
    order: [['createdAt', 'DESC']],
    limit: 100,
    transaction,
  });
  for (const comment of openThreads) {
    const revision = (comment as ReviewComment & { revision?: RouteRevision & { route?: Route } })
      .revision!;
    items.push({
      kind: 'comment',
      routeId: revision.route!.id,
      routeName: revision.route!.name,
      revisionNumber: revision.number,
      from: { id: comment.author!.id, name: comment.author!.name },
      at: comment.createdAt.toISOString(),
      text: comment.body.length > 140 ? `${comment.body.slice(0, 139)}…` : comment.body,
    });
  }
  return items.sort((a, b) => b.at.localeCompare(a.at));
}
