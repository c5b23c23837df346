import { randomBytes, timingSafeEqual } from 'node:crypto';
import type { RequestHandler } from 'express';
import { csrfFailed } from '../errors';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

export function newCsrfToken(): string {
  return randomBytes(32).toString('base64url');
}

function sameToken(expected: string, given: string): boolean {
  const a = Buffer.from(expected);
  const b = Buffer.from(given);
  return a.length === b.length && timingSafeEqual(a, b);
}

/**
 * Synchronizer-token CSRF protection for cookie sessions: a state-changing
 * request made with the session cookie must echo the session's token in
 * X-CSRF-Token. Bearer-token requests are exempt (a browser cannot attach
 * them cross-site), and so is signing in, which replaces the session anyway.
 */
export function csrfProtection(exempt: (method: string, path: string) => boolean): RequestHandler {
  return (req, _res, next) => {
    if (
      SAFE_METHODS.has(req.method) ||
      req.authMethod !== 'session' ||
      exempt(req.method, req.path)
    )
      return next();
    const expected = req.session.csrfToken;
    const given = req.get('x-csrf-token');
    if (!expected || !given || !sameToken(expected, given)) throw csrfFailed();
    next();
  };
}
