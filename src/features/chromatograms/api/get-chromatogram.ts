import { queryOptions, useQueries, useQuery } from '@tanstack/react-query';
import { chromatogramDetailSchema } from '@shared/schemas/chromatograms';
import { apiRequest } from '@/api/client';
import { queryKeys } from '@/api/query-keys';
import { api } from '@/paths';

/** One sample; `full` asks for every point of the trace (the plot thins it per pixel itself). */
export const getChromatogramQueryOptions = (
  workspaceId: string,
  routeId: string,
  id: string,
  full: boolean,
) =>
  queryOptions({
    queryKey: queryKeys.chromatograms.one(workspaceId, routeId, id, full),
    queryFn: ({ signal }) =>
      apiRequest(api.chromatograms.one(workspaceId, routeId, id, full), {
        schema: chromatogramDetailSchema,
        signal,
      }),
    staleTime: 60_000,
  });

export const useChromatogram = (workspaceId: string, routeId: string, id: string, full = false) =>
  useQuery(getChromatogramQueryOptions(workspaceId, routeId, id, full));

/** Several samples at once (overlays), decimated. */
export const useChromatograms = (workspaceId: string, routeId: string, ids: string[]) =>
  useQueries({
    queries: ids.map((id) => getChromatogramQueryOptions(workspaceId, routeId, id, false)),
  });
