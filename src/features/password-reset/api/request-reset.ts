import { useMutation } from '@tanstack/react-query';
import type { RequestResetInput } from '@shared/schemas/password-reset';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';

export const requestReset = (input: RequestResetInput) =>
  apiRequest(api.passwordResets, { method: 'POST', body: input, ignoreUnauthorized: true });

export const useRequestReset = () => useMutation({ mutationFn: requestReset });
