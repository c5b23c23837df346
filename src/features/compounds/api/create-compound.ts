import { useMutation, useQueryClient } from '@tanstack/react-query';
import { compoundSchema, type CompoundCreateInput } from '@shared/schemas/compounds';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

export const createCompound = (workspaceId: string, input: CompoundCreateInput) =>
  apiRequest(api.compounds(workspaceId), { method: 'POST', body: input, schema: compoundSchema });

export const useCreateCompound = (workspaceId: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CompoundCreateInput) => createCompound(workspaceId, input),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: queryKeys.compounds.list(workspaceId) }),
  });
};
