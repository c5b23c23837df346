import { useMutation, useQueryClient } from '@tanstack/react-query';
import { createdTokenSchema, type CreateTokenInput } from '@shared/schemas/tokens';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

export const createToken = (input: CreateTokenInput) =>
  apiRequest(api.tokens, { method: 'POST', body: input, schema: createdTokenSchema });

export const useCreateToken = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createToken,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.tokens() }),
  });
};
