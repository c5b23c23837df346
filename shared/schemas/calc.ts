/**
 * Calculation API payloads (POST /api/v1/calc/*). A public contract: paths and
 * field names do not change. Units are in the field names (°C, kPa, kJ/mol).
 *
 * Components are given by SMILES; the server resolves a SMILES to a library
 * solvent first (its curated data), otherwise to data derived from the
 * structure (UNIFAC groups by substructure matching). Every reply says which
 * method and which data it used, with warnings.
 */
import { z } from 'zod';
import { text } from './text';
import { hansenTripleSchema, unifacGroupRowSchema, valueSourceSchema } from './solvents';

export const CALC_LIMITS = {
  maxComponents: 20,
  temperatureC: [-100, 400],
  pressureKPa: [0.01, 10_000],
  fractionSumTolerance: 1e-6,
} as const;

const finite = () => z.number({ error: 'Enter a finite number.' });

export const temperatureCSchema = finite()
  .min(CALC_LIMITS.temperatureC[0], {
    message: `Temperature must be at least ${CALC_LIMITS.temperatureC[0]} °C.`,
  })
  .max(CALC_LIMITS.temperatureC[1], {
    message: `Temperature must be at most ${CALC_LIMITS.temperatureC[1]} °C.`,
  });

export const pressureKPaSchema = finite()
  .min(CALC_LIMITS.pressureKPa[0], {
    message: `Pressure must be at least ${CALC_LIMITS.pressureKPa[0]} kPa.`,
  })
  .max(CALC_LIMITS.pressureKPa[1], {
    message: `Pressure must be at most ${CALC_LIMITS.pressureKPa[1]} kPa.`,
  });

export const smilesSchema = text({ error: 'Give the structure as a SMILES string.' })
  .trim()
  .min(1, { message: 'The SMILES is empty.' })
  .max(2000, { message: 'The SMILES is longer than 2000 characters.' });

export const componentRefSchema = z.object({ smiles: smilesSchema }).strict();
export type ComponentRef = z.infer<typeof componentRefSchema>;

const componentsSchema = z
  .array(componentRefSchema)
  .min(1, { message: 'Give at least one component.' })
  .max(CALC_LIMITS.maxComponents, { message: `At most ${CALC_LIMITS.maxComponents} components.` });

const moleFractionsSchema = z
  .array(
    finite()
      .min(0, { message: 'A mole fraction cannot be negative.' })
      .max(1, { message: 'A mole fraction cannot exceed 1.' }),
  )
  .min(1, { message: 'Give at least one mole fraction.' })
  .max(CALC_LIMITS.maxComponents, {
    message: `At most ${CALC_LIMITS.maxComponents} mole fractions.`,
  });

/** One mole fraction per component, summing to 1 within 1e-6. */
function checkComposition(
  value: { components: unknown[]; moleFractions: number[] },
  ctx: z.RefinementCtx,
) {
  if (value.moleFractions.length !== value.components.length) {
    ctx.addIssue({
      code: 'custom',
      path: ['moleFractions'],
      message: `Give one mole fraction per component: ${value.components.length} component(s), ${value.moleFractions.length} fraction(s).`,
    });
    return;
  }
  const sum = value.moleFractions.reduce((s, x) => s + x, 0);
  if (Math.abs(sum - 1) > CALC_LIMITS.fractionSumTolerance) {
    ctx.addIssue({
      code: 'custom',
      path: ['moleFractions'],
      message: `Mole fractions must sum to 1 (they sum to ${sum}).`,
    });
  }
}

const warningsSchema = z.array(text());

/** How a SMILES was resolved: a library solvent, or groups derived from the structure. */
export const resolvedComponentSchema = z.object({
  smiles: text(),
  basis: z.enum(['library', 'structure']),
  solventId: text().nullable(),
  name: text().nullable(),
});
export type ResolvedComponent = z.infer<typeof resolvedComponentSchema>;

// ----- vapour pressure ------------------------------------------------------

export const vapourPressureRequestSchema = z
  .object({ component: componentRefSchema, temperatureC: temperatureCSchema })
  .strict();
export type VapourPressureRequest = z.infer<typeof vapourPressureRequestSchema>;
export const vapourPressureReplySchema = z.object({
  pressureKPa: z.number(),
  method: z.enum(['dippr101', 'wagner', 'antoine', 'antoine-anchored', 'clausius-clapeyron']),
  source: valueSourceSchema,
  component: resolvedComponentSchema,
  warnings: warningsSchema,
});
export type VapourPressureReply = z.infer<typeof vapourPressureReplySchema>;

// ----- activity coefficients ----------------------------------------------

export const activityCoefficientsRequestSchema = z
  .object({
    components: componentsSchema,
    moleFractions: moleFractionsSchema,
    temperatureC: temperatureCSchema,
  })
  .strict()
  .superRefine(checkComposition);
export type ActivityCoefficientsRequest = z.infer<typeof activityCoefficientsRequestSchema>;
export const activityCoefficientsReplySchema = z.object({
  activityCoefficients: z.array(z.number()),
  groups: z.array(
    resolvedComponentSchema.extend({
      subgroups: z.array(unifacGroupRowSchema),
      source: valueSourceSchema,
    }),
  ),
  method: text(),
  source: valueSourceSchema,
  warnings: warningsSchema,
});
export type ActivityCoefficientsReply = z.infer<typeof activityCoefficientsReplySchema>;

// ----- bubble point ---------------------------------------------------------

export const bubblePointRequestSchema = z
  .object({
    components: componentsSchema,
    moleFractions: moleFractionsSchema,
    pressureKPa: pressureKPaSchema,
  })
  .strict()
  .superRefine(checkComposition);
export type BubblePointRequest = z.infer<typeof bubblePointRequestSchema>;
export const bubblePointReplySchema = z.object({
  temperatureC: z.number(),
  vapourMoleFractions: z.array(z.number()),
  activityCoefficients: z.array(z.number()),
  components: z.array(resolvedComponentSchema.extend({ volatile: z.boolean() })),
  method: text(),
  sources: z.array(valueSourceSchema),
  warnings: warningsSchema,
});
export type BubblePointReply = z.infer<typeof bubblePointReplySchema>;

// ----- azeotrope ------------------------------------------------------------

export const azeotropeRequestSchema = z
  .object({
    components: z
      .array(componentRefSchema)
      .length(2, { message: 'The azeotrope search takes exactly two components.' }),
    pressureKPa: pressureKPaSchema,
  })
  .strict();
export type AzeotropeRequest = z.infer<typeof azeotropeRequestSchema>;
export const azeotropeReplySchema = z.object({
  found: z.boolean(),
  temperatureC: z.number().nullable(),
  moleFractions: z.array(z.number()).nullable(),
  kind: z.enum(['minimum-boiling', 'maximum-boiling']).nullable(),
  components: z.array(resolvedComponentSchema),
  method: text(),
  sources: z.array(valueSourceSchema),
  warnings: warningsSchema,
});
export type AzeotropeReply = z.infer<typeof azeotropeReplySchema>;

// ----- partition ------------------------------------------------------------

export const pKaEntrySchema = z
  .object({
    value: finite()
      .min(-10, { message: 'pKa must be at least −10.' })
      .max(30, { message: 'pKa must be at most 30.' }),
    type: z.enum(['acid', 'base'], {
      error: "Type is 'acid' or 'base' (for a base, the pKa of its conjugate acid).",
    }),
  })
  .strict();
export type PKaEntry = z.infer<typeof pKaEntrySchema>;

export const logPSchema = finite()
  .min(-10, { message: 'log P must be at least −10.' })
  .max(15, { message: 'log P must be at most 15.' });

export const partitionRequestSchema = z
  .object({
    solute: z
      .object({
        smiles: smilesSchema,
        pKa: z.array(pKaEntrySchema).max(6, { message: 'At most 6 pKa values.' }).optional(),
        logP: logPSchema.optional(),
      })
      .strict(),
    organic: componentRefSchema,
    aqueous: z
      .object({
        pH: finite()
          .min(-2, { message: 'pH must be at least −2.' })
          .max(16, { message: 'pH must be at most 16.' })
          .optional(),
        salt: z
          .object({
            name: text().trim().min(1, { message: 'Name the salt (e.g. nacl).' }).max(80),
            molar: finite()
              .min(0, { message: 'Salt concentration cannot be negative.' })
              .max(10, { message: 'Salt concentration must be at most 10 mol/L.' }),
          })
          .strict()
          .optional(),
      })
      .strict()
      .default({}),
    temperatureC: temperatureCSchema.default(25),
  })
  .strict();
export type PartitionRequest = z.input<typeof partitionRequestSchema>;
export const partitionReplySchema = z.object({
  logD: z.number(),
  D: z.number(),
  basis: z.literal('molar-concentration'),
  method: text(),
  source: valueSourceSchema,
  organic: resolvedComponentSchema,
  warnings: warningsSchema,
});
export type PartitionReply = z.infer<typeof partitionReplySchema>;

// ----- solubility -----------------------------------------------------------

export const solubilityRequestSchema = z
  .object({
    solute: z
      .object({
        smiles: smilesSchema.optional(),
        meltingPointC: finite()
          .min(-150, { message: 'Melting point must be at least −150 °C.' })
          .max(600, { message: 'Melting point must be at most 600 °C.' }),
        enthalpyFusionKJmol: finite()
          .positive({ message: 'Enthalpy of fusion must be positive.' })
          .max(500, { message: 'Enthalpy of fusion must be at most 500 kJ/mol.' }),
      })
      .strict(),
    solvent: componentRefSchema.optional(),
    temperatureC: temperatureCSchema,
  })
  .strict();
export type SolubilityRequest = z.infer<typeof solubilityRequestSchema>;
export const solubilityReplySchema = z.object({
  idealMoleFraction: z.number(),
  moleFraction: z.number(),
  activityCoefficient: z.number().nullable(),
  method: text(),
  solvent: resolvedComponentSchema.nullable(),
  warnings: warningsSchema,
});
export type SolubilityReply = z.infer<typeof solubilityReplySchema>;

// ----- Hansen distance ------------------------------------------------------

const hansenValue = (label: string, max: number) =>
  finite()
    .min(0, { message: `${label} cannot be negative.` })
    .max(max, { message: `${label} must be at most ${max} MPa^0.5.` });

export const hansenOperandSchema = z.union([
  componentRefSchema,
  z
    .object({ d: hansenValue('δD', 40), p: hansenValue('δP', 40), h: hansenValue('δH', 50) })
    .strict(),
]);
export const hansenDistanceRequestSchema = z
  .object({ a: hansenOperandSchema, b: hansenOperandSchema })
  .strict();
export type HansenDistanceRequest = z.infer<typeof hansenDistanceRequestSchema>;

const hansenResolvedSchema = hansenTripleSchema.extend({
  basis: z.enum(['given', 'library', 'estimated']),
  source: valueSourceSchema.nullable(),
  method: text().nullable(),
});
export const hansenDistanceReplySchema = z.object({
  ra: z.number(),
  a: hansenResolvedSchema,
  b: hansenResolvedSchema,
  method: text(),
  warnings: warningsSchema,
});
export type HansenDistanceReply = z.infer<typeof hansenDistanceReplySchema>;
