/**
 * Solvent library payloads: GET /api/v1/solvents and GET /api/v1/solvents/:id.
 * Every value comes with its source under `sources` (field → citation).
 */
import { z } from 'zod';
import { text } from './text';

export const GUIDE_CATEGORIES = [
  'recommended',
  'problematic',
  'hazardous',
  'highly-hazardous',
] as const;

/** Where a value comes from: the bibliography id, its status, and the full citation where known. */
export const valueSourceSchema = z.object({
  ref: text(),
  status: z.enum([
    'confirmed',
    'secondary',
    'unverified-memory',
    'estimated',
    'common-practice',
    'not-confirmed',
  ]),
  note: text().optional(),
  citation: text().optional(),
  via: text().optional(),
  url: text().optional(),
});
export type ValueSource = z.infer<typeof valueSourceSchema>;

export const hansenTripleSchema = z.object({ d: z.number(), p: z.number(), h: z.number() });

export const unifacGroupRowSchema = z.object({
  subgroup: z.number().int(),
  name: text(),
  mainGroup: z.number().int().optional(),
  mainGroupName: text().optional(),
  count: z.number(),
});
export type UnifacGroupRow = z.infer<typeof unifacGroupRowSchema>;

export const solventSummarySchema = z.object({
  id: text(),
  name: text(),
  synonyms: z.array(text()),
  smiles: text(),
  cas: text(),
  molarMassGmol: z.number(),
  ich: z.object({
    class: z.union([z.literal(1), z.literal(2), z.literal(3)]).nullable(),
    limitPpm: z.number().nullable(),
  }),
  boilingPointC: z.number(),
  meltingPointC: z.number(),
  densityGmL: z.number(),
  /** Temperature at which densityGmL applies [°C]. */
  densityTemperatureC: z.number(),
  /** Closed-cup flash point; null where the liquid has none, or where none was confirmed (sources.flashPointC.status 'not-confirmed': treat as flammable). */
  flashPointC: z.number().nullable(),
  hansen: hansenTripleSchema,
  viscosityMPas25C: z.number(),
  peroxideFormer: z.boolean(),
  lowConductivity: z.boolean(),
  /** CHEM21 guide category (ranking after discussion), read from the guide's table; null where the guide does not list the solvent. */
  guideCategory: z.enum(GUIDE_CATEGORIES).nullable(),
  waterMiscibility: z.enum(['miscible', 'partial']),
  unifac: z.array(unifacGroupRowSchema),
  sources: z.record(text(), valueSourceSchema),
});
export type SolventSummary = z.infer<typeof solventSummarySchema>;
export const solventListSchema = z.array(solventSummarySchema);

export const antoineSetSchema = z.object({
  form: z.enum(['log10-bar-degC', 'log10-bar-K']),
  A: z.number(),
  B: z.number(),
  C: z.number(),
  TminK: z.number(),
  TmaxK: z.number(),
  source: valueSourceSchema,
});

export const solventDetailSchema = solventSummarySchema.extend({
  antoine: z.array(antoineSetSchema),
  enthalpyVapKJmol: z.number().nullable(),
  molarVolumeCm3mol: z.number().nullable(),
  densityPerK: z.number().nullable(),
  pdeMgDay: z.number().nullable(),
  dielectricConstant: z.number().nullable(),
  waterMutualSolubility: z
    .object({
      solventInWaterWtPct: z.number(),
      waterInSolventWtPct: z.number(),
      temperatureC: z.number(),
    })
    .nullable(),
  dataVersion: text(),
});
export type SolventDetail = z.infer<typeof solventDetailSchema>;

export const GUIDE_CATEGORY_LABELS: Record<(typeof GUIDE_CATEGORIES)[number], string> = {
  recommended: 'Recommended',
  problematic: 'Problematic',
  hazardous: 'Hazardous',
  'highly-hazardous': 'Highly hazardous',
};
