import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '@/api/client';
import { projectListSchema } from './schemas';
import { routesApi } from './urls';

export const getProjectsQueryOptions = (workspaceId: string) =>
  queryOptions({
    queryKey: ['workspaces', workspaceId, 'projects'],
    queryFn: ({ signal }) =>
      apiRequest(routesApi.projects(workspaceId), { schema: projectListSchema, signal }),
  });

export const useProjects = (workspaceId: string) => useQuery(getProjectsQueryOptions(workspaceId));
