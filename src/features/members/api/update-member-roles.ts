import { useMutation, useQueryClient } from '@tanstack/react-query';
import { memberSchema, type UpdateRolesInput } from '@shared/schemas/members';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

export const updateMemberRoles = (workspaceId: string, userId: string, input: UpdateRolesInput) =>
  apiRequest(api.member(workspaceId, userId), {
    method: 'PATCH',
    body: input,
    schema: memberSchema,
  });

export const useUpdateMemberRoles = (workspaceId: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, roles }: { userId: string } & UpdateRolesInput) =>
      updateMemberRoles(workspaceId, userId, { roles }),
    onSuccess: async () => {
      await queryClient.invalidateQueries({
        queryKey: queryKeys.members.list(workspaceId),
      });
      // The admin may have changed their own roles.
      await queryClient.invalidateQueries({ queryKey: queryKeys.session() });
    },
  });
};
