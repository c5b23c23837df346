import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { invitationSchema, pendingInvitationListSchema } from '@shared/schemas/members';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

export const pendingInvitationsQuery = (workspaceId: string) =>
  queryOptions({
    queryKey: queryKeys.members.pendingInvitations(workspaceId),
    queryFn: () =>
      apiRequest(api.invitations(workspaceId), { schema: pendingInvitationListSchema }),
  });

export const usePendingInvitations = (workspaceId: string) =>
  useQuery(pendingInvitationsQuery(workspaceId));

export const resendInvitation = (workspaceId: string, invitationId: string) =>
  apiRequest(api.resendInvitation(workspaceId, invitationId), {
    method: 'POST',
    schema: invitationSchema,
  });

export const revokeInvitation = (workspaceId: string, invitationId: string) =>
  apiRequest(api.pendingInvitation(workspaceId, invitationId), { method: 'DELETE' });

export const useResendInvitation = (workspaceId: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (invitationId: string) => resendInvitation(workspaceId, invitationId),
    onSuccess: () =>
      queryClient.invalidateQueries({
        queryKey: queryKeys.members.pendingInvitations(workspaceId),
      }),
  });
};

export const useRevokeInvitation = (workspaceId: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (invitationId: string) => revokeInvitation(workspaceId, invitationId),
    onSuccess: () =>
      queryClient.invalidateQueries({
        queryKey: queryKeys.members.pendingInvitations(workspaceId),
      }),
  });
};
