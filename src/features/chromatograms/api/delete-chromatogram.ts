import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/api/client';
import { queryKeys } from '@/api/query-keys';
import { api } from '@/paths';

export const deleteChromatogram = (workspaceId: string, routeId: string, id: string) =>
  apiRequest(api.chromatograms.one(workspaceId, routeId, id), { method: 'DELETE' });

export const useDeleteChromatogram = (workspaceId: string, routeId: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => deleteChromatogram(workspaceId, routeId, id),
    onSuccess: () =>
      queryClient.invalidateQueries({
        queryKey: queryKeys.chromatograms.all(workspaceId, routeId),
      }),
  });
};
