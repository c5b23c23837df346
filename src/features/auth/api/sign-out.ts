import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';
import { sessionQueryKey } from './get-session';
import { markSignedOut } from '../session-end';

export const signOut = () =>
  apiRequest(api.session, { method: 'DELETE', ignoreUnauthorized: true });

export const useSignOut = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSettled: () => {
      markSignedOut();
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== sessionQueryKey[0] });
      queryClient.setQueryData(sessionQueryKey, null);
    },
  });
};
