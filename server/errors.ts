import type {
  ApiErrorBody,
  ApiErrorBodyOf,
  ApiErrorCode,
  ApiErrorDetail,
  ApiErrorDetailsOf,
} from '@shared/schemas/errors';

/**
 * The HTTP status of every error code in the contract (shared/schemas/errors.ts). The
 * `satisfies` makes the type-check name any code that has no status yet.
 */
export const ERROR_STATUS = {
  validation_failed: 400,
  bad_request: 400,
  malformed_json: 400,
  malformed_path: 400,
  unreadable_body: 400,
  unstorable_text: 400,
  unauthenticated: 401,
  invalid_credentials: 401,
  invalid_token: 401,
  invalid_password: 401,
  forbidden: 403,
  csrf_failed: 403,
  token_read_only: 403,
  not_found: 404,
  already_exists: 409,
  reference_conflict: 409,
  already_member: 409,
  last_admin: 409,
  route_archived: 409,
  draft_conflict: 409,
  stale_draft: 409,
  version_conflict: 409,
  review_open: 409,
  review_closed: 409,
  revision_superseded: 409,
  already_decided: 409,
  invalid_reviewers: 422,
  job_finished: 409,
  reset_used: 410,
  reset_expired: 410,
  invitation_used: 410,
  invitation_expired: 410,
  payload_too_large: 413,
  route_too_large: 413,
  unsupported_encoding: 415,
  unsupported_charset: 415,
  file_too_large: 413,
  unsupported_file: 415,
  structure_unparsable: 422,
  unifac_missing_parameters: 422,
  no_data: 422,
  not_computable: 422,
  route_invalid: 422,
  route_unevaluable: 422,
  evaluation_timeout: 422,
  result_too_large: 422,
  unreadable_file: 422,
  rate_limited: 429,
  sign_in_throttled: 429,
  too_many_evaluations: 429,
  too_many_jobs: 429,
  internal_error: 500,
  service_unavailable: 503,
  database_unavailable: 503,
  server_busy: 503,
} as const satisfies Record<ApiErrorCode, number>;

type Status = (typeof ERROR_STATUS)[ApiErrorCode];
/** The codes answered with one HTTP status, e.g. CodeWithStatus<409>. */
export type CodeWithStatus<S extends Status> = {
  [C in ApiErrorCode]: (typeof ERROR_STATUS)[C] extends S ? C : never;
}[ApiErrorCode];

type BodyOf<C extends ApiErrorCode> = ApiErrorBodyOf<C>;
/** Codes whose replies carry no details. */
type PlainCode = {
  [C in ApiErrorCode]: 'details' extends keyof BodyOf<C> ? never : C;
}[ApiErrorCode];
/** The factory's trailing argument: required, optional or absent, as the contract says. */
type DetailsArgs<C extends ApiErrorCode> = 'details' extends keyof BodyOf<C>
  ? undefined extends ApiErrorDetailsOf<C>
    ? [details?: ApiErrorDetailsOf<C>]
    : [details: ApiErrorDetailsOf<C>]
  : [];

/**
 * An error the API reports to its caller. `body` is exactly what the reply's `error` member
 * holds, typed by the shared contract; `status` follows from its code.
 */
export class AppError extends Error {
  readonly status: number;

  constructor(
    readonly body: ApiErrorBody,
    readonly headers?: Record<string, string>,
  ) {
    super(body.message);
    this.name = 'AppError';
    this.status = ERROR_STATUS[body.code];
  }

  get code(): ApiErrorCode {
    return this.body.code;
  }
}

/**
 * The one error factory: a code from the contract, a plain sentence a person may read, and
 * the details that code carries (required, optional or none, by the contract's type).
 */
export function apiError<C extends ApiErrorCode>(
  code: C,
  message: string,
  ...details: DetailsArgs<C>
): AppError {
  const body =
    details[0] === undefined ? { code, message } : { code, message, details: details[0] };
  return new AppError(body as ApiErrorBody);
}

/** An AppError with a Retry-After header (seconds). */
const retryAfter = (error: AppError, seconds: number) =>
  new AppError(error.body, {
    ...error.headers,
    'Retry-After': String(Math.max(1, Math.ceil(seconds))),
  });

// Named factories for the common failures, so call sites read as what went wrong.
export const badRequest = (message: string, details?: ApiErrorDetail[]) =>
  apiError('bad_request', message, details);
export const validationFailed = (details: ApiErrorDetail[]) =>
  apiError('validation_failed', 'Some fields are not valid.', details);
export const malformedJson = () =>
  apiError('malformed_json', 'The request body is not valid JSON.');
export const unauthenticated = (message = 'Sign in to continue.') =>
  apiError('unauthenticated', message);
export const invalidCredentials = () =>
  apiError('invalid_credentials', 'E-mail or password is incorrect.');
export const invalidToken = () =>
  apiError('invalid_token', 'The API token is not valid or was revoked.');
export const forbidden = (message = 'You do not have permission to do this.') =>
  apiError('forbidden', message);
export const csrfFailed = () =>
  apiError(
    'csrf_failed',
    'The request is missing a valid X-CSRF-Token header. Reload the page and try again.',
  );
// Loaders that run before authorize() must use the default text, so a hidden
// object and a missing one give identical replies.
export const notFound = (what = 'The requested item') =>
  apiError('not_found', `${what} was not found.`);
export const conflict = (code: CodeWithStatus<409> & PlainCode, message: string) =>
  apiError(code, message);
export const gone = (code: CodeWithStatus<410> & PlainCode, message: string) =>
  apiError(code, message);
/** A PATCH based on an older version of a route or compound: nothing was changed. */
export const versionConflict = (
  what: 'route' | 'compound',
  current: { version: number; updatedAt: Date },
) =>
  apiError(
    'version_conflict',
    `This ${what} was changed by someone else after you opened it (it is now at version ${current.version}). Your change was not saved; reload to see theirs, then make yours again.`,
    { version: current.version, updatedAt: current.updatedAt.toISOString() },
  );
export const malformedPath = () =>
  apiError(
    'malformed_path',
    'The address contains a malformed %-escape; check the link and try again.',
  );
export const unreadableBody = () =>
  apiError(
    'unreadable_body',
    'The request body could not be read (damaged compression or an interrupted upload).',
  );
export const unstorableText = () =>
  apiError(
    'unstorable_text',
    'Some text contains a character that cannot be stored (an invisible NUL character or half of a broken Unicode character); retype it.',
  );
export const unsupportedCharset = () =>
  apiError('unsupported_charset', 'Send the request body as UTF-8 JSON.');
export const unsupportedEncoding = () =>
  apiError(
    'unsupported_encoding',
    'The request body is compressed in a way the server does not accept; send it as plain, gzip, deflate or br.',
  );
export const routeTooLarge = (what: string, limit: string) =>
  apiError(
    'route_too_large',
    `This ${what}; the server evaluates at most ${limit} in one request. Split the route, or ask for fewer draws.`,
  );
export const resultTooLarge = (bytes: number, limitBytes: number) =>
  apiError(
    'result_too_large',
    `The result would be ${(bytes / 1e6).toFixed(1)} MB, more than the ${Number((limitBytes / 1e6).toFixed(1))} MB the server sends in one reply. Evaluate a smaller part of the route.`,
  );
export const evaluationTimedOut = (ms: number) =>
  apiError(
    'evaluation_timeout',
    `The calculation took longer than ${Math.round(ms / 1000)} s and was stopped. Split the route, or ask for fewer draws.`,
  );
export const tooManyEvaluations = (limit: number) =>
  retryAfter(
    apiError(
      'too_many_evaluations',
      `You already have ${limit} calculation${limit === 1 ? '' : 's'} running; wait for ${limit === 1 ? 'it' : 'one'} to finish.`,
    ),
    2,
  );
export const tooManyJobs = (limit: number) =>
  retryAfter(
    apiError(
      'too_many_jobs',
      `You already have ${limit} uncertainty run${limit === 1 ? '' : 's'} queued or running; wait for one to finish or cancel it.`,
    ),
    10,
  );
export const serverBusy = () =>
  retryAfter(
    apiError(
      'server_busy',
      'The server is busy with other calculations; try again in a few seconds.',
    ),
    5,
  );
export const databaseUnavailable = () =>
  retryAfter(
    apiError(
      'database_unavailable',
      'The database cannot be reached at the moment; try again in a minute. A change you were making was not saved.',
    ),
    10,
  );
export const payloadTooLarge = () =>
  apiError('payload_too_large', 'The request body is too large.');
export const tooManyRequests = (retryAfterSeconds = 60) =>
  retryAfter(
    apiError('rate_limited', 'Too many requests. Wait a few minutes and try again.'),
    retryAfterSeconds,
  );
export const signInThrottled = (seconds: number) =>
  retryAfter(
    apiError(
      'sign_in_throttled',
      `Too many failed sign-ins. Wait ${seconds} second${seconds === 1 ? '' : 's'} and try again, or reset your password.`,
    ),
    seconds,
  );
export const tokenReadOnly = () =>
  apiError(
    'token_read_only',
    'This API token is read-only. Create a read-write token on your account page to make changes.',
  );
export const serviceUnavailable = (message = 'The service is temporarily unavailable.') =>
  apiError('service_unavailable', message);
export const internalError = () =>
  apiError('internal_error', 'Something went wrong on the server.');
