import { keepPreviousData, useInfiniteQuery } from '@tanstack/react-query';
import type { RouteSort } from '@shared/schemas/routes';
import { apiRequest } from '@/api/client';
import { routeListSchema } from './schemas';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

export interface RouteListFilter {
  archived: boolean;
  /** Part of a route's or its project's name; searched by the server. */
  q: string;
  sort: RouteSort;
}

export const getRoutes = (
  workspaceId: string,
  filter: RouteListFilter & { cursor?: string },
  signal?: AbortSignal,
) => apiRequest(api.routes(workspaceId, filter), { schema: routeListSchema, signal });

/**
 * The workspace's routes a page at a time, sorted and searched by the server
 * ("Show more routes" asks for the next page); nothing is cut off.
 */
export const useRoutes = (workspaceId: string, filter: RouteListFilter) =>
  useInfiniteQuery({
    queryKey: queryKeys.routes.list(workspaceId, filter),
    queryFn: ({ pageParam, signal }) =>
      getRoutes(workspaceId, { ...filter, ...(pageParam ? { cursor: pageParam } : {}) }, signal),
    initialPageParam: '',
    getNextPageParam: (last) => last.nextCursor ?? undefined,
    // A new search or order keeps the rows shown until its first page arrives.
    placeholderData: keepPreviousData,
  });
