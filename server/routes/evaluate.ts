import { Router } from 'express';
import { apiErrorSchema } from '@shared/schemas/errors';
import {
  evaluateRequestSchema,
  evaluateResponseSchema,
  monteCarloRequestSchema,
  monteCarloStartedSchema,
  routeEvaluationErrorSchema,
} from '@shared/schemas/evaluate';
import { defineRoute } from '../http/route';
import { authorize } from '../policies';
import type { AppConfig } from '../config';
import { enginePool } from '../pool';
import { checkStepCount, inUserSlot } from '../services/evaluation-limits';
import { startMonteCarlo } from '../services/monte-carlo-jobs';

/** Route documents are large (a 200-step route with its compounds); these paths accept up to this much JSON. */
export const ROUTE_JSON_BODY_LIMIT = '2mb';

const unevaluable = {
  description:
    'The document is valid but cannot be evaluated (cycle, unconnected required port, unknown component, a step that cannot run); details name the step and field.',
  schema: routeEvaluationErrorSchema,
};

const busyResponse = {
  description:
    'too_many_evaluations: the caller already has the allowed number of calculations running.',
  schema: apiErrorSchema,
};
const poolFullResponse = {
  description: 'server_busy: every engine worker is busy and the queue is full; retry later.',
  schema: apiErrorSchema,
};

export function evaluateRouter(config: AppConfig): Router {
  const router = Router();

  defineRoute(router, {
    method: 'post',
    path: '/evaluate',
    summary:
      'Evaluate a route document and return per-step results, streams, totals and cautions; nothing is stored.',
    tags: ['evaluation'],
    auth: true,
    body: evaluateRequestSchema,
    transaction: false,
    responses: {
      200: {
        description:
          'The result, with the engine version and the advice to defer to the site process-safety review.',
        schema: evaluateResponseSchema,
      },
      413: {
        description:
          'The document is larger than the body limit, or has more steps than one evaluation may (route_too_large).',
        schema: apiErrorSchema,
      },
      422: unevaluable,
      429: busyResponse,
      503: poolFullResponse,
    },
    handle: async ({ actor, body }) => {
      authorize(actor, 'route.evaluate', null);
      checkStepCount(body.document.steps.length, config.evaluation);
      // Evaluated and serialised in the engine pool; the web thread only passes the text on.
      const { json } = await inUserSlot(actor.userId, config.evaluation, () =>
        enginePool().run('route.evaluate', {
          document: body.document,
          maxReplyBytes: config.evaluation.maxReplyBytes,
        }),
      );
      return { status: 200, json };
    },
  });

  defineRoute(router, {
    method: 'post',
    path: '/evaluate/monte-carlo',
    summary:
      'Start a seeded Monte Carlo evaluation over the ± ranges of the document; poll GET /jobs/{jobId} for progress and p5/p50/p95.',
    tags: ['evaluation'],
    auth: true,
    body: monteCarloRequestSchema,
    // Validation and small runs happen in the engine pool first; the job row is written after.
    transaction: false,
    responses: {
      202: { description: 'The job was queued.', schema: monteCarloStartedSchema },
      413: {
        description: 'More steps × draws than one run may ask for (route_too_large).',
        schema: apiErrorSchema,
      },
      422: unevaluable,
      429: {
        description:
          'too_many_jobs: the caller already has the allowed number of runs queued or running; too_many_evaluations: calculations running.',
        schema: apiErrorSchema,
      },
      503: poolFullResponse,
    },
    handle: async ({ actor, body }) => {
      authorize(actor, 'job.create', null);
      const job = await startMonteCarlo(
        { userId: actor.userId, document: body.document, draws: body.draws, seed: body.seed },
        config.evaluation,
      );
      return { status: 202, body: { jobId: job.id } };
    },
  });

  return router;
}
