import type { Pool } from 'pg';
import type { SignInThrottle } from '../services/sign-in-throttle';

/** What the credential routes share: the pool that keeps rate limits, and the sign-in throttle. */
export interface Security {
  pool: Pool;
  throttle: SignInThrottle;
}
