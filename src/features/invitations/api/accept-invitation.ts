import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AcceptInvitationInput } from '@shared/schemas/members';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';
import { sessionQueryKey } from '@/features/auth/api/get-session';

export const acceptInvitation = (token: string, input: AcceptInvitationInput) =>
  apiRequest(api.acceptInvitation(token), { method: 'POST', body: input, ignoreUnauthorized: true });

export const useAcceptInvitation = (token: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: AcceptInvitationInput) => acceptInvitation(token, input),
    // Accepting may sign the person in or add a workspace to their session.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: sessionQueryKey }),
  });
};
