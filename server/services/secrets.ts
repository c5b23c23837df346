import { createHash, randomBytes } from 'node:crypto';

/** A URL-safe random secret for links and API tokens (256 bits). */
export function randomSecret(prefix = ''): string {
  return prefix + randomBytes(32).toString('base64url');
}

/**
 * Tokens are stored only as their SHA-256: they are long random values, so a
 * fast hash is enough and lets us look them up by hash.
 */
export function sha256(value: string): string {
  return createHash('sha256').update(value).digest('hex');
}
