import { useInfiniteQuery } from '@tanstack/react-query';
import { chromatogramListSchema } from '@shared/schemas/chromatograms';
import { apiRequest } from '@/api/client';
import { queryKeys } from '@/api/query-keys';
import { api } from '@/paths';

/** The samples of one step, oldest first, a page at a time. */
export const useStepChromatograms = (workspaceId: string, routeId: string, stepId: string) =>
  useInfiniteQuery({
    queryKey: queryKeys.chromatograms.list(workspaceId, routeId, stepId),
    queryFn: ({ pageParam, signal }) =>
      apiRequest(
        api.chromatograms.list(workspaceId, routeId, {
          stepId,
          cursor: pageParam || undefined,
        }),
        { schema: chromatogramListSchema, signal },
      ),
    initialPageParam: '',
    getNextPageParam: (last) => last.nextCursor ?? undefined,
  });
