import type { RequestHandler } from 'express';
import type { Pool } from 'pg';
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import { tooManyRequests } from '../errors';
import { RATE_LIMIT_TABLE } from '../services/sign-in-throttle';
import { sha256 } from '../services/secrets';

/**
 * A per-client-address limiter answering in the API's error shape, with the
 * counts in PostgreSQL (rate-limiter-flexible's store), so N server instances
 * behind a load balancer share one budget. The client address is req.ip:
 * the socket's address, or the proxy's X-Forwarded-For when TRUST_PROXY says
 * which proxies to believe (docs/deployment.md).
 */
export function limitRequests(options: {
  pool: Pool;
  /** Names the budget, e.g. 'sign-in'. */
  name: string;
  windowMinutes: number;
  limit: number;
}): RequestHandler {
  const limiter = new RateLimiterPostgres({
    storeClient: options.pool,
    storeType: 'pool',
    tableName: RATE_LIMIT_TABLE,
    tableCreated: true,
    clearExpiredByTimeout: false,
    keyPrefix: `requests-${options.name}`,
    points: options.limit,
    duration: options.windowMinutes * 60,
  });
  return async (req, res, next) => {
    try {
      const used = await limiter.consume(sha256(req.ip ?? 'unknown'));
      res.set('RateLimit-Limit', String(options.limit));
      res.set('RateLimit-Remaining', String(used.remainingPoints));
      next();
    } catch (rejection) {
      if (!(rejection instanceof RateLimiterRes)) return next(rejection);
      next(tooManyRequests(Math.ceil(rejection.msBeforeNext / 1000)));
    }
  };
}
