import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';
import { allQueriesExcept, queryKeys } from '@/api/query-keys';
import { markSignedOut } from '../session-end';

export const signOut = () =>
  apiRequest(api.session, { method: 'DELETE', ignoreUnauthorized: true });

export const useSignOut = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSettled: () => {
      markSignedOut();
      queryClient.removeQueries({ predicate: allQueriesExcept(queryKeys.session()) });
      queryClient.setQueryData(queryKeys.session(), null);
    },
  });
};
