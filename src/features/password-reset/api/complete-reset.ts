import { useMutation } from '@tanstack/react-query';
import type { CompleteResetInput } from '@shared/schemas/password-reset';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';

export const completeReset = (token: string, input: CompleteResetInput) =>
  apiRequest(api.passwordReset(token), { method: 'POST', body: input, ignoreUnauthorized: true });

export const useCompleteReset = (token: string) =>
  useMutation({ mutationFn: (input: CompleteResetInput) => completeReset(token, input) });
