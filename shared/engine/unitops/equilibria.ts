/**
 * Phase equilibria the step models share: the VLE system of the volatile
 * solvents, the split of a liquid into organic and aqueous phases (mutual
 * solubility), the pH of an aqueous phase, and distribution ratios of solutes.
 */
import {
  createVleSystem,
  liquidLiquidSplit,
  type VleComponent,
  type VleSystem,
} from '../thermo/vle';
import type { RegressedPair } from '../thermo/nrtl';
import { vleComponentOf } from '../thermo/mutual-solubility';
import {
  distributionRatio,
  neutralFraction,
  partitionByActivity,
  type PKa,
} from '../properties/partition';
import { solventById } from '../data/index';
import type { SolventRecord, UnifacGroups } from '../data/types';
import type { EvalContext } from '../route/context';
import { warn, method } from '../route/context';
import type { EngineWarning, MethodUsed } from '../route/types';

// ---------------------------------------------------------------- VLE ----

export interface SolventVle {
  ids: string[];
  sys: VleSystem;
}

/** The solvent components of the route, in id order (volatile liquids). *
 * Source: the route document (no physics).
 * Validity: any route.
 * @param ctx  evaluation context (route components resolved against the library)
 * @returns ids of the solvent components, in route order
 */
export function solventIds(ctx: EvalContext): string[] {
  return ctx.ids.filter((id) => ctx.comps.get(id)!.kind === 'solvent');
}

const vleCache = new Map<string, VleSystem>();

/**
 * VLE system (UNIFAC + Antoine, modified Raoult) over the given solvent
 * components. Solutes are treated as non-volatile and left out of the
 * activity coefficients (dilute-solution assumption, stated in the methods).
 * Systems are memoised by their solvent list (pure: same inputs, same system).
 *
 * Source: createVleSystem (thermo/vle.ts): UNIFAC, Hansen et al. 1991; regressed water pairs, Renon & Prausnitz 1968.
 * Validity: as createVleSystem.
 * @param ctx  evaluation context (route components resolved against the library)
 * @param ids  solvent component ids of the system
 * @returns the ids and the memoised VLE system; throws when UNIFAC lacks a group pair
 */
export function solventVle(ctx: EvalContext, ids: string[]): SolventVle {
  const key = ids.map((id) => ctx.comps.get(id)!.solvent!.id).join('|');
  let sys = vleCache.get(key);
  if (!sys) {
    const water = solventById('water');
    const comps: VleComponent[] = ids.map((id) =>
      vleComponentOf(ctx.comps.get(id)!.solvent!, water),
    );
    sys = createVleSystem(comps);
    if (vleCache.size > 200) vleCache.clear();
    vleCache.set(key, sys);
  }
  return { ids, sys };
}

// ------------------------------------------------------ phase split ----

export interface LiquidSplit {
  split: boolean;
  /** Solvent kg in each phase (non-solvent components are not included). */
  organicKg: Record<string, number>;
  aqueousKg: Record<string, number>;
  method: string;
}

/**
 * The two liquids of the last liquid–liquid flash at one wash stage, to start the next pass over
 * the same stage from (filled and read by splitLiquid; valid for the same solvents and temperature).
 * Owned by one step's evaluation only, so a step's result depends on its own inputs alone.
 */
export interface LiquidSplitStart {
  key?: string;
  phases?: [number[], number[]];
}

/**
 * One liquid phase: every solvent to the aqueous or the organic side (a module-level function,
 * not a closure per call: splitLiquid runs at every wash stage).
 */
function singlePhase(
  ids: readonly string[],
  kg: Record<string, number>,
  organicKg: Record<string, number>,
  aqueousKg: Record<string, number>,
  toAqueous: boolean,
  why: string,
): LiquidSplit {
  for (const id of ids) (toAqueous ? aqueousKg : organicKg)[id] = kg[id];
  return { split: false, organicKg, aqueousKg, method: why };
}

/**
 * Split the solvents of a liquid into two phases at T.
 *
 * Every solvent distributes by its own activity: one liquid–liquid flash
 * (tangent-plane stability, Rachford–Rice; thermo/vle.ts liquidLiquidSplit)
 * with the activity model of createVleSystem — UNIFAC plus, for each
 * water–solvent pair with tabulated mutual solubilities, an NRTL (else
 * Margules) term regressed so that the binary reproduces the tabulated
 * phases exactly at the tabulated temperature (thermo/nrtl.ts). So the two
 * phases are the mutually saturated phases at the wash temperature, minor
 * solvents (however little of them) partition by their own activity
 * coefficients, and a solvent without tabulated data follows UNIFAC. Away
 * from the tabulated temperature the mutual solubility follows the
 * temperature dependence of UNIFAC with constant pair energies (NRTL τ = b/T;
 * the library holds one temperature per pair), with an information note
 * beyond 15 K. Where the main organic solvent's tabulated mutual solubility
 * cannot be fitted by a stable model (thermo/nrtl.ts keeps only fits that are
 * globally stable), the tabulated phases are used by the lever rule
 *   W = A(1 − w_s) + G w_w,   O = A w_s + G (1 − w_w)
 * (A, G the aqueous and organic phase masses) and the other organic solvents
 * split like it, with a note saying so. No split → everything in one phase,
 * with a warning.
 * Salting-out of the organic solvent by brine is not modelled.
 *
 * @param kg   kg of each component [kg] (non-solvents ignored)
 * @param T_K  temperature [K]
 * @returns the solvent kg of each phase [kg] and whether two phases form
 *
 * Validity: as liquidLiquidSplit; 0–80 °C.
 *
 * Source: thermo/vle.ts liquidLiquidSplit (Michelsen 1982; Rachford & Rice 1952) with the regressed liquid model (thermo/nrtl.ts); lever rule: mass balance.
 * @param ctx  evaluation context (route components resolved against the library)
 * @param warnings  receives the notes and warnings of the split
 * @param methods   receives the method used
 * @param start     the stage's previous phases, read and updated (a warm start of the flash: the
 *                  same split to the flash's tolerance), or undefined
 */
export function splitLiquid(
  ctx: EvalContext,
  kg: Record<string, number>,
  T_K: number,
  warnings: EngineWarning[],
  methods: MethodUsed[],
  start?: LiquidSplitStart,
): LiquidSplit {
  const ids = solventIds(ctx).filter((id) => kg[id] > 0);
  const organicKg: Record<string, number> = {};
  const aqueousKg: Record<string, number> = {};
  for (const id of ids) {
    organicKg[id] = 0;
    aqueousKg[id] = 0;
  }
  const w = ctx.waterId;
  if (ids.length === 0) return singlePhase(ids, kg, organicKg, aqueousKg, false, 'no solvent');
  const organics = ids.filter((id) => id !== w);
  if (!w || !(kg[w] > 0)) {
    if (organics.length < 2) return singlePhase(ids, kg, organicKg, aqueousKg, false, 'one liquid');
  } else if (organics.length === 0) {
    return singlePhase(ids, kg, organicKg, aqueousKg, true, 'water only');
  }
  let vle: SolventVle | null = null;
  let vleError: Error | null = null;
  try {
    vle = solventVle(ctx, ids);
  } catch (e) {
    vleError = e as Error;
  }
  const orgTotal = organics.reduce((a, id) => a + kg[id], 0);
  const main = organics.reduce((m, id) => (kg[id] > kg[m] ? id : m), organics[0]);
  const mainRec = ctx.comps.get(main)!.solvent!;
  const fitted = new Set(vle ? vle.sys.regressedPairs.map((p) => ids[p.solvent]) : []);

  if (w && kg[w] > 0 && mainRec.waterMutualSolubility && !fitted.has(main)) {
    // Tabulated mutual solubility and no regressed liquid model for it: the measured phases
    // win over UNIFAC alone (lever rule at the tabulated temperature; other solvents follow).
    const ms = mainRec.waterMutualSolubility.value;
    const ws = ms.solventInWaterWtPct / 100;
    const ww = ms.waterInSolventWtPct / 100;
    const W = kg[w];
    const O = orgTotal;
    const det = (1 - ws) * (1 - ww) - ws * ww;
    const A = (W * (1 - ww) - O * ww) / det;
    const G = (O * (1 - ws) - W * ws) / det;
    // Two causes reach this branch: UNIFAC has no parameters for a group pair of the liquid (no
    // activity model at all: e.g. an ester or ether with DMAc or NMP), or the pair could not be
    // fitted as a stable split. Say which, since the first one also leaves the other solvents'
    // split unmodelled (a water-miscible one among them goes largely to the water in fact).
    const others = orgTotal > kg[main];
    method(
      methods,
      'phase split',
      vleError
        ? 'mutual solubility (lever rule on tabulated mutual solubilities; UNIFAC has no parameters for this liquid)'
        : 'mutual solubility (lever rule on tabulated mutual solubilities; no stable liquid model reproduces them)',
      `${mainRec.name}–water: ${mainRec.waterMutualSolubility.source.ref} (${mainRec.waterMutualSolubility.source.status})`,
    );
    warn(
      warnings,
      vleError && others ? 'warning' : 'info',
      'mutual-solubility-not-fitted',
      `${vleError ? `No liquid model can be built for this liquid (${vleError.message})` : `No liquid model reproduces the measured mutual solubility of ${mainRec.name} and water as a stable split`}, so the measured ${mainRec.name}–water phases (${ms.temperatureC} °C) are used as they are, at any temperature${others ? `, and the other organic solvents (${((100 * (orgTotal - kg[main])) / orgTotal).toFixed(1)} % of the organic solvents) are assumed to split like ${mainRec.name}${vleError ? ': a water-miscible one among them in fact goes largely to the water, so check its split by analysis' : ''}` : ''}.`,
    );
    if (A <= 0) {
      warn(
        warnings,
        'warning',
        'no-phase-split',
        `All the water dissolves in ${mainRec.name}: one liquid phase, nothing separates.`,
      );
      return singlePhase(
        ids,
        kg,
        organicKg,
        aqueousKg,
        false,
        'mutual solubility: single organic phase',
      );
    }
    if (G <= 0) {
      warn(
        warnings,
        'warning',
        'no-phase-split',
        `All the ${mainRec.name} dissolves in the water: one liquid phase, nothing separates.`,
      );
      return singlePhase(
        ids,
        kg,
        organicKg,
        aqueousKg,
        true,
        'mutual solubility: single aqueous phase',
      );
    }
    const solventInAq = A * ws;
    for (const id of organics) {
      const share = O > 0 ? kg[id] / O : 0;
      aqueousKg[id] = Math.min(kg[id], solventInAq * share);
      organicKg[id] = kg[id] - aqueousKg[id];
    }
    aqueousKg[w] = Math.min(W, A * (1 - ws));
    organicKg[w] = W - aqueousKg[w];
    return { split: true, organicKg, aqueousKg, method: 'mutual solubility' };
  }

  // Liquid–liquid flash with the regressed activity model.
  try {
    if (!vle) throw vleError ?? new Error('no liquid model');
    const mol = ids.map((id) => kg[id] / ctx.comps.get(id)!.molarMassKgMol);
    const N = mol.reduce((a, b) => a + b, 0);
    const z = mol.map((m) => m / N);
    const key = start && `${T_K}|${ids.join('|')}`;
    const r = liquidLiquidSplit(
      vle.sys,
      z,
      T_K,
      start && start.key === key ? start.phases : undefined,
    );
    if (start) {
      start.key = key;
      start.phases = r.split ? r.phases : undefined;
    }
    for (const m of r.warnings) warn(warnings, 'info', 'lle', m);
    const { tabulated, untabulated, methodText, sources, pairBySolvent } = flashDescription(
      ctx,
      ids,
      organics,
      fitted,
      vle,
    );
    method(methods, 'phase split', methodText, sources);
    for (const id of tabulated) {
      const rec = ctx.comps.get(id)!.solvent!;
      // Measured over a range of temperatures: the fitted temperature dependence holds inside
      // it; outside, the flash's own note (code 'lle', pairRangeWarnings) says it is extrapolated.
      if (pairBySolvent.get(id)?.fittedRangeK) continue;
      const tC = rec.waterMutualSolubility!.value.temperatureC;
      if (Math.abs(T_K - 273.15 - tC) > 15)
        warn(
          warnings,
          'info',
          'mutual-solubility-temperature',
          `Mutual solubility of ${rec.name} and water is tabulated at ${tC} °C; at ${(T_K - 273.15).toFixed(0)} °C it follows the temperature dependence of the fitted liquid model (UNIFAC with constant pair energies).`,
        );
    }
    if (!r.split) {
      warn(
        warnings,
        'warning',
        'no-phase-split',
        'The liquids are miscible at this composition and temperature (UNIFAC): one liquid phase, nothing separates.',
      );
      const aq = w ? (kg[w] ?? 0) / totalOf(kg, ids) > 0.5 : false;
      return singlePhase(ids, kg, organicKg, aqueousKg, aq, 'UNIFAC: single phase');
    }
    const beta = r.phaseFraction;
    const [x0, x1] = r.phases;
    // The 'aqueous' phase: the one with more water; without water (two organic liquids) the more
    // polar one, i.e. the phase in which water would have the lower activity coefficient at
    // infinite dilution (UNIFAC), e.g. acetonitrile against heptane.
    const wi = w ? ids.indexOf(w) : -1;
    const aqIndex = wi >= 0 ? (x1[wi] > x0[wi] ? 1 : 0) : morePolarPhase(ctx, ids, x0, x1, T_K);
    const xa = aqIndex === 1 ? x1 : x0;
    const fa = aqIndex === 1 ? beta : 1 - beta;
    ids.forEach((id, i) => {
      const nA = Math.min(mol[i], fa * N * xa[i]);
      aqueousKg[id] = nA * ctx.comps.get(id)!.molarMassKgMol;
      if (aqueousKg[id] > kg[id]) aqueousKg[id] = kg[id];
      organicKg[id] = kg[id] - aqueousKg[id];
    });
    if (untabulated.length)
      warn(
        warnings,
        'info',
        'unifac-mutual-solubility',
        `Mutual solubility of ${untabulated.map((id) => ctx.comps.get(id)!.name).join(', ')} with the other liquids from UNIFAC alone (no tabulated mutual solubility with water): the minor component of each phase can be off by a factor of 2–10.`,
      );
    return {
      split: true,
      organicKg,
      aqueousKg,
      method: tabulated.length ? 'regressed LLE' : 'UNIFAC LLE',
    };
  } catch (e) {
    warn(
      warnings,
      'warning',
      'no-lle-model',
      `No liquid–liquid model for these solvents (${(e as Error).message}); the organic solvents are kept in the organic phase and the water in the aqueous phase.`,
    );
    for (const id of ids) (id === w ? aqueousKg : organicKg)[id] = kg[id];
    return { split: true, organicKg, aqueousKg, method: 'assumed immiscible' };
  }
}

/** What splitLiquid states about the flash of a set of solvents (fixed for the route's components). */
interface FlashDescription {
  tabulated: string[];
  untabulated: string[];
  methodText: string;
  sources: string;
  pairBySolvent: Map<string, RegressedPair>;
}

/** Flash descriptions per context, by the solvents present (splitLiquid runs at every wash stage). */
const flashDescriptions = new WeakMap<EvalContext, Map<string, FlashDescription>>();

function flashDescription(
  ctx: EvalContext,
  ids: readonly string[],
  organics: readonly string[],
  fitted: ReadonlySet<string>,
  vle: SolventVle,
): FlashDescription {
  let byIds = flashDescriptions.get(ctx);
  if (!byIds) flashDescriptions.set(ctx, (byIds = new Map()));
  const key = ids.join('|');
  let d = byIds.get(key);
  if (d) return d;
  const tabulated = organics.filter((id) => fitted.has(id));
  d = {
    tabulated,
    untabulated: organics.filter(
      (id) => !fitted.has(id) && !ctx.comps.get(id)!.solvent!.waterMutualSolubility,
    ),
    methodText: tabulated.length
      ? 'liquid–liquid flash of every solvent by its own activity (UNIFAC with NRTL/Margules terms regressed to the tabulated mutual solubilities with water: added to UNIFAC, or NRTL in its place for a pair measured at several temperatures; tangent-plane stability, Rachford–Rice)'
      : 'UNIFAC liquid–liquid flash (tangent-plane stability, Rachford–Rice)',
    sources: [
      'Fredenslund, Jones & Prausnitz 1975; parameters Hansen et al., Ind. Eng. Chem. Res. 1991, 30, 2352',
      ...(tabulated.length ? ['NRTL: Renon & Prausnitz, AIChE J. 1968, 14, 135'] : []),
      ...tabulated.map((id) => {
        const rec = ctx.comps.get(id)!.solvent!;
        const ms = rec.waterMutualSolubility!;
        const curve = rec.waterMutualSolubilityCurve;
        const more = curve
          ? ` and at ${curve.value.map((p) => p.temperatureC).join(', ')} °C: ${curve.source.ref} (${curve.source.status})`
          : '';
        return `${rec.name}–water mutual solubility at ${ms.value.temperatureC} °C: ${ms.source.ref} (${ms.source.status})${more}`;
      }),
    ].join('; '),
    pairBySolvent: new Map(vle.sys.regressedPairs.map((p) => [ids[p.solvent], p] as const)),
  };
  byIds.set(key, d);
  return d;
}

/**
 * Which of two organic liquid phases is the more polar: the one in which water at
 * infinite dilution has the lower UNIFAC activity coefficient (γ∞ of water, a
 * model-based polarity scale). Returns 0 or 1; 1 when water has no parameters
 * against these solvents (the phase poorer in the first listed solvent).
 */
function morePolarPhase(
  ctx: EvalContext,
  ids: string[],
  x0: readonly number[],
  x1: readonly number[],
  T_K: number,
): 0 | 1 {
  const water = solventById('water');
  if (!water) return 1;
  const groups = [water.unifac.value, ...ids.map((id) => ctx.comps.get(id)!.solvent!.unifac.value)];
  const at = (x: readonly number[]) =>
    ctx.unifac.model(groups).gammas([1e-9, ...x.map((v) => v * (1 - 1e-9))], T_K)[0];
  try {
    return at(x0) < at(x1) ? 0 : 1;
  } catch {
    return 1;
  }
}

/**
 * Distribution ratio of a compound between two organic liquid phases from
 * UNIFAC activity coefficients at infinite dilution in each phase
 * (properties/partition.ts partitionByActivity):
 *   K_x = γ∞_polar / γ∞_less-polar,   D = K_c = K_x · V̄_polar / V̄_less-polar
 * (molar concentrations, less-polar phase over polar phase, the 'organic' and
 * 'aqueous' ports of the wash). Phase compositions are the solvent-only
 * compositions of the LLE split; molar volumes by ideal mixing at T.
 * Returns null (with a warning) when the compound has no UNIFAC groups or
 * UNIFAC lacks a parameter; the caller keeps the compound in the feed phase.
 *
 * @param lessPolarKg, polarKg solvent kg of each phase [kg]; T_K [K]
 *
 * Source: properties/partition.ts partitionByActivity (UNIFAC: Fredenslund, Jones & Prausnitz 1975; Hansen et al. 1991).
 * Validity: dilute solutes; UNIFAC's range (≈ 275–425 K); D typically within 0.5 log units.
 * @param ctx  evaluation context (route components resolved against the library)
 * @param compoundId  route compound id
 * @param lessPolarKg  solvent kg of the less polar phase [kg]
 * @param polarKg  solvent kg of the more polar phase [kg]
 * @param T_K  temperature [K]
 * @param warnings  receives the warnings
 * @returns D [-] with its method and source, or null
 */
export function organicOrganicDistribution(
  ctx: EvalContext,
  compoundId: string,
  lessPolarKg: Record<string, number>,
  polarKg: Record<string, number>,
  T_K: number,
  warnings: EngineWarning[],
): SoluteDistribution | null {
  const c = ctx.comps.get(compoundId)!.compound!;
  if (!c.unifac) {
    warn(
      warnings,
      'warning',
      'no-unifac-groups',
      `${c.name}: no UNIFAC groups, so no distribution between the two organic phases can be estimated; kept in the feed phase.`,
    );
    return null;
  }
  const groups = Object.fromEntries(Object.entries(c.unifac).map(([k, v]) => [Number(k), v]));
  const phase = (kg: Record<string, number>) => {
    const ids = solventIds(ctx).filter((id) => kg[id] > 0);
    const mol = ids.map((id) => kg[id] / ctx.comps.get(id)!.molarMassKgMol);
    const N = mol.reduce((a, b) => a + b, 0);
    const x = mol.map((m) => m / N);
    const v = ids.reduce(
      (a, id, i) =>
        a + x[i] * ctx.comps.get(id)!.molarMassKgMol * ctx.comps.get(id)!.specificVolume(T_K),
      0,
    );
    return {
      groups: ids.map((id) => ctx.comps.get(id)!.solvent!.unifac.value),
      moleFractions: x,
      molarVolumeM3mol: v,
    };
  };
  try {
    const r = partitionByActivity({
      soluteGroups: groups,
      organic: phase(lessPolarKg),
      aqueous: phase(polarKg),
      T_K,
      models: ctx.unifac,
    });
    for (const m of r.warnings) warn(warnings, 'info', 'distribution', `${c.name}: ${m}`);
    return {
      D: r.Kc,
      method:
        'activity-coefficient ratio at infinite dilution between the two organic phases (UNIFAC)',
      source:
        'UNIFAC: Fredenslund, Jones & Prausnitz 1975; parameters Hansen et al., Ind. Eng. Chem. Res. 1991, 30, 2352 (estimated)',
    };
  } catch (e) {
    warn(
      warnings,
      'warning',
      'no-unifac-parameters',
      `${c.name}: UNIFAC cannot estimate its distribution between the two organic phases (${(e as Error).message}); kept in the feed phase.`,
    );
    return null;
  }
}

function totalOf(kg: Record<string, number>, ids: string[]) {
  return ids.reduce((a, id) => a + kg[id], 0);
}

// ---------------------------------------------------------------- pH ----

/** Ion product of water at 25 °C, pKw = 14.00 (common textbook value). */
const PKW = 14.0;

/**
 * Mean negative charge of a polyprotic acid H_nA at [H⁺] = H [mol/L]: fractions
 * α_k ∝ Π_{j≤k} Ka_j / [H]^k, charge Σ k α_k. Ka = 10^−pKa of each step, taken once per
 * charge balance (the same numbers as taking them at every trial pH).
 */
function meanAcidCharge(Ka: readonly number[], H: number): number {
  let term = 1;
  let sum = 1;
  let charge = 0;
  for (let k = 0; k < Ka.length; k++) {
    term *= Ka[k] / H;
    sum += term;
    charge += (k + 1) * term;
  }
  return charge / sum;
}

export interface PHInput {
  /** Aqueous phase volume [m³]. */
  volumeM3: number;
  /** kg of each component in the aqueous phase. */
  kg: Record<string, number>;
  /** Include compounds with pKa values (ph-adjust), not only aqueous solutes (washes). */
  includeCompounds: boolean;
  /** Extra strong acid (+) or base (−) [mol], for titration. */
  extraStrongAcidMol?: number;
  /**
   * Ionisable compounds carried by a feed into a two-phase contact (washes):
   * total amount [mol], pKa sites, and the partition coefficient of the
   * neutral species K = c_org/c_aq [-] into an organic phase of volume
   * organicVolumeM3 [m³] (K = 0: all in the aqueous phase). Only the charged
   * species stay in water; see aqueousPH.
   */
  carried?: {
    organicVolumeM3: number;
    compounds: Array<{ mol: number; pKa: readonly PKa[]; K: number }>;
  };
}

/**
 * pH of an aqueous phase by charge balance,
 *   [H⁺] + Σ cations = [OH⁻] + Σ anions,
 * with strong acids and bases fully dissociated, weak acids and the carbonate
 * type salts by their pKa values (Henderson–Hasselbalch fractions; a salt of
 * kind 'amphoteric-salt' carries one Na⁺, 'weak-base' one Na⁺ per pKa),
 * activity coefficients = 1 (ideal dilute solution), pKw = 14 at 25 °C.
 * Solved by bisection on pH in [−2, 16] to 3e−10.
 *
 * Compounds carried into a wash (`carried`): each pKa site ionises
 * independently (Henderson–Hasselbalch), only the neutral species partitions
 * into the organic phase, so with f_n(pH) the neutral fraction and K the
 * neutral partition coefficient the total aqueous concentration is
 *   c_aq = n / (V_aq + K f_n V_org)
 * and the compound adds c_aq Σ_acid sites 1/(1 + 10^(pKa − pH)) anions and
 * c_aq Σ_base sites 1/(1 + 10^(pH − pKa)) cations to the balance. This is how
 * a bicarbonate wash facing more acid than base ends near the acid's pKa.
 * Returns null when there is no water.
 *
 * Source: charge balance with Henderson–Hasselbalch fractions (e.g. Harris, Quantitative Chemical Analysis, systematic treatment of equilibrium; cited from memory).
 * Validity: ideal dilute solution (activities = concentrations), 25 °C constants, pH −2 … 16.
 * @param ctx  evaluation context (route components resolved against the library)
 * @param input.volumeM3  aqueous phase volume [m³]
 * @param input.kg  kg of each component in the aqueous phase [kg]
 * @param input.extraStrongAcidMol  extra strong acid (+) or base (−) [mol]
 * @param input.carried  ionisable compounds carried into a contact (amounts [mol], pKa [-], K [-], organic volume [m³])
 * @returns pH [-], or null without water
 */
export function aqueousPH(ctx: EvalContext, input: PHInput): number | null {
  const VL = input.volumeM3 * 1000;
  if (!(VL > 1e-12)) return null;
  const strongAcid: number[] = [];
  const cations: number[] = [];
  const acidSystems: Array<{ c: number; pKa: number[]; Ka: number[] }> = [];
  const bases: Array<{ c: number; pKa: number }> = [];
  for (const id of ctx.ids) {
    const m = input.kg[id];
    if (!(m > 0)) continue;
    const comp = ctx.comps.get(id)!;
    const c = m / comp.molarMassKgMol / VL;
    if (comp.aqueous) {
      const ab = comp.aqueous.acidBase;
      switch (ab.kind) {
        case 'strong-acid':
          strongAcid.push(c * ab.protons);
          break;
        case 'strong-base':
          cations.push(c * ab.hydroxides);
          break;
        case 'weak-acid':
          acidSystems.push({ c, pKa: ab.pKa.value, Ka: [] });
          break;
        case 'amphoteric-salt':
          cations.push(c);
          acidSystems.push({ c, pKa: ab.pKa.value, Ka: [] });
          break;
        case 'weak-base':
          cations.push(c * ab.pKa.value.length);
          acidSystems.push({ c, pKa: ab.pKa.value, Ka: [] });
          break;
        case 'neutral':
          break;
      }
    } else if (input.includeCompounds && comp.compound?.pKa) {
      for (const p of comp.compound.pKa) {
        if (p.type === 'acid') acidSystems.push({ c, pKa: [p.value], Ka: [] });
        else bases.push({ c, pKa: p.value });
      }
    }
  }
  const carried = input.carried && input.carried.compounds.length > 0 ? input.carried : null;
  const VoL = carried ? carried.organicVolumeM3 * 1000 : 0;
  const extra = (input.extraStrongAcidMol ?? 0) / VL;
  const sA = strongAcid.reduce((a, b) => a + b, 0) + Math.max(extra, 0);
  const sB = cations.reduce((a, b) => a + b, 0) + Math.max(-extra, 0);
  for (const a of acidSystems) a.Ka = a.pKa.map((pKa) => 10 ** -pKa);
  const f = (pH: number) => {
    const H = 10 ** -pH;
    const OH = 10 ** (pH - PKW);
    let pos = H + sB;
    let neg = OH + sA;
    for (const a of acidSystems) neg += a.c * meanAcidCharge(a.Ka, H);
    for (const b of bases) pos += b.c / (1 + 10 ** (pH - b.pKa));
    if (carried) {
      for (const cc of carried.compounds) {
        let fn = 1;
        let anions = 0;
        let cations = 0;
        for (const p of cc.pKa) {
          if (p.type === 'acid') {
            const dep = 1 / (1 + 10 ** (p.value - pH));
            anions += dep;
            fn *= 1 - dep;
          } else {
            const prot = 1 / (1 + 10 ** (pH - p.value));
            cations += prot;
            fn *= 1 - prot;
          }
        }
        const cAq = cc.mol / (VL + cc.K * fn * VoL);
        neg += cAq * anions;
        pos += cAq * cations;
      }
    }
    return pos - neg;
  };
  let lo = -2;
  let hi = 16;
  for (let i = 0; i < 36; i++) {
    const mid = 0.5 * (lo + hi);
    if (f(mid) > 0) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

// ---------------------------------------------------- distribution ----

/**
 * A liquid phase as the activity-coefficient estimate needs it: UNIFAC groups
 * and mole fractions of its solvents, and its molar volume by ideal mixing at
 * T [m³/mol]; key: the composition rounded to 1e-6 (for memoising).
 */
function phaseOf(ctx: EvalContext, kg: Record<string, number>, T_K: number): PhaseDescription {
  // A wash asks for the same two phases once per compound and pH: the description of an earlier
  // request for this object is returned when the context, T and every solvent amount are the same
  // (compared exactly, so a changed amount is described afresh). The last few are kept per context.
  let kept = describedPhases.get(ctx);
  if (!kept) {
    const ids = solventIds(ctx);
    kept = { ids, next: 0, slots: [] };
    for (let k = 0; k < PHASES_KEPT; k++)
      kept.slots.push({ kg: null, T_K: NaN, amounts: new Float64Array(ids.length), phase: null });
    describedPhases.set(ctx, kept);
  }
  const { ids, slots } = kept;
  for (const slot of slots) {
    if (slot.kg !== kg || slot.T_K !== T_K) continue;
    let same = true;
    for (let i = 0; i < ids.length; i++)
      // An absent solvent is kept as NaN (a Float64Array's undefined): neither counts in the phase.
      if (!Object.is(kg[ids[i]] ?? NaN, slot.amounts[i])) {
        same = false;
        break;
      }
    if (same) return slot.phase;
  }
  const phase = describePhase(ctx, kg, T_K);
  const slot = slots[kept.next];
  kept.next = (kept.next + 1) % PHASES_KEPT;
  slot.kg = kg;
  slot.T_K = T_K;
  for (let i = 0; i < ids.length; i++) slot.amounts[i] = kg[ids[i]];
  slot.phase = phase;
  return phase;
}

type PhaseDescription = {
  groups: UnifacGroups[];
  moleFractions: number[];
  molarVolumeM3mol: number;
  key: string;
} | null;

/** Phase descriptions kept per context (phaseOf): a wash stage has two phases. */
const PHASES_KEPT = 4;

/** The last few phase descriptions of each context (phaseOf), with what each was computed from. */
const describedPhases = new WeakMap<
  EvalContext,
  {
    ids: string[];
    next: number;
    slots: Array<{
      kg: Record<string, number> | null;
      T_K: number;
      amounts: Float64Array;
      phase: PhaseDescription;
    }>;
  }
>();

function describePhase(
  ctx: EvalContext,
  kg: Record<string, number>,
  T_K: number,
): PhaseDescription {
  const ids = solventIds(ctx).filter((id) => kg[id] > 0);
  if (ids.length === 0) return null;
  const mol = ids.map((id) => kg[id] / ctx.comps.get(id)!.molarMassKgMol);
  const N = mol.reduce((a, b) => a + b, 0);
  const x = mol.map((m) => m / N);
  const v = ids.reduce(
    (a, id, i) =>
      a + x[i] * ctx.comps.get(id)!.molarMassKgMol * ctx.comps.get(id)!.specificVolume(T_K),
    0,
  );
  return {
    groups: ids.map((id) => ctx.comps.get(id)!.solvent!.unifac.value),
    moleFractions: x,
    molarVolumeM3mol: v,
    key: ids.map((id, i) => `${id}:${x[i].toFixed(6)}`).join(','),
  };
}

type ActivityEstimate = ReturnType<typeof partitionByActivity>;

/**
 * The activity-coefficient estimate of each compound between two described phases (phaseOf), kept
 * with the descriptions themselves: a wash stage asks for it twice per ionisable compound (the
 * neutral partition coefficient of the charge balance, then the distribution at the stage's pH), and
 * a description object stands for one exact composition, so the estimate is the same number.
 */
const activityEstimates = new WeakMap<object, WeakMap<object, Map<string, ActivityEstimate>>>();

function memoisedActivityEstimate(
  organic: object,
  aqueous: object,
  key: string,
): typeof partitionByActivity {
  return (input) => {
    let byAqueous = activityEstimates.get(organic);
    if (!byAqueous) activityEstimates.set(organic, (byAqueous = new WeakMap()));
    let byKey = byAqueous.get(aqueous);
    if (!byKey) byAqueous.set(aqueous, (byKey = new Map()));
    let r = byKey.get(key);
    if (!r) byKey.set(key, (r = partitionByActivity(input)));
    return r;
  };
}

export interface SoluteDistribution {
  D: number;
  method: string;
  source: string;
}

/**
 * Partition coefficient of the neutral species, K = D(pH)/f_n(pH) [-], of an
 * ionisable compound between an organic solvent and the aqueous phase, for
 * the charge balance of a wash (aqueousPH `carried`). D is evaluated by
 * compoundDistribution at whichever of pH 2, 4.5, 7, 9.5, 12 gives the largest
 * neutral fraction (to avoid dividing by a vanishing f_n); for every method
 * D = K f_n(pH) (× the salt factor), so K does not depend on that choice.
 * Returns Infinity when the compound is assumed to stay in the organic phase.
 *
 * @param salt    Setschenow constant [L/mol] and salt molarity [mol/L]
 * @param T_K     temperature [K]
 * @param phases  solvent kg of each phase [kg] (mutually saturated phases), see compoundDistribution
 *
 * Validity: as compoundDistribution.
 *
 * Source: Henderson–Hasselbalch with compoundDistribution (properties/partition.ts).
 * @param ctx  evaluation context (route components resolved against the library)
 * @param compoundId  route compound id
 * @param organicSolventComponentId  main organic solvent component id
 */
export function neutralPartitionCoefficient(
  ctx: EvalContext,
  compoundId: string,
  organicSolventComponentId: string,
  salt: { ks_Lmol: number; molar: number } | undefined,
  T_K: number,
  phases?: { organicKg: Record<string, number>; aqueousKg: Record<string, number> },
): number {
  const pKa = (ctx.comps.get(compoundId)!.compound!.pKa ?? []) as PKa[];
  let best = 7;
  let bestF = -1;
  for (const p of [2, 4.5, 7, 9.5, 12]) {
    const f = neutralFraction(pKa, p);
    if (f > bestF) {
      bestF = f;
      best = p;
    }
  }
  const d = compoundDistribution(
    ctx,
    compoundId,
    organicSolventComponentId,
    best,
    salt,
    T_K,
    [],
    phases,
  );
  if (!Number.isFinite(d.D) || !(bestF > 0)) return Infinity;
  return d.D / bestF;
}

/** A pure solvent as a phase description for the activity-coefficient estimate (ideal molar volume). */
function pureSolventPhase(s: SolventRecord) {
  return {
    groups: [s.unifac.value],
    moleFractions: [1],
    molarVolumeM3mol: (s.molarMassGmol.value / s.density.value.gPerMl) * 1e-6,
  };
}

/**
 * Distribution ratio D = c_org / c_aq (molar concentrations, all species) of
 * a route compound between the organic phase and an aqueous phase of the
 * given pH and salt, via properties/partition (measured D, else the UNIFAC
 * activity-coefficient ratio at infinite dilution, else Collander from logP;
 * Henderson–Hasselbalch and Setschenow on top).
 *
 * The activity-coefficient estimate uses the mutually saturated phases of
 * the contact when `phases` is given (every solvent of each phase by its mole
 * fraction, so the organic phase carries its dissolved water and the aqueous
 * phase its dissolved solvent), as docs/methods.md states; without it the
 * pure main solvent against pure water. Measured D and Collander refer to the
 * main solvent (organicSolventComponentId).
 *
 * @param pH      aqueous pH [-] or null (no ionisation correction)
 * @param salt    Setschenow constant [L/mol] and salt molarity [mol/L]
 * @param T_K     temperature [K]
 * @param phases  solvent kg of each phase [kg], from splitLiquid
 * @returns D [-] (Infinity when nothing is known: the compound stays organic, with a warning)
 *
 * Validity: dilute solutes; as the method used.
 *
 * Source: properties/partition.ts distributionRatio (measured D; Collander 1951; UNIFAC; Henderson–Hasselbalch; Setschenow 1889).
 * @param ctx  evaluation context (route components resolved against the library)
 * @param compoundId  route compound id
 * @param organicSolventComponentId  main organic solvent component id
 * @param warnings  receives the warnings
 */
export function compoundDistribution(
  ctx: EvalContext,
  compoundId: string,
  organicSolventComponentId: string,
  pH: number | null,
  salt: { ks_Lmol: number; molar: number } | undefined,
  T_K: number,
  warnings: EngineWarning[],
  phases?: { organicKg: Record<string, number>; aqueousKg: Record<string, number> },
): SoluteDistribution {
  const c = ctx.comps.get(compoundId)!.compound!;
  const solvent = ctx.comps.get(organicSolventComponentId)!.solvent!;
  const water = ctx.waterId ? ctx.comps.get(ctx.waterId)!.solvent : undefined;
  // Phase descriptions for the activity-coefficient estimate: the mutually saturated phases of
  // the split where given (every solvent of each phase, ideal-mixing molar volume), else the pure
  // main solvent against pure water.
  const organicPhase = phases ? phaseOf(ctx, phases.organicKg, T_K) : null;
  const aqueousPhase = phases ? phaseOf(ctx, phases.aqueousKg, T_K) : null;
  const orgDesc = organicPhase ?? pureSolventPhase(solvent);
  const aqDesc = aqueousPhase ?? (water ? pureSolventPhase(water) : undefined);
  const phaseKey =
    organicPhase && aqueousPhase ? `${organicPhase.key}/${aqueousPhase.key}` : 'pure';
  const groupsKey = `unifac-groups:${compoundId}`;
  if (c.unifac && !ctx.cache.has(groupsKey))
    ctx.cache.set(
      groupsKey,
      Object.fromEntries(Object.entries(c.unifac).map(([k, v]) => [Number(k), v])),
    );
  const groups = c.unifac ? (ctx.cache.get(groupsKey) as Record<number, number>) : undefined;
  // The same inputs give the same ratio: memoised for this evaluation (washes ask stage after stage).
  const memoKey = `${compoundId}|${organicSolventComponentId}|${pH}|${salt ? `${salt.ks_Lmol}|${salt.molar}` : '-'}|${T_K}|${phaseKey}`;
  const memo = ctx.scratch.get(memoKey) as
    { r: ReturnType<typeof distributionRatio> } | { error: string } | undefined;
  if (memo) {
    if ('error' in memo) {
      warn(warnings, 'warning', 'no-distribution-data', memo.error);
      return { D: Infinity, method: 'assumed (no data)', source: 'none' };
    }
    for (const m of memo.r.warnings) warn(warnings, 'info', 'distribution', `${c.name}: ${m}`);
    return {
      D: memo.r.D,
      method: memo.r.method,
      source: `${memo.r.source.ref} (${memo.r.source.status})`,
    };
  }
  try {
    const r = distributionRatio({
      activityEstimate:
        organicPhase && aqueousPhase
          ? memoisedActivityEstimate(organicPhase, aqueousPhase, `${compoundId}|${T_K}`)
          : undefined,
      solute: {
        logP: c.logP,
        pKa: c.pKa as PKa[] | undefined,
        unifac: groups,
        measured: c.partition?.map((p) => ({
          organicSolventId: p.organicSolventId,
          pH: p.pH,
          temperatureC: p.temperatureC,
          D: p.D,
          source: p.source,
        })),
      },
      organic: {
        solventId: solvent.id,
        groups: orgDesc.groups,
        moleFractions: orgDesc.moleFractions,
        molarVolumeM3mol: orgDesc.molarVolumeM3mol,
      },
      aqueous: {
        pH: pH ?? undefined,
        salt,
        groups: aqDesc?.groups,
        moleFractions: aqDesc?.moleFractions,
        molarVolumeM3mol: aqDesc?.molarVolumeM3mol,
      },
      T_K,
      models: ctx.unifac,
    });
    ctx.scratch.set(memoKey, { r });
    for (const m of r.warnings) warn(warnings, 'info', 'distribution', `${c.name}: ${m}`);
    return { D: r.D, method: r.method, source: `${r.source.ref} (${r.source.status})` };
  } catch (e) {
    const message = `${c.name}: no measured D, logP or UNIFAC groups (${(e as Error).message}); assumed to stay in the organic phase.`;
    ctx.scratch.set(memoKey, { error: message });
    warn(warnings, 'warning', 'no-distribution-data', message);
    return { D: Infinity, method: 'assumed (no data)', source: 'none' };
  }
}
