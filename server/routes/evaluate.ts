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
import { evaluateDocument } from '../services/evaluation';
import { startMonteCarlo } from '../services/monte-carlo-jobs';

/** Route documents are large (a 200-step route with its compounds); these paths accept up to this much JSON. */
export const ROUTE_JSON_BODY_LIMIT = '2mb';

const unevaluable = {
  description:
    'The document is valid but cannot be evaluated (cycle, unconnected required port, unknown component, a step that cannot run); details name the step and field.',
  schema: routeEvaluationErrorSchema,
};

export function evaluateRouter(): Router {
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
      413: { description: 'The document is larger than the body limit.', schema: apiErrorSchema },
      422: unevaluable,
    },
    handle: async ({ actor, body }) => {
      authorize(actor, 'route.evaluate', null);
      return { status: 200, body: evaluateDocument(body.document) };
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
    responses: {
      202: { description: 'The job was queued.', schema: monteCarloStartedSchema },
      422: unevaluable,
    },
    handle: async ({ actor, body, transaction }) => {
      authorize(actor, 'job.create', null);
      const job = await startMonteCarlo(
        { userId: actor.userId, document: body.document, draws: body.draws, seed: body.seed },
        transaction,
      );
      return { status: 202, body: { jobId: job.id } };
    },
  });

  return router;
}
