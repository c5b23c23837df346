import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AcceptInvitationInput } from '@shared/schemas/members';
import { sessionSchema } from '@shared/schemas/session';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';
import { allQueriesExcept, queryKeys } from '@/api/query-keys';
import { clearSessionEnd } from '@/features/auth';

/** Joins the workspace; the reply is the new session (the person is signed in). */
export const acceptInvitation = (token: string, input: AcceptInvitationInput) =>
  apiRequest(api.acceptInvitation(token), {
    method: 'POST',
    body: input,
    schema: sessionSchema,
    ignoreUnauthorized: true,
  });

export const useAcceptInvitation = (token: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: AcceptInvitationInput) => acceptInvitation(token, input),
    onSuccess: (session) => {
      // Forget what an earlier session loaded. The invitation itself stays: the
      // page still shows it while navigating, and refetching a used one answers 410.
      queryClient.removeQueries({
        predicate: allQueriesExcept(queryKeys.session(), queryKeys.invitations.all()),
      });
      clearSessionEnd();
      queryClient.setQueryData(queryKeys.session(), session);
    },
  });
};
