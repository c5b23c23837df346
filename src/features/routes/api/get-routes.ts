import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '@/api/client';
import { routeListSchema } from './schemas';
import { routesApi } from './urls';

export const getRoutes = (workspaceId: string, archived: boolean, signal?: AbortSignal) =>
  apiRequest(routesApi.list(workspaceId, { archived }), { schema: routeListSchema, signal });

export const getRoutesQueryOptions = (workspaceId: string, archived = false) =>
  queryOptions({
    queryKey: ['workspaces', workspaceId, 'routes', { archived }],
    queryFn: ({ signal }) => getRoutes(workspaceId, archived, signal),
  });

export const useRoutes = (workspaceId: string, archived = false) =>
  useQuery(getRoutesQueryOptions(workspaceId, archived));
