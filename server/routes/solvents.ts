import { Router } from 'express';
import { z } from 'zod';
import { text } from '@shared/schemas/text';
import { apiErrorSchema } from '@shared/schemas/errors';
import { solventDetailSchema, solventListSchema } from '@shared/schemas/solvents';
import { defineRoute } from '../http/route';
import { authorize } from '../policies';
import { getSolvent, listSolvents } from '../services/solvents';

export function solventsRouter(): Router {
  const router = Router();

  defineRoute(router, {
    method: 'get',
    path: '/solvents',
    summary:
      'The solvent library: identity, boiling point, density, flash point, ICH class, Hansen parameters, flags; every value with its source.',
    tags: ['solvents'],
    auth: true,
    transaction: false,
    responses: {
      200: { description: 'Every library solvent, by name.', schema: solventListSchema },
    },
    handle: async ({ actor }) => {
      authorize(actor, 'solvent.read', null);
      return { status: 200, body: listSolvents() };
    },
  });

  defineRoute(router, {
    method: 'get',
    path: '/solvents/{solventId}',
    summary: 'One library solvent with every value and its source, including the Antoine sets.',
    tags: ['solvents'],
    auth: true,
    transaction: false,
    params: z.object({ solventId: text().min(1).max(80) }),
    responses: {
      200: { description: 'The solvent.', schema: solventDetailSchema },
      404: { description: 'No such solvent.', schema: apiErrorSchema },
    },
    handle: async ({ actor, params }) => {
      authorize(actor, 'solvent.read', null);
      return { status: 200, body: getSolvent(params.solventId) };
    },
  });

  return router;
}
