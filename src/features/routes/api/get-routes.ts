import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '@/api/client';
import { routeListSchema } from './schemas';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

export const getRoutes = (workspaceId: string, archived: boolean, signal?: AbortSignal) =>
  apiRequest(api.routes(workspaceId, { archived }), { schema: routeListSchema, signal });

export const getRoutesQueryOptions = (workspaceId: string, archived = false) =>
  queryOptions({
    queryKey: queryKeys.routes.list(workspaceId, { archived }),
    queryFn: ({ signal }) => getRoutes(workspaceId, archived, signal),
  });

export const useRoutes = (workspaceId: string, archived = false) =>
  useQuery(getRoutesQueryOptions(workspaceId, archived));
