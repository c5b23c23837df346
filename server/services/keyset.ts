/**
 * Keyset paging shared by every list: a page starts after the last row's sort
 * key (the sorted columns, then the id), so rows never repeat or go missing
 * between pages whatever is added meanwhile, and each page is an index range
 * scan however deep the reader pages. The cursor is opaque to callers: the
 * sort it belongs to and the key of the last row, as text.
 */
import { literal, QueryTypes, type Transaction, type WhereOptions } from 'sequelize';
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

/** `(expr1 ILIKE '%q%' OR expr2 ILIKE ...)`: a filter on whatever scan the planner picks. */
export function containsAny(expressions: string[], q: string): WhereOptions {
  const pattern = database().escape(containsPattern(q));
  return literal(
    `(${expressions.map((e) => `${e} ILIKE ${pattern}`).join(' OR ')})`,
  ) as unknown as WhereOptions;
}

/**
 * Whether a trigram index can find `q`: pg_trgm takes its trigrams from runs of
 * three letters or digits in the search text; a shorter text would read the whole index.
 */
export const trigramSearchable = (q: string) => /[\p{L}\p{N}]{3}/u.test(q);

/** The table a list searches: its rows' ids and the expressions a trigram index covers. */
export interface SearchTarget {
  /** The list's rows as Sequelize names them in SQL, e.g. "ReviewComment". */
  model: string;
  table: string;
  /** Expressions over a table alias, each as its trigram index has it. */
  expressions: Array<(alias: string) => string>;
  /** An extra condition of the matching rows (the list's own scope), over the same alias. */
  scope?: (alias: string) => string;
}

/** A search that matches at most this many rows starts from its matches; more, from the order. */
export const MATCH_FIRST_MAX = 500;

/**
 * The ids `matchesSql` (a `SELECT <id> …` of the matching rows, run on the trigram index)
 * finds, or null when there are more than MATCH_FIRST_MAX of them.
 */
export async function probeMatches(
  matchesSql: string,
  transaction: Transaction | null,
): Promise<string[] | null> {
  const rows = await database().query<{ id: string }>(
    `SELECT m.id FROM (${matchesSql}) m LIMIT ${MATCH_FIRST_MAX + 1}`,
    { type: QueryTypes.SELECT, transaction },
  );
  return rows.length > MATCH_FIRST_MAX ? null : rows.map((row) => row.id);
}

/** The SQL condition: the rows with these ids (none for an empty list). */
export const idsInSql = (idSql: string, ids: string[]): string =>
  ids.length ? `${idSql} IN (${ids.map((id) => database().escape(id)).join(', ')})` : 'false';

/** The rows with these ids (none for an empty list), as a Sequelize condition. */
export const withIds = (idSql: string, ids: string[]): WhereOptions =>
  literal(idsInSql(idSql, ids)) as unknown as WhereOptions;

/**
 * The rows of the list whose expressions contain `q`. "Contains" cannot be sized by the
 * planner: given `ORDER BY … LIMIT 51` with the ILIKE as a filter, it walks the list's order
 * index hoping to meet 51 matches soon, and a selective term makes it read the whole list
 * (70–160 ms for 110 of 50,000 comments). So a term with three letters or digits in a row is
 * first looked up on its trigram GIN index, at most MATCH_FIRST_MAX + 1 ids: when there are
 * no more than MATCH_FIRST_MAX, the list reads just those rows by primary key and sorts them
 * for the page (keyset condition as usual); when there are more, matches are dense and the
 * order walk meets a page of them soon, so the term stays a filter on that walk. A shorter
 * term cannot use a trigram index and is always a filter. The look-up is one more short
 * statement, only for such searches.
 */
export async function matchingRows(
  target: SearchTarget,
  q: string,
  transaction: Transaction | null = null,
): Promise<WhereOptions> {
  const outer = `"${target.model}"`;
  const filter = containsAny(
    target.expressions.map((e) => e(outer)),
    q,
  );
  if (!trigramSearchable(q)) return filter;
  const pattern = database().escape(containsPattern(q));
  const match = target.expressions.map((e) => `${e('s')} ILIKE ${pattern}`).join(' OR ');
  const scope = target.scope ? ` AND ${target.scope('s')}` : '';
  const ids = await probeMatches(
    `SELECT s.id FROM ${target.table} s WHERE (${match})${scope}`,
    transaction,
  );
  return ids === null ? filter : withIds(`${outer}."id"`, ids);
}
