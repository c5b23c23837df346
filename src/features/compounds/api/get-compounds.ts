import { queryOptions, useQuery } from '@tanstack/react-query';
import { compoundListSchema } from '@shared/schemas/compounds';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';

export const getCompounds = (workspaceId: string, signal?: AbortSignal) =>
  apiRequest(api.compounds(workspaceId), { schema: compoundListSchema, signal });

export const getCompoundsQueryOptions = (workspaceId: string) =>
  queryOptions({
    queryKey: ['workspaces', workspaceId, 'compounds'],
    queryFn: ({ signal }) => getCompounds(workspaceId, signal),
  });

export const useCompounds = (workspaceId: string) =>
  useQuery(getCompoundsQueryOptions(workspaceId));
