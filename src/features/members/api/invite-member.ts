import { useMutation, useQueryClient } from '@tanstack/react-query';
import { invitationSchema, type InviteInput } from '@shared/schemas/members';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

export const inviteMember = (workspaceId: string, input: InviteInput) =>
  apiRequest(api.invitations(workspaceId), {
    method: 'POST',
    body: input,
    schema: invitationSchema,
  });

export const useInviteMember = (workspaceId: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: InviteInput) => inviteMember(workspaceId, input),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: queryKeys.members.list(workspaceId) }),
  });
};
