/**
 * Keyset paging shared by every list: a page starts after the last row's sort
 * key (the sorted columns, then the id), so rows never repeat or go missing
 * between pages whatever is added meanwhile, and each page is an index range
 * scan however deep the reader pages. The cursor is opaque to callers: the
 * sort it belongs to and the key of the last row, as text.
 */
import { literal, type WhereOptions } from 'sequelize';
import { database } from '../db/sequelize';
import { badRequest } from '../errors';

type Literal = ReturnType<typeof literal>;

/** A sorted column: an SQL expression and the type its text form is cast back to. */
export interface KeyColumn {
  sql: string;
  type: 'text' | 'uuid' | 'timestamptz' | 'float8' | 'int';
}

/** One order of a list: its columns (the last one unique, usually the id) and a direction. */
export interface KeysetOrder {
  name: string;
  columns: KeyColumn[];
  direction: 'ASC' | 'DESC';
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const TIMESTAMP = /^\d{4}-\d{2}-\d{2}[ T]\d{2}:\d{2}:\d{2}(\.\d{1,6})?(Z|[+-]\d{2}(:?\d{2})?)?$/;
const validValue: Record<KeyColumn['type'], (value: string) => boolean> = {
  text: (value) => value.length <= 1000,
  uuid: (value) => UUID.test(value),
  timestamptz: (value) => TIMESTAMP.test(value),
  float8: (value) => value.trim() !== '' && Number.isFinite(Number(value)),
  int: (value) => /^-?\d{1,9}$/.test(value),
};

const invalidCursor = () =>
  badRequest('The page link is not valid; start from the first page.', [
    { path: 'query.cursor', message: 'Not a cursor from a previous page.' },
  ]);

/**
 * The two orders of a table's rows by creation, "oldest" and "newest", with the id breaking ties
 * (the shape most lists here share; each is served by a (…, created_at, id) index).
 * @param model  the model's name as Sequelize quotes it in SQL, e.g. "Chromatogram"
 */
export function byCreation(model: string): Record<'oldest' | 'newest', KeysetOrder> {
  const columns: KeyColumn[] = [
    { sql: `"${model}"."created_at"`, type: 'timestamptz' },
    { sql: `"${model}"."id"`, type: 'uuid' },
  ];
  return {
    oldest: { name: 'oldest', columns, direction: 'ASC' },
    newest: { name: 'newest', columns, direction: 'DESC' },
  };
}

export const encodeCursor = (order: KeysetOrder, key: string[]) =>
  Buffer.from(JSON.stringify([order.name, ...key]), 'utf8').toString('base64url');

/** The key of the last row of the previous page; 400 when the cursor is not one of ours or belongs to another order. */
export function decodeCursor(text: string, order: KeysetOrder): string[] {
  let parts: unknown;
  try {
    parts = JSON.parse(Buffer.from(text, 'base64url').toString('utf8'));
  } catch {
    throw invalidCursor();
  }
  if (!Array.isArray(parts) || parts.length !== order.columns.length + 1) throw invalidCursor();
  const [name, ...key] = parts as unknown[];
  if (typeof name !== 'string') throw invalidCursor();
  if (name !== order.name)
    throw badRequest(
      'The page link belongs to another order of the list; start from the first page.',
      [
        {
          path: 'query.cursor',
          message: `This cursor pages the list sorted by ${name}, not by ${order.name}.`,
        },
      ],
    );
  const valid = key.every(
    (value, i) => typeof value === 'string' && validValue[order.columns[i]!.type](value),
  );
  if (!valid) throw invalidCursor();
  return key as string[];
}

/** The rows after the cursor's key, in the order's direction (a row comparison an index serves). */
export function afterCursor(order: KeysetOrder, cursor: string): WhereOptions {
  const key = decodeCursor(cursor, order);
  const escape = (value: string) => database().escape(value);
  const left = order.columns.map((c) => c.sql).join(', ');
  const right = order.columns.map((c, i) => `${escape(key[i]!)}::${c.type}`).join(', ');
  return literal(
    `(${left}) ${order.direction === 'ASC' ? '>' : '<'} (${right})`,
  ) as unknown as WhereOptions;
}

/** Attributes to select beside the row: each sort column as text, named k0, k1, ... */
export const keyAttributes = (order: KeysetOrder): Array<[Literal, string]> =>
  order.columns.map((c, i) => [literal(`(${c.sql})::text`), `k${i}`]);

/** ORDER BY of the order. */
export const keyOrder = (order: KeysetOrder): Array<[Literal, string]> =>
  order.columns.map((c) => [literal(c.sql), order.direction]);

/**
 * The page and the next cursor from rows fetched with `limit + 1`: one row
 * beyond the page says there is a next one.
 */
export function pageOf<T extends { get(key: string): unknown }>(
  rows: T[],
  limit: number,
  order: KeysetOrder,
): { items: T[]; nextCursor: string | null } {
  const items = rows.slice(0, limit);
  const last = items.at(-1);
  return {
    items,
    nextCursor:
      rows.length > limit && last
        ? encodeCursor(
            order,
            order.columns.map((_, i) => String(last.get(`k${i}`))),
          )
        : null,
  };
}

/** ILIKE pattern for "contains", with the wildcards of the search text taken literally. */
export const containsPattern = (text: string) => `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

/** `(expr1 ILIKE '%q%' OR expr2 ILIKE ...)`, served by trigram indexes on each expression. */
export function containsAny(expressions: string[], q: string): WhereOptions {
  const pattern = database().escape(containsPattern(q));
  return literal(
    `(${expressions.map((e) => `${e} ILIKE ${pattern}`).join(' OR ')})`,
  ) as unknown as WhereOptions;
}
