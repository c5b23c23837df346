import { useMutation, useQueryClient } from '@tanstack/react-query';
import { createRoute } from '@/features/routes';
import { queryKeys } from '@/api/query-keys';
import type { RouteDocument } from '@shared/schemas/route';

/** Save a substituted document as a new route (a copy); the original route is not touched. */
export const useTryInCopy = (workspaceId: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: { name: string; projectName?: string; document: RouteDocument }) =>
      createRoute(workspaceId, {
        name: input.name,
        projectName: input.projectName,
        document: input.document as unknown as Record<string, unknown>,
      }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.routes.all(workspaceId) }),
  });
};
