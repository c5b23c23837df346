import { queryOptions, useQuery } from '@tanstack/react-query';
import { solventListSchema } from '@shared/schemas/solvents';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';

export const getSolvents = (signal?: AbortSignal) =>
  apiRequest(api.solvents, { schema: solventListSchema, signal });

/** The library changes only with a release: keep it for the session. */
export const getSolventsQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.solvents.list(),
    queryFn: ({ signal }) => getSolvents(signal),
    staleTime: Infinity,
  });

export const useSolvents = () => useQuery(getSolventsQueryOptions());
