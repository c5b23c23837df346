import { useMutation, useQueryClient } from '@tanstack/react-query';
import { equipmentSchema, type EquipmentUpdateInput } from '@shared/schemas/equipment';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

export const updateEquipment = (workspaceId: string, id: string, input: EquipmentUpdateInput) =>
  apiRequest(api.equipmentItem(workspaceId, id), {
    method: 'PATCH',
    body: input,
    schema: equipmentSchema,
  });

export const useUpdateEquipment = (workspaceId: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, input }: { id: string; input: EquipmentUpdateInput }) =>
      updateEquipment(workspaceId, id, input),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: queryKeys.equipment.list(workspaceId) }),
  });
};
