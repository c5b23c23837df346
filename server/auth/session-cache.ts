import pg from 'pg';

/**
 * The channel on which the database announces a change to what a session read brings along
 * (migrations, "auth-change-notify"): `s:<sid>` when a stored session is rewritten or deleted
 * (sign-out, a password change ending other sessions), `u:<userId>` when the user's row or one
 * of their memberships changes (role change, removal, a new membership, account deletion).
 */
export const AUTH_CHANGES_CHANNEL = 'phasewright_auth_changes';

/** What one session read returned, as JSON text: each hit parses it into fresh objects. */
export interface CachedSessionRead {
  json: string;
  userId: string | null;
  /** When the stored session expires (ms), as read. */
  expiresAt: number;
}

export interface SessionCacheOptions {
  connectionString: string;
  /** How long an entry is used at most, whatever notifications say (ms). */
  ttlMs: number;
  maxEntries: number;
  log: (error: unknown) => void;
}

interface Entry extends CachedSessionRead {
  cachedAt: number;
}

/**
 * A per-process cache of session reads (the session with its user and memberships), so a
 * signed-in read does not read them again on every request. Kept correct across server
 * instances by LISTEN on AUTH_CHANGES_CHANNEL: database triggers announce every change to a
 * session, a user or a membership, whoever makes it, and each instance drops what it holds for
 * that session or user. While the listening connection is down (or not yet up) nothing is
 * cached or served from the cache; once it is back the cache starts empty.
 */
export class SessionCache {
  private readonly entries = new Map<string, Entry>();
  private readonly sidsOfUser = new Map<string, Set<string>>();
  private listener: pg.Client | null = null;
  private listening = false;
  private closed = false;
  private retry: NodeJS.Timeout | null = null;
  /**
   * Bumped by every invalidation: a read that started before one may have seen the old rows,
   * so it is not cached (see put()).
   */
  private generation = 0;

  constructor(private readonly options: SessionCacheOptions) {}

  /** Connects and listens; until that succeeds the cache is bypassed. */
  start(): void {
    if (this.closed || this.listener) return;
    const client = new pg.Client({
      connectionString: this.options.connectionString,
      application_name: 'phasewright-session-cache',
    });
    this.listener = client;
    const lost = (error?: unknown) => {
      if (this.listener !== client) return;
      if (error && !this.closed) this.options.log(error);
      this.listener = null;
      this.stopServing();
      client.end().catch(() => undefined);
      if (!this.closed) {
        this.retry = setTimeout(() => this.start(), 1_000);
        this.retry.unref();
      }
    };
    client.on('error', lost);
    client.on('end', () => lost());
    client.on('notification', (message) => this.onNotification(message.payload ?? ''));
    client
      .connect()
      .then(() => client.query(`LISTEN ${AUTH_CHANGES_CHANNEL}`))
      .then(
        () => {
          if (this.listener !== client) return;
          // Whatever changed while nobody listened is unknown: start empty.
          this.stopServing();
          this.listening = true;
        },
        (error: unknown) => lost(error),
      );
  }

  async close(): Promise<void> {
    this.closed = true;
    if (this.retry) clearTimeout(this.retry);
    this.stopServing();
    const client = this.listener;
    this.listener = null;
    await client?.end().catch(() => undefined);
  }

  /** The generation to hand to put() after a read from the database. */
  get currentGeneration(): number {
    return this.generation;
  }

  /** A cached read of the session, if one is fresh and the session has not expired. */
  get(sid: string, now = Date.now()): CachedSessionRead | undefined {
    if (!this.listening) return undefined;
    const entry = this.entries.get(sid);
    if (!entry) return undefined;
    // An expiry pushed forward on another instance is not announced; the database decides.
    if (entry.expiresAt < now || now - entry.cachedAt > this.options.ttlMs) {
      this.forgetSession(sid);
      return undefined;
    }
    return entry;
  }

  /** Keeps a read made from the database, unless anything was invalidated since it started. */
  put(sid: string, read: CachedSessionRead, generation: number): void {
    if (!this.listening || generation !== this.generation) return;
    this.forgetSession(sid);
    if (this.entries.size >= this.options.maxEntries) {
      const oldest = this.entries.keys().next().value;
      if (oldest !== undefined) this.forgetSession(oldest);
    }
    this.entries.set(sid, { ...read, cachedAt: Date.now() });
    if (read.userId) {
      let sids = this.sidsOfUser.get(read.userId);
      if (!sids) this.sidsOfUser.set(read.userId, (sids = new Set()));
      sids.add(sid);
    }
  }

  /** Drops a session (this instance writes or ends it; the trigger tells the others). */
  invalidateSession(sid: string): void {
    this.generation++;
    this.forgetSession(sid);
  }

  invalidateUser(userId: string): void {
    this.generation++;
    for (const sid of this.sidsOfUser.get(userId) ?? []) this.forgetSession(sid);
  }

  get size(): number {
    return this.entries.size;
  }

  private onNotification(payload: string): void {
    const id = payload.slice(2);
    if (payload.startsWith('s:')) this.invalidateSession(id);
    else if (payload.startsWith('u:')) this.invalidateUser(id);
    else this.forgetAll(); // not ours to understand: drop everything, to be safe
  }

  private stopServing(): void {
    this.listening = false;
    this.forgetAll();
  }

  private forgetAll(): void {
    this.generation++;
    this.entries.clear();
    this.sidsOfUser.clear();
  }

  private forgetSession(sid: string): void {
    const entry = this.entries.get(sid);
    if (!entry) return;
    this.entries.delete(sid);
    if (entry.userId) {
      const sids = this.sidsOfUser.get(entry.userId);
      sids?.delete(sid);
      if (sids?.size === 0) this.sidsOfUser.delete(entry.userId);
    }
  }
}
