import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

export const deleteCompound = (workspaceId: string, compoundId: string) =>
  apiRequest(api.compound(workspaceId, compoundId), { method: 'DELETE' });

export const useDeleteCompound = (workspaceId: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (compoundId: string) => deleteCompound(workspaceId, compoundId),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: queryKeys.compounds.list(workspaceId) }),
  });
};
