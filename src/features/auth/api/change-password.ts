import { useMutation } from '@tanstack/react-query';
import type { ChangePasswordInput } from '@shared/schemas/session';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';

export const changePassword = (input: ChangePasswordInput) =>
  apiRequest(api.accountPassword, { method: 'POST', body: input });

export const useChangePassword = () => useMutation({ mutationFn: changePassword });
