/**
 * Failed sign-ins slow down the one who fails, not the account's owner.
 * Failures are counted in PostgreSQL (shared by every server instance) under
 * three keys: this account from this address, this account from anywhere,
 * and this address for any account. Past a number of free tries each key
 * makes the next attempt wait, twice as long after each further failure, up
 * to a cap; a success from the address clears its account keys.
 *
 * The keys are the e-mail as typed (normalised) and the client address, never
 * whether an account exists, so a known and an unknown account answer alike.
 * A wrong password while waiting is not even checked.
 */
import type { Pool } from 'pg';
import { RateLimiterPostgres, type RateLimiterRes } from 'rate-limiter-flexible';
import { signInThrottled } from '../errors';
import { sha256 } from './secrets';

interface Rule {
  /** Failures allowed before any wait. */
  free: number;
  /** First wait, seconds; doubled after each further failure. */
  minSeconds: number;
  /** Longest wait, seconds. */
  maxSeconds: number;
}

export interface ThrottleRules {
  pair: Rule;
  account: Rule;
  address: Rule;
  /** Failures are forgotten this long after the last one, hours. */
  memoryHours: number;
}

/** Common practice (OWASP authentication guidance: throttle, do not lock out); tune in config. */
export const DEFAULT_THROTTLE: ThrottleRules = {
  pair: { free: 5, minSeconds: 2, maxSeconds: 15 * 60 },
  account: { free: 20, minSeconds: 2, maxSeconds: 60 },
  address: { free: 50, minSeconds: 2, maxSeconds: 15 * 60 },
  memoryHours: 24,
};

type Kind = 'pair' | 'account' | 'address';

export interface SignInThrottle {
  /** Throws 429 sign_in_throttled (with Retry-After) while any key must wait. */
  assertAllowed(email: string, address: string): Promise<void>;
  recordFailure(email: string, address: string): Promise<void>;
  recordSuccess(email: string, address: string): Promise<void>;
  /** Forgets the account's failures (after a password reset proved the mailbox). */
  forgetAccount(email: string): Promise<void>;
}

export const RATE_LIMIT_TABLE = 'rate_limits';

export function createSignInThrottle(
  pool: Pool,
  rules: ThrottleRules = DEFAULT_THROTTLE,
): SignInThrottle {
  const store = (keyPrefix: string, points: number, duration: number) =>
    new RateLimiterPostgres({
      storeClient: pool,
      storeType: 'pool',
      tableName: RATE_LIMIT_TABLE,
      tableCreated: true,
      clearExpiredByTimeout: false,
      keyPrefix,
      points,
      duration,
    });
  const memory = rules.memoryHours * 3600;
  const failures = {
    pair: store('sign-in-failures-pair', 1_000_000, memory),
    account: store('sign-in-failures-account', 1_000_000, memory),
    address: store('sign-in-failures-address', 1_000_000, memory),
  };
  const waits = {
    pair: store('sign-in-wait-pair', 1, 1),
    account: store('sign-in-wait-account', 1, 1),
    address: store('sign-in-wait-address', 1, 1),
  };
  const keys = (email: string, address: string): Record<Kind, string> => {
    const account = sha256(email.trim().toLowerCase());
    return { pair: `${account}.${sha256(address)}`, account, address: sha256(address) };
  };

  return {
    async assertAllowed(email, address) {
      const k = keys(email, address);
      let waitMs = 0;
      for (const kind of ['pair', 'account', 'address'] as const) {
        const res: RateLimiterRes | null = await waits[kind].get(k[kind]);
        if (res && res.consumedPoints > 1) waitMs = Math.max(waitMs, res.msBeforeNext);
      }
      if (waitMs > 0) throw signInThrottled(Math.ceil(waitMs / 1000));
    },
    async recordFailure(email, address) {
      const k = keys(email, address);
      for (const kind of ['pair', 'account', 'address'] as const) {
        const counted = await failures[kind].penalty(k[kind], 1);
        const rule = rules[kind];
        const over = counted.consumedPoints - rule.free;
        if (over > 0) {
          const seconds = Math.min(rule.maxSeconds, rule.minSeconds * 2 ** (over - 1));
          await waits[kind].block(k[kind], seconds);
        }
      }
    },
    async recordSuccess(email, address) {
      const k = keys(email, address);
      // The address key stays: one good account must not wipe an address's failures on others.
      for (const kind of ['pair', 'account'] as const) {
        await failures[kind].delete(k[kind]);
        await waits[kind].delete(k[kind]);
      }
    },
    async forgetAccount(email) {
      const account = sha256(email.trim().toLowerCase());
      await pool.query(`DELETE FROM ${RATE_LIMIT_TABLE} WHERE key LIKE $1 OR key LIKE $2`, [
        `sign-in-%:${account}`,
        `sign-in-%:${account}.%`,
      ]);
    },
  };
}
