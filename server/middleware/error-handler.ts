import type { ErrorRequestHandler, RequestHandler } from 'express';
import {
  ConnectionError,
  ForeignKeyConstraintError,
  UniqueConstraintError,
  ValidationError as SequelizeValidationError,
} from 'sequelize';
import { ZodError } from 'zod';
import { apiErrorSchema } from '@shared/schemas/errors';
import { parseExact } from '@shared/schemas/exact';
import {
  apiError,
  AppError,
  conflict,
  databaseUnavailable,
  internalError,
  malformedJson,
  malformedPath,
  payloadTooLarge,
  unreadableBody,
  unstorableText,
  unsupportedCharset,
  unsupportedEncoding,
  validationFailed,
} from '../errors';
import { zodIssuesToDetails } from '../http/validation';

export const apiNotFound: RequestHandler = () => {
  throw apiError('not_found', 'No such API endpoint.');
};

/**
 * Errors raised before a route runs: body-parser marks its errors with a
 * `type`, the router marks an undecodable path parameter with status 400.
 * Mapped by those marks, never by their messages.
 */
function requestReadingError(error: unknown): AppError | null {
  const marked = error as { type?: unknown; status?: unknown; statusCode?: unknown } | null;
  const type = marked?.type;
  if (type === 'entity.too.large') return payloadTooLarge();
  if (type === 'entity.parse.failed') return malformedJson();
  if (type === 'charset.unsupported') return unsupportedCharset();
  if (type === 'encoding.unsupported') return unsupportedEncoding();
  if (error instanceof URIError) return malformedPath();
  const status = Number(marked?.status ?? marked?.statusCode);
  if (Number.isInteger(status) && status >= 400 && status < 500) {
    // Express's router: "Failed to decode param"; zlib: a corrupt gzip or br body.
    if (/decode param/i.test(String((error as Error).message))) return malformedPath();
    return unreadableBody();
  }
  return null;
}

/** SQLSTATE classes and socket errors that mean the database is away, not that the request is wrong. */
const UNAVAILABLE_SQLSTATES = /^(08|57P0[123]|53)/;
const UNAVAILABLE_ERRNOS = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EPIPE',
  'ENOTFOUND',
]);

/** True when the error (or the driver error it wraps) says the database cannot be reached. */
export function isDatabaseUnavailable(error: unknown): boolean {
  if (error instanceof ConnectionError) return true;
  for (let e = error as Record<string, unknown> | null, depth = 0; e && depth < 4; depth++) {
    const code = typeof e.code === 'string' ? e.code : '';
    if (UNAVAILABLE_SQLSTATES.test(code) || UNAVAILABLE_ERRNOS.has(code)) return true;
    if (
      /Connection terminated|connection timeout|Client has encountered a connection error/i.test(
        String(e.message ?? ''),
      )
    )
      return true;
    e = (e.parent ?? e.original ?? e.cause ?? null) as Record<string, unknown> | null;
  }
  return false;
}

/** Database errors mapped by their class. */
function databaseError(error: unknown): AppError | null {
  if (error instanceof UniqueConstraintError)
    return conflict('already_exists', 'This already exists.');
  if (error instanceof ForeignKeyConstraintError)
    return conflict('reference_conflict', 'This refers to, or is referred to by, another record.');
  if (error instanceof SequelizeValidationError) {
    return validationFailed(
      error.errors.map((item) => ({ path: item.path ?? '', message: item.message })),
    );
  }
  if (isDatabaseUnavailable(error)) return databaseUnavailable();
  // A character PostgreSQL cannot store that slipped past the schemas.
  const code = (error as { parent?: { code?: unknown } })?.parent?.code;
  if (code === '22021' || code === '22P05') return unstorableText();
  return null;
}

export interface ErrorHandlerOptions {
  /**
   * Check every error reply against the shared contract before it is sent (outside
   * production): a reply that does not match is a server defect, logged and answered as an
   * internal error, so tests see it at once.
   */
  checkReplies?: boolean;
}

export function errorHandler(
  log: (error: unknown) => void,
  options: ErrorHandlerOptions = {},
): ErrorRequestHandler {
  return (error, _req, res, _next) => {
    let appError: AppError;
    if (error instanceof AppError) appError = error;
    else if (error instanceof ZodError)
      appError = validationFailed(zodIssuesToDetails(error.issues));
    else appError = requestReadingError(error) ?? databaseError(error) ?? internalError();
    if (appError.status >= 500) log(error);
    if (options.checkReplies) {
      const checked = parseExact(
        apiErrorSchema,
        JSON.parse(JSON.stringify({ error: appError.body })),
      );
      if (!checked.success) {
        log(
          new Error(
            `Error reply "${appError.code}" does not match the error contract: ${checked.error.message}`,
          ),
        );
        appError = internalError();
      }
    }
    if (res.headersSent) return;
    if (appError.headers) res.set(appError.headers);
    // Stack traces and internal messages never leave the server.
    res.status(appError.status).json({ error: appError.body });
  };
}
