import { Router } from 'express';
import { apiErrorSchema } from '@shared/schemas/errors';
import { routeEvaluationErrorSchema } from '@shared/schemas/evaluate';
import { optimiseRequestSchema, optimiseStartedSchema } from '@shared/schemas/optimise';
import { defineRoute } from '../http/route';
import { authorize } from '../policies';
import type { AppConfig } from '../config';
import { startOptimisation } from '../services/optimise-jobs';

export function optimiseRouter(config: AppConfig): Router {
  const router = Router();

  defineRoute(router, {
    method: 'post',
    path: '/optimise',
    summary:
      'Start a seeded route optimisation: minimise PMI, solvent use or cycle time over the freed step parameters within their bounds, subject to purity, impurity, yield, ICH residual-solvent and vessel-volume constraints; poll GET /jobs/{jobId} for progress and the result, DELETE /jobs/{jobId} to cancel. Results are model results to confirm at the bench and through the site process-safety review.',
    tags: ['evaluation'],
    auth: true,
    body: optimiseRequestSchema,
    // The request is checked in the engine pool first; the job row is written after.
    transaction: false,
    responses: {
      202: { description: 'The optimisation was queued.', schema: optimiseStartedSchema },
      400: {
        description:
          'validation_failed: a free parameter names no step or no number of it, a bound is outside the field or below the other, or a limited impurity is not in the route; details name each.',
        schema: apiErrorSchema,
      },
      413: {
        description: 'More steps × evaluations than one run may ask for (route_too_large).',
        schema: apiErrorSchema,
      },
      422: {
        description:
          'The document is valid but cannot be evaluated; details name the step and field.',
        schema: routeEvaluationErrorSchema,
      },
      429: {
        description:
          'too_many_jobs: the caller already has the allowed number of runs queued or running; too_many_evaluations: calculations running.',
        schema: apiErrorSchema,
      },
      503: {
        description: 'server_busy: every engine worker is busy and the queue is full; retry later.',
        schema: apiErrorSchema,
      },
    },
    handle: async ({ actor, body }) => {
      authorize(actor, 'job.create', null);
      const job = await startOptimisation({ ...body, userId: actor.userId }, config.evaluation);
      return { status: 202, body: { jobId: job.id } };
    },
  });

  return router;
}
