import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Role } from '@shared/schemas/session';
import { memberListSchema } from '@shared/schemas/members';
import { apiRequest } from '@/api/client';
import { fetchAllPages, listUrl, usePagedList } from '@/api/lists';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

export const getMemberPage = (
  workspaceId: string,
  query: { q?: string; role?: Role; limit?: string; cursor?: string },
  signal?: AbortSignal,
) => apiRequest(listUrl(api.members(workspaceId), query), { schema: memberListSchema, signal });

/** The members page: by name, searched (name or e-mail) and paged by the server. */
export const useMemberPages = (workspaceId: string, q: string) =>
  usePagedList(queryKeys.members.pages(workspaceId, q), (cursor, signal) =>
    getMemberPage(workspaceId, { q, cursor }, signal),
  );

/** Every member holding `role` (all pages), for choosing among them, e.g. reviewers. */
export const getMembersWithRoleQueryOptions = (workspaceId: string, role: Role) =>
  queryOptions({
    queryKey: queryKeys.members.withRole(workspaceId, role),
    queryFn: ({ signal }) =>
      fetchAllPages((query) => getMemberPage(workspaceId, { ...query, role }, signal)),
  });

export const useMembersWithRole = (workspaceId: string, role: Role) =>
  useQuery(getMembersWithRoleQueryOptions(workspaceId, role));
