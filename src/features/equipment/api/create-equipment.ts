import { useMutation, useQueryClient } from '@tanstack/react-query';
import { equipmentSchema, type EquipmentCreateInput } from '@shared/schemas/equipment';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

export const createEquipment = (workspaceId: string, input: EquipmentCreateInput) =>
  apiRequest(api.equipment(workspaceId), { method: 'POST', body: input, schema: equipmentSchema });

export const useCreateEquipment = (workspaceId: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: EquipmentCreateInput) => createEquipment(workspaceId, input),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: queryKeys.equipment.list(workspaceId) }),
  });
};
