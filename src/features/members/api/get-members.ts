import { queryOptions, useQuery } from '@tanstack/react-query';
import { memberListSchema } from '@shared/schemas/members';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

export const getMembers = (workspaceId: string, signal?: AbortSignal) =>
  apiRequest(api.members(workspaceId), { schema: memberListSchema, signal });

export const getMembersQueryOptions = (workspaceId: string) =>
  queryOptions({
    queryKey: queryKeys.members.list(workspaceId),
    queryFn: ({ signal }) => getMembers(workspaceId, signal),
  });

export const useMembers = (workspaceId: string) => useQuery(getMembersQueryOptions(workspaceId));
