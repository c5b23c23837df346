import connectPgSimple from 'connect-pg-simple';
import session, { type SessionData } from 'express-session';
import type pg from 'pg';
import type { Role } from '@shared/schemas/session';
import type { SessionCache } from './session-cache';

/**
 * What the session read brings along: the signed-in user's row and their
 * memberships, read in the same statement as the session itself, and when the
 * stored session expires. Never written back to the store.
 */
export interface SessionLoad {
  expiresAt: number;
  user: {
    id: string;
    email: string;
    name: string;
    passwordHash: string;
    createdAt: string;
    updatedAt: string;
  } | null;
  memberships: { workspaceId: string; roles: Role[] }[];
}

/** The property of a loaded session that carries its SessionLoad (stripped before saving). */
export const SESSION_LOAD = 'loaded';

declare module 'express-session' {
  interface SessionData {
    [SESSION_LOAD]?: SessionLoad;
  }
}

/** A stored expiry pushed forward less than this long ago is not pushed again. */
export const TOUCH_INTERVAL_MS = 60_000;

export interface SessionStoreOptions {
  pool: pg.Pool;
  /** false: this store does not prune (another store on the same table does). */
  pruneSessionIntervalSeconds: number | false;
  errorLog: (...args: unknown[]) => void;
  /**
   * Serve reads from this cache and fill it (server/auth/session-cache.ts). Every store
   * invalidates it when it writes or ends a session, cached or not.
   */
  cache?: { cache: SessionCache; serveFromCache: boolean };
}

/**
 * connect-pg-simple's store with changes that keep a signed-in read at one statement
 * for the session and the actor, or none:
 * - get() reads the session, its user and the user's memberships in one statement;
 * - with a cache that serves (the store for reads: GET and HEAD), get() answers from the
 *   cache when it can; the database announces every change to a session, user or
 *   membership, and each server drops what it cached for it (server/auth/session-cache.ts);
 *   the store for writes always reads the database, so a change is authorized on what is
 *   stored now;
 * - touch() writes the rolling expiry at most once a minute, not on every read.
 */
export function createSessionStore(
  options: SessionStoreOptions,
): InstanceType<ReturnType<typeof connectPgSimple>> {
  const PgStore = connectPgSimple(session);

  class PhasewrightSessionStore extends PgStore {
    constructor() {
      super({
        pool: options.pool,
        tableName: 'session',
        createTableIfMissing: false,
        pruneSessionInterval: options.pruneSessionIntervalSeconds,
        errorLog: options.errorLog,
      });
    }

    override get(
      sid: string,
      callback: (error: unknown, session?: SessionData | null) => void,
    ): void {
      const cache = options.cache?.cache;
      const hit = options.cache?.serveFromCache ? cache?.get(sid) : undefined;
      if (hit) return callback(null, loaded(JSON.parse(hit.json) as LoadedRow));
      const generation = cache?.currentGeneration ?? 0;
      options.pool
        .query<{
          sess: SessionData | string;
          expires_ms: string;
          user: unknown;
          memberships: unknown;
        }>(
          `SELECT s.sess,
                  (extract(epoch FROM s.expire) * 1000)::bigint AS expires_ms,
                  CASE WHEN u.id IS NULL THEN NULL ELSE json_build_object(
                    'id', u.id, 'email', u.email, 'name', u.name, 'passwordHash', u.password_hash,
                    'createdAt', u.created_at, 'updatedAt', u.updated_at) END AS user,
                  (SELECT coalesce(json_agg(json_build_object('workspaceId', m.workspace_id, 'roles', m.roles)), '[]'::json)
                     FROM memberships m WHERE m.user_id = u.id) AS memberships
             FROM session s
             LEFT JOIN users u ON u.id::text = s.sess -> 'passport' ->> 'user'
            WHERE s.sid = $1 AND s.expire >= now()`,
          [sid],
        )
        .then(
          (result) => {
            const row = result.rows[0];
            if (!row) return callback(null, null);
            let sess: SessionData;
            try {
              sess = typeof row.sess === 'string' ? JSON.parse(row.sess) : row.sess;
            } catch {
              return this.destroy(sid, (error) => callback(error));
            }
            const read: LoadedRow = {
              sess,
              load: {
                expiresAt: Number(row.expires_ms),
                user: row.user as SessionLoad['user'],
                memberships: row.memberships as SessionLoad['memberships'],
              },
            };
            cache?.put(
              sid,
              {
                json: JSON.stringify(read),
                userId: read.load.user?.id ?? null,
                expiresAt: read.load.expiresAt,
              },
              generation,
            );
            callback(null, loaded(read));
          },
          (error: unknown) => callback(error),
        );
    }

    override set(sid: string, sess: SessionData, callback?: (error?: unknown) => void): void {
      options.cache?.cache.invalidateSession(sid);
      super.set(sid, withoutLoad(sess), afterWrite(sid, callback));
    }

    override destroy(sid: string, callback?: (error?: unknown) => void): void {
      options.cache?.cache.invalidateSession(sid);
      super.destroy(sid, afterWrite(sid, callback));
    }

    override touch(sid: string, sess: SessionData, callback?: (error?: unknown) => void): void {
      const stored = sess[SESSION_LOAD]?.expiresAt;
      const next = sess.cookie?.expires ? new Date(sess.cookie.expires).getTime() : null;
      if (stored !== undefined && next !== null && next - stored < TOUCH_INTERVAL_MS) {
        callback?.();
        return;
      }
      // The cached read holds the old expiry; the next request reads the new one.
      super.touch(sid, withoutLoad(sess), afterWrite(sid, callback));
    }
  }

  // A read that started before the write finished may have cached the old row.
  const afterWrite =
    (sid: string, callback?: (error?: unknown) => void) =>
    (error?: unknown): void => {
      options.cache?.cache.invalidateSession(sid);
      callback?.(error);
    };

  return new PhasewrightSessionStore();
}

interface LoadedRow {
  sess: SessionData;
  load: SessionLoad;
}

function loaded(read: LoadedRow): SessionData {
  read.sess[SESSION_LOAD] = read.load;
  return read.sess;
}

function withoutLoad(sess: SessionData): SessionData {
  if (!(SESSION_LOAD in sess)) return sess;
  // The session object keeps its cookie as a class instance; copy its fields as they are.
  const copy = { ...sess } as SessionData;
  delete copy[SESSION_LOAD];
  return copy;
}
