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
import {
  calcActivityCoefficients,
  calcAzeotrope,
  calcBubblePoint,
  calcHansenDistance,
  calcPartition,
  calcSolubility,
  calcVapourPressure,
} from '../services/calc';

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
export function calcRouter(): Router {
  const router = Router();

  const calc = <B extends ZodType>(spec: {
    path: string;
    summary: string;
    body: B;
    reply: ZodType;
    run: (body: never) => unknown;
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
      handle: async ({ actor, body }) => {
        authorize(actor, 'calc.run', null);
        return { status: 200, body: spec.run(body as never) };
      },
    });

  calc({
    path: 'vapour-pressure',
    summary:
      'Vapour pressure of a library solvent (Antoine; Clausius–Clapeyron outside the fitted range, with a warning).',
    body: vapourPressureRequestSchema,
    reply: vapourPressureReplySchema,
    run: calcVapourPressure,
  });
  calc({
    path: 'activity-coefficients',
    summary:
      'UNIFAC activity coefficients of a liquid mixture; components by SMILES (library solvent, or groups assigned from the structure).',
    body: activityCoefficientsRequestSchema,
    reply: activityCoefficientsReplySchema,
    run: calcActivityCoefficients,
  });
  calc({
    path: 'bubble-point',
    summary:
      "Bubble-point temperature and vapour composition at a pressure (modified Raoult's law).",
    body: bubblePointRequestSchema,
    reply: bubblePointReplySchema,
    run: calcBubblePoint,
  });
  calc({
    path: 'azeotrope',
    summary: 'Azeotrope of a binary of library solvents at a pressure.',
    body: azeotropeRequestSchema,
    reply: azeotropeReplySchema,
    run: calcAzeotrope,
  });
  calc({
    path: 'partition',
    summary:
      'Distribution ratio D (organic/aqueous, molar concentrations) of a solute: Collander from logP, or UNIFAC; pH by Henderson–Hasselbalch, salt by Setschenow.',
    body: partitionRequestSchema,
    reply: partitionReplySchema,
    run: calcPartition,
  });
  calc({
    path: 'solubility',
    summary:
      'Ideal solubility from melting point and enthalpy of fusion, and the UNIFAC-corrected solubility in a solvent.',
    body: solubilityRequestSchema,
    reply: solubilityReplySchema,
    run: calcSolubility,
  });
  calc({
    path: 'hansen-distance',
    summary: 'Hansen distance Ra between two materials given by SMILES or by δD, δP, δH.',
    body: hansenDistanceRequestSchema,
    reply: hansenDistanceReplySchema,
    run: calcHansenDistance,
  });

  return router;
}
