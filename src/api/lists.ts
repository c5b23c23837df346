import { keepPreviousData, useInfiniteQuery, type QueryKey } from '@tanstack/react-query';
import { LIST_LIMIT_MAX } from '@shared/schemas/lists';

/** Every list reply of the API: a page of items and the cursor of the next page (null on the last). */
export interface ListPage<T> {
  items: T[];
  nextCursor: string | null;
}

/** A list address with its query: empty values are left out. */
export function listUrl(path: string, query: Record<string, string | undefined>): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) if (value) params.set(key, value);
  const text = params.toString();
  return text ? `${path}?${text}` : path;
}

/**
 * A list the server pages, sorts and searches: the first page, then the next
 * one on request ("Show more"); `items` is every page read so far.
 */
export function usePagedList<T>(
  queryKey: QueryKey,
  fetchPage: (cursor: string | undefined, signal: AbortSignal) => Promise<ListPage<T>>,
) {
  const query = useInfiniteQuery({
    queryKey,
    queryFn: ({ pageParam, signal }) => fetchPage(pageParam || undefined, signal),
    initialPageParam: '',
    getNextPageParam: (last: ListPage<T>) => last.nextCursor ?? undefined,
    // A new search keeps the rows shown until its first page arrives.
    placeholderData: keepPreviousData,
  });
  return { ...query, items: query.data?.pages.flatMap((page) => page.items) ?? [] };
}

/**
 * Every item of a list, page after page of the largest size, for a choice that
 * must offer all of them (the compounds a step can name, the reviewers of a
 * revision, the vessels of a step list). Nothing is cut off.
 */
export async function fetchAllPages<T>(
  fetchPage: (query: { limit: string; cursor?: string }) => Promise<ListPage<T>>,
): Promise<T[]> {
  const items: T[] = [];
  let cursor: string | undefined;
  do {
    const page = await fetchPage({ limit: String(LIST_LIMIT_MAX), cursor });
    items.push(...page.items);
    cursor = page.nextCursor ?? undefined;
  } while (cursor);
  return items;
}
