import { useMutation, useQuery } from '@tanstack/react-query';
import { apiRequest } from '@/api/client';
import { jobAcceptedSchema, jobSchema, type Job } from '@/features/routes';
import { api } from '@/paths';
import { queryKeys } from '@/api/query-keys';
import type { EditorDoc } from '../document';

/** Start a seeded Monte Carlo run of the document over its ± ranges: 202 with the job to poll. */
export function startMonteCarlo(input: { doc: EditorDoc; draws: number; seed: number }) {
  const document = { ...input.doc, steps: input.doc.steps.map(({ position: _p, ...s }) => s) };
  return apiRequest(api.monteCarlo, {
    method: 'POST',
    body: { document, draws: input.draws, seed: input.seed },
    schema: jobAcceptedSchema,
  });
}

export const useStartMonteCarlo = () => useMutation({ mutationFn: startMonteCarlo });

const POLL_MS = 500;

/** The job, polled while it is queued or running; polling stops when it is done or failed. */
export function useJob(jobId: string | null) {
  return useQuery({
    queryKey: queryKeys.jobs.one(jobId),
    queryFn: ({ signal }) => apiRequest(api.job(jobId!), { schema: jobSchema, signal }),
    enabled: jobId !== null,
    refetchInterval: (query) => {
      const status = (query.state.data as Job | undefined)?.status;
      return status === 'done' || status === 'failed' ? false : POLL_MS;
    },
    refetchIntervalInBackground: true,
    staleTime: 0,
  });
}
