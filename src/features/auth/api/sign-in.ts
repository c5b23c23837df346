import { useMutation, useQueryClient } from '@tanstack/react-query';
import { sessionSchema, type SignInInput } from '@shared/schemas/session';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';
import { allQueriesExcept, queryKeys } from '@/api/query-keys';

export const signIn = (input: SignInInput) =>
  apiRequest(api.session, {
    method: 'POST',
    body: input,
    schema: sessionSchema,
    ignoreUnauthorized: true,
  });

export const useSignIn = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (session) => {
      // A new person may be signing in: drop whatever the last one loaded.
      queryClient.removeQueries({ predicate: allQueriesExcept(queryKeys.session()) });
      queryClient.setQueryData(queryKeys.session(), session);
    },
  });
};
