import { queryOptions, useQuery } from '@tanstack/react-query';
import { invitationInfoSchema } from '@shared/schemas/members';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

export const getInvitation = (token: string, signal?: AbortSignal) =>
  apiRequest(api.invitation(token), {
    schema: invitationInfoSchema,
    signal,
    ignoreUnauthorized: true,
  });

export const getInvitationQueryOptions = (token: string) =>
  queryOptions({
    queryKey: queryKeys.invitations.one(token),
    queryFn: ({ signal }) => getInvitation(token, signal),
    retry: false,
  });

export const useInvitation = (token: string) => useQuery(getInvitationQueryOptions(token));
