import { queryOptions, useQuery } from '@tanstack/react-query';
import { equipmentListSchema } from '@shared/schemas/equipment';
import { apiRequest } from '@/api/client';
import { fetchAllPages, listUrl, usePagedList } from '@/api/lists';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

export const getEquipmentPage = (
  workspaceId: string,
  query: { q?: string; limit?: string; cursor?: string },
  signal?: AbortSignal,
) =>
  apiRequest(listUrl(api.equipment(workspaceId), query), { schema: equipmentListSchema, signal });

/** The equipment page: vessels first, by name, searched and paged by the server. */
export const useEquipmentPages = (workspaceId: string, q: string) =>
  usePagedList(queryKeys.equipment.pages(workspaceId, q), (cursor, signal) =>
    getEquipmentPage(workspaceId, { q, cursor }, signal),
  );

/** Every piece of equipment of the workspace (all pages), for choosing one per step. */
export const getEquipmentQueryOptions = (workspaceId: string) =>
  queryOptions({
    queryKey: queryKeys.equipment.all(workspaceId),
    queryFn: ({ signal }) => fetchAllPages((query) => getEquipmentPage(workspaceId, query, signal)),
  });

export const useEquipment = (workspaceId: string) =>
  useQuery(getEquipmentQueryOptions(workspaceId));
