import { createHmac, timingSafeEqual } from 'node:crypto';
import type { NextFunction, Request, RequestHandler } from 'express';
import type { SessionData, Store } from 'express-session';
import { User } from '../models';
import { actorFrom } from '../services/actors';
import { SESSION_LOAD, TOUCH_INTERVAL_MS } from './session-store';

export interface ReadSessionOptions {
  /** The session cookie's name (the one express-session sets at sign-in). */
  name: string;
  secret: string;
  /** The idle time-out: each touch sets the expiry this far ahead (ms). */
  idleMs: number;
  /** The store reads are served from (the one with the session cache); it must touch. */
  store: Store & { touch: NonNullable<Store['touch']> };
  /**
   * The chain every other request takes (express-session, passport, authenticate); a read
   * goes through it whenever the lean path cannot answer on its own.
   */
  fallback: RequestHandler[];
  /** The clock (ms); tests move it. */
  now?: () => number;
}

/** Marks a request whose session the lean path read. */
const LEAN = Symbol('lean read session');
interface LeanRequest extends Request {
  [LEAN]?: true;
}

/**
 * The session of a signed-in read (GET, HEAD) at the cost of one HMAC and one cache look-up:
 * what express-session and passport do per request, minus what a read does not need.
 *
 * - The cookie is the one express-session set at sign-in (`s:<sid>.<HMAC-SHA256, base64>`,
 *   the cookie-signature format), verified with one HMAC in constant time.
 * - The session comes from the read store: its cache (kept true across servers by the
 *   database's change notifications, server/auth/session-cache.ts) or one statement on a miss,
 *   which sees only unexpired sessions (the idle time-out). The absolute lifetime is checked
 *   after this, by sessionLifetime(), as for every request.
 * - req.session, req.sessionID, req.user, req.actor and req.authMethod are set as
 *   express-session, passport and authenticate() would set them; req.user (a model instance)
 *   is built only if a handler asks for it.
 * - The rolling expiry moves only when it would move by more than a minute: then the stored
 *   expiry is written and the cookie is sent again with the new Expires; otherwise nothing is
 *   written and no Set-Cookie is sent. The idle time-out keeps its meaning to within a minute.
 * - A read never saves the session. Anything unusual (a Bearer token, no or a bad cookie, a
 *   session without a signed-in user or without its CSRF token, which GET /session would add)
 *   goes through the fallback chain, exactly as before.
 */
export function readSession(options: ReadSessionOptions): RequestHandler {
  const now = options.now ?? Date.now;
  const fallback = chain(options.fallback);

  return (req: LeanRequest, res, next) => {
    if ((req.method !== 'GET' && req.method !== 'HEAD') || req.headers.authorization !== undefined)
      return fallback(req, res, next);
    const sid = verifiedSessionId(req.headers.cookie, options.name, options.secret);
    if (sid === undefined) return fallback(req, res, next);
    options.store.get(sid, (error, sess) => {
      if (error) return next(error);
      if (!sess) return next(); // expired or ended: not signed in (nothing to save or send)
      const load = sess[SESSION_LOAD];
      const userId = (sess as { passport?: { user?: unknown } }).passport?.user;
      if (!load?.user || load.user.id !== userId || !sess.csrfToken || !sess.cookie)
        return fallback(req, res, next);
      req.sessionID = sid;
      req.sessionStore = options.store as Request['sessionStore'];
      const session = options.store.createSession(req, sess as SessionData & { cookie: never });
      const loadedUser = load.user;
      let user: Express.User | undefined;
      Object.defineProperty(req, 'user', {
        configurable: true,
        enumerable: true,
        get: () =>
          (user ??= User.build(
            {
              ...loadedUser,
              createdAt: new Date(loadedUser.createdAt),
              updatedAt: new Date(loadedUser.updatedAt),
            },
            { isNewRecord: false, raw: true },
          )),
        set: (value: Express.User | undefined) => {
          user = value;
        },
      });
      req.actor = actorFrom(loadedUser.id, load.memberships);
      req.authMethod = 'session';
      req[LEAN] = true;

      const expires = now() + options.idleMs;
      if (expires - load.expiresAt < TOUCH_INTERVAL_MS) return next();
      session.cookie.expires = new Date(expires);
      session.cookie.originalMaxAge = options.idleMs;
      options.store.touch(sid, session, (touchError?: unknown) => {
        if (touchError) return next(touchError);
        // express-session sends a secure cookie only over https; so does this.
        if (!session.cookie.secure || req.secure) {
          const cookie = session.cookie;
          res.cookie(options.name, `s:${sign(sid, options.secret)}`, {
            path: cookie.path ?? '/',
            expires: cookie.expires ?? undefined,
            httpOnly: cookie.httpOnly,
            secure: Boolean(cookie.secure),
            sameSite: cookie.sameSite,
            domain: cookie.domain,
          });
        }
        next();
      });
    });
  };
}

/** Whether the lean path read this request's session (tests ask). */
export function readByLeanPath(req: Request): boolean {
  return (req as LeanRequest)[LEAN] === true;
}

/** The session id of a validly signed session cookie in the Cookie header, if there is one. */
export function verifiedSessionId(
  header: string | undefined,
  name: string,
  secret: string,
): string | undefined {
  if (!header) return undefined;
  const prefix = `${name}=`;
  // The first cookie of that name wins, as in the cookie parser express-session uses.
  let raw: string | undefined;
  for (let at = 0; at < header.length;) {
    const semicolon = header.indexOf(';', at);
    const end = semicolon < 0 ? header.length : semicolon;
    const pair = header.slice(at, end).trim();
    if (pair.startsWith(prefix)) {
      raw = pair.slice(prefix.length).trim();
      break;
    }
    at = end + 1;
  }
  if (raw === undefined) return undefined;
  if (raw.startsWith('"') && raw.endsWith('"')) raw = raw.slice(1, -1);
  if (raw.includes('%')) {
    try {
      raw = decodeURIComponent(raw);
    } catch {
      return undefined;
    }
  }
  if (!raw.startsWith('s:')) return undefined;
  const signed = raw.slice(2);
  const dot = signed.lastIndexOf('.');
  if (dot < 0) return undefined;
  const sid = signed.slice(0, dot);
  const given = Buffer.from(signed.slice(dot + 1));
  const expected = Buffer.from(signature(sid, secret));
  return given.length === expected.length && timingSafeEqual(given, expected) ? sid : undefined;
}

/** cookie-signature's format: HMAC-SHA256 of the value, base64 without padding. */
function signature(value: string, secret: string): string {
  return createHmac('sha256', secret).update(value).digest('base64').replace(/=+$/, '');
}

function sign(value: string, secret: string): string {
  return `${value}.${signature(value, secret)}`;
}

/** Runs middleware one after the other, as the router would (errors and rejections to next). */
function chain(handlers: RequestHandler[]): RequestHandler {
  return (req, res, next) => {
    let index = 0;
    const step = (error?: unknown): void => {
      if (error !== undefined && error !== null) return next(error);
      const handler = handlers[index++];
      if (!handler) return next();
      try {
        const result: unknown = handler(req, res, step as NextFunction);
        if (result instanceof Promise) result.catch((rejection: unknown) => next(rejection));
      } catch (thrown) {
        next(thrown);
      }
    };
    step();
  };
}
