/**
 * Distillation from a batch still: concentration to a target volume,
 * put-and-take solvent swap, constant-volume solvent swap; at a set pressure
 * or at a set pot temperature (the pressure follows the pot liquid).
 *
 * Model: Rayleigh equation (rayleigh.ts) with the vapour from modified
 * Raoult's law and UNIFAC activity coefficients (thermo/vle.ts). While the
 * pot liquid splits into two liquid phases (water with toluene, ethyl
 * acetate, 2-MeTHF ...) the vapour is that of the heterogeneous bubble point,
 * so azeotropic removal of water comes out of the equilibrium itself.
 * Solutes (compounds and aqueous solutes) are non-volatile and are left out
 * of the activity coefficients (dilute-solution assumption; boiling-point
 * elevation by concentrated solutes is not modelled).
 *
 * Put-and-take: distil to the target volume, then `cycles` times: add the new
 * solvent, distil back to the target; the crash-out check runs at the bottom
 * of every leg. Constant volume: the new solvent is fed as fast as distillate
 * is taken, holding the starting volume; the feed and the vapour are
 * integrated together (rayleigh.ts, rayleighConstantVolume). Every leg is
 * integrated adaptively to DISTILLATION_TOLERANCE_X (1e-6) in the liquid mole
 * fractions. Volumes are at 20 °C.
 *
 * Units: volumes [m³] inside, reported in L; T [K] inside, reported in °C;
 * P [Pa] inside, reported in mbar.
 */
import type { ParamsOf, RouteStep } from '../document';
import { RANGES } from '../document';
import {
  bubblePoint,
  bubblePressure,
  extrapolationLog,
  extrapolationWarnings,
  heterogeneousBubblePoint,
  heterogeneousBubblePressure,
  liquidLiquidSplit,
  logExtrapolation,
  type HeterogeneousBubblePoint,
} from '../thermo/vle';
import type { EvalContext } from '../route/context';
import {
  commonCautions,
  emptyStream,
  finishStream,
  method,
  cToK,
  solventKgFromVolume,
  streamVolume,
  volumeToM3,
  warn,
} from '../route/context';
import { StepError } from '../route/errors';
import { listInWords } from '../route/step-words';
import { UnifacParameterError } from '../errors';
import { UNIFAC_SUBGROUPS } from '../data/unifac';
import type { EngineWarning, MethodUsed, StepOutput, Stream } from '../route/types';
import { COMMON_PRACTICE_BASIS, COMMON_PRACTICE_HOURS, newResult, round } from './common';
import { solventVle } from './equilibria';
import {
  RAYLEIGH_TOLERANCE_X,
  rayleighConstantVolume,
  rayleighToVolume,
  type PotVle,
} from './rayleigh';
import { solubilityIn } from './solubility-model';

/**
 * Why the pot solvents have no boiling model, in the chemist's words: the solvents by name and,
 * when UNIFAC lacks an interaction pair, which solvents carry the two groups (never group numbers
 * or the model's own message).
 * Source: UNIFAC main groups and parameter table of Hansen et al., Ind. Eng. Chem. Res. 1991, 30,
 * 2352 (data/unifac.ts); wording this project's own.
 * Validity: any error thrown while building the pot's VLE system.
 * @param ctx  evaluation context (component names and solvent records)
 * @param vol  ids of the volatile solvents in the pot
 * @param e    the error the VLE system threw
 * @returns the StepError to throw, naming the step when the evaluation catches it
 */
function noBoilingModel(ctx: EvalContext, vol: readonly string[], e: unknown): StepError {
  const names = vol.map((id) => ctx.comps.get(id)!.name);
  const solvents = listInWords(names);
  const groupsOf = (id: string) =>
    Object.keys(ctx.comps.get(id)!.solvent?.unifac.value ?? {}).map(
      (g) => UNIFAC_SUBGROUPS.get(Number(g))?.mainGroup,
    );
  const carrying = (main: number) =>
    vol.filter((id) => groupsOf(id).includes(main)).map((id) => ctx.comps.get(id)!.name);
  let why = 'the group-contribution method (UNIFAC) cannot describe them';
  if (e instanceof UnifacParameterError && e.gap.missingPairs.length > 0) {
    const pairs = e.gap.missingPairs.map((p) => {
      const a = listInWords(carrying(p.mainGroupA));
      const b = listInWords(carrying(p.mainGroupB));
      return a && b && a !== b ? `${a} and ${b}` : a || b;
    });
    why = `the group-contribution method (UNIFAC) has no published parameters between ${listInWords([...new Set(pairs)])}`;
  } else if (e instanceof UnifacParameterError && e.gap.unknownSubgroups.length > 0) {
    const odd = vol
      .filter((id) =>
        Object.keys(ctx.comps.get(id)!.solvent?.unifac.value ?? {}).some((g) =>
          e.gap.unknownSubgroups.includes(Number(g)),
        ),
      )
      .map((id) => ctx.comps.get(id)!.name);
    why = `the group-contribution method (UNIFAC) does not know a structure group of ${listInWords(odd) || 'one of them'}`;
  }
  const advice =
    vol.length > 1
      ? 'take one of them out before this step (for example by a wash) or choose another solvent'
      : 'choose another solvent';
  return new StepError(
    'params',
    `No boiling model for ${solvents} in the pot: ${why}; ${advice}.`,
    (step) =>
      `${step} cannot work out how ${solvents} boil${vol.length > 1 ? ' together' : ''}: ${why}. To distil, ${advice}.`,
  );
}

/** Reference temperature of reported and target volumes [K]. */
export const VOLUME_REFERENCE_K = 293.15;
/** End accuracy of every distillation leg in the liquid mole fractions [–] (docs/methods.md). */
export const DISTILLATION_TOLERANCE_X = RAYLEIGH_TOLERANCE_X;

export type DistillationCondition =
  { kind: 'pressure'; P_Pa: number } | { kind: 'pot-temperature'; T_K: number };

export interface ProfilePoint {
  distillateL: number;
  potVolumeL: number;
  potTemperatureC: number;
  pressureMbar: number;
  newSolventAddedL: number;
  /** Original solvents as wt % of all solvents in the pot. */
  originalSolventWtPct: number;
}

export interface DistilState {
  pot: Record<string, number>;
  distillate: Record<string, number>;
  profile: ProfilePoint[];
  newSolventAddedM3: number;
  distillateM3: number;
  originalSolventIds: string[];
  lastT_K: number;
  maxT_K: number;
  minVolumeM3: number;
  maxVolumeM3: number;
}

const MBAR = 100;

function originalWtPct(ctx: EvalContext, st: DistilState): number {
  let orig = 0;
  let all = 0;
  for (const id of ctx.ids) {
    if (ctx.comps.get(id)!.kind !== 'solvent') continue;
    all += st.pot[id];
    if (st.originalSolventIds.includes(id)) orig += st.pot[id];
  }
  return all > 0 ? (100 * orig) / all : 0;
}

/** The solvent fed during a constant-volume leg (distilLeg). */
export interface LegFeed {
  /** Solvent fed as fast as it distils (constant-volume mode). */
  solventId: string;
  /** Volume fed during the leg, at 20 °C [m³]. */
  m3: number;
  /** Adds the fed solvent to the pot and the step's bookkeeping (kg from the volume at 20 °C). */
  add: (m3: number) => void;
}

/** Temperature at which the condensate settles in a decanter (Dean–Stark trap) [K]. */
export const DECANTER_K = VOLUME_REFERENCE_K;

/**
 * Distil the pot in `st` to `targetM3` (volume at 20 °C) by the Rayleigh
 * equation with the UNIFAC VLE; updates st (pot, distillate, profile).
 * Formula: dn_i/ds = −y_i / Σ_j y_j v_j (s the distilled volume, v_j molar
 * volumes at 20 °C), y from the bubble point at the set pressure or the
 * bubble pressure at the set pot temperature (heterogeneous bubble point
 * while the pot liquid splits); with `feed`, the constant-volume form
 * (rayleighConstantVolume); with `decanter`, the water-rich layer of the
 * condensate (split at DECANTER_K) is what leaves the pot.
 *
 * Source: Rayleigh, Phil. Mag. 1902, 4, 521; modified Raoult's law with
 * UNIFAC (Hansen et al., Ind. Eng. Chem. Res. 1991, 30, 2352) and the
 * regressed water pairs (thermo/nrtl.ts); Dormand–Prince 5(4) integration
 * (numerics/ode.ts); Brent's method for the pressure at a set pot
 * temperature (numerics/roots.ts).
 * Validity: one equilibrium stage (no reflux, no column), solutes
 * non-volatile and left out of the activity coefficients (no boiling-point
 * elevation); as the VLE model (UNIFAC 0–150 °C, Antoine ranges with the
 * anchored extrapolation of thermo/antoine.ts).
 * @param ctx         evaluation context (route components resolved against the library)
 * @param st          the distillation state (pot, distillate, profile; modified)
 * @param targetM3    pot volume to distil to, at 20 °C [m³]
 * @param cond        set pressure [Pa] or set pot temperature [K]
 * @param toleranceX  end accuracy in every liquid mole fraction [–]
 * @param warnings    receives the warnings of the leg
 * @param methods     receives the methods used
 * @param feed        the solvent fed as fast as it distils (constant-volume mode), volume [m³]
 * @param decanter    whether a decanter (Dean–Stark trap) returns the organic layer
 * @returns nothing; the leg's result is written into st
 */
export function distilLeg(
  ctx: EvalContext,
  st: DistilState,
  targetM3: number,
  cond: DistillationCondition,
  toleranceX: number,
  warnings: EngineWarning[],
  methods: MethodUsed[],
  feed?: LegFeed,
  decanter = false,
) {
  const vol = ctx.ids.filter(
    (id) => ctx.comps.get(id)!.kind === 'solvent' && (st.pot[id] > 0 || id === feed?.solventId),
  );
  // An empty pot (no volatile solvent at all, e.g. the feed stream is empty): nothing to distil, and in
  // constant-volume mode nothing is fed either (there is no pot volume to hold).
  if (vol.length === 0 || vol.every((id) => !(st.pot[id] > 0))) {
    warn(warnings, 'warning', 'nothing-to-distil', 'No volatile solvent is left in the pot.');
    return;
  }
  let fixed = 0;
  for (const id of ctx.ids)
    if (!vol.includes(id) && st.pot[id] > 0)
      fixed += st.pot[id] * ctx.comps.get(id)!.specificVolume(VOLUME_REFERENCE_K);
  const M = vol.map((id) => ctx.comps.get(id)!.molarMassKgMol);
  const moles = Float64Array.from(vol.map((id, i) => st.pot[id] / M[i]));
  const charged = Float64Array.from(moles);
  const mv = Float64Array.from(
    vol.map((id, i) => M[i] * ctx.comps.get(id)!.specificVolume(VOLUME_REFERENCE_K)),
  );
  let sys;
  try {
    sys = solventVle(ctx, vol).sys;
  } catch (e) {
    throw noBoilingModel(ctx, vol, e);
  }
  const x = new Array<number>(vol.length);
  const norm = (m: Float64Array) => {
    let t = 0;
    for (let i = 0; i < m.length; i++) t += m[i];
    for (let i = 0; i < m.length; i++) x[i] = m[i] / t;
    return x;
  };
  // Two liquid phases at the start of the leg? Then every evaluation asks for the boiling point of a
  // liquid that may split (heterogeneousBubblePoint, which returns the one-liquid bubble point once the
  // split has gone), so the vapour is a function of the pot contents alone, as the integrator needs.
  const mayDemix =
    vol.length > 1 && liquidLiquidSplit(sys, norm(moles), Math.min(st.lastT_K, 373.15)).split;
  const vleWarnings = new Set<string>();
  // Data used outside its range is said once per solvent (or pair) and cause, with the range of
  // temperatures met, not once for every temperature the integrator evaluates.
  const extrapolated = extrapolationLog(sys);
  const note = (T: number, xs: ArrayLike<number>, ws: readonly string[]) => {
    for (const w of logExtrapolation(extrapolated, T, xs, ws)) vleWarnings.add(w);
  };
  // The last boiling point of the two-liquid pot, to start the next one from (the integrator's
  // evaluations are close together): its flash and temperature are the starting guesses only, so
  // the answer is the same to the solver's tolerances.
  let previous: HeterogeneousBubblePoint | undefined;
  let previousPhases: [number[], number[]] | undefined;
  const potVle: PotVle = (m) => {
    const xs = norm(m);
    if (cond.kind === 'pressure') {
      if (mayDemix) {
        const r = heterogeneousBubblePoint(sys, xs, cond.P_Pa, { previous });
        previous = r;
        note(r.T_K, xs, r.warnings);
        return { T_K: r.T_K, P_Pa: cond.P_Pa, y: r.y };
      }
      const r = bubblePoint(sys, xs, cond.P_Pa, { T0_K: st.lastT_K });
      note(r.T_K, xs, r.warnings);
      st.lastT_K = r.T_K;
      return { T_K: r.T_K, P_Pa: cond.P_Pa, y: r.y };
    }
    if (mayDemix) {
      // The liquids that boil together at the set pot temperature are the split at that temperature
      // (liquid–liquid equilibrium does not depend on pressure here), and the pressure is the bubble
      // pressure of one of them (heterogeneousBubblePressure): no root search on the pressure. The
      // flash starts from the last step's two liquids.
      const r = heterogeneousBubblePressure(sys, xs, cond.T_K, previousPhases);
      previousPhases = r.phases;
      note(cond.T_K, xs, r.warnings);
      return { T_K: cond.T_K, P_Pa: r.P_Pa, y: r.y };
    }
    const r = bubblePressure(sys, xs, cond.T_K);
    note(cond.T_K, xs, r.warnings);
    return { T_K: cond.T_K, P_Pa: r.P_Pa, y: r.y };
  };
  // Decanter (Dean–Stark trap): the condensate settles at DECANTER_K; the water-rich layer is taken
  // off and the organic layer runs back to the pot, so what leaves the pot is the water-rich layer of
  // the condensate (liquidLiquidSplit with the liquid model regressed to the mutual solubilities).
  // Once the condensate no longer separates (the water is off), it is taken off whole.
  const w = ctx.waterId ? vol.indexOf(ctx.waterId) : -1;
  let decanted = false;
  let stoppedSeparating = false;
  const removed: PotVle =
    decanter && w >= 0 && vol.length > 1
      ? (m) => {
          const v = potVle(m);
          const y = Array.from(v.y as ArrayLike<number>);
          const split = liquidLiquidSplit(sys, y, DECANTER_K);
          if (!split.split) {
            if (decanted) stoppedSeparating = true;
            return v;
          }
          decanted = true;
          const [a, b] = split.phases;
          return { ...v, y: a[w] >= b[w] ? a : b };
        }
      : potVle;
  if (decanter) {
    if (w < 0 || !(st.pot[ctx.waterId!] > 0) || vol.length < 2)
      warn(
        warnings,
        'info',
        'decanter-idle',
        'The decanter separates nothing: the pot holds no water besides one solvent, so the condensate is taken off whole.',
      );
    method(
      methods,
      'decanter',
      `Decanter (Dean–Stark trap): the condensate settles at ${(DECANTER_K - 273.15).toFixed(0)} °C; the water-rich layer is taken off, the organic layer returns to the pot; layers from the liquid–liquid split of the regressed liquid model`,
      'Liquid–liquid split: Michelsen, Fluid Phase Equilib. 1982, 9, 1; mutual solubilities from the solvent library (thermo/nrtl.ts)',
    );
  }
  method(
    methods,
    'distillation',
    `Rayleigh equation integrated adaptively (Dormand–Prince 5(4), ${toleranceX.toExponential(0)} in liquid mole fraction), modified Raoult with UNIFAC; heterogeneous bubble point while two liquids are present`,
    'Rayleigh, Phil. Mag. 1902, 4, 521; UNIFAC: Hansen et al., Ind. Eng. Chem. Res. 1991, 30, 2352; Antoine constants from the solvent library',
  );
  let r;
  if (feed) {
    // Constant volume: the fed solvent replaces the distillate volume for volume.
    r = rayleighConstantVolume(
      moles,
      mv,
      vol.indexOf(feed.solventId),
      feed.m3,
      removed,
      { toleranceX },
      fixed,
    );
    feed.add(feed.m3);
  } else {
    r = rayleighToVolume(moles, mv, fixed, targetM3, removed, { toleranceX });
  }
  if (decanted)
    warn(
      warnings,
      stoppedSeparating ? 'warning' : 'info',
      'decanter',
      stoppedSeparating
        ? 'The condensate stopped separating in the decanter during the distillation: the water that can be removed this way is off, and from there the condensate is taken off whole (the organic solvent distils too).'
        : 'The decanter took off the water-rich layer and returned the organic layer to the pot throughout; the distillate is the water-rich layer. Size the trap for its volume.',
    );
  if (!r.converged)
    warn(
      warnings,
      'warning',
      'distillation-not-converged',
      `The distillation integral did not reach its tolerance (${r.reason} after ${r.steps} steps): pot and distillate compositions are approximate.`,
    );
  for (const w of extrapolationWarnings(extrapolated)) vleWarnings.add(w);
  for (const w of vleWarnings) warn(warnings, 'info', 'vle', w);
  if (r.exhausted)
    warn(
      warnings,
      'warning',
      'target-below-solids',
      'The volatile solvents ran out before the target volume: the pot is at dryness (the non-volatile contents exceed the target volume).',
    );
  // The pot takes the integrator's moles left (exactly 0 at dryness) rather than the charge less the
  // moles distilled: the difference of two nearly equal numbers leaves a dust of solvent (1e-19 kg)
  // that later steps would read as a liquor (a "dry" pot in which everything stays dissolved).
  // A solvent the integrator left untouched (a leg that distils nothing) keeps its kilograms to the
  // bit: kg / M · M need not give them back, and the difference would be a distillate of dust.
  vol.forEach((id, i) => {
    if (r.moles[i] === charged[i]) return;
    const left = Math.min(st.pot[id], Math.max(0, r.moles[i] * M[i]));
    st.distillate[id] += st.pot[id] - left;
    st.pot[id] = left;
  });
  const base = st.distillateM3;
  const fedBase = st.newSolventAddedM3 - (feed?.m3 ?? 0);
  // Original solvents as wt % of the solvents in the pot at each point of the profile.
  const originalShare = (m: Float64Array): number => {
    let orig = 0;
    let all = 0;
    for (const id of ctx.ids) {
      if (ctx.comps.get(id)!.kind !== 'solvent') continue;
      const i = vol.indexOf(id);
      const kg = i >= 0 ? m[i] * M[i] : st.pot[id];
      all += kg;
      if (st.originalSolventIds.includes(id)) orig += kg;
    }
    return all > 0 ? (100 * orig) / all : 0;
  };
  // The first leg also reports its starting point (the feed as it starts to boil).
  for (const p of st.profile.length === 0 ? r.profile : r.profile.slice(1)) {
    st.maxT_K = Math.max(st.maxT_K, p.T_K);
    st.minVolumeM3 = Math.min(st.minVolumeM3, p.volume);
    st.lastT_K = p.T_K;
    st.profile.push({
      distillateL: round((base + p.distilled) * 1000, 4),
      potVolumeL: round(p.volume * 1000, 4),
      potTemperatureC: round(p.T_K - 273.15, 3),
      pressureMbar: round(p.P_Pa / MBAR, 2),
      newSolventAddedL: round(
        (p.fed !== undefined ? fedBase + p.fed : st.newSolventAddedM3) * 1000,
        4,
      ),
      originalSolventWtPct: round(originalShare(p.moles), 4),
    });
  }
  if (r.profile.length > 0) {
    st.lastT_K = r.profile[r.profile.length - 1].T_K;
    st.maxT_K = Math.max(st.maxT_K, r.profile[0].T_K);
  }
  st.distillateM3 = base + (r.profile.length ? r.profile[r.profile.length - 1].distilled : 0);
  const last = st.profile[st.profile.length - 1];
  if (last) last.originalSolventWtPct = round(originalWtPct(ctx, st), 4);
}

/**
 * Warn when a compound in the pot exceeds its solubility at the end of a leg
 * (crash-out or oiling): a warning when m_i > c_sat,i(T) in the pot's solvents.
 *
 * Source: solubility-model.ts solubilityIn (van 't Hoff fits, UNIFAC or
 * ideal solubility, Jouyban–Acree blends).
 * Validity: as solubilityIn; an equilibrium check at the end of the leg only
 * (supersaturation and wall crusting during the leg are not modelled).
 * @param ctx         evaluation context (route components resolved against the library)
 * @param pot         mass of each component in the pot [kg]
 * @param T_K         pot temperature [K]
 * @param potVolumeL  pot volume, for the message [L]
 * @param warnings    receives the crash-out warnings
 * @param methods     receives the methods used
 */
export function solubilityCrossingCheck(
  ctx: EvalContext,
  pot: Record<string, number>,
  T_K: number,
  potVolumeL: number,
  warnings: EngineWarning[],
  methods: MethodUsed[],
) {
  for (const id of ctx.ids) {
    const c = ctx.comps.get(id)!;
    if (c.kind !== 'compound' || !(pot[id] > 0)) continue;
    const s = solubilityIn(ctx, id, pot, T_K, warnings, methods);
    if (s && pot[id] > s.capacityKg) {
      warn(
        warnings,
        'warning',
        'solubility-crossed',
        `${c.name} exceeds its solubility (${s.capacityKg.toPrecision(3)} kg dissolvable, ${pot[id].toPrecision(3)} kg present) at ${potVolumeL.toFixed(2)} L and ${(T_K - 273.15).toFixed(0)} °C: it may crash out or oil out on the walls during the concentration.`,
      );
    }
  }
}

/** The crash-out check at the bottom of one leg of a swap (pot volume and temperature there). */
function legCrossingCheck(
  ctx: EvalContext,
  st: DistilState,
  warnings: EngineWarning[],
  methods: MethodUsed[],
  leg: string,
) {
  const before = warnings.length;
  const potVolumeL = streamVolume(ctx, st.pot, VOLUME_REFERENCE_K) * 1000;
  solubilityCrossingCheck(ctx, st.pot, st.lastT_K, potVolumeL, warnings, methods);
  for (let k = before; k < warnings.length; k++)
    if (warnings[k].code === 'solubility-crossed')
      warnings[k] = { ...warnings[k], message: `${leg}: ${warnings[k].message}` };
}

/**
 * Starting state of a distillation: the feed in the pot, an empty distillate,
 * the original solvents (those present other than the new solvent) recorded
 * for the swap's progress.
 * Source: this project's own bookkeeping (no external source).
 * Validity: any feed stream the route produces.
 * @param ctx           evaluation context (route components resolved against the library)
 * @param feed          the stream charged to the pot (kg [kg])
 * @param T_K           starting pot temperature [K]
 * @param newSolventId  the solvent swapped in, or null
 * @returns the state with the pot volume at 20 °C [m³] as its first extreme
 */
export function newDistilState(
  ctx: EvalContext,
  feed: Stream,
  T_K: number,
  newSolventId: string | null,
): DistilState {
  const pot = { ...feed.kg };
  const distillate: Record<string, number> = {};
  for (const id of ctx.ids) distillate[id] = 0;
  const v = streamVolume(ctx, pot, VOLUME_REFERENCE_K);
  return {
    pot,
    distillate,
    profile: [],
    newSolventAddedM3: 0,
    distillateM3: 0,
    originalSolventIds: ctx.ids.filter(
      (id) => ctx.comps.get(id)!.kind === 'solvent' && id !== newSolventId && feed.kg[id] > 0,
    ),
    lastT_K: T_K,
    maxT_K: 0,
    minVolumeM3: v,
    maxVolumeM3: v,
  };
}

/**
 * Distillation step model: concentration, put-and-take swap or constant-volume
 * swap at a set pressure or pot temperature (module comment), leg by leg with
 * distilLeg and a crash-out check at the bottom of every leg; duration from a
 * common-practice distillation rate.
 *
 * Source: distilLeg (Rayleigh 1902; modified Raoult with UNIFAC, Hansen et
 * al. 1991); solubilityCrossingCheck; durations common practice
 * (COMMON_PRACTICE_HOURS).
 * Validity: as distilLeg (single stage, non-volatile solutes); integration
 * tolerance DISTILLATION_TOLERANCE_X in the liquid mole fractions.
 * @param inputs  the pot contents on port 'feed'
 * @param params  the step's parameters (mode with target volumes and cycles, condition with pressureMbar [mbar] or potTemperatureC [°C], decanter)
 * @param ctx     evaluation context (route components resolved against the library)
 * @param step    the route step being evaluated
 * @returns the pot and the distillate streams with the step result (profile, volumes [L], temperatures [°C])
 */
export function distillation(
  inputs: Record<string, Stream | undefined>,
  params: ParamsOf<'distillation'>,
  ctx: EvalContext,
  step: RouteStep,
): StepOutput {
  const feed = inputs.feed!;
  const result = newResult(step, { hours: 0, basis: COMMON_PRACTICE_BASIS });
  const W = result.warnings;
  const Ms = result.methods;
  const cond: DistillationCondition =
    params.condition.kind === 'pressure'
      ? {
          kind: 'pressure',
          P_Pa: ctx.num(params.condition.pressureMbar, ...RANGES.pressureMbar) * MBAR,
        }
      : {
          kind: 'pot-temperature',
          T_K: cToK(ctx.num(params.condition.potTemperatureC, ...RANGES.temperatureC)),
        };
  const mode = params.mode;
  const decanter = params.decanter === true;
  if (decanter && mode.kind !== 'concentrate')
    throw new StepError(
      'params.decanter',
      'A decanter (Dean–Stark trap) is used with "Concentrate to a volume" only; swap the solvent in a separate step.',
    );
  const newId = mode.kind === 'concentrate' ? null : mode.addSolventId;
  if (newId && ctx.comps.get(newId)!.kind !== 'solvent')
    throw new StepError(
      'params.mode.addSolventId',
      'The added solvent must be a solvent component.',
    );
  const st = newDistilState(ctx, feed, Math.max(feed.temperatureK, 300), newId);
  const startVolume = st.maxVolumeM3;
  const add = (m3: number) => {
    const kg = solventKgFromVolume(ctx, newId!, m3, VOLUME_REFERENCE_K);
    st.pot[newId!] += kg;
    result.addedKg[newId!] = (result.addedKg[newId!] ?? 0) + kg;
    result.addedVolumeM3 += m3;
    st.newSolventAddedM3 += m3;
    st.maxVolumeM3 = Math.max(st.maxVolumeM3, streamVolume(ctx, st.pot, VOLUME_REFERENCE_K));
  };
  if (mode.kind === 'concentrate') {
    const target = volumeToM3(ctx, mode.targetVolume);
    if (target >= startVolume)
      warn(
        W,
        'info',
        'nothing-distilled',
        'The target volume is not below the feed volume: nothing is distilled.',
      );
    distilLeg(ctx, st, target, cond, DISTILLATION_TOLERANCE_X, W, Ms, undefined, decanter);
  } else if (mode.kind === 'put-and-take') {
    const target = volumeToM3(ctx, mode.targetVolume);
    const addV = volumeToM3(ctx, mode.addVolume);
    distilLeg(ctx, st, target, cond, DISTILLATION_TOLERANCE_X, W, Ms);
    for (let c = 0; c < mode.cycles; c++) {
      // A solute can crash out at the bottom of any leg, not only the last: check each.
      legCrossingCheck(ctx, st, W, Ms, `leg ${c + 1} of ${mode.cycles + 1}`);
      add(addV);
      distilLeg(ctx, st, target, cond, DISTILLATION_TOLERANCE_X, W, Ms);
    }
  } else {
    // Constant volume: the feed and the vapour integrated together in one adaptive leg; the profile
    // carries the residual of the original solvents at every step.
    const addV = volumeToM3(ctx, mode.addVolume);
    distilLeg(ctx, st, startVolume, cond, DISTILLATION_TOLERANCE_X, W, Ms, {
      solventId: newId!,
      m3: addV,
      add,
    });
  }
  if (!(st.distillateM3 > 0) && !W.some((w) => w.code === 'nothing-distilled'))
    warn(
      W,
      'info',
      'nothing-distilled',
      'Nothing is distilled in this step: there is no distillate.',
    );
  const potVol = streamVolume(ctx, st.pot, VOLUME_REFERENCE_K);
  const T_end = st.lastT_K;
  solubilityCrossingCheck(ctx, st.pot, T_end, potVol * 1000, W, Ms);

  // Peroxide formers concentrated to low volume (common practice: below a quarter of the starting volume, or dryness).
  const solventsInPot = ctx.ids.filter((id) => ctx.comps.get(id)!.kind === 'solvent');
  const solventTotal = solventsInPot.reduce((a, id) => a + feed.kg[id], 0);
  for (const id of solventsInPot) {
    const s = ctx.comps.get(id)!.solvent!;
    if (
      s.peroxideFormer.value &&
      feed.kg[id] + (result.addedKg[id] ?? 0) > 0.05 * solventTotal &&
      st.minVolumeM3 < 0.25 * st.maxVolumeM3
    ) {
      W.push({
        severity: 'hazard',
        code: 'peroxide-concentration',
        message: `${s.name} is a peroxide former and is concentrated to ${((100 * st.minVolumeM3) / st.maxVolumeM3).toFixed(0)} % of its volume: test for peroxides before distilling (common practice) and never distil to dryness.`,
      });
    }
  }
  const pot = emptyStream(ctx, 'liquid', T_end);
  const dist = emptyStream(ctx, 'liquid', VOLUME_REFERENCE_K);
  for (const id of ctx.ids) {
    pot.kg[id] = st.pot[id];
    pot.solidKg[id] = Math.min(feed.solidKg[id], st.pot[id]);
    dist.kg[id] = st.distillate[id];
  }
  finishStream(ctx, pot);
  finishStream(ctx, dist);
  commonCautions(ctx, feed.kg, st.maxT_K || T_end, W, { transfer: false });
  result.peakVolumeM3 = Math.max(st.maxVolumeM3, streamVolume(ctx, feed.kg, VOLUME_REFERENCE_K));
  const rateLh = COMMON_PRACTICE_HOURS.distillateVolumesPerHour * result.peakVolumeM3 * 1000;
  result.duration = {
    hours:
      COMMON_PRACTICE_HOURS.distillationSetup +
      (rateLh > 0 ? (st.distillateM3 * 1000) / rateLh : 0),
    basis: `${COMMON_PRACTICE_BASIS}: distillate rate 0.1 working volumes per hour`,
  };
  const residual = originalWtPct(ctx, st);
  const distTot = Object.values(st.distillate).reduce((a, b) => a + b, 0);
  result.summary = {
    'distillate L': round(st.distillateM3 * 1000, 3),
    'pot volume L': round(potVol * 1000, 3),
    'final pot °C': round(T_end - 273.15, 1),
    ...(newId
      ? {
          'original solvent wt%': round(residual, 3),
          'new solvent L': round(st.newSolventAddedM3 * 1000, 3),
        }
      : {}),
  };
  result.details = {
    mode: mode.kind,
    condition: params.condition,
    profile: st.profile,
    // No distillate volume, no distillate composition.
    distillateComposition: Object.fromEntries(
      ctx.ids
        .filter((id) => st.distillateM3 > 0 && st.distillate[id] > 0)
        .map((id) => [id, round((100 * st.distillate[id]) / distTot, 4)]),
    ),
    residualOriginalSolventWtPct: residual,
    newSolventAddedL: st.newSolventAddedM3 * 1000,
    maxPotTemperatureC: st.maxT_K - 273.15,
  };
  return { outputs: { pot, distillate: dist }, result };
}
