import { queryOptions, useQuery } from '@tanstack/react-query';
import { equipmentListSchema } from '@shared/schemas/equipment';
import { LIST_LIMIT_MAX } from '@shared/schemas/lists';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

/** The workspace's equipment, one page of the largest size (vessels first, by name). */
export const getEquipment = (workspaceId: string, signal?: AbortSignal) =>
  apiRequest(`${api.equipment(workspaceId)}?limit=${LIST_LIMIT_MAX}`, {
    schema: equipmentListSchema,
    signal,
  });

export const getEquipmentQueryOptions = (workspaceId: string) =>
  queryOptions({
    queryKey: queryKeys.equipment.list(workspaceId),
    queryFn: ({ signal }) => getEquipment(workspaceId, signal),
  });

export const useEquipment = (workspaceId: string) =>
  useQuery(getEquipmentQueryOptions(workspaceId));
