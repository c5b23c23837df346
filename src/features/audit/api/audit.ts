import { keepPreviousData, useInfiniteQuery, useMutation } from '@tanstack/react-query';
import { auditListSchema, auditVerifySchema, type AuditFilter } from '@shared/schemas/audit';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

const query = (filter: AuditFilter, extra: Record<string, string> = {}) => {
  const params = new URLSearchParams(extra);
  for (const [key, value] of Object.entries(filter)) if (value) params.set(key, String(value));
  const text = params.toString();
  return text ? `?${text}` : '';
};

/**
 * The filtered trail, newest first, a page at a time ("Show more"). While a new search or
 * filter loads, the rows of the last one stay on screen (isPlaceholderData).
 */
export const useAuditTrail = (workspaceId: string, filter: AuditFilter) =>
  useInfiniteQuery({
    queryKey: queryKeys.audit.list(workspaceId, filter),
    queryFn: ({ pageParam, signal }) =>
      apiRequest(
        `${api.audit(workspaceId)}${query(filter, { limit: '100', ...(pageParam ? { cursor: pageParam } : {}) })}`,
        { schema: auditListSchema, signal },
      ),
    initialPageParam: '',
    getNextPageParam: (last) => last.nextCursor ?? undefined,
    placeholderData: keepPreviousData,
  });

export const useVerifyAudit = (workspaceId: string) =>
  useMutation({
    mutationFn: () => apiRequest(api.auditVerify(workspaceId), { schema: auditVerifySchema }),
  });

export const auditCsvUrl = (workspaceId: string, filter: AuditFilter) =>
  `${api.auditCsv(workspaceId)}${query(filter)}`;
