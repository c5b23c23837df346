/**
 * Workspace compounds: the product, its impurities, reagents and by-products
 * with their structure and the chemist's measured data. The same schemas
 * validate the API, drive the compound form and parse the replies.
 *
 * Rule: a value the chemist enters (measured logP, entered Hansen parameters,
 * edited UNIFAC groups) wins; otherwise the server estimates it on save by a
 * named method and marks it 'estimated'.
 */
import { z } from 'zod';
import { text } from './text';
import { listQuerySchema, listReplySchema } from './lists';
import { logPSchema, pKaEntrySchema } from './calc';
import { unifacGroupRowSchema } from './solvents';

export const COMPOUND_ROLES = ['product', 'impurity', 'reagent', 'by-product'] as const;
export const compoundRoleSchema = z.enum(COMPOUND_ROLES, {
  error: 'Choose a role: product, impurity, reagent or by-product.',
});
export type CompoundRole = z.infer<typeof compoundRoleSchema>;
export const COMPOUND_ROLE_LABELS: Record<CompoundRole, string> = {
  product: 'Product',
  impurity: 'Impurity',
  reagent: 'Reagent',
  'by-product': 'By-product',
};

export const COMPOUND_LIMITS = {
  nameMax: 200,
  smilesMax: 2000,
  molfileMax: 500_000,
  notesMax: 2000,
  pointsMax: 200,
  pKaMax: 6,
} as const;

export const SOLUBILITY_UNITS = ['g/L', 'mg/mL', 'mole-fraction', 'wt%'] as const;

const finite = () => z.number({ error: 'Enter a finite number.' });
const solventIdSchema = text().trim().min(1, { message: 'Choose a solvent.' }).max(80);

/** A measured solubility of the compound in one library solvent. */
export const compoundSolubilityPointSchema = z
  .object({
    solventId: solventIdSchema,
    temperatureC: finite()
      .min(-100, { message: 'At least −100 °C.' })
      .max(300, { message: 'At most 300 °C.' }),
    value: finite().positive({ message: 'Enter a positive value.' }),
    unit: z.enum(SOLUBILITY_UNITS, { error: 'Unit is g/L, mg/mL, mole-fraction or wt%.' }),
    source: text().trim().max(300).optional(),
  })
  .strict();
export type CompoundSolubilityPoint = z.infer<typeof compoundSolubilityPointSchema>;

/** A measured distribution ratio D = c_org/c_aq between a library solvent and water. */
export const compoundPartitionPointSchema = z
  .object({
    organicSolventId: solventIdSchema,
    pH: finite()
      .min(-2, { message: 'pH at least −2.' })
      .max(16, { message: 'pH at most 16.' })
      .optional(),
    temperatureC: finite()
      .min(-100, { message: 'At least −100 °C.' })
      .max(300, { message: 'At most 300 °C.' })
      .optional(),
    D: finite().positive({ message: 'D must be positive.' }),
    source: text().trim().max(300).optional(),
  })
  .strict();
export type CompoundPartitionPoint = z.infer<typeof compoundPartitionPointSchema>;

/** UNIFAC subgroup counts keyed by subgroup number (Hansen et al. 1991 table). */
export const unifacGroupCountsSchema = z.record(
  text().regex(/^\d+$/, { message: 'UNIFAC subgroup keys are subgroup numbers.' }),
  z
    .number()
    .int({ message: 'A group count is a whole number.' })
    .min(1, { message: 'A group count is at least 1.' })
    .max(100),
);
export type UnifacGroupCounts = z.infer<typeof unifacGroupCountsSchema>;

const hansenEntrySchema = z
  .object({
    d: finite()
      .min(0, { message: 'δD cannot be negative.' })
      .max(40, { message: 'δD at most 40 MPa^0.5.' }),
    p: finite()
      .min(0, { message: 'δP cannot be negative.' })
      .max(40, { message: 'δP at most 40 MPa^0.5.' }),
    h: finite()
      .min(0, { message: 'δH cannot be negative.' })
      .max(50, { message: 'δH at most 50 MPa^0.5.' }),
  })
  .strict();

const optionalNumber = <T extends z.ZodType>(schema: T) => schema.nullable().optional();

const compoundFields = {
  name: text().trim().min(1, { message: 'Enter a name.' }).max(COMPOUND_LIMITS.nameMax),
  /** SMILES; leave empty when a molfile is given. */
  smiles: text()
    .trim()
    .max(COMPOUND_LIMITS.smilesMax, { message: 'The SMILES is longer than 2000 characters.' })
    .nullable()
    .optional(),
  /** MDL molfile (V2000 or V3000); used when no SMILES is given. */
  molfile: text()
    .max(COMPOUND_LIMITS.molfileMax, { message: 'The molfile is too large.' })
    .nullable()
    .optional(),
  role: compoundRoleSchema,
  pKa: z
    .array(pKaEntrySchema)
    .max(COMPOUND_LIMITS.pKaMax, { message: 'At most 6 pKa values.' })
    .optional(),
  /** A measured logP; leave out (or null) to have it estimated. */
  logP: z
    .object({ value: logPSchema, method: text().trim().max(200).optional() })
    .strict()
    .nullable()
    .optional(),
  meltingPointC: optionalNumber(
    finite().min(-150, { message: 'At least −150 °C.' }).max(600, { message: 'At most 600 °C.' }),
  ),
  enthalpyFusionKJmol: optionalNumber(
    finite()
      .positive({ message: 'Must be positive.' })
      .max(500, { message: 'At most 500 kJ/mol.' }),
  ),
  /** Entered Hansen parameters; leave out (or null) to have them estimated. */
  hansen: hansenEntrySchema.nullable().optional(),
  /** Edited UNIFAC groups; leave out (or null) to use the automatic assignment. */
  unifacGroups: unifacGroupCountsSchema.nullable().optional(),
  solubility: z.array(compoundSolubilityPointSchema).max(COMPOUND_LIMITS.pointsMax).optional(),
  partition: z.array(compoundPartitionPointSchema).max(COMPOUND_LIMITS.pointsMax).optional(),
  notes: text().max(COMPOUND_LIMITS.notesMax).optional(),
  /** Specification limit in the isolated product [%, solvent-free basis], e.g. 0.15; null for none. */
  specLimitPct: optionalNumber(
    finite()
      .min(0, { message: 'The limit cannot be negative.' })
      .max(100, { message: 'The limit is at most 100 %.' }),
  ),
  /**
   * Incorporation into the product's crystals as a distribution coefficient K
   * (ratio to the product in the solid over that in the liquor); null for none.
   */
  solidIncorporation: optionalNumber(
    finite()
      .min(0, { message: 'The incorporation cannot be negative.' })
      .max(10, { message: 'The incorporation is at most 10.' }),
  ),
};

const hasStructure = (v: { smiles?: string | null; molfile?: string | null }) =>
  Boolean(v.smiles?.trim()) || Boolean(v.molfile?.trim());

export const compoundCreateSchema = z
  .object(compoundFields)
  .strict()
  .refine(hasStructure, { path: ['smiles'], message: 'Enter a SMILES or paste a molfile.' });
export type CompoundCreateInput = z.input<typeof compoundCreateSchema>;

export const compoundUpdateSchema = z
  .object(compoundFields)
  .partial()
  /** The compound version the change was based on; a newer one is a conflict (409 version_conflict). */
  .extend({ baseVersion: z.number().int().min(1) })
  .strict()
  .refine((v) => v.smiles === undefined || v.molfile === undefined || hasStructure(v), {
    path: ['smiles'],
    message: 'Enter a SMILES or paste a molfile.',
  });
export type CompoundUpdateInput = z.input<typeof compoundUpdateSchema>;

/** An acidic or basic group found in the structure, with its estimated pKa. */
export const ionisableGroupSchema = z.object({
  group: text(),
  type: z.enum(['acid', 'base']),
  /** Estimated pKa (for a base, of its conjugate acid); null when the method does not cover the group. */
  pKa: z.number().nullable(),
  method: text(),
  /** Typical error of the estimate [pKa units]; null without an estimate. */
  typicalError: z.number().nullable(),
  notes: z.array(text()),
});
export type IonisableGroupPayload = z.infer<typeof ionisableGroupSchema>;

export const unassignedAtomSchema = z.object({
  index: z.number().int(),
  element: text(),
  reason: text(),
});

export const compoundSchema = z.object({
  id: text(),
  /** Goes up by one with every change; PATCH names it as baseVersion. */
  version: z.number().int(),
  workspaceId: text(),
  name: text(),
  role: compoundRoleSchema,
  smiles: text().nullable(),
  molfile: text().nullable(),
  canonicalSmiles: text(),
  formula: text(),
  molarMassGmol: z.number(),
  /** Sanitised SVG drawing of the structure. */
  svg: text(),
  pKa: z.array(pKaEntrySchema),
  logP: z
    .object({
      value: z.number(),
      source: z.enum(['measured', 'estimated']),
      method: text(),
      warnings: z.array(text()),
    })
    .nullable(),
  meltingPointC: z.number().nullable(),
  enthalpyFusionKJmol: z.number().nullable(),
  hansen: z
    .object({
      d: z.number(),
      p: z.number(),
      h: z.number(),
      source: z.enum(['entered', 'estimated']),
      method: text(),
      warnings: z.array(text()),
    })
    .nullable(),
  unifac: z.object({
    groups: unifacGroupCountsSchema,
    source: z.enum(['assigned', 'edited']),
    summary: z.array(unifacGroupRowSchema),
    unassignedAtoms: z.array(unassignedAtomSchema),
    warnings: z.array(text()),
  }),
  /** Why an estimate could not be made (e.g. atoms no group covers). */
  estimateNotes: z.array(text()),
  solubility: z.array(compoundSolubilityPointSchema),
  partition: z.array(compoundPartitionPointSchema),
  notes: text(),
  specLimitPct: z.number().nullable(),
  solidIncorporation: z.number().nullable(),
  /** Acidic and basic groups found from the structure; measured pKa values (pKa) replace the estimates. */
  ionisableGroups: z.array(ionisableGroupSchema),
  /** Structure fingerprint (openchemlib FragFp, hex) for similarity; null when it cannot be made. */
  fingerprint: text().nullable(),
  createdBy: z.object({ id: text(), name: text() }).nullable(),
  createdAt: text(),
  updatedAt: text(),
});
export type Compound = z.infer<typeof compoundSchema>;
export const compoundListSchema = listReplySchema(compoundSchema);
/** By name A to Z (default) or newest first; q matches part of the name or the formula. */
export const compoundListQuerySchema = listQuerySchema(
  ['name', 'created'],
  'Sort by name (name) or newest first (created).',
);
export type CompoundListQuery = z.input<typeof compoundListQuerySchema>;

// ----- structure preview ----------------------------------------------------

export const structurePreviewRequestSchema = z.union([
  z
    .object({
      smiles: text()
        .trim()
        .min(1, { message: 'The SMILES is empty.' })
        .max(COMPOUND_LIMITS.smilesMax),
    })
    .strict(),
  z
    .object({
      molfile: text().min(1, { message: 'The molfile is empty.' }).max(COMPOUND_LIMITS.molfileMax),
    })
    .strict(),
]);
export type StructurePreviewRequest = z.infer<typeof structurePreviewRequestSchema>;

export const structurePreviewSchema = z.object({
  formula: text(),
  molarMassGmol: z.number(),
  svg: text(),
  canonicalSmiles: text(),
  /** The library solvent this structure is, if any. */
  librarySolventId: text().nullable(),
  unifac: z.object({
    groups: unifacGroupCountsSchema,
    summary: z.array(unifacGroupRowSchema),
    unassignedAtoms: z.array(unassignedAtomSchema),
    warnings: z.array(text()),
  }),
  /** Acidic and basic groups found from the structure, with estimated pKa and the method. */
  ionisableGroups: z.array(ionisableGroupSchema),
  estimates: z.object({
    logP: z.object({ value: z.number(), method: text(), warnings: z.array(text()) }).nullable(),
    hansen: z
      .object({
        d: z.number(),
        p: z.number(),
        h: z.number(),
        method: text(),
        warnings: z.array(text()),
      })
      .nullable(),
    /** Why an estimate is missing. */
    notes: z.array(text()),
  }),
});
export type StructurePreview = z.infer<typeof structurePreviewSchema>;

/**
 * The pKa values a route uses for a compound: the chemist's measured values
 * when any are entered, else the estimates from the structure (marked
 * estimated). At most six, as the route document allows.
 */
export function pKaForEngine(
  measured: ReadonlyArray<{ value: number; type: 'acid' | 'base' }>,
  groups: ReadonlyArray<{ pKa: number | null; type: 'acid' | 'base' }>,
): Array<{ value: number; type: 'acid' | 'base'; source: 'measured' | 'estimated' }> {
  if (measured.length > 0)
    return measured.slice(0, 6).map((p) => ({ value: p.value, type: p.type, source: 'measured' }));
  return groups
    .filter((g): g is { pKa: number; type: 'acid' | 'base' } => g.pKa !== null)
    .slice(0, 6)
    .map((g) => ({ value: g.pKa, type: g.type, source: 'estimated' }));
}
