import { Router } from 'express';
import type { ZodType } from 'zod';
import {
  activityCoefficientsReplySchema,
  activityCoefficientsRequestSchema,
  azeotropeReplySchema,
  azeotropeRequestSchema,
  bubblePointReplySchema,
  bubblePointRequestSchema,
  hansenDistanceReplySchema,
  hansenDistanceRequestSchema,
  partitionReplySchema,
  partitionRequestSchema,
  solubilityReplySchema,
  solubilityRequestSchema,
  vapourPressureReplySchema,
  vapourPressureRequestSchema,
} from '@shared/schemas/calc';
import { apiErrorSchema } from '@shared/schemas/errors';
import { defineRoute } from '../http/route';
import { authorize } from '../policies';
import type { AppConfig } from '../config';
import { enginePool } from '../pool';
import type { CalculationName } from '../pool/tasks';
import { inUserSlot } from '../services/evaluation-limits';

const unprocessableResponse = {
  description:
    'Well formed but not computable: structure_unparsable (the SMILES cannot be read; the message names the problem), ' +
    'unifac_missing_parameters (atoms no group covers, or a group pair without parameters), no_data (e.g. no Antoine constants), not_computable.',
  schema: apiErrorSchema,
};

/**
 * The calculation endpoints: any signed-in member may call them (session or
 * Bearer token). They read no database, so they run without a transaction.
 */
export function calcRouter(config: AppConfig): Router {
  const router = Router();

  const calc = <B extends ZodType>(spec: {
    path: CalculationName;
    summary: string;
    body: B;
    reply: ZodType;
  }) =>
    defineRoute(router, {
      method: 'post',
      path: `/calc/${spec.path}`,
      summary: spec.summary,
      tags: ['calculations'],
      auth: true,
      transaction: false,
      body: spec.body,
      responses: {
        200: {
          description: 'The result with its method, sources and warnings.',
          schema: spec.reply,
        },
        422: unprocessableResponse,
      },
      writes: false,
      handle: async ({ actor, body }) => {
        authorize(actor, 'calc.run', null);
        // The engine runs in the pool, never on the web thread.
        const reply = await inUserSlot(actor.userId, config.evaluation, () =>
          enginePool().run('calculate', { operation: spec.path, body }),
        );
        return { status: 200, body: reply };
      },
    });

  calc({
    path: 'vapour-pressure',
    summary:
      'Vapour pressure of a library solvent (Antoine; Clausius–Clapeyron outside the fitted range, with a warning).',
    body: vapourPressureRequestSchema,
    reply: vapourPressureReplySchema,
  });
  calc({
    path: 'activity-coefficients',
    summary:
      'UNIFAC activity coefficients of a liquid mixture; components by SMILES (library solvent, or groups assigned from the structure).',
    body: activityCoefficientsRequestSchema,
    reply: activityCoefficientsReplySchema,
  });
  calc({
    path: 'bubble-point',
    summary:
      "Bubble-point temperature and vapour composition at a pressure (modified Raoult's law).",
    body: bubblePointRequestSchema,
    reply: bubblePointReplySchema,
  });
  calc({
    path: 'azeotrope',
    summary: 'Azeotrope of a binary of library solvents at a pressure.',
    body: azeotropeRequestSchema,
    reply: azeotropeReplySchema,
  });
  calc({
    path: 'partition',
    summary:
      'Distribution ratio D (organic/aqueous, molar concentrations) of a solute: Collander from logP, or UNIFAC; pH by Henderson–Hasselbalch, salt by Setschenow.',
    body: partitionRequestSchema,
    reply: partitionReplySchema,
  });
  calc({
    path: 'solubility',
    summary:
      'Ideal solubility from melting point and enthalpy of fusion, and the UNIFAC-corrected solubility in a solvent.',
    body: solubilityRequestSchema,
    reply: solubilityReplySchema,
  });
  calc({
    path: 'hansen-distance',
    summary: 'Hansen distance Ra between two materials given by SMILES or by δD, δP, δH.',
    body: hansenDistanceRequestSchema,
    reply: hansenDistanceReplySchema,
  });

  return router;
}
