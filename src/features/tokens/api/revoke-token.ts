import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

export const revokeToken = (id: string) => apiRequest(api.token(id), { method: 'DELETE' });

export const useRevokeToken = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeToken,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.tokens() }),
  });
};
