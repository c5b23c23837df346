/**
 * The route document: the chemist's isolation route as a directed acyclic
 * graph of steps joined by typed ports. One zod schema serves the editor's
 * forms, the client hooks, the server validation and the engine.
 *
 * Units in the document are the chemist's (°C, mbar, kg, L, "vol", "equiv",
 * wt %); the engine converts them to SI at its edge. "vol" is litres of liquid
 * per kg of the reference input; "equiv" is mol per mol of the reference input.
 *
 * Any numeric parameter written with `uncertain(...)` may be a plain number
 * or `{ value, plusMinus }`: the Monte Carlo evaluation draws it uniformly in
 * [value − plusMinus, value + plusMinus] (clipped to the field's range).
 *
 * docs/route-format.md documents every field.
 */
import { z } from 'zod';
import { identifier, text } from './text';

export const ROUTE_SCHEMA_VERSION = 1 as const;

const finite = () => z.number().finite();

/**
 * A number with an optional ± range, bounded to [min, max].
 * Source: this project's own bookkeeping (no external source).
 * Validity: finite bounds, min ≤ max.
 * @param min  lowest value the field accepts [unit of the field]
 * @param max  highest value the field accepts [unit of the field]
 * @returns the zod schema: a number, or { value, plusMinus } with plusMinus ≥ 0
 */
export function uncertain(min: number, max: number) {
  const plain = finite().min(min).max(max);
  return z.union([plain, z.object({ value: plain, plusMinus: finite().nonnegative() }).strict()]);
}
export type Uncertain = number | { value: number; plusMinus: number };

/** Field ranges, shared by the schema, the forms and the evaluator. */
export const RANGES = {
  temperatureC: [-100, 250],
  pressureMbar: [1, 5000],
  volume: [0, 1e6],
  stages: [1, 50],
  wtPct: [0, 100],
  fraction: [0, 1],
  equiv: [0, 1000],
  cycles: [1, 20],
  massKg: [0, 1e7],
} as const;

const temperatureC = uncertain(...RANGES.temperatureC);
const id = identifier();

/** A liquid volume: litres, or "vol" (L per kg of the reference input). */
export const volumeSchema = z
  .object({ value: uncertain(...RANGES.volume), unit: z.enum(['L', 'vol']) })
  .strict();
export type Volume = z.infer<typeof volumeSchema>;

// ----- components ---------------------------------------------------------

export const pKaSchema = z
  .object({
    value: finite().min(-10).max(30),
    type: z.enum(['acid', 'base']),
    /** Measured (entered by the chemist) or estimated from the structure; measured when absent. */
    source: z.enum(['measured', 'estimated']).optional(),
  })
  .strict();

/** UNIFAC subgroup counts keyed by subgroup number (Hansen et al. 1991 table). */
export const unifacGroupsSchema = z.record(
  text().regex(/^\d+$/, 'UNIFAC subgroup keys are subgroup numbers'),
  z.number().int().min(1).max(100),
);

export const solubilityPointSchema = z
  .object({
    solventId: id,
    temperatureC: finite().min(-100).max(300),
    value: finite().positive(),
    unit: z.enum(['g/L', 'mg/mL', 'mole-fraction', 'wt%']),
    source: text().max(300).optional(),
  })
  .strict();

/**
 * Jouyban–Acree interaction terms of a compound in one solvent pair (Jouyban,
 * J. Pharm. Pharm. Sci. 2008, 11, 32), fitted by the chemist to measured
 * solubilities in the blend: ln x_m = f1 ln x1 + f2 ln x2 + (f1 f2/T) Σ J_k (f1 − f2)^k,
 * with f on the stated basis and f1 the first solvent of the pair.
 */
export const cosolvencySchema = z
  .object({
    /** Library solvent ids of the pair, in the order the J terms were fitted (f1 − f2). */
    solventIds: z.tuple([id, id]),
    J0: finite().min(-1e5).max(1e5),
    J1: finite().min(-1e5).max(1e5).default(0),
    J2: finite().min(-1e5).max(1e5).default(0),
    /** Basis of the solute-free fractions the J terms were fitted on. */
    basis: z.enum(['volume', 'mass', 'mole']),
    source: text().max(300).optional(),
  })
  .strict();

export const partitionPointSchema = z
  .object({
    organicSolventId: id,
    pH: finite().min(-2).max(16).optional(),
    temperatureC: finite().min(-100).max(300).optional(),
    D: finite().positive(),
    source: text().max(300).optional(),
  })
  .strict();

/**
 * A workspace compound as a self-contained property snapshot, so that a
 * stored route evaluates the same even if the compound record changes later.
 * Reused by the compounds API.
 */
export const compoundSnapshotSchema = z
  .object({
    kind: z.literal('compound'),
    id,
    name: text().min(1).max(200),
    role: z.enum(['product', 'impurity', 'reagent', 'by-product']),
    smiles: text().max(2000).optional(),
    molarMassGmol: finite().positive().max(1e5),
    meltingPointC: finite().min(-150).max(600).optional(),
    enthalpyFusionKJmol: finite().positive().max(500).optional(),
    /** Solid or liquid density, g/mL, for volumes; 1.2 g/mL assumed when absent (common practice). */
    densityGmL: finite().positive().max(5).optional(),
    logP: finite().min(-10).max(15).optional(),
    pKa: z.array(pKaSchema).max(6).optional(),
    /**
     * Acidic and basic groups found in the structure (by the structure reader, not the engine),
     * so the evaluation can say when one has no pKa and is treated as neutral.
     */
    ionisableGroups: z
      .array(z.object({ group: text().min(1).max(100), type: z.enum(['acid', 'base']) }).strict())
      .max(20)
      .optional(),
    unifac: unifacGroupsSchema.optional(),
    hansen: z
      .object({
        d: finite().min(0).max(40),
        p: finite().min(0).max(40),
        h: finite().min(0).max(50),
      })
      .strict()
      .optional(),
    solubility: z.array(solubilityPointSchema).max(200).optional(),
    partition: z.array(partitionPointSchema).max(200).optional(),
    /** Jouyban–Acree interaction terms for solvent pairs (mixed-solvent solubility). */
    cosolvency: z.array(cosolvencySchema).max(50).optional(),
    /** Specification limit in the isolated product [%, solvent-free basis], e.g. 0.15. */
    specLimitPct: finite().min(0).max(100).optional(),
    /**
     * Incorporation into the product's crystals: distribution coefficient
     * K = (m_i/m_product in the solid) / (m_i/m_product in the liquor); absent = none.
     */
    solidIncorporation: finite().min(0).max(10).optional(),
    /** Structure fingerprint (openchemlib FragFp, 512 bits as hex) for similarity to the product. */
    fingerprint: text()
      .regex(/^[0-9a-f]{128}$/, 'A fingerprint is 128 hexadecimal digits')
      .optional(),
    /** Free-text note, e.g. "invented demo compound". */
    note: text().max(500).optional(),
  })
  .strict();
export type CompoundSnapshot = z.infer<typeof compoundSnapshotSchema>;

export const solventComponentSchema = z
  .object({ kind: z.literal('solvent'), id, solventId: id })
  .strict();
export const aqueousSoluteComponentSchema = z
  .object({ kind: z.literal('aqueous-solute'), id: id.optional(), soluteId: id })
  .strict();

export const componentSchema = z.discriminatedUnion('kind', [
  solventComponentSchema,
  aqueousSoluteComponentSchema,
  compoundSnapshotSchema,
]);
export type RouteComponent = z.infer<typeof componentSchema>;

/**
 * The id under which a component appears in streams (an aqueous solute
 * without its own id goes by its library id).
 * Source: this project's own bookkeeping (no external source).
 * Validity: any component the schema accepts.
 * @param c  the route component
 * @returns its stream id
 */
export function componentKey(c: RouteComponent): string {
  return c.kind === 'aqueous-solute' ? (c.id ?? c.soluteId) : c.id;
}

// ----- added liquids ------------------------------------------------------

/** A liquid added by a step: a route solvent component, or an aqueous medium
 * (water + an aqueous-solute component at wt %, optional measured pH). */
export const addedLiquidSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('solvent'), solventId: id, volume: volumeSchema }).strict(),
  z
    .object({
      kind: z.literal('aqueous'),
      soluteId: id,
      wtPct: uncertain(0, 60),
      volume: volumeSchema,
      /** Measured pH of the medium; estimated from its composition when absent. */
      pH: finite().min(-2).max(16).optional(),
    })
    .strict(),
]);
export type AddedLiquid = z.infer<typeof addedLiquidSchema>;

// ----- step parameters ----------------------------------------------------

const chargeEntrySchema = z.discriminatedUnion('kind', [
  z
    .object({
      kind: z.literal('component'),
      componentId: id,
      amount: uncertain(...RANGES.volume),
      /** kg; wt% of the charge's crudeMassKg; L or vol (liquids with a density); equiv. */
      unit: z.enum(['kg', 'wt%', 'L', 'vol', 'equiv']),
    })
    .strict(),
  z
    .object({
      kind: z.literal('aqueous'),
      soluteId: id,
      wtPct: uncertain(0, 60),
      volume: volumeSchema,
    })
    .strict(),
]);

export const chargeParamsSchema = z
  .object({
    temperatureC,
    /** Total mass of the crude solid that wt% entries refer to, kg. */
    crudeMassKg: uncertain(...RANGES.massKg).optional(),
    contents: z.array(chargeEntrySchema).min(1).max(100),
  })
  .strict();

export const washParamsSchema = z
  .object({
    addedLiquid: addedLiquidSchema,
    stages: z.number().int().min(RANGES.stages[0]).max(RANGES.stages[1]),
    /** Cross-current: the added volume is fresh liquid per stage. Counter-current: the added volume is the total. */
    mode: z.enum(['cross-current', 'counter-current']),
    temperatureC,
    /** The phase the route carries on (for product-loss warnings). */
    keep: z.enum(['organic', 'aqueous']).default('organic'),
  })
  .strict();

export const extractionParamsSchema = washParamsSchema;

const distillationCondition = z.discriminatedUnion('kind', [
  z
    .object({ kind: z.literal('pressure'), pressureMbar: uncertain(...RANGES.pressureMbar) })
    .strict(),
  z.object({ kind: z.literal('pot-temperature'), potTemperatureC: temperatureC }).strict(),
]);

export const distillationParamsSchema = z
  .object({
    mode: z.discriminatedUnion('kind', [
      z.object({ kind: z.literal('concentrate'), targetVolume: volumeSchema }).strict(),
      z
        .object({
          kind: z.literal('put-and-take'),
          cycles: z.number().int().min(RANGES.cycles[0]).max(RANGES.cycles[1]),
          targetVolume: volumeSchema,
          addSolventId: id,
          addVolume: volumeSchema,
        })
        .strict(),
      z
        .object({ kind: z.literal('constant-volume'), addSolventId: id, addVolume: volumeSchema })
        .strict(),
    ]),
    condition: distillationCondition,
    /** Dean–Stark trap: the condensate separates, the aqueous layer is taken off, the organic layer returns. */
    decanter: z.boolean().optional(),
  })
  .strict();

export const crystallisationParamsSchema = z
  .object({
    mode: z.discriminatedUnion('kind', [
      z.object({ kind: z.literal('cooling'), startC: temperatureC, endC: temperatureC }).strict(),
      z
        .object({
          kind: z.literal('antisolvent'),
          antisolventId: id,
          volume: volumeSchema,
          temperatureC,
        })
        .strict(),
      z
        .object({
          kind: z.literal('evaporative'),
          targetVolume: volumeSchema,
          pressureMbar: uncertain(...RANGES.pressureMbar),
        })
        .strict(),
    ]),
    seeded: z.boolean(),
    /** Seed charge, wt % of the product in the feed. */
    seedWtPct: uncertain(0, 20).optional(),
  })
  .strict();

export const filtrationParamsSchema = z
  .object({
    /** Liquor retained by the cake, L per kg of solid. Default 0.5 (common practice). */
    retainedLiquorLPerKg: uncertain(0, 10).default(0.5),
    cakeWash: z
      .object({
        solventId: id,
        /** Volume of each wash. */
        volume: volumeSchema,
        washes: z.number().int().min(1).max(10),
        temperatureC: temperatureC.optional(),
        /** Fraction of the retained liquor displaced by a wash of one retained volume (the wash efficiency E of R = (1 − E)^W). Default 0.8 (common practice). */
        displacementEfficiency: uncertain(0, 1).default(0.8),
        /** Fraction of the retained liquor one wash cannot displace however large it is (liquor in dead-end pores, inside agglomerates and at particle contacts; channelling): the floor of R per wash. Assumed 0.05 (common practice) when absent. */
        undisplacedFraction: uncertain(0, 0.5).optional(),
        /** Mean crystal size, µm, for the dissolution rate of the solid in the passing wash. Assumed 100 µm (with a warning) when absent. */
        crystalSizeUm: uncertain(1, 5000).optional(),
      })
      .strict()
      .optional(),
    /** Specific cake resistance α, m/kg. Default 1e10 (common practice). */
    specificCakeResistanceMPerKg: uncertain(1e6, 1e15).default(1e10),
    /** Filter-medium resistance R_m, 1/m. Default 1e10 (common practice). */
    mediumResistancePerM: uncertain(0, 1e14).default(1e10),
    /** Filter area, m². Default 0.1. */
    filterAreaM2: uncertain(1e-4, 100).default(0.1),
    /** Pressure drop across cake and medium, bar. Default 0.8 (vacuum filtration; common practice). */
    pressureDropBar: uncertain(0.01, 20).default(0.8),
  })
  .strict();

export const dryingParamsSchema = z
  .object({
    target: z.discriminatedUnion('kind', [
      z.object({ kind: z.literal('lod'), lodWtPct: uncertain(0, 50) }).strict(),
      z.object({ kind: z.literal('residual'), residualPpm: uncertain(0, 1e6) }).strict(),
    ]),
    temperatureC,
    pressureMbar: uncertain(...RANGES.pressureMbar),
    /** Time allowed in the dryer, h: drying stops at the target or at this time. 12 h when absent (common practice). */
    maxHours: uncertain(0.1, 1000).optional(),
    /** Drying coefficient k_d, mol of vapour per kg of dry solid per hour per unit driving force (p* − p)/P. Assumed 0.5 (with a warning) when absent. */
    dryingCoefficient: uncertain(1e-4, 1e4).optional(),
    /** Critical solvent content X_c, kg of solvent per kg of dry solid, where the falling-rate period begins. Assumed 0.05 (with a warning) when absent. */
    criticalContentKgPerKg: uncertain(1e-4, 5).optional(),
    /** Inert gas through the dryer (nitrogen bleed or sweep), normal litres per minute per kg of dry solid; 0 for a closed vacuum dryer. Assumed 0.2 (with a warning) when absent. */
    inertGasNLPerMinPerKg: uncertain(0, 1000).optional(),
  })
  .strict();

export const quenchParamsSchema = z
  .object({
    /** The reagent: a compound or aqueous-solute component. */
    reagentId: id,
    equiv: uncertain(...RANGES.equiv),
    /** Optional carrier liquid in which the reagent is charged (e.g. water). */
    carrier: z.object({ solventId: id, volume: volumeSchema }).strict().optional(),
    /** The component the reagent reacts with. */
    reactsWith: id,
    /** Stoichiometric coefficients: reagent + substrate → products. */
    stoichiometry: z
      .object({ reagent: finite().positive(), substrate: finite().positive() })
      .strict()
      .default({ reagent: 1, substrate: 1 }),
    products: z
      .array(z.object({ componentId: id, molPerMolSubstrate: finite().positive() }).strict())
      .max(10)
      .default([]),
    temperatureC,
    /** Reaction enthalpy, kJ per mol of substrate (negative = exothermic), if known. */
    reactionEnthalpyKJmol: finite().min(-2000).max(2000).optional(),
    /** Heat capacity of the mixture, kJ/(kg K), for the adiabatic temperature rise. */
    heatCapacityKJkgK: finite().positive().max(10).optional(),
  })
  .strict();

export const phAdjustParamsSchema = z
  .object({
    reagentSoluteId: id,
    wtPct: uncertain(0.1, 60),
    targetPH: uncertain(-1, 15),
    temperatureC,
  })
  .strict();

const removalSchema = z.object({ componentId: id, fractionRemoved: uncertain(0, 1) }).strict();

export const carbonTreatmentParamsSchema = z
  .object({
    /** Carbon charge, wt % of the feed's dissolved solids. */
    carbonWtPct: uncertain(0, 100),
    removals: z.array(removalSchema).max(50),
    temperatureC,
  })
  .strict();

export const polishFiltrationParamsSchema = z
  .object({ removals: z.array(removalSchema).max(50), temperatureC: temperatureC.optional() })
  .strict();

export const splitParamsSchema = z.object({ fractionToA: uncertain(0, 1) }).strict();
export const mergeParamsSchema = z.object({}).strict();

// ----- steps, ports, connections -----------------------------------------

export type PortPhase = 'liquid' | 'organic' | 'aqueous' | 'slurry' | 'solid' | 'vapour';
export interface PortSpec {
  name: string;
  phase: PortPhase;
  required: boolean;
}
export interface KindPorts {
  inputs: readonly PortSpec[];
  outputs: readonly PortSpec[];
}

const p = (name: string, phase: PortPhase, required = true): PortSpec => ({
  name,
  phase,
  required,
});

/** The ports of every step kind, for the editor and the graph validation. */
export const PORTS = {
  charge: { inputs: [p('feed', 'liquid', false)], outputs: [p('out', 'liquid')] },
  wash: {
    inputs: [p('feed', 'liquid')],
    outputs: [p('organic', 'organic'), p('aqueous', 'aqueous')],
  },
  extraction: {
    inputs: [p('feed', 'liquid')],
    outputs: [p('organic', 'organic'), p('aqueous', 'aqueous')],
  },
  distillation: {
    inputs: [p('feed', 'liquid')],
    outputs: [p('pot', 'liquid'), p('distillate', 'liquid')],
  },
  crystallisation: {
    inputs: [p('feed', 'slurry')],
    outputs: [p('slurry', 'slurry'), p('distillate', 'liquid')],
  },
  filtration: {
    inputs: [p('slurry', 'slurry')],
    outputs: [p('cake', 'solid'), p('filtrate', 'liquid')],
  },
  drying: { inputs: [p('wet', 'solid')], outputs: [p('dry', 'solid'), p('vapour', 'vapour')] },
  quench: { inputs: [p('feed', 'liquid')], outputs: [p('out', 'liquid')] },
  'ph-adjust': { inputs: [p('feed', 'liquid')], outputs: [p('out', 'liquid')] },
  'carbon-treatment': {
    inputs: [p('feed', 'liquid')],
    outputs: [p('out', 'liquid'), p('spent', 'solid')],
  },
  'polish-filtration': {
    inputs: [p('feed', 'liquid')],
    outputs: [p('out', 'liquid'), p('retained', 'solid')],
  },
  split: { inputs: [p('feed', 'liquid')], outputs: [p('a', 'liquid'), p('b', 'liquid')] },
  merge: {
    inputs: [p('a', 'liquid'), p('b', 'liquid'), p('c', 'liquid', false)],
    outputs: [p('out', 'liquid')],
  },
} as const satisfies Record<string, KindPorts>;

export type StepKind = keyof typeof PORTS;

/** Which output phases an input port of a given phase accepts. */
export const PHASE_ACCEPTS: Record<PortPhase, readonly PortPhase[]> = {
  liquid: ['liquid', 'organic', 'aqueous'],
  organic: ['organic', 'liquid'],
  aqueous: ['aqueous', 'liquid'],
  slurry: ['slurry', 'liquid', 'organic', 'aqueous'],
  solid: ['solid', 'slurry'],
  vapour: ['vapour'],
};

const positionSchema = z.object({ x: finite(), y: finite() }).strict();
const stepBase = { id, name: text().max(200), position: positionSchema.optional() };

export const stepSchema = z.discriminatedUnion('kind', [
  z.object({ ...stepBase, kind: z.literal('charge'), params: chargeParamsSchema }).strict(),
  z.object({ ...stepBase, kind: z.literal('wash'), params: washParamsSchema }).strict(),
  z.object({ ...stepBase, kind: z.literal('extraction'), params: extractionParamsSchema }).strict(),
  z
    .object({ ...stepBase, kind: z.literal('distillation'), params: distillationParamsSchema })
    .strict(),
  z
    .object({
      ...stepBase,
      kind: z.literal('crystallisation'),
      params: crystallisationParamsSchema,
    })
    .strict(),
  z.object({ ...stepBase, kind: z.literal('filtration'), params: filtrationParamsSchema }).strict(),
  z.object({ ...stepBase, kind: z.literal('drying'), params: dryingParamsSchema }).strict(),
  z.object({ ...stepBase, kind: z.literal('quench'), params: quenchParamsSchema }).strict(),
  z.object({ ...stepBase, kind: z.literal('ph-adjust'), params: phAdjustParamsSchema }).strict(),
  z
    .object({
      ...stepBase,
      kind: z.literal('carbon-treatment'),
      params: carbonTreatmentParamsSchema,
    })
    .strict(),
  z
    .object({
      ...stepBase,
      kind: z.literal('polish-filtration'),
      params: polishFiltrationParamsSchema,
    })
    .strict(),
  z.object({ ...stepBase, kind: z.literal('split'), params: splitParamsSchema }).strict(),
  z.object({ ...stepBase, kind: z.literal('merge'), params: mergeParamsSchema }).strict(),
]);
export type RouteStep = z.infer<typeof stepSchema>;
export type StepOf<K extends StepKind> = Extract<RouteStep, { kind: K }>;
export type ParamsOf<K extends StepKind> = StepOf<K>['params'];

const endpointSchema = z.object({ stepId: id, port: text().min(1).max(40) }).strict();
export const connectionSchema = z.object({ id, from: endpointSchema, to: endpointSchema }).strict();
export type RouteConnection = z.infer<typeof connectionSchema>;

export const routeDocumentSchema = z
  .object({
    schemaVersion: z.literal(ROUTE_SCHEMA_VERSION),
    name: text().max(200).optional(),
    /** The input mass that "vol" and "equiv" refer to. */
    referenceInput: z.object({ componentId: id, massKg: finite().positive().max(1e7) }).strict(),
    components: z.array(componentSchema).min(1).max(100),
    steps: z.array(stepSchema).min(1).max(1000),
    connections: z.array(connectionSchema).max(5000),
  })
  .strict();
export type RouteDocument = z.infer<typeof routeDocumentSchema>;
/** The document as written, before defaults are applied. */
export type RouteDocumentInput = z.input<typeof routeDocumentSchema>;

// ----- result shapes (validated on the client when read back) -------------

export const warningSchema = z.object({
  severity: z.enum(['info', 'advisory', 'warning', 'hazard']),
  code: text(),
  message: text(),
});
export type EngineWarning = z.infer<typeof warningSchema>;

export const methodSchema = z.object({ what: text(), method: text(), source: text() });
export type MethodUsed = z.infer<typeof methodSchema>;

export const streamSchema = z.object({
  phase: z.enum(['liquid', 'organic', 'aqueous', 'slurry', 'solid', 'vapour']),
  temperatureK: z.number(),
  /** Total kg of each component (dissolved, liquid and solid). */
  kg: z.record(text(), z.number()),
  /** The part of `kg` present as solid. */
  solidKg: z.record(text(), z.number()),
  /** Volume by ideal mixing of the components, m³. */
  volumeM3: z.number(),
});
export type StreamShape = z.infer<typeof streamSchema>;
