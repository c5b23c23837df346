import { createHash } from 'node:crypto';

/**
 * Canonical JSON in the manner of RFC 8785 (JSON Canonicalization Scheme):
 * object keys sorted by UTF-16 code units, no whitespace, numbers and strings
 * as ECMAScript's JSON.stringify writes them, undefined members left out.
 */
export function canonicalJson(value: unknown): string {
  if (value === null || typeof value !== 'object') {
    if (typeof value === 'number' && !Number.isFinite(value))
      throw new Error('canonical JSON has no form for NaN or Infinity');
    return JSON.stringify(value ?? null);
  }
  if (Array.isArray(value))
    return `[${value.map((item) => (item === undefined ? 'null' : canonicalJson(item))).join(',')}]`;
  const record = value as Record<string, unknown>;
  const members = Object.keys(record)
    .filter((key) => record[key] !== undefined)
    .sort()
    .map((key) => `${JSON.stringify(key)}:${canonicalJson(record[key])}`);
  return `{${members.join(',')}}`;
}

/** SHA-256 (hex) of the canonical JSON of a revision's document, the server's result and the engine version. */
export function revisionContentHash(input: {
  document: unknown;
  result: unknown;
  engineVersion: string;
}): string {
  const canonical = canonicalJson({
    document: input.document,
    result: input.result ?? null,
    engineVersion: input.engineVersion,
  });
  return createHash('sha256').update(canonical, 'utf8').digest('hex');
}
