import { queryOptions, useQuery } from '@tanstack/react-query';
import { compoundListSchema } from '@shared/schemas/compounds';
import { apiRequest } from '@/api/client';
import { routesApi } from './urls';

/** The workspace's compounds, for the editor's component picker. */
export const getWorkspaceCompoundsQueryOptions = (workspaceId: string) =>
  queryOptions({
    queryKey: ['workspaces', workspaceId, 'compounds'],
    queryFn: ({ signal }) =>
      apiRequest(routesApi.compounds(workspaceId), { schema: compoundListSchema, signal }),
    retry: false,
  });

export const useWorkspaceCompounds = (workspaceId: string) =>
  useQuery(getWorkspaceCompoundsQueryOptions(workspaceId));
