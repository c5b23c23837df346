import { z, type ZodType } from 'zod';
import { text } from './text';

/** Paging of every list: `limit` (default 50, at most 200) and the `cursor` of the previous reply. */
export const LIST_LIMIT_DEFAULT = 50;
export const LIST_LIMIT_MAX = 200;

export const listPagingSchema = z.object({
  limit: z.coerce
    .number()
    .int({ message: 'Use a whole number.' })
    .min(1, { message: 'Use at least 1.' })
    .max(LIST_LIMIT_MAX, { message: `Use at most ${LIST_LIMIT_MAX}.` })
    .default(LIST_LIMIT_DEFAULT),
  cursor: text().max(2000).optional(),
});

/** The one list reply: a page of items and the cursor of the next page (null on the last). */
export const listReplySchema = <T extends ZodType>(item: T) =>
  z.object({ items: z.array(item), nextCursor: text().nullable() });

/**
 * The query of a list: paging, `q` (part of the names the list says it searches)
 * and `sort`, one of the orders the list offers (the first is the default).
 */
export const listQuerySchema = <const S extends readonly [string, ...string[]]>(
  sorts: S,
  sortMessage: string,
) =>
  listPagingSchema.extend({
    q: text().trim().max(200).optional(),
    sort: z.enum(sorts, { message: sortMessage }).default(sorts[0] as never),
  });
