import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '@/api/client';
import { routeDetailSchema } from './schemas';
import { routesApi } from './urls';

export const getRoute = (workspaceId: string, routeId: string, signal?: AbortSignal) =>
  apiRequest(routesApi.one(workspaceId, routeId), { schema: routeDetailSchema, signal });

export const getRouteQueryOptions = (workspaceId: string, routeId: string) =>
  queryOptions({
    queryKey: ['workspaces', workspaceId, 'routes', 'detail', routeId],
    queryFn: ({ signal }) => getRoute(workspaceId, routeId, signal),
    // The editor owns the draft once open; refetching would fight the chemist's edits.
    staleTime: Infinity,
    refetchOnWindowFocus: false,
  });

export const useRoute = (workspaceId: string, routeId: string) =>
  useQuery(getRouteQueryOptions(workspaceId, routeId));
