import { Router } from 'express';
import { z } from 'zod';
import { apiErrorSchema } from '@shared/schemas/errors';
import {
  attentionListQuerySchema,
  attentionListSchema,
  commentListQuerySchema,
  commentListSchema,
  commentSchema,
  createCommentSchema,
  createDecisionSchema,
  createdRevisionSchema,
  createReviewRequestSchema,
  createRevisionSchema,
  decisionReplySchema,
  reviewRequestSchema,
  revisionCompareSchema,
  revisionDetailSchema,
  revisionListQuerySchema,
  revisionListSchema,
  type RevisionDetail,
  type RevisionTotals,
} from '@shared/schemas/revisions';
import type { DraftDocument } from '@shared/schemas/routes';
import type { AppConfig } from '../config';
import { database } from '../db/sequelize';
import { apiError } from '../errors';
import { defineRoute } from '../http/route';
import { authorize, can, type Actor } from '../policies';
import { loadWorkspace, memberWorkspace } from '../services/members';
import { compareRevisions } from '../services/revision-compare';
import {
  addComment,
  attentionFor,
  pickAttention,
  listComments,
  openReviewOf,
  presentComment,
  presentReviewRequest,
  recordDecision,
  setCommentResolved,
  submitForReview,
} from '../services/reviews';
import {
  approvalOf,
  listRevisions,
  loadRevision,
  presentRevisionSummary,
  revisionStatus,
  saveRevision,
  type RevisionWithReviews,
} from '../services/revisions';
import { loadRoute } from '../services/routes';
import { verifyCredentials } from '../services/sign-in';
import type { Security } from '../http/security';

const BASE = '/workspaces/{workspaceId}/routes/{routeId}/revisions';
const routeParams = z.object({ workspaceId: z.uuid(), routeId: z.uuid() });
const revisionNumber = z.coerce
  .number({ message: 'Use a revision number.' })
  .int({ message: 'Use a revision number.' })
  .min(1, { message: 'Use a revision number.' })
  .max(1_000_000_000);
const revisionParams = routeParams.extend({ number: revisionNumber });
const compareParams = routeParams.extend({ a: revisionNumber, b: revisionNumber });
const commentParams = revisionParams.extend({ id: z.uuid() });

const notFoundResponse = {
  description: 'No such workspace, route or revision, or not one of yours.',
  schema: apiErrorSchema,
};
const forbiddenResponse = (description: string) => ({ description, schema: apiErrorSchema });

/** Loads the workspace and route the caller may see (404 otherwise), then the revision. */
async function loadScope(
  actor: Actor,
  params: { workspaceId: string; routeId: string },
  transaction: Parameters<typeof loadRoute>[2],
) {
  const workspace = await loadWorkspace(params.workspaceId, transaction);
  authorize(actor, 'revision.list', { workspaceId: workspace.id });
  const route = await loadRoute(workspace.id, params.routeId, transaction);
  return { workspace, route };
}

function readableRevision(actor: Actor, revision: RevisionWithReviews) {
  authorize(actor, 'revision.read', {
    workspaceId: revision.workspaceId as string,
    status: revisionStatus(revision),
  });
}

function presentDetail(actor: Actor, revision: RevisionWithReviews): RevisionDetail {
  const scope = { workspaceId: revision.workspaceId as string };
  const status = revisionStatus(revision);
  const open = openReviewOf(revision);
  return {
    ...presentRevisionSummary(revision),
    document: revision.document as DraftDocument,
    result: (revision.result ?? null) as Record<string, unknown> | null,
    evaluationError: (revision.evaluationError ?? null) as RevisionDetail['evaluationError'],
    engineVersion: revision.engineVersion,
    draftVersion: revision.draftVersion,
    reviews: (revision.reviews ?? []).map(presentReviewRequest),
    approval: approvalOf(revision),
    abilities: {
      submit:
        can(actor, 'review.submit', scope) &&
        (status === 'draft' || status === 'returned' || status === 'superseded'),
      comment: can(actor, 'comment.create', scope),
      decide:
        open !== null &&
        can(actor, 'review.decide', { ...scope, authorId: revision.authorId as string }) &&
        (open.reviewers ?? []).some((r) => r.id === actor.userId) &&
        !(open.decisions ?? []).some((d) => d.signerId === actor.userId),
    },
  };
}

export function revisionsRouter(config: AppConfig, security: Security): Router {
  const router = Router();

  defineRoute(router, {
    method: 'post',
    path: BASE,
    summary:
      "Save the route's current draft as the next revision: an immutable snapshot with the server's own evaluation, engine version and content hash. The draft stays as it is. 409 stale_draft when baseDraftVersion is not the current draft version (error.details.draftVersion).",
    tags: ['revisions'],
    auth: true,
    params: routeParams,
    body: createRevisionSchema,
    responses: {
      201: { description: 'Saved.', schema: createdRevisionSchema },
      403: forbiddenResponse('Only chemists and admins save revisions.'),
      404: notFoundResponse,
      409: {
        description: 'stale_draft (details.draftVersion) or route_archived.',
        schema: apiErrorSchema,
      },
    },
    handle: async ({ actor, params, body, transaction }) => {
      const { workspace, route } = await loadScope(actor, params, transaction);
      authorize(actor, 'revision.create', { workspaceId: workspace.id });
      const revision = await saveRevision(route, body, actor.userId, transaction);
      return {
        status: 201,
        body: {
          number: revision.number,
          contentHash: revision.contentHash,
          engineVersion: revision.engineVersion,
          totals: (revision.totals ?? null) as RevisionTotals | null,
          createdAt: revision.createdAt.toISOString(),
          author: { id: revision.author!.id, name: revision.author!.name },
        },
      };
    },
  });

  defineRoute(router, {
    method: 'get',
    path: BASE,
    summary:
      'Revisions of the route, newest first, with status and totals. Scale-up engineers see the approved ones only.',
    tags: ['revisions'],
    auth: true,
    params: routeParams,
    query: revisionListQuerySchema,
    responses: {
      200: { description: 'One page of revisions.', schema: revisionListSchema },
      404: notFoundResponse,
    },
    handle: async ({ actor, params, query, transaction }) => {
      const { workspace, route } = await loadScope(actor, params, transaction);
      const approvedOnly = !can(actor, 'revision.listAll', { workspaceId: workspace.id });
      const page = await listRevisions(route, query, approvedOnly, transaction);
      return {
        status: 200,
        body: { items: page.items.map(presentRevisionSummary), nextCursor: page.nextCursor },
      };
    },
  });

  defineRoute(router, {
    method: 'get',
    path: `${BASE}/{number}`,
    summary:
      'One revision: its summary plus the document, the stored result, the engine version, reviews with their signatures, the approval when approved, and what the caller may do.',
    tags: ['revisions'],
    auth: true,
    params: revisionParams,
    responses: {
      200: { description: 'The revision.', schema: revisionDetailSchema },
      403: forbiddenResponse('Scale-up engineers read approved revisions only.'),
      404: notFoundResponse,
    },
    handle: async ({ actor, params, transaction }) => {
      const { route } = await loadScope(actor, params, transaction);
      const revision = await loadRevision(route, params.number, transaction, { withContent: true });
      readableRevision(actor, revision);
      return { status: 200, body: presentDetail(actor, revision) };
    },
  });

  defineRoute(router, {
    method: 'get',
    path: `${BASE}/{a}/compare/{b}`,
    summary:
      'What changed from revision a to revision b: steps added, removed and changed (each field old → new), connections, and every total of the evaluation (result.totals names, purge factors as purge.<componentId>).',
    tags: ['revisions'],
    auth: true,
    params: compareParams,
    responses: {
      200: { description: 'The differences.', schema: revisionCompareSchema },
      403: forbiddenResponse('Scale-up engineers compare approved revisions only.'),
      404: notFoundResponse,
    },
    handle: async ({ actor, params, transaction }) => {
      const { route } = await loadScope(actor, params, transaction);
      const a = await loadRevision(route, params.a, transaction, { withContent: true });
      const b = await loadRevision(route, params.b, transaction, { withContent: true });
      readableRevision(actor, a);
      readableRevision(actor, b);
      return {
        status: 200,
        body: compareRevisions(
          { number: a.number, document: a.document, totals: a.totals },
          { number: b.number, document: b.document, totals: b.totals },
        ),
      };
    },
  });

  defineRoute(router, {
    method: 'post',
    path: `${BASE}/{number}/review-requests`,
    summary:
      'Submit the revision for review to one or more members with the reviewer role (never its author), with a note; each reviewer is e-mailed.',
    tags: ['reviews'],
    auth: true,
    params: revisionParams,
    body: createReviewRequestSchema,
    responses: {
      201: { description: 'Submitted.', schema: reviewRequestSchema },
      403: forbiddenResponse('Only chemists and admins submit revisions.'),
      404: notFoundResponse,
      409: {
        description: 'review_open, review_closed (approved) or revision_superseded.',
        schema: apiErrorSchema,
      },
      422: {
        description:
          'invalid_reviewers: the author, or someone without the reviewer role in this workspace.',
        schema: apiErrorSchema,
      },
    },
    handle: async ({ req, actor, params, body, transaction }) => {
      const { workspace, route } = await loadScope(actor, params, transaction);
      authorize(actor, 'review.submit', { workspaceId: workspace.id });
      const revision = await loadRevision(route, params.number, transaction, { lock: true });
      const review = await submitForReview(
        route,
        revision,
        body,
        req.user!,
        { appUrl: config.appUrl, workspaceId: workspace.id, workspaceName: workspace.name },
        transaction,
      );
      return { status: 201, body: presentReviewRequest(review) };
    },
  });

  defineRoute(router, {
    method: 'get',
    path: `${BASE}/{number}/comments`,
    summary:
      'One page of the comments on the revision, oldest first (sort=newest for newest first); q matches part of the text; a reply names its thread (parentId), a step comment its step (stepId); limit (default 50, at most 200) and the cursor of the previous page.',
    tags: ['reviews'],
    auth: true,
    params: revisionParams,
    query: commentListQuerySchema,
    responses: {
      200: { description: 'One page of comments.', schema: commentListSchema },
      403: forbiddenResponse('Scale-up engineers read approved revisions only.'),
      404: notFoundResponse,
    },
    handle: async ({ actor, params, query, transaction }) => {
      const { route } = await loadScope(actor, params, transaction);
      const revision = await loadRevision(route, params.number, transaction);
      readableRevision(actor, revision);
      const page = await listComments(revision, query, transaction);
      return {
        status: 200,
        body: { items: page.items.map(presentComment), nextCursor: page.nextCursor },
      };
    },
  });

  defineRoute(router, {
    method: 'post',
    path: `${BASE}/{number}/comments`,
    summary:
      'Comment on the revision, on one of its steps (stepId), or reply in a thread (parentId). The revision author is e-mailed.',
    tags: ['reviews'],
    auth: true,
    params: revisionParams,
    body: createCommentSchema,
    responses: {
      201: { description: 'Added.', schema: commentSchema },
      403: forbiddenResponse('Chemists and reviewers comment.'),
      404: notFoundResponse,
    },
    handle: async ({ req, actor, params, body, transaction }) => {
      const { workspace, route } = await loadScope(actor, params, transaction);
      const revision = await loadRevision(route, params.number, transaction, { withContent: true });
      readableRevision(actor, revision);
      authorize(actor, 'comment.create', { workspaceId: workspace.id });
      const comment = await addComment(
        route,
        revision,
        body,
        req.user!,
        { appUrl: config.appUrl, workspaceId: workspace.id, workspaceName: workspace.name },
        transaction,
      );
      return { status: 201, body: presentComment(comment) };
    },
  });

  defineRoute(router, {
    method: 'patch',
    path: `${BASE}/{number}/comments/{id}`,
    summary: 'Resolve or reopen a comment thread (at its first comment).',
    tags: ['reviews'],
    auth: true,
    params: commentParams,
    body: z.object({ resolved: z.boolean({ message: 'Use true or false.' }) }),
    responses: {
      200: { description: 'Updated.', schema: commentSchema },
      403: forbiddenResponse('Chemists and reviewers resolve threads.'),
      404: notFoundResponse,
    },
    handle: async ({ actor, params, body, transaction }) => {
      const { workspace, route } = await loadScope(actor, params, transaction);
      const revision = await loadRevision(route, params.number, transaction);
      readableRevision(actor, revision);
      authorize(actor, 'comment.resolve', { workspaceId: workspace.id });
      const comment = await setCommentResolved(
        route,
        revision,
        params.id,
        body.resolved,
        actor.userId,
        transaction,
      );
      return { status: 200, body: presentComment(comment) };
    },
  });

  defineRoute(router, {
    method: 'post',
    path: `${BASE}/{number}/decisions`,
    summary:
      "Approve, or return with a reason, as one of the revision's reviewers: an electronic signature. The password is entered again; a wrong one answers 401, records nothing and counts as a failed sign-in (a correct one resets the count). The record keeps the signer's name and e-mail, UTC time, meaning and the revision's content hash.",
    tags: ['reviews'],
    auth: true,
    params: revisionParams,
    body: createDecisionSchema,
    // The password check must count a failure even though the request fails.
    transaction: false,
    responses: {
      201: { description: 'Signed.', schema: decisionReplySchema },
      401: { description: 'invalid_password: nothing was signed.', schema: apiErrorSchema },
      403: forbiddenResponse(
        'Only the reviewers the revision was sent to decide, never its author.',
      ),
      404: notFoundResponse,
      409: {
        description: 'review_closed (nothing to sign) or already_decided.',
        schema: apiErrorSchema,
      },
      423: { description: 'The account is locked after failed attempts.', schema: apiErrorSchema },
    },
    handle: async ({ req, actor, params, body }) => {
      const { workspace, route } = await loadScope(actor, params, null);
      const preview = await loadRevision(route, params.number, null);
      readableRevision(actor, preview);
      authorize(actor, 'review.decide', {
        workspaceId: workspace.id,
        authorId: preview.authorId as string,
      });
      // The re-entered password counts like a sign-in: repeated failures make the signer wait.
      const address = req.ip ?? 'unknown';
      await security.throttle.assertAllowed(req.user!.email, address);
      const signer = await verifyCredentials(req.user!.email, body.password, 'signature');
      if (!signer) await security.throttle.recordFailure(req.user!.email, address);
      else await security.throttle.recordSuccess(req.user!.email, address);
      if (!signer)
        throw apiError(
          'invalid_password',
          'The password is not correct, so nothing was signed. Enter your own password to sign.',
        );
      const { decision, status } = await database().transaction(async (transaction) => {
        const revision = await loadRevision(route, params.number, transaction, { lock: true });
        return recordDecision(
          route,
          revision,
          body,
          signer,
          { appUrl: config.appUrl, workspaceId: workspace.id, workspaceName: workspace.name },
          transaction,
        );
      });
      return {
        status: 201,
        body: {
          decision: decision.decision,
          signer: { name: decision.signerName, email: decision.signerEmail },
          signedAt: decision.signedAt.toISOString(),
          meaning: decision.meaning,
          contentHash: decision.contentHash,
          status,
        },
      };
    },
  });

  defineRoute(router, {
    method: 'get',
    path: '/workspaces/{workspaceId}/attention',
    summary:
      'What needs the signed-in person in this workspace, newest first: reviews waiting for their signature, their revisions returned or approved, open comments on their revisions in review.',
    tags: ['reviews'],
    auth: true,
    params: z.object({ workspaceId: z.uuid() }),
    query: attentionListQuerySchema,
    responses: {
      200: { description: 'One page of items.', schema: attentionListSchema },
      404: { description: 'No such workspace, or not one of yours.', schema: apiErrorSchema },
    },
    handle: async ({ actor, params, query, transaction }) => {
      const workspace = memberWorkspace(actor, params.workspaceId);
      authorize(actor, 'attention.list', { workspaceId: workspace.id });
      const all = pickAttention(await attentionFor(workspace.id, actor.userId, transaction), query);
      const offset = query.cursor && /^\d{1,6}$/.test(query.cursor) ? Number(query.cursor) : 0;
      const items = all.slice(offset, offset + query.limit);
      return {
        status: 200,
        body: {
          items,
          nextCursor: offset + query.limit < all.length ? String(offset + query.limit) : null,
        },
      };
    },
  });

  return router;
}
