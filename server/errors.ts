import type { ApiErrorDetail } from '@shared/schemas/errors';

/**
 * An error the API reports to its caller. `code` is stable (clients and
 * scripts branch on it), `status` is the HTTP status, `message` is a plain
 * sentence that may be shown to a person.
 */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: ApiErrorDetail[],
    readonly headers?: Record<string, string>,
  ) {
    super(message);
    this.name = 'AppError';
  }
}

// Factories: one per kind of failure, so a status and its code never drift apart.
export const badRequest = (message: string, details?: ApiErrorDetail[]) =>
  new AppError(400, 'bad_request', message, details);
export const validationFailed = (details: ApiErrorDetail[]) =>
  new AppError(400, 'validation_failed', 'Some fields are not valid.', details);
export const malformedJson = () =>
  new AppError(400, 'malformed_json', 'The request body is not valid JSON.');
export const unauthenticated = (message = 'Sign in to continue.') =>
  new AppError(401, 'unauthenticated', message);
export const invalidCredentials = () =>
  new AppError(401, 'invalid_credentials', 'E-mail or password is incorrect.');
export const invalidToken = () =>
  new AppError(401, 'invalid_token', 'The API token is not valid or was revoked.');
export const forbidden = (message = 'You do not have permission to do this.') =>
  new AppError(403, 'forbidden', message);
export const csrfFailed = () =>
  new AppError(
    403,
    'csrf_failed',
    'The request is missing a valid X-CSRF-Token header. Reload the page and try again.',
  );
// Loaders that run before authorize() must use the default text, so a hidden
// object and a missing one give identical replies.
export const notFound = (what = 'The requested item') =>
  new AppError(404, 'not_found', `${what} was not found.`);
export const conflict = (code: string, message: string) => new AppError(409, code, message);
export const gone = (code: string, message: string) => new AppError(410, code, message);
export const payloadTooLarge = () =>
  new AppError(413, 'payload_too_large', 'The request body is too large.');
export const accountLocked = (minutes: number) =>
  new AppError(
    423,
    'account_locked',
    `Too many failed sign-ins. The account is locked; try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`,
  );
export const tooManyRequests = () =>
  new AppError(429, 'rate_limited', 'Too many requests. Wait a few minutes and try again.');
export const serviceUnavailable = (message = 'The service is temporarily unavailable.') =>
  new AppError(503, 'service_unavailable', message);
export const internalError = () =>
  new AppError(500, 'internal_error', 'Something went wrong on the server.');
