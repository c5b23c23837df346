import { useMutation, useQueryClient } from '@tanstack/react-query';
import { compoundSchema, type CompoundUpdateInput } from '@shared/schemas/compounds';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

export const updateCompound = (
  workspaceId: string,
  compoundId: string,
  input: CompoundUpdateInput,
) =>
  apiRequest(api.compound(workspaceId, compoundId), {
    method: 'PATCH',
    body: input,
    schema: compoundSchema,
  });

export const useUpdateCompound = (workspaceId: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ compoundId, input }: { compoundId: string; input: CompoundUpdateInput }) =>
      updateCompound(workspaceId, compoundId, input),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: queryKeys.compounds.list(workspaceId) }),
  });
};
