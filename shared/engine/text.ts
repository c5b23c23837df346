/**
 * Text fields of every payload. PostgreSQL cannot store a NUL character in
 * text or JSON, and a lone UTF-16 surrogate (half of a pair, as a broken
 * copy-paste leaves it) is not valid Unicode, so JSON columns refuse it too.
 * Such text is refused at the schema with the field's path, never passed on
 * to fail later as a server error. Every payload schema builds its strings
 * with `text()` (a lint rule keeps it so).
 */
import { z } from 'zod';

/** NUL, a high surrogate not followed by a low one, or a low surrogate not preceded by a high one. */
// eslint-disable-next-line no-control-regex -- NUL is exactly what is looked for
const UNSTORABLE = /\u0000|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

export const UNSTORABLE_TEXT_MESSAGE =
  'This text contains a character that cannot be stored (an invisible NUL character or half of a broken Unicode character); retype it.';

/**
 * True when the string can be stored as it is (no NUL, no lone UTF-16 surrogate).
 * Source: PostgreSQL text and JSON refuse NUL; a lone surrogate is not valid
 * Unicode (The Unicode Standard, surrogates chapter) — module comment.
 * Validity: any string.
 * @param value  the text
 * @returns whether PostgreSQL can store it
 */
export function isStorableText(value: string): boolean {
  return !UNSTORABLE.test(value);
}

/**
 * A string that PostgreSQL can store: z.string() plus the refusal above.
 * Source: this project's own bookkeeping (no external source).
 * Validity: any payload string field.
 * @param params  the options z.string takes (messages)
 * @returns the zod schema of the field
 */
export function text(params?: Parameters<typeof z.string>[0]) {
  return z.string(params).refine(isStorableText, { message: UNSTORABLE_TEXT_MESSAGE });
}

/**
 * Names that every JavaScript object already answers to. An identifier that
 * equals one of them would read the built-in instead of a missing entry
 * wherever ids index plain objects (`kg[id] ?? 0` gives a function), so ids
 * may not take these names.
 */
export const RESERVED_IDS: ReadonlySet<string> = new Set([
  '__proto__',
  'constructor',
  'prototype',
  'hasOwnProperty',
  'isPrototypeOf',
  'propertyIsEnumerable',
  'toString',
  'toLocaleString',
  'valueOf',
  '__defineGetter__',
  '__defineSetter__',
  '__lookupGetter__',
  '__lookupSetter__',
]);

/**
 * An identifier of a component, step or connection: 1–80 characters, not a built-in name.
 * Source: this project's own bookkeeping (no external source).
 * Validity: any identifier field of the route document.
 * @returns the zod schema of the identifier
 */
export function identifier() {
  return text()
    .min(1, { message: 'Give an identifier.' })
    .max(80, { message: 'An identifier has at most 80 characters.' })
    .refine((value) => !RESERVED_IDS.has(value), {
      message: 'This identifier is a reserved word; choose another (for example add a prefix).',
    });
}

/**
 * An object without a prototype, for data indexed by identifiers.
 * Source: this project's own bookkeeping (no external source).
 * Validity: any identifier as key (no built-in name is inherited).
 * @returns an empty record without a prototype
 */
export function idRecord<T>(): Record<string, T> {
  return Object.create(null) as Record<string, T>;
}
