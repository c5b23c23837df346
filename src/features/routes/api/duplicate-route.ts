import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/api/client';
import { routeDetailSchema } from './schemas';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

export const duplicateRoute = (workspaceId: string, routeId: string, name?: string) =>
  apiRequest(api.routeDuplicate(workspaceId, routeId), {
    method: 'POST',
    body: name ? { name } : {},
    schema: routeDetailSchema,
  });

export const useDuplicateRoute = (workspaceId: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ routeId, name }: { routeId: string; name?: string }) =>
      duplicateRoute(workspaceId, routeId, name),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.routes.all(workspaceId) }),
  });
};
