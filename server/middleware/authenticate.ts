import type { RequestHandler } from 'express';
import { invalidToken } from '../errors';
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
    const user = await findUserByApiToken(match[1]);
    if (!user) throw invalidToken();
    req.user = user;
    req.authMethod = 'token';
  } else if (req.user) {
    req.authMethod = 'session';
  }
  if (req.user) req.actor = await loadActor(req.user.id);
  next();
};
