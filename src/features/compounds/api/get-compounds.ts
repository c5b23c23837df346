import { queryOptions, useQuery } from '@tanstack/react-query';
import { compoundListSchema } from '@shared/schemas/compounds';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

export const getCompounds = (workspaceId: string, signal?: AbortSignal) =>
  apiRequest(api.compounds(workspaceId), { schema: compoundListSchema, signal });

export const getCompoundsQueryOptions = (workspaceId: string) =>
  queryOptions({
    queryKey: queryKeys.compounds.list(workspaceId),
    queryFn: ({ signal }) => getCompounds(workspaceId, signal),
  });

export const useCompounds = (workspaceId: string) =>
  useQuery(getCompoundsQueryOptions(workspaceId));
