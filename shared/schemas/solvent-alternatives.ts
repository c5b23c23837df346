/**
 * POST /api/v1/solvent-alternatives: the solvent substitution advisor
 * (shared/engine/substitution). The reply is the ranked list of substitutes.
 */
import { z } from 'zod';
import { SUBSTITUTION_ROLES } from '../engine/substitution/roles';
import { GUIDE_CATEGORIES } from './solvents';
import { routeTotalsSchema } from './evaluate';
import { routeDocumentSchema } from './route';
import { text } from './text';

export {
  SUBSTITUTION_ROLES,
  ROLE_LABELS as SUBSTITUTION_ROLE_LABELS,
  type SubstitutionRole,
} from '../engine/substitution/roles';

export const solventAlternativesRequestSchema = z.object({
  document: routeDocumentSchema,
  stepId: text().min(1).max(200),
  role: z.enum(SUBSTITUTION_ROLES),
});
export type SolventAlternativesRequest = z.input<typeof solventAlternativesRequestSchema>;

const percentilesSchema = z.object({
  p5: z.number().nullable(),
  p50: z.number().nullable(),
  p95: z.number().nullable(),
});

export const solventAlternativeSchema = z.object({
  solventId: text(),
  /** The engine's route totals with the substitute in the step's role; null when the route cannot be evaluated with it. */
  totals: routeTotalsSchema.nullable(),
  /** Substitute minus current route. */
  deltaVsCurrent: z
    .object({
      yieldPct: z.number().nullable(),
      solventFreePurityPct: z.number().nullable(),
      pmi: z.number().nullable(),
      solventUseLPerKg: z.number().nullable(),
    })
    .nullable(),
  ich: z.object({
    class: z.union([z.literal(1), z.literal(2), z.literal(3)]).nullable(),
    limitPpm: z.number().nullable(),
  }),
  /** CHEM21 guide category read from the guide's table; null when its row was not read. */
  guideCategory: z.enum(GUIDE_CATEGORIES).nullable(),
  boilingPointC: z.number(),
  flashPointC: z.number().nullable(),
  /** The first caution is always that this is a model result to confirm at the bench and through the process-safety review. */
  cautions: z.array(text()),
  /** The solvent's name, for people. */
  name: text(),
  /** Keeps the yield within 2 points and the solvent-free purity at least the current route's. */
  keepsYieldAndPurity: z.boolean(),
  waterMiscibility: z.enum(['miscible', 'partial']),
  /** Whether it boils with water as two liquids at 1 atm, by the model; null when the model cannot say. */
  heteroazeotropeWithWater: z
    .object({ forms: z.boolean(), temperatureC: z.number().nullable() })
    .nullable(),
  /** Monte Carlo spread (p5/p50/p95) of the constrained figures with the substitute; given for every suggestion the engine could evaluate, null for the others. */
  uncertainty: z
    .object({
      draws: z.number().int(),
      seed: z.number().int(),
      failedDraws: z.number().int(),
      yieldPct: percentilesSchema,
      solventFreePurityPct: percentilesSchema,
      pmi: percentilesSchema,
    })
    .nullable(),
});
export type SolventAlternative = z.infer<typeof solventAlternativeSchema>;

export const solventAlternativesResponseSchema = z.array(solventAlternativeSchema);
