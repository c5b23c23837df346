/**
 * The route optimiser's request: the route, the parameters the chemist
 * frees with their bounds, what to minimise and the constraints to meet.
 * The reply arrives through the job (shared/schemas/jobs.ts).
 */
import { z } from 'zod';
import { MAX_EVALUATIONS, OBJECTIVES } from '../engine/optimise/optimise';
import { routeDocumentSchema } from './route';
import { text } from './text';

export { OBJECTIVES, MAX_EVALUATIONS };
/** Parameters one run may free. */
export const MAX_FREE_PARAMS = 12;

const percent = (what: string) =>
  z
    .number({ error: `Give the ${what} as a number of per cent.` })
    .min(0, `The ${what} cannot be below 0 %.`)
    .max(100, `The ${what} cannot be above 100 %.`);

export const freeParamSchema = z.object({
  stepId: text({ error: 'Name the step whose parameter is free (its id).' }).min(
    1,
    'Name the step whose parameter is free (its id).',
  ),
  /** The parameter's path inside the step's params, e.g. "addedLiquid.volume" or "mode.cycles". */
  param: text({ error: 'Give the parameter to vary, e.g. addedLiquid.volume.' })
    .min(1, 'Give the parameter to vary, e.g. addedLiquid.volume.')
    .max(200),
  /** Lower bound, in the unit the document gives the parameter (e.g. vol). */
  min: z.number({ error: 'Give the lower bound as a number.' }).finite(),
  /** Upper bound, in the same unit. */
  max: z.number({ error: 'Give the upper bound as a number.' }).finite(),
  /** Whole numbers only (stages, cycles and cake washes are whole numbers anyway). */
  integer: z.boolean().optional(),
});

export const optimiseConstraintsSchema = z.object({
  minSolventFreePurityPct: percent('solvent-free purity').optional(),
  /** Largest level of each named impurity in the isolated solid, solvent-free basis. */
  maxImpurityPct: z.record(text(), percent('impurity limit')).optional(),
  minYieldPct: percent('yield').optional(),
  /** Every residual solvent at or below its ICH Q3C limit. */
  ichResidualSolvents: z
    .literal(true, { error: 'Set the ICH residual-solvent check to true, or leave it out.' })
    .optional(),
  /** The vessel's working volume, L: no step may hold more. */
  maxVolumeL: z
    .number({ error: 'Give the working volume in litres.' })
    .positive('The working volume must be more than 0 L.')
    .optional(),
});

export const optimiseRequestSchema = z.object({
  document: routeDocumentSchema,
  free: z
    .array(freeParamSchema)
    .min(1, 'Free at least one parameter for the optimiser to vary.')
    .max(MAX_FREE_PARAMS, `Free at most ${MAX_FREE_PARAMS} parameters in one run.`),
  objective: z.enum(OBJECTIVES, {
    error: 'Choose what to minimise: pmi, solventLPerKg or cycleTimeH.',
  }),
  constraints: optimiseConstraintsSchema.default({}),
  seed: z
    .number({ error: 'Give a whole-number seed, so the run can be repeated.' })
    .int('Give a whole-number seed, so the run can be repeated.')
    .min(-2_147_483_648)
    .max(4_294_967_295),
  budget: z
    .object({
      evaluations: z
        .number({ error: 'Give the number of evaluations as a whole number.' })
        .int('Give the number of evaluations as a whole number.')
        .min(10, 'Allow at least 10 evaluations.')
        .max(MAX_EVALUATIONS, `Allow at most ${MAX_EVALUATIONS} evaluations in one run.`),
    })
    .optional(),
});
export type OptimiseRequestInput = z.input<typeof optimiseRequestSchema>;
export type OptimiseRequestBody = z.output<typeof optimiseRequestSchema>;

export const optimiseStartedSchema = z.object({ jobId: text() });
