/**
 * Saved revisions of a route, their comparison, review requests, comments
 * and signed decisions. Every list reply is `{ items, nextCursor }`.
 */
import { z } from 'zod';
import { text } from './text';
import { routeTotalsSchema } from './evaluate';
import { listQuerySchema, listReplySchema } from './lists';
import { draftDocumentSchema, personRefSchema } from './routes';

export const REVISION_MESSAGE_MAX_LENGTH = 2000;
export const REVIEW_NOTE_MAX_LENGTH = 4000;
export const COMMENT_MAX_LENGTH = 4000;
export const SIGNATURE_MEANING_MAX_LENGTH = 500;
export const MAX_REVIEWERS = 10;

/** Where a revision stands, in plain words: saved, sent for review, signed off, sent back, or overtaken by a newer one. */
export const REVISION_STATUSES = [
  'draft',
  'in_review',
  'approved',
  'returned',
  'superseded',
] as const;
export const revisionStatusSchema = z.enum(REVISION_STATUSES);
export type RevisionStatus = z.infer<typeof revisionStatusSchema>;
export const REVISION_STATUS_LABELS: Record<RevisionStatus, string> = {
  draft: 'Draft',
  in_review: 'In review',
  approved: 'Approved',
  returned: 'Returned',
  superseded: 'Superseded',
};

/** The default meaning of signatures, stated in the record beside the signer's name. */
export const DEFAULT_SIGNATURE_MEANING = {
  approve:
    'Approved as technical reviewer: I have reviewed this revision of the route, its inputs and its computed results, and approve it.',
  return:
    'Returned as technical reviewer: I have reviewed this revision of the route and return it for the changes given in the reason.',
} as const;

const personWithEmailSchema = z.object({ id: text(), name: text(), email: text() });

/**
 * The route evaluation's totals as stored with the revision (names as in
 * result.totals). Every field the engine writes is declared; a revision stored
 * by an older engine may lack the newer ones, so only the four every revision
 * has are required.
 */
export const revisionTotalsSchema = routeTotalsSchema.partial().required({
  yieldPct: true,
  purityWtPct: true,
  pmi: true,
  purge: true,
});
export type RevisionTotals = z.infer<typeof revisionTotalsSchema>;

export const createRevisionSchema = z.object({
  message: text()
    .trim()
    .min(1, { message: 'Say what changed in this revision.' })
    .max(REVISION_MESSAGE_MAX_LENGTH),
  /** The draft version the chemist looked at; a newer draft is a conflict. */
  baseDraftVersion: z.number().int().min(1),
});
export type CreateRevisionInput = z.input<typeof createRevisionSchema>;

export const createdRevisionSchema = z.object({
  number: z.number().int(),
  contentHash: text(),
  engineVersion: text(),
  totals: revisionTotalsSchema.nullable(),
  createdAt: text(),
  author: personRefSchema,
});

/** A signed decision, as shown on the revision and given to exports. */
export const signatureSchema = z.object({
  id: text(),
  decision: z.enum(['approve', 'return']),
  signer: z.object({ id: text(), name: text(), email: text() }),
  /** UTC, from the database clock. */
  signedAt: text(),
  meaning: text(),
  reason: text().nullable(),
  /** The content hash of the revision that was signed. */
  contentHash: text(),
});
export type Signature = z.infer<typeof signatureSchema>;

export const reviewRequestSchema = z.object({
  id: text(),
  status: z.enum(['in_review', 'approved', 'returned', 'superseded']),
  note: text(),
  submittedBy: personRefSchema,
  reviewers: z.array(
    personWithEmailSchema.extend({ decision: z.enum(['approve', 'return']).nullable() }),
  ),
  decisions: z.array(signatureSchema),
  createdAt: text(),
  closedAt: text().nullable(),
});
export type ReviewRequestPayload = z.infer<typeof reviewRequestSchema>;

export const revisionAbilitiesSchema = z.object({
  submit: z.boolean(),
  comment: z.boolean(),
  decide: z.boolean(),
});

export const revisionSummarySchema = z.object({
  number: z.number().int(),
  contentHash: text(),
  message: text(),
  status: revisionStatusSchema,
  author: personRefSchema,
  createdAt: text(),
  totals: revisionTotalsSchema.nullable(),
});
export type RevisionSummary = z.infer<typeof revisionSummarySchema>;
/** Newest first (default) or oldest first; q matches part of the message or the author's name. */
export const revisionListQuerySchema = listQuerySchema(
  ['newest', 'oldest'],
  'Sort newest first (newest) or oldest first (oldest).',
);
/**
 * What needs the person: newest first (default) or oldest first; q matches part of the
 * route's name, the text or the name of the person it comes from.
 */
export const attentionListQuerySchema = listQuerySchema(
  ['newest', 'oldest'],
  'Sort newest first (newest) or oldest first (oldest).',
);
export const revisionListSchema = listReplySchema(revisionSummarySchema);

export const revisionDetailSchema = revisionSummarySchema.extend({
  document: draftDocumentSchema,
  /** The server's own evaluation, stored with the revision; null when the route could not be evaluated. */
  result: z.record(text(), z.unknown()).nullable(),
  evaluationError: z
    .object({ code: text(), message: text(), details: z.array(z.unknown()) })
    .nullable(),
  engineVersion: text(),
  draftVersion: z.number().int(),
  /** Review requests, newest first. */
  reviews: z.array(reviewRequestSchema),
  /** The approving signatures when the revision is approved, else null. */
  approval: z.object({ signatures: z.array(signatureSchema) }).nullable(),
  abilities: revisionAbilitiesSchema,
});
export type RevisionDetail = z.infer<typeof revisionDetailSchema>;

export const stepRefSchema = z.object({ id: text(), kind: text(), name: text() });
export const fieldChangeSchema = z.object({
  path: text(),
  from: z.unknown(),
  to: z.unknown(),
});
export const revisionCompareSchema = z.object({
  from: z.number().int(),
  to: z.number().int(),
  stepsAdded: z.array(stepRefSchema),
  stepsRemoved: z.array(stepRefSchema),
  stepsChanged: z.array(
    z.object({
      stepId: text(),
      name: text(),
      kind: text(),
      changes: z.array(fieldChangeSchema),
    }),
  ),
  connectionsAdded: z.array(text()),
  connectionsRemoved: z.array(text()),
  /** Other document changes (components, reference input), each path old → new. */
  documentChanges: z.array(fieldChangeSchema),
  /**
   * Every numeric total of the evaluation, by its name in result.totals
   * (yieldPct, purityWtPct, pmi, ...), and each purge factor as "purge.<componentId>".
   */
  totals: z.record(text(), z.object({ from: z.number().nullable(), to: z.number().nullable() })),
});
export type RevisionCompare = z.infer<typeof revisionCompareSchema>;

export const createReviewRequestSchema = z.object({
  reviewerIds: z
    .array(z.uuid({ message: 'Choose a reviewer from the list.' }))
    .min(1, { message: 'Choose at least one reviewer.' })
    .max(MAX_REVIEWERS, { message: `Choose at most ${MAX_REVIEWERS} reviewers.` }),
  note: text().trim().max(REVIEW_NOTE_MAX_LENGTH).default(''),
});
export type CreateReviewRequestInput = z.input<typeof createReviewRequestSchema>;

export const createCommentSchema = z.object({
  body: text()
    .trim()
    .min(1, { message: 'Write a comment.' })
    .max(COMMENT_MAX_LENGTH, { message: `Keep it under ${COMMENT_MAX_LENGTH} characters.` }),
  stepId: text().min(1).max(80).optional(),
  parentId: z.uuid().optional(),
});
export type CreateCommentInput = z.input<typeof createCommentSchema>;
export const updateCommentSchema = z.object({ resolved: z.boolean() });

export const commentSchema = z.object({
  id: text(),
  body: text(),
  stepId: text().nullable(),
  parentId: text().nullable(),
  author: personRefSchema,
  createdAt: text(),
  resolved: z.boolean(),
  resolvedAt: text().nullable(),
  resolvedBy: personRefSchema.nullable(),
});
export type CommentPayload = z.infer<typeof commentSchema>;
/** Oldest first (default, threads read top to bottom) or newest first; q matches part of the text. */
export const commentListQuerySchema = listQuerySchema(
  ['oldest', 'newest'],
  'Sort oldest first (oldest) or newest first (newest).',
);
export const commentListSchema = listReplySchema(commentSchema);

export const createDecisionSchema = z
  .object({
    decision: z.enum(['approve', 'return'], { message: 'Choose approve or return.' }),
    /** The signer's password, entered again for this signature. */
    password: text().min(1, { message: 'Enter your password to sign.' }).max(256),
    meaning: text().trim().min(1).max(SIGNATURE_MEANING_MAX_LENGTH).optional(),
    reason: text().trim().max(REVIEW_NOTE_MAX_LENGTH).optional(),
  })
  .superRefine((body, ctx) => {
    if (body.decision === 'return' && !body.reason)
      ctx.addIssue({
        code: 'custom',
        path: ['reason'],
        message: 'Say why the revision goes back to its author.',
      });
  });
export type CreateDecisionInput = z.input<typeof createDecisionSchema>;
export const decisionReplySchema = z.object({
  decision: z.enum(['approve', 'return']),
  signer: z.object({ name: text(), email: text() }),
  signedAt: text(),
  meaning: text(),
  contentHash: text(),
  /** The revision's status after this decision. */
  status: revisionStatusSchema,
});

/** What needs the signed-in person: reviews to do, returned revisions, new comments, approvals. */
export const attentionItemSchema = z.object({
  kind: z.enum(['review_requested', 'returned', 'approved', 'comment']),
  routeId: text(),
  routeName: text(),
  revisionNumber: z.number().int(),
  from: personRefSchema,
  at: text(),
  text: text(),
});
export type AttentionItem = z.infer<typeof attentionItemSchema>;
export const attentionListSchema = listReplySchema(attentionItemSchema);
