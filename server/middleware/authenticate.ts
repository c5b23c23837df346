import type { RequestHandler } from 'express';
import { invalidToken, unauthenticated } from '../errors';
import { loadActor } from '../services/actors';
import { findUserByApiToken } from '../services/tokens';

const BEARER = /^Bearer\s+(\S+)\s*$/i;

/**
 * Works out who is calling. A Bearer token wins over the session cookie (and
 * an invalid token is a 401 even if a cookie is present, so scripts fail
 * loudly). Sets req.user, req.authMethod and req.actor.
 */
export const authenticate: RequestHandler = async (req, _res, next) => {
  const header = req.get('authorization');
  if (header) {
    const match = BEARER.exec(header);
    if (!match) throw invalidToken();
    const found = await findUserByApiToken(match[1]);
    if (!found) throw invalidToken();
    req.user = found.user;
    req.authMethod = 'token';
    req.tokenScope = found.scope;
    req.actor = await loadActor(found.user.id);
  } else if (req.user) {
    req.authMethod = 'session';
    // Usually read together with the session (server/auth/session-store.ts).
    req.actor ??= await loadActor(req.user.id);
  } else {
    req.actor = undefined;
  }
  next();
};

/**
 * Ends a session at its absolute lifetime, however active it was (the idle
 * time-out is the cookie's rolling expiry). A session without a sign-in time
 * predates the rule and ends too.
 */
export function sessionLifetime(maxHours: number): RequestHandler {
  return (req, _res, next) => {
    const signedInAt = req.session?.signedInAt;
    if (!req.user || req.authMethod === 'token' || !req.session) return next();
    if (signedInAt && Date.now() - signedInAt < maxHours * 3600_000) return next();
    req.session.destroy(() =>
      next(
        unauthenticated(
          `Your session ended ${maxHours} hours after you signed in; sign in again to continue.`,
        ),
      ),
    );
  };
}
