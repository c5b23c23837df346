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
  internalError,
  malformedJson,
  payloadTooLarge,
  serviceUnavailable,
  validationFailed,
} from '../errors';
import { zodIssuesToDetails } from '../http/validation';

export const apiNotFound: RequestHandler = () => {
  throw apiError('not_found', 'No such API endpoint.');
};

/** body-parser marks its errors with a `type`; map those, not their messages. */
function bodyParserError(error: unknown): AppError | null {
  const type = (error as { type?: unknown })?.type;
  if (type === 'entity.too.large') return payloadTooLarge();
  if (type === 'entity.parse.failed') return malformedJson();
  if (typeof type === 'string' && type.startsWith('encoding.'))
    return apiError('unsupported_encoding', 'The request encoding is not supported.');
  return null;
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
  if (error instanceof ConnectionError)
    return serviceUnavailable('The database cannot be reached.');
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
    else appError = bodyParserError(error) ?? databaseError(error) ?? internalError();
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
