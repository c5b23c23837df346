import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '@/api/client';
import { projectListSchema } from './schemas';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

export const getProjectsQueryOptions = (workspaceId: string) =>
  queryOptions({
    queryKey: queryKeys.projects.list(workspaceId),
    queryFn: ({ signal }) =>
      apiRequest(api.projects(workspaceId), { schema: projectListSchema, signal }),
  });

export const useProjects = (workspaceId: string) => useQuery(getProjectsQueryOptions(workspaceId));
