import { Router } from 'express';
import { z } from 'zod';
import { apiErrorSchema } from '@shared/schemas/errors';
import { anyJobSchema, jobListQuerySchema, jobListSchema } from '@shared/schemas/jobs';
import { defineRoute } from '../http/route';
import { authorize } from '../policies';
import { listJobs, presentJobSummary } from '../services/job-list';
import { cancelJob, loadJob, presentJob } from '../services/monte-carlo-jobs';

export function jobsRouter(): Router {
  const router = Router();

  defineRoute(router, {
    method: 'get',
    path: '/jobs',
    summary:
      'One page of the background jobs you started (Monte Carlo runs, route optimisations), newest first (sort=oldest for oldest first), without their results; kind and status filter, q matches part of either; limit (default 50, at most 200) and the cursor of the previous page.',
    tags: ['evaluation'],
    auth: true,
    query: jobListQuerySchema,
    responses: {
      200: {
        description: 'One page of your jobs and the cursor of the next page (null on the last).',
        schema: jobListSchema,
      },
    },
    handle: async ({ actor, query, transaction }) => {
      authorize(actor, 'job.read', { userId: actor.userId });
      const page = await listJobs(actor.userId, query, transaction);
      return {
        status: 200,
        body: { items: page.items.map(presentJobSummary), nextCursor: page.nextCursor },
      };
    },
  });

  defineRoute(router, {
    method: 'get',
    path: '/jobs/{jobId}',
    summary: 'Status, progress (0..1) and, when done, the result of a background job you started.',
    tags: ['evaluation'],
    auth: true,
    params: z.object({ jobId: z.uuid() }),
    transaction: false,
    responses: {
      200: { description: 'The job.', schema: anyJobSchema },
      404: { description: 'No such job, or started by someone else.', schema: apiErrorSchema },
    },
    handle: async ({ actor, params }) => {
      const job = await loadJob(params.jobId);
      authorize(actor, 'job.read', { userId: job.userId as string });
      return { status: 200, body: presentJob(job) };
    },
  });

  defineRoute(router, {
    method: 'post',
    path: '/jobs/{jobId}/cancel',
    summary:
      'Cancel a background job you started that is still queued or running; the run stops after its current chunk at the latest.',
    tags: ['evaluation'],
    auth: true,
    params: z.object({ jobId: z.uuid() }),
    writes: false,
    responses: {
      200: { description: 'The job, now cancelled.', schema: anyJobSchema },
      404: { description: 'No such job, or started by someone else.', schema: apiErrorSchema },
      409: { description: 'job_finished: the job has already finished.', schema: apiErrorSchema },
    },
    handle: async ({ actor, params, transaction }) => {
      const job = await loadJob(params.jobId, transaction);
      authorize(actor, 'job.cancel', { userId: job.userId as string });
      return { status: 200, body: presentJob(await cancelJob(job, transaction)) };
    },
  });

  defineRoute(router, {
    method: 'delete',
    path: '/jobs/{jobId}',
    summary:
      'Cancel a background job you started (a route optimisation or a Monte Carlo run) that is still queued or running; the run stops after its current chunk at the latest.',
    tags: ['evaluation'],
    auth: true,
    params: z.object({ jobId: z.uuid() }),
    writes: false,
    responses: {
      200: { description: 'The job, now cancelled.', schema: anyJobSchema },
      404: { description: 'No such job, or started by someone else.', schema: apiErrorSchema },
      409: { description: 'job_finished: the job has already finished.', schema: apiErrorSchema },
    },
    handle: async ({ actor, params, transaction }) => {
      const job = await loadJob(params.jobId, transaction);
      authorize(actor, 'job.cancel', { userId: job.userId as string });
      return { status: 200, body: presentJob(await cancelJob(job, transaction)) };
    },
  });

  return router;
}
