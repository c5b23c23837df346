import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

export const deleteEquipment = (workspaceId: string, id: string) =>
  apiRequest(api.equipmentItem(workspaceId, id), { method: 'DELETE' });

export const useDeleteEquipment = (workspaceId: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => deleteEquipment(workspaceId, id),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: queryKeys.equipment.list(workspaceId) }),
  });
};
