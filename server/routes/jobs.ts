import { Router } from 'express';
import { z } from 'zod';
import { apiErrorSchema } from '@shared/schemas/errors';
import { jobSchema } from '@shared/schemas/jobs';
import { defineRoute } from '../http/route';
import { authorize } from '../policies';
import { loadJob, presentJob } from '../services/monte-carlo-jobs';

export function jobsRouter(): Router {
  const router = Router();

  defineRoute(router, {
    method: 'get',
    path: '/jobs/{jobId}',
    summary: 'Status, progress (0..1) and, when done, the result of a background job you started.',
    tags: ['evaluation'],
    auth: true,
    params: z.object({ jobId: z.uuid() }),
    transaction: false,
    responses: {
      200: { description: 'The job.', schema: jobSchema },
      404: { description: 'No such job, or started by someone else.', schema: apiErrorSchema },
    },
    handle: async ({ actor, params }) => {
      const job = await loadJob(params.jobId);
      authorize(actor, 'job.read', { userId: job.userId as string });
      return { status: 200, body: presentJob(job) };
    },
  });

  return router;
}
