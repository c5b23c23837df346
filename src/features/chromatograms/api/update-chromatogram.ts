import { useMutation, useQueryClient } from '@tanstack/react-query';
import { chromatogramDetailSchema, type ChromatogramUpdate } from '@shared/schemas/chromatograms';
import { apiRequest } from '@/api/client';
import { allQueriesExcept, queryKeys } from '@/api/query-keys';
import { api } from '@/paths';

export const updateChromatogram = (
  workspaceId: string,
  routeId: string,
  id: string,
  change: ChromatogramUpdate,
) =>
  apiRequest(api.chromatograms.one(workspaceId, routeId, id), {
    method: 'PATCH',
    body: change,
    schema: chromatogramDetailSchema,
  });

export const useUpdateChromatogram = (workspaceId: string, routeId: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, change }: { id: string; change: ChromatogramUpdate }) =>
      updateChromatogram(workspaceId, routeId, id, change),
    onSuccess: (detail) => {
      queryClient.setQueryData(
        queryKeys.chromatograms.one(workspaceId, routeId, detail.id, false),
        detail,
      );
      // The trace itself does not change: keep the full one already here.
      queryClient.setQueryData(
        queryKeys.chromatograms.one(workspaceId, routeId, detail.id, true),
        (old: typeof detail | undefined) =>
          old ? { ...detail, trace: old.trace, decimated: old.decimated } : undefined,
      );
      // Lists refresh in the background; the edit is done once the server has answered.
      void queryClient.invalidateQueries({
        queryKey: queryKeys.chromatograms.all(workspaceId, routeId),
        predicate: allQueriesExcept(queryKeys.chromatograms.ones(workspaceId, routeId)),
      });
    },
  });
};
