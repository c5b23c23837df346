import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/api/client';
import { routeDetailSchema } from './schemas';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

export type UpdateRouteInput = {
  name?: string;
  projectName?: string | null;
  archived?: boolean;
  /** The route version the change is based on (409 version_conflict when stale). */
  baseVersion: number;
};

export const updateRoute = (workspaceId: string, routeId: string, input: UpdateRouteInput) =>
  apiRequest(api.route(workspaceId, routeId), {
    method: 'PATCH',
    body: input,
    schema: routeDetailSchema,
  });

export const useUpdateRoute = (workspaceId: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ routeId, input }: { routeId: string; input: UpdateRouteInput }) =>
      updateRoute(workspaceId, routeId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.routes.all(workspaceId) }),
  });
};
