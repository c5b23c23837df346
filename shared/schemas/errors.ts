/**
 * The API's error contract: every error reply is `{ error: { code, message, details? } }`,
 * and `details` has one shape per `code`. The union below is the single list of codes; the
 * server's error factory (server/errors.ts) is typed from it, so a code cannot be sent with
 * details of the wrong shape, and the client parses every error reply with it exactly.
 *
 * To add a code: add it to the member whose details it carries (or to a new member), give it
 * its HTTP status in server/errors.ts (the type-check asks for it), and describe it in
 * docs/api.md.
 */
import { z } from 'zod';
import { routeEvaluationFailureSchema, ROUTE_EVALUATION_CODES } from './evaluate';
import { draftConflictDetailsSchema, personRefSchema } from './routes';

/** 409 stale_draft: a revision was asked of a draft version that is no longer current. */
export const staleDraftDetailsSchema = z.object({
  draftVersion: z.number().int(),
  updatedAt: z.string(),
  updatedBy: personRefSchema,
});

/** 409 version_conflict: a PATCH based on an older version of a route or compound. */
export const versionConflictDetailsSchema = z.object({
  version: z.number().int(),
  updatedAt: z.string(),
});

/** One problem with a request field; `path` is dotted ("steps.0.name"), empty for the whole body. */
export const apiErrorDetailSchema = z.object({
  path: z.string(),
  message: z.string(),
});
export type ApiErrorDetail = z.infer<typeof apiErrorDetailSchema>;
export const fieldProblemsSchema = z.array(apiErrorDetailSchema);

/** Codes whose replies list every field problem (400 validation, database validation). */
export const FIELD_PROBLEM_CODES = ['validation_failed', 'invalid_reviewers'] as const;

/** Codes that may name the field at fault, or the request as a whole. */
export const OPTIONAL_FIELD_PROBLEM_CODES = ['bad_request', 'structure_unparsable'] as const;

/** Codes whose replies carry no details: the message says it all. */
export const PLAIN_ERROR_CODES = [
  // 400
  'malformed_json',
  'malformed_path',
  'unreadable_body',
  'unstorable_text',
  // 401
  'unauthenticated',
  'invalid_credentials',
  'invalid_token',
  'invalid_password',
  // 403
  'forbidden',
  'csrf_failed',
  'token_read_only',
  // 404
  'not_found',
  // 409
  'already_exists',
  'reference_conflict',
  'already_member',
  'last_admin',
  'route_archived',
  'review_open',
  'review_closed',
  'revision_superseded',
  'already_decided',
  'job_finished',
  // 410
  'reset_used',
  'reset_expired',
  'invitation_used',
  'invitation_expired',
  // 413, 415
  'payload_too_large',
  'route_too_large',
  'unsupported_encoding',
  'unsupported_charset',
  'file_too_large',
  'unsupported_file',
  // 422: a well-formed request that cannot be computed
  'unifac_missing_parameters',
  'no_data',
  'not_computable',
  'evaluation_timeout',
  'result_too_large',
  'unreadable_file',
  // 429
  'rate_limited',
  'sign_in_throttled',
  'too_many_evaluations',
  'too_many_jobs',
  // 5xx
  'internal_error',
  'service_unavailable',
  'database_unavailable',
  'server_busy',
] as const;

const message = z.string();

export const apiErrorBodySchema = z.discriminatedUnion('code', [
  z.object({ code: z.enum(FIELD_PROBLEM_CODES), message, details: fieldProblemsSchema }),
  z.object({
    code: z.enum(OPTIONAL_FIELD_PROBLEM_CODES),
    message,
    details: fieldProblemsSchema.optional(),
  }),
  z.object({ code: z.literal('draft_conflict'), message, details: draftConflictDetailsSchema }),
  z.object({ code: z.literal('stale_draft'), message, details: staleDraftDetailsSchema }),
  z.object({ code: z.literal('version_conflict'), message, details: versionConflictDetailsSchema }),
  routeEvaluationFailureSchema,
  z.object({ code: z.enum(PLAIN_ERROR_CODES), message }),
]);
/** The `error` member of an error reply, one shape per code. */
export type ApiErrorBody = z.infer<typeof apiErrorBodySchema>;
export type ApiErrorCode = ApiErrorBody['code'];
/** The body of one code's reply (members keyed by several codes included). */
export type ApiErrorBodyOf<C extends ApiErrorCode> = ApiErrorBody extends infer B
  ? B extends { code: infer K }
    ? C extends K
      ? B
      : never
    : never
  : never;
/** The details a code carries (undefined for codes without details). */
export type ApiErrorDetailsOf<C extends ApiErrorCode> = 'details' extends keyof ApiErrorBodyOf<C>
  ? ApiErrorBodyOf<C>['details' & keyof ApiErrorBodyOf<C>]
  : undefined;

/** Every error the API returns has this shape; `code` is stable and meant for programs. */
export const apiErrorSchema = z.object({ error: apiErrorBodySchema });
export type ApiError = z.infer<typeof apiErrorSchema>;

/** Every code the API may answer with, for documentation and tests. */
export const API_ERROR_CODES: readonly ApiErrorCode[] = [
  ...FIELD_PROBLEM_CODES,
  ...OPTIONAL_FIELD_PROBLEM_CODES,
  'draft_conflict',
  'stale_draft',
  'version_conflict',
  ...ROUTE_EVALUATION_CODES,
  ...PLAIN_ERROR_CODES,
];
