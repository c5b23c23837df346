import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/api/client';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';
import { optimiseJobSchema, type OptimiseJob } from '@shared/schemas/jobs';
import { optimiseStartedSchema, type OptimiseRequestInput } from '@shared/schemas/optimise';

/** Start an optimisation of the route: 202 with the job to poll. */
export const startOptimise = (input: OptimiseRequestInput) =>
  apiRequest(api.optimise, { method: 'POST', body: input, schema: optimiseStartedSchema });

export const useStartOptimise = () => useMutation({ mutationFn: startOptimise });

const POLL_MS = 700;
const FINISHED: ReadonlyArray<OptimiseJob['status']> = ['done', 'failed', 'cancelled'];

/** The optimisation job, parsed with the optimise job schema and polled until it has finished. */
export function useOptimiseJob(jobId: string | null) {
  return useQuery({
    queryKey: queryKeys.jobs.one(jobId),
    queryFn: ({ signal }) => apiRequest(api.job(jobId!), { schema: optimiseJobSchema, signal }),
    enabled: jobId !== null,
    refetchInterval: (query) => {
      const status = (query.state.data as OptimiseJob | undefined)?.status;
      return status && FINISHED.includes(status) ? false : POLL_MS;
    },
    refetchIntervalInBackground: true,
    staleTime: 0,
  });
}

/** Cancel the run (DELETE /jobs/{jobId}); the reply is the job, now cancelled. */
export function useCancelOptimise() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (jobId: string) =>
      apiRequest(api.job(jobId), { method: 'DELETE', schema: optimiseJobSchema }),
    onSuccess: (job) => queryClient.setQueryData(queryKeys.jobs.one(job.id), job),
  });
}
