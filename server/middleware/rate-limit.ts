import type { RequestHandler } from 'express';
import { rateLimit } from 'express-rate-limit';
import { tooManyRequests } from '../errors';

/**
 * A per-client-address limiter answering in the API's error shape. Counts live
 * in memory per server instance, so behind a load balancer each instance
 * allows the limit on its own; the account lockout (in the database) is the
 * firm bound for sign-in.
 */
export function limitRequests(options: { windowMinutes: number; limit: number }): RequestHandler {
  return rateLimit({
    windowMs: options.windowMinutes * 60_000,
    limit: options.limit,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    handler: (_req, _res, next) => next(tooManyRequests()),
  });
}
