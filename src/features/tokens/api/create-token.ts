import { useMutation, useQueryClient } from '@tanstack/react-query';
import { createdTokenSchema, type CreateTokenInput } from '@shared/schemas/tokens';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';
import { getTokensQueryOptions } from './get-tokens';

export const createToken = (input: CreateTokenInput) =>
  apiRequest(api.tokens, { method: 'POST', body: input, schema: createdTokenSchema });

export const useCreateToken = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createToken,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: getTokensQueryOptions().queryKey }),
  });
};
