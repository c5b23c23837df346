import { useQuery } from '@tanstack/react-query';
import { chromatogramListSchema, type ChromatogramSummary } from '@shared/schemas/chromatograms';
import { apiRequest } from '@/api/client';
import { queryKeys } from '@/api/query-keys';
import { api } from '@/paths';

/** Pages read at most for the calibration's choice of samples (200 each). */
const MAX_PAGES = 10;

/** Every sample of the route (all steps), for choosing the levels before and after a wash. */
export const useRouteChromatograms = (workspaceId: string, routeId: string) =>
  useQuery({
    queryKey: queryKeys.chromatograms.route(workspaceId, routeId),
    queryFn: async ({ signal }) => {
      const items: ChromatogramSummary[] = [];
      let cursor: string | undefined;
      for (let page = 0; page < MAX_PAGES; page++) {
        const reply = await apiRequest(api.chromatograms.list(workspaceId, routeId, { cursor }), {
          schema: chromatogramListSchema,
          signal,
        });
        items.push(...reply.items);
        if (!reply.nextCursor) break;
        cursor = reply.nextCursor;
      }
      return items;
    },
    refetchOnMount: 'always',
  });
