import { useMutation, useQueryClient } from '@tanstack/react-query';
import { chromatogramDetailSchema, type ChromatogramUpdate } from '@shared/schemas/chromatograms';
import { apiRequest } from '@/api/client';
import { chromatogramKeys } from './keys';
import { chromatogramsApi } from './urls';

export const updateChromatogram = (
  workspaceId: string,
  routeId: string,
  id: string,
  change: ChromatogramUpdate,
) =>
  apiRequest(chromatogramsApi.one(workspaceId, routeId, id), {
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
        chromatogramKeys.one(workspaceId, routeId, detail.id, false),
        detail,
      );
      return queryClient.invalidateQueries({
        queryKey: chromatogramKeys.all(workspaceId, routeId),
      });
    },
  });
};
