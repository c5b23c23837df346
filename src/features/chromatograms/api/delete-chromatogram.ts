import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/api/client';
import { chromatogramKeys } from './keys';
import { chromatogramsApi } from './urls';

export const deleteChromatogram = (workspaceId: string, routeId: string, id: string) =>
  apiRequest(chromatogramsApi.one(workspaceId, routeId, id), { method: 'DELETE' });

export const useDeleteChromatogram = (workspaceId: string, routeId: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => deleteChromatogram(workspaceId, routeId, id),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: chromatogramKeys.all(workspaceId, routeId) }),
  });
};
