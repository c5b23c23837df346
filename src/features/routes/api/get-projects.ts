import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '@/api/client';
import { fetchAllPages, listUrl } from '@/api/lists';
import { projectListSchema } from './schemas';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

/** Every project of the workspace by name (all pages), with its route count. */
export const getProjectsQueryOptions = (workspaceId: string) =>
  queryOptions({
    queryKey: queryKeys.projects.list(workspaceId),
    queryFn: ({ signal }) =>
      fetchAllPages((query) =>
        apiRequest(listUrl(api.projects(workspaceId), query), {
          schema: projectListSchema,
          signal,
        }),
      ),
  });

export const useProjects = (workspaceId: string) => useQuery(getProjectsQueryOptions(workspaceId));
