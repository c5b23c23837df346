import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

export const removeMember = (workspaceId: string, userId: string) =>
  apiRequest(api.member(workspaceId, userId), { method: 'DELETE' });

export const useRemoveMember = (workspaceId: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (userId: string) => removeMember(workspaceId, userId),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: queryKeys.members.list(workspaceId) }),
  });
};
