import { Router } from 'express';
import { z } from 'zod';
import { apiErrorSchema } from '@shared/schemas/errors';
import { routeEvaluationErrorSchema } from '@shared/schemas/evaluate';
import {
  solventAlternativesRequestSchema,
  solventAlternativesResponseSchema,
} from '@shared/schemas/solvent-alternatives';
import { defineRoute } from '../http/route';
import { authorize } from '../policies';
import type { AppConfig } from '../config';
import { enginePool } from '../pool';
import { checkStepCount, inUserSlot } from '../services/evaluation-limits';
import { ADVISOR_TIME_LIMIT_FACTOR } from '../services/solvent-alternatives';

export function solventAlternativesRouter(config: AppConfig): Router {
  const router = Router();

  defineRoute(router, {
    method: 'post',
    path: '/solvent-alternatives',
    summary:
      "Rank the library's alternatives to one step's solvent (extraction, swap target, crystallisation solvent, antisolvent, cake wash), each computed by evaluating the route again with the substitute in that role; nothing is stored.",
    tags: ['evaluation'],
    auth: true,
    body: solventAlternativesRequestSchema,
    transaction: false,
    responses: {
      200: {
        description:
          'The substitutes, ranked: by PMI among those that keep the yield within 2 points and the solvent-free purity at least the current, then the others by PMI, then those the route cannot be evaluated with. The current solvent is not listed. Each one the engine could evaluate carries the Monte Carlo spread (p5/p50/p95 over 8 seeded draws of the ± ranges) of its yield, solvent-free purity and PMI, and every one the caution that it is a model result to confirm at the bench and through the process-safety review.',
        schema: solventAlternativesResponseSchema,
      },
      400: {
        description:
          'bad_request: the route has no such step, or the step has no solvent in that role (details name stepId or role).',
        schema: apiErrorSchema,
      },
      413: {
        description: 'More steps than one evaluation may have (route_too_large).',
        schema: apiErrorSchema,
      },
      422: {
        description:
          'The route itself cannot be evaluated (details name the step and field), or evaluation_timeout: the substitutes took longer than three times the engine time limit.',
        schema: z.union([routeEvaluationErrorSchema, apiErrorSchema]),
      },
      429: {
        description:
          'too_many_evaluations: the caller already has the allowed number of calculations running.',
        schema: apiErrorSchema,
      },
      503: {
        description: 'server_busy: every engine worker is busy and the queue is full; retry later.',
        schema: apiErrorSchema,
      },
    },
    handle: async ({ actor, body }) => {
      authorize(actor, 'route.evaluate', null);
      checkStepCount(body.document.steps.length, config.evaluation);
      const alternatives = await inUserSlot(actor.userId, config.evaluation, () =>
        enginePool().run('solvent.alternatives', body, {
          timeoutMs: ADVISOR_TIME_LIMIT_FACTOR * config.pool.taskTimeoutMs,
        }),
      );
      return { status: 200, body: alternatives };
    },
  });

  return router;
}
