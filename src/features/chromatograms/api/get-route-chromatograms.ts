import { useQuery } from '@tanstack/react-query';
import { chromatogramListSchema, type ChromatogramSummary } from '@shared/schemas/chromatograms';
import { apiRequest } from '@/api/client';
import { fetchAllPages } from '@/api/lists';
import { queryKeys } from '@/api/query-keys';
import { api } from '@/paths';

/** Every sample of the route (all steps), for choosing the levels before and after a wash. */
export const useRouteChromatograms = (workspaceId: string, routeId: string) =>
  useQuery({
    queryKey: queryKeys.chromatograms.route(workspaceId, routeId),
    queryFn: async ({ signal }) => {
      const items: ChromatogramSummary[] = await fetchAllPages(({ cursor }) =>
        apiRequest(api.chromatograms.list(workspaceId, routeId, { cursor }), {
          schema: chromatogramListSchema,
          signal,
        }),
      );
      return items;
    },
    refetchOnMount: 'always',
  });
