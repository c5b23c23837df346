import { queryOptions, useQuery } from '@tanstack/react-query';
import { compoundListSchema } from '@shared/schemas/compounds';
import { apiRequest } from '@/api/client';
import { fetchAllPages, listUrl, usePagedList } from '@/api/lists';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

export const getCompoundPage = (
  workspaceId: string,
  query: { q?: string; limit?: string; cursor?: string },
  signal?: AbortSignal,
) => apiRequest(listUrl(api.compounds(workspaceId), query), { schema: compoundListSchema, signal });

/** The compounds page: by name, searched (name or formula) and paged by the server. */
export const useCompoundPages = (workspaceId: string, q: string) =>
  usePagedList(queryKeys.compounds.pages(workspaceId, q), (cursor, signal) =>
    getCompoundPage(workspaceId, { q, cursor }, signal),
  );

/** Every compound of the workspace, for the steps that name one (all pages). */
export const getCompoundsQueryOptions = (workspaceId: string) =>
  queryOptions({
    queryKey: queryKeys.compounds.all(workspaceId),
    queryFn: ({ signal }) => fetchAllPages((query) => getCompoundPage(workspaceId, query, signal)),
  });

export const useCompounds = (workspaceId: string) =>
  useQuery(getCompoundsQueryOptions(workspaceId));
