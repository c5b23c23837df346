/**
 * Exact parsing of replies: the schema must describe every field the other
 * side sent. zod's objects drop unknown keys silently, which hides a contract
 * that has drifted (the server adds a field the client never learns about, or
 * renames one and the client quietly reads a default). `parseExact` parses
 * with the schema and then refuses any key, at any depth, that the parse
 * dropped. Records keep their keys, so open maps (per-step results) stay open.
 */
import { z } from 'zod';

function isPlainObject(value: unknown): value is Record<string, unknown> {
  if (value === null || typeof value !== 'object' || Array.isArray(value)) return false;
  const proto = Object.getPrototypeOf(value);
  return proto === Object.prototype || proto === null;
}

/** The path of the first key present in `input` but dropped from `output`, or null. */
function droppedKey(
  input: unknown,
  output: unknown,
  path: PropertyKey[],
): { path: PropertyKey[]; key: string } | null {
  if (Array.isArray(input) && Array.isArray(output)) {
    for (let i = 0; i < input.length && i < output.length; i++) {
      const found = droppedKey(input[i], output[i], [...path, i]);
      if (found) return found;
    }
    return null;
  }
  if (isPlainObject(input) && isPlainObject(output)) {
    for (const key of Object.keys(input)) {
      if (!Object.hasOwn(output, key)) return { path, key };
      const found = droppedKey(input[key], output[key], [...path, key]);
      if (found) return found;
    }
  }
  return null;
}

/** Like `schema.safeParse(value)`, but a field the schema does not declare is an error. */
export function parseExact<S extends z.ZodType>(
  schema: S,
  value: unknown,
): z.ZodSafeParseResult<z.output<S>> {
  const result = schema.safeParse(value);
  if (!result.success) return result;
  const dropped = droppedKey(value, result.data, []);
  if (!dropped) return result;
  return {
    success: false,
    error: new z.ZodError([
      {
        code: 'unrecognized_keys',
        keys: [dropped.key],
        path: dropped.path,
        input: value as Record<string, unknown>,
        message: `Unrecognized key: "${dropped.key}"`,
      },
    ]),
  } as z.ZodSafeParseResult<z.output<S>>;
}

/**
 * Compile-time equality of two types: `const _same: Exactly<A, B> = true` fails the
 * type-check when a reply schema and the engine type it describes drift apart.
 */
export type Exactly<A, B> =
  (<T>() => T extends A ? 1 : 2) extends <T>() => T extends B ? 1 : 2 ? true : false;
