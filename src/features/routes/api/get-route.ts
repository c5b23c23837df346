import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '@/api/client';
import { routeDetailSchema } from './schemas';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

export const getRoute = (workspaceId: string, routeId: string, signal?: AbortSignal) =>
  apiRequest(api.route(workspaceId, routeId), { schema: routeDetailSchema, signal });

export const getRouteQueryOptions = (workspaceId: string, routeId: string) =>
  queryOptions({
    queryKey: queryKeys.routes.detail(workspaceId, routeId),
    queryFn: ({ signal }) => getRoute(workspaceId, routeId, signal),
    // The editor owns the draft once open; refetching would fight the chemist's edits.
    staleTime: Infinity,
    refetchOnWindowFocus: false,
  });

export const useRoute = (workspaceId: string, routeId: string) =>
  useQuery(getRouteQueryOptions(workspaceId, routeId));
