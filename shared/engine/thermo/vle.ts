/**
 * Vapour–liquid and liquid–liquid equilibria of mixtures: bubble and dew
 * points by modified Raoult's law with UNIFAC activity coefficients, binary
 * azeotrope search, liquid–liquid split, and the boiling point of a split
 * liquid (heteroazeotrope).
 *
 * Modified Raoult's law (ideal vapour, Poynting factor 1, low pressure):
 *   y_i P = x_i γ_i(x, T) P_i^sat(T)
 * as in Smith, Van Ness & Abbott, Introduction to Chemical Engineering
 * Thermodynamics, 7th ed., §10.5, and Poling, Prausnitz & O'Connell, The
 * Properties of Gases and Liquids, 5th ed., §8-4. Valid up to a few bar; not
 * for supercritical components or associating vapours (acetic acid dimerises
 * in the vapour; the error in its K-value can reach a factor of two).
 *
 * Liquid–liquid equilibrium: equal activities x_i^I γ_i^I = x_i^II γ_i^II,
 * solved by successive substitution on K_i = γ_i^I / γ_i^II with a
 * Rachford–Rice material balance (Rachford & Rice, J. Pet. Technol. 1952, 4,
 * 19), after a tangent-plane stability test (Michelsen, Fluid Phase Equilib.
 * 1982, 9, 1; doi:10.1016/0378-3812(82)85001-2) started from near-pure trial
 * phases.
 */
import { EngineError } from '../errors';
import type { AntoineSet, Sourced, UnifacGroups, VapourPressureCorrelation } from '../data/types';
import { T0_K, PA_PER_BAR } from '../units';
import {
  correlationLnPressure,
  saturationTemperature as pureBoilingPoint,
  vapourPressureExtrapolation,
  vapourPressureRangeWarning,
  vapourPressureWithSlope,
  type VapourPressureExtra,
} from './antoine';
import { checkComposition, createUnifac, type UnifacModel } from './unifac';
import {
  regressReplacingWaterPair,
  regressWaterPair,
  withRegressedPairs,
  type MutualSolubilityCurvePoint,
  type MutualSolubilityPoint,
  type RegressedPair,
} from './nrtl';
import { brent, findRoot, newtonSafe } from '../numerics';

const LN10 = Math.LN10;
const LN_PA_PER_BAR = Math.log(PA_PER_BAR);

export interface VleComponent {
  name?: string;
  /** Antoine sets in order of preference (may be empty if a correlation or TbK is given, or nonVolatile). */
  antoine: readonly AntoineSet[];
  /** Wide-range vapour-pressure correlation (preferred over Antoine when present). */
  vapourPressure?: Sourced<VapourPressureCorrelation>;
  unifac: UnifacGroups;
  /** Normal boiling point [K], for Clausius–Clapeyron when there is no Antoine set. */
  TbK?: number;
  /** Enthalpy of vaporisation at Tb [J/mol]. */
  dHvapJmol?: number;
  /** A solute with negligible vapour pressure: y = 0, but it counts in the γ of the others. */
  nonVolatile?: boolean;
  /** This component is water (the partner of the regressed mutual-solubility pairs). */
  isWater?: boolean;
  /** Tabulated mutual solubility with water, as mole fractions: regressed into a pair term (thermo/nrtl.ts). */
  mutualSolubilityWithWater?: MutualSolubilityPoint;
  /** Further measured mutual solubilities with water at other temperatures: the temperature dependence of the pair (thermo/nrtl.ts). */
  mutualSolubilityCurveWithWater?: readonly MutualSolubilityCurvePoint[];
}

export interface VleSystem {
  components: readonly VleComponent[];
  /** Activity model: UNIFAC, plus the regressed terms of water–solvent pairs with tabulated mutual solubilities. */
  unifac: UnifacModel;
  /** The regressed pairs (indices into components, b in K), empty when none. */
  regressedPairs: readonly RegressedPair[];
  /** Warnings from building the system (a regression that did not converge). */
  warnings: readonly string[];
}

const pairMemo = new Map<string, RegressedPair | null>();

/** Regressed terms for every (water, solvent with tabulated mutual solubility) pair, memoised by the data. */
function regressPairs(components: readonly VleComponent[]): {
  pairs: RegressedPair[];
  warnings: string[];
} {
  const water = components.findIndex((c) => c.isWater);
  const pairs: RegressedPair[] = [];
  const warnings: string[] = [];
  if (water < 0) return { pairs, warnings };
  components.forEach((c, i) => {
    const data = c.mutualSolubilityWithWater;
    if (i === water || !data) return;
    const curve = c.mutualSolubilityCurveWithWater ?? [];
    const key = JSON.stringify([components[water].unifac, c.unifac, data, curve]);
    let fit = pairMemo.get(key);
    if (fit === undefined) {
      // Measured at several temperatures: NRTL replaces UNIFAC for the binary, with its
      // temperature dependence fitted. At one temperature: a term added to UNIFAC, else (no
      // stable added term) the replacing form with constant interaction energies.
      fit =
        curve.length > 0
          ? regressReplacingWaterPair(data, curve)
          : (regressWaterPair(createUnifac([components[water].unifac, c.unifac]), data) ??
            regressReplacingWaterPair(data, []));
      if (pairMemo.size > 500) pairMemo.clear();
      pairMemo.set(key, fit);
    }
    if (fit) pairs.push({ ...fit, water, solvent: i });
    else
      warnings.push(
        `${c.name ?? `component ${i + 1}`}: no liquid–liquid model reproduces its tabulated mutual solubility with water as a stable split; UNIFAC alone is used for that pair (mutual solubilities may be off by a factor of 2–10).`,
      );
  });
  return { pairs, warnings };
}

/**
 * Builds the activity model for a list of components once, for repeated VLE
 * calls: UNIFAC, plus a pair term (NRTL, else Margules) regressed to the tabulated mutual
 * solubility of every water–solvent pair that has one; for a pair tabulated at several
 * temperatures, or whose added term is never stable, NRTL in the place of UNIFAC for that
 * binary (thermo/nrtl.ts, regressReplacingWaterPair).
 *
 * Source: UNIFAC (Hansen et al. 1991); NRTL (Renon & Prausnitz 1968); Margules (1895).
 *
 * @param components  pure-component data (vapour pressure, UNIFAC groups, water flag, mutual solubility [mole fractions, K])
 * @returns the system; throws UnifacParameterError when a group pair has no parameters
 *
 * Validity: as UNIFAC; the regressed pairs reproduce their tabulated
 * phases exactly at the tabulated (reference) temperature; a pair fitted over
 * a range of temperatures warns outside it (pairRangeWarnings).
 */
export function createVleSystem(components: readonly VleComponent[]): VleSystem {
  if (components.length === 0)
    throw new EngineError('invalid-input', 'A VLE system needs at least one component.');
  const { pairs, warnings } = regressPairs(components);
  return {
    components,
    unifac: withRegressedPairs(createUnifac(components.map((c) => c.unifac)), pairs, (p) =>
      createUnifac([components[p.water].unifac, components[p.solvent].unifac]),
    ),
    regressedPairs: pairs,
    warnings,
  };
}

/**
 * Work arrays of one system's bubble points and liquid–liquid flashes, allocated once per system
 * instead of per call (neither solver calls itself or the other while it holds them).
 */
interface VleScratch {
  lnP: Float64Array;
  slope: Float64Array;
  lnGamma: Float64Array;
  lnGI: Float64Array;
  lnGII: Float64Array;
  K: Float64Array;
}
const scratchOf = new WeakMap<UnifacModel, VleScratch>();
function vleScratch(model: UnifacModel): VleScratch {
  let s = scratchOf.get(model);
  if (!s) {
    const n = model.n;
    s = {
      lnP: new Float64Array(n),
      slope: new Float64Array(n),
      lnGamma: new Float64Array(n),
      lnGI: new Float64Array(n),
      lnGII: new Float64Array(n),
      K: new Float64Array(n),
    };
    scratchOf.set(model, s);
  }
  return s;
}

function componentLabel(sys: VleSystem, i: number): string {
  return sys.components[i].name ?? `component ${i + 1}`;
}

function fallbackOf(c: VleComponent): VapourPressureExtra {
  return { correlation: c.vapourPressure, TbK: c.TbK, dHvapJmol: c.dHvapJmol };
}

/**
 * ln P_i^sat [ln Pa] and d ln P_i^sat/dT [1/K] of every volatile component at
 * T, written into lnP and slope (non-volatile components: lnP = −∞, slope 0).
 * Inline Antoine inside a range; the general routine (with its
 * extrapolation) otherwise.
 */
function saturationPressures(
  sys: VleSystem,
  T_K: number,
  lnP: Float64Array,
  slope: Float64Array,
): void {
  const comps = sys.components;
  for (let i = 0; i < comps.length; i++) {
    const c = comps[i];
    if (c.nonVolatile) {
      lnP[i] = -Infinity;
      slope[i] = 0;
      continue;
    }
    let done = false;
    const corr = c.vapourPressure?.value;
    if (corr) {
      if (T_K >= corr.TminK && T_K <= corr.TmaxK) {
        const r = correlationLnPressure(corr, T_K);
        lnP[i] = r.lnP;
        slope[i] = r.dlnPdT;
        done = true;
      }
    } else if (c.antoine.length > 0) {
      const set = c.antoine[0];
      if (T_K >= set.TminK && T_K <= set.TmaxK) {
        const denom = (set.form === 'log10-bar-degC' ? T_K - T0_K : T_K) + set.C;
        lnP[i] = (set.A - set.B / denom) * LN10 + LN_PA_PER_BAR;
        slope[i] = (LN10 * set.B) / (denom * denom);
        done = true;
      }
    }
    if (!done) {
      const r = vapourPressureWithSlope(c.antoine, T_K, fallbackOf(c));
      lnP[i] = Math.log(r.pressurePa);
      slope[i] = r.dlnPdT;
    }
  }
}

/**
 * How far beyond the temperature range of its data a fitted water pair is used
 * without a warning [K]: this project's own allowance (the fitted τ(T) is
 * smooth, and a few kelvin past the last point stay within the scatter of
 * the tabulated solubilities).
 */
export const PAIR_RANGE_ALLOWANCE_K = 5;

/**
 * Warnings for fitted water–solvent pairs used outside the temperature range
 * of their data (RegressedPair.fittedRangeK) by more than
 * PAIR_RANGE_ALLOWANCE_K: the liquid–liquid model is then extrapolated.
 *
 * Source: this project's own bookkeeping (no external source).
 *
 * @param sys       system from createVleSystem
 * @param T_K       temperature [K]
 * @param involved  mole fractions or amounts of the components present [any unit]; a pair counts when both are > 0
 * @returns one warning per pair extrapolated, in the chemist's words
 *
 * Validity: any system; pairs without a fitted range (one tabulated temperature) never warn.
 */
export function pairRangeWarnings(
  sys: VleSystem,
  T_K: number,
  involved: ArrayLike<number>,
): string[] {
  const warnings: string[] = [];
  for (const p of sys.regressedPairs) {
    const range = p.fittedRangeK;
    if (!range || !(involved[p.water] > 0 && involved[p.solvent] > 0)) continue;
    if (T_K >= range[0] - PAIR_RANGE_ALLOWANCE_K && T_K <= range[1] + PAIR_RANGE_ALLOWANCE_K)
      continue;
    const c = (K: number) => `${(K - 273.15).toFixed(1)} °C`;
    warnings.push(
      `${componentLabel(sys, p.solvent)}–water: the liquid–liquid model is fitted to mutual solubilities measured from ${c(range[0])} to ${c(range[1])}; at ${c(T_K)} it is extrapolated (mutual solubilities less certain).`,
    );
  }
  return warnings;
}

/**
 * Whether T lies inside the range of the component's preferred vapour-pressure data (its
 * correlation, else its first Antoine set): there vapourPressureWithSlope returns no warning, and
 * saturationPressures takes its inline path.
 */
function inPreferredRange(c: VleComponent, T_K: number): boolean {
  const corr = c.vapourPressure?.value;
  if (corr) return T_K >= corr.TminK && T_K <= corr.TmaxK;
  const set = c.antoine[0];
  return set !== undefined && T_K >= set.TminK && T_K <= set.TmaxK;
}

/** Warnings from vapour-pressure extrapolation at the final temperature, and from fitted pairs used outside their range. */
function saturationWarnings(sys: VleSystem, T_K: number, involved: ArrayLike<number>): string[] {
  const warnings: string[] = pairRangeWarnings(sys, T_K, involved);
  const comps = sys.components;
  for (let i = 0; i < comps.length; i++) {
    const c = comps[i];
    // Inside the preferred data's range there is nothing to say (and nothing to compute again).
    if (c.nonVolatile || involved[i] === 0 || inPreferredRange(c, T_K)) continue;
    const r = vapourPressureWithSlope(c.antoine, T_K, fallbackOf(c));
    for (const w of r.warnings) warnings.push(`${componentLabel(sys, i)}: ${w}`);
  }
  return warnings;
}

/**
 * The temperatures met outside the data over many boiling points of one system (a distillation
 * leg): for each component and cause of vapour-pressure extrapolation, and for each regressed
 * pair used outside its fitted range, the lowest and highest temperature [K]. The warnings it
 * gives (extrapolationWarnings) say once, with the range, what the boiling points' own warnings
 * say at every temperature.
 */
export interface ExtrapolationLog {
  sys: VleSystem;
  /** key `${component}|${cause}` → component index and the temperatures met [K]. */
  vapour: Map<string, { i: number; lo: number; hi: number }>;
  /** regressed pair index → temperatures met outside its fitted range [K]. */
  pairs: Map<number, { lo: number; hi: number }>;
}

/**
 * An empty ExtrapolationLog for the system.
 * Source: this project's own bookkeeping (no external source).
 * Validity: any system.
 * @param sys  the system whose boiling points will be logged
 * @returns the empty log
 */
export function extrapolationLog(sys: VleSystem): ExtrapolationLog {
  return { sys, vapour: new Map(), pairs: new Map() };
}

/**
 * Takes a boiling point's warnings: the ones about data used outside its range at T (exactly the
 * lines saturationWarnings gives for T and the liquid) are recorded in the log and left out of
 * the returned list; the other warnings are returned as they are.
 *
 * Source: this project's own bookkeeping (the rules of saturationWarnings).
 * Validity: warnings given by a boiling point of the log's system at T_K.
 *
 * @param log       the log (modified)
 * @param T_K       temperature of the boiling point [K]
 * @param involved  mole fractions of the liquid [–] (a component counts when > 0)
 * @param warnings  the boiling point's warnings
 * @returns the warnings that are not about extrapolated data
 */
export function logExtrapolation(
  log: ExtrapolationLog,
  T_K: number,
  involved: ArrayLike<number>,
  warnings: readonly string[],
): string[] {
  if (warnings.length === 0) return [];
  const sys = log.sys;
  const here = saturationWarnings(sys, T_K, involved);
  if (here.length === 0) return [...warnings];
  const grow = <V extends { lo: number; hi: number }>(
    m: Map<string | number, V>,
    k: string | number,
    v: V,
  ) => {
    const e = m.get(k);
    if (!e) m.set(k, v);
    else {
      e.lo = Math.min(e.lo, T_K);
      e.hi = Math.max(e.hi, T_K);
    }
  };
  sys.regressedPairs.forEach((p, k) => {
    const range = p.fittedRangeK;
    if (!range || !(involved[p.water] > 0 && involved[p.solvent] > 0)) return;
    if (T_K >= range[0] - PAIR_RANGE_ALLOWANCE_K && T_K <= range[1] + PAIR_RANGE_ALLOWANCE_K)
      return;
    grow(log.pairs as Map<string | number, { lo: number; hi: number }>, k, { lo: T_K, hi: T_K });
  });
  const comps = sys.components;
  for (let i = 0; i < comps.length; i++) {
    const c = comps[i];
    if (c.nonVolatile || involved[i] === 0 || inPreferredRange(c, T_K)) continue;
    const cause = vapourPressureExtrapolation(c.antoine, T_K, fallbackOf(c));
    if (cause === null) continue;
    grow(
      log.vapour as Map<string | number, { i: number; lo: number; hi: number }>,
      `${i}|${cause}`,
      {
        i,
        lo: T_K,
        hi: T_K,
      },
    );
  }
  const skip = new Set(here);
  return warnings.filter((w) => !skip.has(w));
}

/**
 * The log's warnings: one per component and cause of vapour-pressure extrapolation and one per
 * regressed pair used outside its fitted range, each with the range of temperatures met (°C).
 *
 * Source: the wording of vapourPressureWithSlope's and the regressed pairs' own warnings.
 * Validity: any log.
 *
 * @param log  the log
 * @returns the warnings, in the chemist's words
 */
export function extrapolationWarnings(log: ExtrapolationLog): string[] {
  const sys = log.sys;
  const c = (K: number) => `${(K - 273.15).toFixed(1)} °C`;
  const out: string[] = [];
  for (const [k, t] of log.pairs) {
    const p = sys.regressedPairs[k];
    const range = p.fittedRangeK!;
    const met = c(t.lo) === c(t.hi) ? `at ${c(t.lo)}` : `from ${c(t.lo)} to ${c(t.hi)}`;
    out.push(
      `${componentLabel(sys, p.solvent)}–water: the liquid–liquid model is fitted to mutual solubilities measured from ${c(range[0])} to ${c(range[1])}; ${met} it is extrapolated (mutual solubilities less certain).`,
    );
  }
  for (const { i, lo, hi } of log.vapour.values()) {
    const comp = sys.components[i];
    const w = vapourPressureRangeWarning(comp.antoine, lo, hi, fallbackOf(comp));
    if (w) out.push(`${componentLabel(sys, i)}: ${w}`);
  }
  return out;
}

const boilingPointMemo = new WeakMap<VleComponent, Map<number, number>>();

/** Saturation temperature of one component at P [K], for starting guesses (memoised per component and P). */
function saturationTemperatureGuess(c: VleComponent, P_Pa: number): number {
  let memo = boilingPointMemo.get(c);
  if (!memo) {
    memo = new Map();
    boilingPointMemo.set(c, memo);
  }
  const known = memo.get(P_Pa);
  if (known !== undefined) return known;
  let T = 350;
  if (c.vapourPressure || c.antoine.length > 0 || c.TbK) {
    const r = pureBoilingPoint(c.antoine, P_Pa, fallbackOf(c));
    if (Number.isFinite(r.T_K) && r.T_K > 0) T = r.T_K;
  }
  if (memo.size > 64) memo.clear();
  memo.set(P_Pa, T);
  return T;
}

function checkPressure(P_Pa: number): void {
  if (!Number.isFinite(P_Pa) || P_Pa <= 0) {
    throw new EngineError(
      'invalid-input',
      `Pressure must be a finite number of pascal above 0; got ${P_Pa}.`,
      { P_Pa },
    );
  }
}

function checkTemperature(T_K: number): void {
  if (!Number.isFinite(T_K) || T_K <= 0) {
    throw new EngineError(
      'invalid-input',
      `Temperature must be a finite number of kelvin above 0; got ${T_K}.`,
      { T_K },
    );
  }
}

function normalised(x: readonly number[], n: number): Float64Array {
  const scale = checkComposition(x, n);
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = x[i] * scale;
  return out;
}

function requireVolatile(sys: VleSystem, x: ArrayLike<number>, what: string): void {
  for (let i = 0; i < sys.components.length; i++)
    if (!sys.components[i].nonVolatile && x[i] > 0) return;
  throw new EngineError('invalid-input', `The ${what} contains no volatile component.`);
}

/** Result of a bubble-point calculation. */
export interface BubblePointResult {
  /** Bubble-point temperature [K]. */
  T_K: number;
  /** Vapour mole fractions [–] (0 for non-volatile components). */
  y: number[];
  /** Activity coefficients at the bubble point [–]. */
  gammas: number[];
  /** K_i = y_i/x_i = γ_i P_i^sat/P [–] (also for x_i = 0: the infinite-dilution value). */
  K: number[];
  warnings: string[];
}

/**
 * Bubble-point temperature of a liquid at a given pressure.
 *
 * Purpose: the temperature at which a liquid of composition x starts to boil
 * at P, and the composition of the first vapour (pot temperature in a
 * distillation, boiling point of a solvent mixture).
 *
 * Source: see the module comment (modified Raoult's law: Smith, Van Ness &
 * Abbott 7th ed. §10.5; Poling et al. 5th ed. §8-4; LLE: Michelsen 1982,
 * Rachford & Rice 1952).
 *
 * Formula: modified Raoult's law; solve f(T) = ln Σ_i x_i γ_i(x,T) P_i^sat(T) − ln P = 0
 * by Newton's method with f'(T) ≈ Σ_i y_i d ln P_i^sat/dT (the temperature
 * dependence of γ is neglected in the step only), safeguarded by a bracket
 * (numerics/roots.ts newtonSafe); converged when |f| < 1e-10 (P matched to
 * 1e-10 relative).
 *
 * @param sys   system from createVleSystem
 * @param x     liquid mole fractions [–], summing to 1
 * @param P_Pa  pressure [Pa]
 * @param opts  T0_K: starting temperature [K] (default: mole-fraction average of the pure boiling points at P)
 * @returns T_K [K], y [–], gammas [–], K [–], warnings (extrapolated vapour pressures, no convergence)
 *
 * Validity: up to a few bar (ideal vapour); the T range of the Antoine sets
 * (outside, extrapolated with a warning). Non-volatile components have y = 0.
 *
 * Example: ethanol–water x = [0.5, 0.5] at 101 325 Pa → T ≈ 353 K.
 */
export function bubblePoint(
  sys: VleSystem,
  x: readonly number[],
  P_Pa: number,
  opts?: { T0_K?: number },
): BubblePointResult {
  const n = sys.components.length;
  const xs = normalised(x, n);
  checkPressure(P_Pa);
  requireVolatile(sys, xs, 'liquid');
  const { lnP, slope, lnGamma } = vleScratch(sys.unifac);
  const lnTarget = Math.log(P_Pa);

  let T = opts?.T0_K ?? NaN;
  if (!(T > 0)) {
    let sumX = 0;
    T = 0;
    for (let i = 0; i < n; i++) {
      if (sys.components[i].nonVolatile || xs[i] === 0) continue;
      T += xs[i] * saturationTemperatureGuess(sys.components[i], P_Pa);
      sumX += xs[i];
    }
    T /= sumX;
  }
  const warnings: string[] = [];
  // Temperature of the last residual evaluation: lnP, slope and lnGamma hold its values.
  let evaluatedT = NaN;
  // The previous residual and its vapour-pressure slope, for the activity coefficients' share of
  // the derivative (below).
  let previousT = NaN;
  let previousF = NaN;
  let previousSlope = NaN;
  const solution = newtonSafe(
    (temperature) => {
      saturationPressures(sys, temperature, lnP, slope);
      sys.unifac.lnGammas(xs, temperature, lnGamma);
      evaluatedT = temperature;
      let sum = 0;
      let dsum = 0;
      for (let i = 0; i < n; i++) {
        if (xs[i] === 0 || lnP[i] === -Infinity) continue;
        const p = xs[i] * Math.exp(lnGamma[i] + lnP[i]);
        sum += p;
        dsum += p * slope[i];
      }
      const f = Math.log(sum) - lnTarget;
      const raoult = dsum / sum;
      // The vapour pressures' share of f'(T) is exact; the activity coefficients' share, Σ y_i
      // d ln γ_i/dT, is taken from the secant through the previous residual less the vapour
      // pressures' share there (their mean slope): a secant-corrected Newton step, superlinear
      // where the plain step (γ's share neglected) converges linearly. Used only when it stays
      // within a factor of 2 of the vapour pressures' share.
      let df = raoult;
      const dT = temperature - previousT;
      if (dT !== 0 && Number.isFinite(dT)) {
        const corrected = raoult + (f - previousF) / dT - 0.5 * (raoult + previousSlope);
        if (corrected > 0.5 * raoult && corrected < 2 * raoult) df = corrected;
      }
      previousT = temperature;
      previousF = f;
      previousSlope = raoult;
      return { f, df };
    },
    T,
    { lower: 1, maxStep: 40, ftol: 1e-10, xtol: 1e-12 * T, rtol: 1e-13, maxIterations: 100 },
  );
  T = solution.root;
  if (!solution.converged) {
    warnings.push(
      `Bubble-point iteration did not converge (residual ln P = ${solution.value.toExponential(2)}); result approximate.`,
    );
  }
  // The solver usually stops at the point it evaluated last: its vapour pressures and activity
  // coefficients are then already at hand (the same numbers a fresh evaluation gives).
  if (T !== evaluatedT) {
    saturationPressures(sys, T, lnP, slope);
    sys.unifac.lnGammas(xs, T, lnGamma);
  }
  const gammas: number[] = new Array(n);
  for (let i = 0; i < n; i++) gammas[i] = Math.exp(lnGamma[i]);
  const K: number[] = new Array(n);
  const y: number[] = new Array(n);
  let sumY = 0;
  for (let i = 0; i < n; i++) {
    K[i] = lnP[i] === -Infinity ? 0 : (gammas[i] * Math.exp(lnP[i])) / P_Pa;
    y[i] = xs[i] * K[i];
    sumY += y[i];
  }
  for (let i = 0; i < n; i++) y[i] /= sumY;
  warnings.unshift(...saturationWarnings(sys, T, xs));
  return { T_K: T, y, gammas, K, warnings };
}

/**
 * Bubble-point pressure of a liquid at a given temperature.
 *
 * Source: see the module comment (modified Raoult's law: Smith, Van Ness &
 * Abbott 7th ed. §10.5; Poling et al. 5th ed. §8-4; LLE: Michelsen 1982,
 * Rachford & Rice 1952).
 *
 * Formula: P = Σ_i x_i γ_i P_i^sat, y_i = x_i γ_i P_i^sat / P (modified Raoult).
 *
 * @param sys  system from createVleSystem
 * @param x    liquid mole fractions [–], summing to 1
 * @param T_K  temperature [K]
 * @returns P_Pa [Pa], y [–], gammas [–], warnings
 *
 * Validity: up to a few bar (ideal vapour); vapour pressures as vapourPressure.
 *
 * Example: water alone at 373.15 K → P ≈ 101 kPa.
 */
export function bubblePressure(
  sys: VleSystem,
  x: readonly number[],
  T_K: number,
): { P_Pa: number; y: number[]; gammas: number[]; warnings: string[] } {
  const n = sys.components.length;
  const xs = normalised(x, n);
  checkTemperature(T_K);
  requireVolatile(sys, xs, 'liquid');
  const { lnP, slope } = vleScratch(sys.unifac);
  saturationPressures(sys, T_K, lnP, slope);
  const gammas = Array.from(sys.unifac.gammas(xs, T_K));
  const partial = gammas.map((g, i) => (lnP[i] === -Infinity ? 0 : xs[i] * g * Math.exp(lnP[i])));
  const P = partial.reduce((a, b) => a + b, 0);
  return {
    P_Pa: P,
    y: partial.map((p) => p / P),
    gammas,
    warnings: saturationWarnings(sys, T_K, xs),
  };
}

/**
 * Bubble pressure of many liquids at one fixed temperature (the isothermal
 * drying model asks at every integration stage): the vapour pressures at T are
 * computed once, the buffers are reused, and no warnings are built (ask
 * bubblePressure once for those).
 *
 * Source: as bubblePressure (modified Raoult's law, P = Σ_i x_i γ_i P_i^sat,
 * y_i = x_i γ_i P_i^sat / P; Smith, Van Ness & Abbott 7th ed. §10.5), the same
 * arithmetic in the same order, so the same numbers bit for bit.
 *
 * @param sys  system from createVleSystem
 * @param T_K  temperature [K]
 * @returns a function of the liquid mole fractions x [–] that writes y [–] and returns P [Pa]
 *
 * Validity: as bubblePressure; the same errors (composition, temperature, no volatile component).
 */
export function bubblePressureAtFixedT(
  sys: VleSystem,
  T_K: number,
): (x: ArrayLike<number>, y: Float64Array) => number {
  const n = sys.components.length;
  let expLnP: Float64Array | null = null;
  let volatile: Uint8Array | null = null;
  const gammas = new Float64Array(n);
  const partial = new Float64Array(n);
  const xs = new Float64Array(n);
  return (x, y) => {
    // normalised(x, n), into this evaluator's own array (the same numbers, no allocation per call).
    const scale = checkComposition(x, n);
    for (let i = 0; i < n; i++) xs[i] = x[i] * scale;
    checkTemperature(T_K);
    requireVolatile(sys, xs, 'liquid');
    if (!expLnP || !volatile) {
      const lnP = new Float64Array(n);
      saturationPressures(sys, T_K, lnP, new Float64Array(n));
      expLnP = new Float64Array(n);
      volatile = new Uint8Array(n);
      for (let i = 0; i < n; i++) {
        volatile[i] = lnP[i] === -Infinity ? 0 : 1;
        expLnP[i] = Math.exp(lnP[i]);
      }
    }
    sys.unifac.gammas(xs, T_K, gammas);
    let P = 0;
    for (let i = 0; i < n; i++) {
      partial[i] = volatile[i] ? xs[i] * gammas[i] * expLnP[i] : 0;
      P += partial[i];
    }
    for (let i = 0; i < n; i++) y[i] = partial[i] / P;
    return P;
  };
}

/**
 * Dew-point temperature of a vapour at a given pressure.
 *
 * Purpose: the temperature at which a vapour of composition y starts to
 * condense, and the composition of the first drop (condenser temperature).
 *
 * Source: see the module comment (modified Raoult's law: Smith, Van Ness &
 * Abbott 7th ed. §10.5; Poling et al. 5th ed. §8-4; LLE: Michelsen 1982,
 * Rachford & Rice 1952).
 *
 * Formula: x_i = y_i P / (γ_i(x,T) P_i^sat(T)), Σ x_i = 1; at each T the
 * liquid composition is found by successive substitution, and T by Newton's
 * method on g(T) = ln Σ_i y_i P/(γ_i P_i^sat) safeguarded by a bracket
 * (numerics/roots.ts newtonSafe).
 *
 * @param sys   system from createVleSystem
 * @param y     vapour mole fractions [–], summing to 1; non-volatile components must have y = 0
 * @param P_Pa  pressure [Pa]
 * @returns T_K [K], x [–] (first liquid), warnings
 *
 * Validity: as bubblePoint. The liquid is assumed to be one phase (a dew
 * point that condenses two liquids is not detected).
 *
 * Example: ethanol–water y = [0.5, 0.5] at 101 325 Pa → T ≈ 360 K.
 */
export function dewPoint(
  sys: VleSystem,
  y: readonly number[],
  P_Pa: number,
): { T_K: number; x: number[]; warnings: string[] } {
  const n = sys.components.length;
  const ys = normalised(y, n);
  checkPressure(P_Pa);
  for (let i = 0; i < n; i++) {
    if (sys.components[i].nonVolatile && ys[i] > 0) {
      throw new EngineError(
        'invalid-input',
        `${componentLabel(sys, i)} is non-volatile and cannot be in the vapour.`,
        { index: i },
      );
    }
  }
  requireVolatile(sys, ys, 'vapour');
  const lnP = new Float64Array(n);
  const slope = new Float64Array(n);
  const lnGamma = new Float64Array(n);
  const xs = new Float64Array(n);
  let T = 0;
  for (let i = 0; i < n; i++)
    if (ys[i] > 0) T += ys[i] * saturationTemperatureGuess(sys.components[i], P_Pa);
  // Starting liquid: ideal (γ = 1) at the starting T.
  const liquidAt = (temperature: number): number => {
    saturationPressures(sys, temperature, lnP, slope);
    let sum = 0;
    for (let i = 0; i < n; i++) {
      xs[i] = ys[i] === 0 ? 0 : ys[i] * Math.exp(Math.log(P_Pa) - lnP[i]);
      sum += xs[i];
    }
    for (let i = 0; i < n; i++) xs[i] /= sum;
    // Successive substitution for x at this T.
    let sumRaw = sum;
    for (let inner = 0; inner < 200; inner++) {
      sys.unifac.lnGammas(xs, temperature, lnGamma);
      let change = 0;
      sumRaw = 0;
      const raw = new Float64Array(n);
      for (let i = 0; i < n; i++) {
        raw[i] = ys[i] === 0 ? 0 : ys[i] * Math.exp(Math.log(P_Pa) - lnP[i] - lnGamma[i]);
        sumRaw += raw[i];
      }
      for (let i = 0; i < n; i++) {
        const next = raw[i] / sumRaw;
        change = Math.max(change, Math.abs(next - xs[i]));
        xs[i] = next;
      }
      if (change < 1e-13) break;
    }
    return Math.log(sumRaw); // g(T): > 0 below the dew point, < 0 above
  };
  const solution = newtonSafe(
    (temperature) => {
      const g = liquidAt(temperature);
      // dg/dT ≈ −Σ x_i d ln P_i^sat/dT (weights of the condensing liquid).
      let d = 0;
      for (let i = 0; i < n; i++) if (xs[i] > 0) d -= xs[i] * slope[i];
      return { f: g, df: d };
    },
    T,
    { lower: 1, maxStep: 40, ftol: 1e-10, xtol: 1e-12 * T, rtol: 1e-13, maxIterations: 100 },
  );
  T = solution.root;
  liquidAt(T);
  const converged = solution.converged;
  const g = solution.value;
  const warnings = saturationWarnings(sys, T, ys);
  if (!converged)
    warnings.push(
      `Dew-point iteration did not converge (residual ${g.toExponential(2)}); result approximate.`,
    );
  return { T_K: T, x: Array.from(xs), warnings };
}

/** Result of the binary azeotrope search. */
export interface AzeotropeResult {
  found: boolean;
  /** Azeotrope temperature [K]. */
  T_K?: number;
  /** Azeotrope composition [–] (for a heteroazeotrope: the overall composition, equal to the vapour). */
  x?: [number, number];
  kind?: 'minimum-boiling' | 'maximum-boiling';
  warnings: string[];
}

/**
 * Azeotrope of a binary mixture at a given pressure.
 *
 * Purpose: whether a pair of solvents can be separated by simple
 * distillation, and where the distillation stalls.
 *
 * Source: see the module comment (modified Raoult's law: Smith, Van Ness &
 * Abbott 7th ed. §10.5; Poling et al. 5th ed. §8-4; LLE: Michelsen 1982,
 * Rachford & Rice 1952).
 *
 * Method: an azeotrope is where the relative volatility α_12 = K_1/K_2 =
 * γ_1 P_1^sat / (γ_2 P_2^sat) equals 1 along the bubble-point curve. ln α_12
 * is evaluated at the pure ends (infinite dilution) and on a grid of 50
 * intervals; a sign change is refined by Brent's method (numerics/roots.ts)
 * in x_1 to 1e-10. Kind:
 * minimum-boiling when T_az is below both pure boiling points, else
 * maximum-boiling. If the liquid at the azeotrope splits into two phases
 * (tested with liquidLiquidSplit), the azeotrope is heterogeneous: its
 * temperature and composition are taken from heterogeneousBubblePoint and a
 * warning says so.
 *
 * @param sys   system of exactly two volatile components
 * @param P_Pa  pressure [Pa]
 * @returns found, T_K [K], x [–], kind, warnings
 *
 * Validity: as bubblePoint. Original UNIFAC usually places azeotrope
 * temperatures within 1–3 K, compositions within about 0.05–0.1 in mole
 * fraction; a double azeotrope returns the first and warns.
 *
 * Example: ethanol–water at 101 325 Pa → found, ≈ 351 K, x_ethanol ≈ 0.9, minimum-boiling.
 */
export function findBinaryAzeotrope(sys: VleSystem, P_Pa: number): AzeotropeResult {
  if (sys.components.length !== 2) {
    throw new EngineError(
      'invalid-input',
      `The azeotrope search needs exactly two components; got ${sys.components.length}.`,
    );
  }
  if (sys.components.some((c) => c.nonVolatile)) {
    throw new EngineError('invalid-input', 'Both components of an azeotrope must be volatile.');
  }
  checkPressure(P_Pa);
  const lnAlpha = (x1: number): { value: number; T: number } => {
    const b = bubblePoint(sys, [x1, 1 - x1], P_Pa);
    return { value: Math.log(b.K[0] / b.K[1]), T: b.T_K };
  };
  const intervals = 50;
  const points: Array<{ x1: number; value: number; T: number }> = [];
  for (let j = 0; j <= intervals; j++) {
    const x1 = j / intervals;
    points.push({ x1, ...lnAlpha(x1) });
  }
  const roots: Array<[number, number]> = [];
  for (let j = 0; j < intervals; j++) {
    const a = points[j];
    const b = points[j + 1];
    if (a.value === 0) roots.push([a.x1, a.x1]);
    else if (a.value * b.value < 0) roots.push([a.x1, b.x1]);
  }
  const warnings: string[] = [];
  if (roots.length === 0) return { found: false, warnings };
  if (roots.length > 1)
    warnings.push(`${roots.length} azeotropes found; the one at lowest x1 is reported.`);
  const [lo, hi] = roots[0];
  const refined =
    lo === hi
      ? { root: lo, converged: true }
      : brent((x) => lnAlpha(x).value, lo, hi, { xtol: 1e-10, rtol: 0 });
  if (!refined.converged)
    warnings.push('The azeotrope composition did not converge to 1e-10; result approximate.');
  const x1 = refined.root;
  const bubble = bubblePoint(sys, [x1, 1 - x1], P_Pa);
  warnings.push(...bubble.warnings);
  const T1 = points[intervals].T;
  const T2 = points[0].T;
  const split = liquidLiquidSplit(sys, [x1, 1 - x1], bubble.T_K);
  if (split.split) {
    const het = heterogeneousBubblePoint(sys, [x1, 1 - x1], P_Pa);
    warnings.push(
      'The liquid splits into two phases at the azeotrope: heterogeneous azeotrope; temperature and composition from the three-phase boiling point (the composition given is that of the vapour, equal to the overall liquid).',
      ...het.warnings,
    );
    return {
      found: true,
      T_K: het.T_K,
      x: [het.y[0], het.y[1]],
      kind: 'minimum-boiling',
      warnings,
    };
  }
  const kind = bubble.T_K < Math.min(T1, T2) ? 'minimum-boiling' : 'maximum-boiling';
  return { found: true, T_K: bubble.T_K, x: [x1, 1 - x1], kind, warnings };
}

/** Rachford–Rice for two liquids: fraction β of the feed in phase II, with K_i = x_i^II/x_i^I. */
function solveRachfordRice(z: Float64Array, K: Float64Array): number {
  if (rachfordRiceSum(z, K, 0) <= 0) return 0;
  if (rachfordRiceSum(z, K, 1) >= 0) return 1;
  // The sum is monotone decreasing in β on [0, 1]: Brent on the bracket. (An inline arrow, not a
  // named closure: this runs at every flash iteration.)
  return brent((beta) => rachfordRiceSum(z, K, beta), 0, 1, { xtol: 1e-15, rtol: 0 }).root;
}

/** Rachford–Rice sum Σ z_i (K_i − 1)/(1 + β (K_i − 1)) over the components present. */
function rachfordRiceSum(z: Float64Array, K: Float64Array, beta: number): number {
  const n = z.length;
  let s = 0;
  for (let i = 0; i < n; i++) if (z[i] > 0) s += (z[i] * (K[i] - 1)) / (1 + beta * (K[i] - 1));
  return s;
}

export type LiquidLiquidResult =
  | { split: false; warnings: string[] }
  | {
      split: true;
      /** The two liquid compositions [–]; phases[0] is the richer in the first component. */
      phases: [number[], number[]];
      /** Fraction of all moles in phases[1] [–]. */
      phaseFraction: number;
      warnings: string[];
    };

/**
 * Whether a liquid splits into two phases at T, and the phases if so.
 *
 * Purpose: washes and extractions with partly miscible solvents; the
 * heterogeneous drying of solvents by distillation.
 *
 * Source: see the module comment (modified Raoult's law: Smith, Van Ness &
 * Abbott 7th ed. §10.5; Poling et al. 5th ed. §8-4; LLE: Michelsen 1982,
 * Rachford & Rice 1952).
 *
 * Method: (1) stability: tangent-plane test (Michelsen 1982) by successive
 * substitution from near-pure trial phases of each component,
 *   ln W_i = ln z_i + ln γ_i(z) − ln γ_i(w),  w = W/ΣW;  unstable if ΣW > 1
 * (a trial stops when it converges to 1e-12, falls onto the feed itself to
 * 1e-7, or shows ΣW > 1 + 1e-4 with steps below 1e-6: the flash starts there).
 * (2) flash: K_i = γ_i^I/γ_i^II (equal activities), Rachford–Rice for the
 * phase fraction, iterate to max |Δ ln K| < 1e-10.
 *
 * @param sys  system from createVleSystem
 * @param z    overall liquid mole fractions [–], summing to 1
 * @param T_K  temperature [K]
 * @param start  two liquid phases [–] of a neighbouring feed at the same temperature (the previous
 *               pass over a wash stage): the flash starts from them and, when it converges to two
 *               distinct liquids, the stability test is not repeated (the same phases to the
 *               flash's tolerance, 1e-10 in ln K); otherwise the full method runs
 * @returns `{ split: false }` or the two phases and the fraction of moles in phases[1]
 *
 * Validity: original UNIFAC is fitted to VLE; mutual solubilities it predicts
 * can be off by a factor of 2–10 for the minor component (e.g. the water
 * content of an organic phase). Use measured solubilities where known.
 *
 * Example: toluene–water z = [0.5, 0.5] at 298.15 K → split, water phase with
 * x_toluene of order 1e-4, toluene phase with x_water of order 1e-2.
 */
export function liquidLiquidSplit(
  sys: VleSystem,
  z: readonly number[],
  T_K: number,
  start?: readonly [readonly number[], readonly number[]],
): LiquidLiquidResult {
  const n = sys.components.length;
  const zs = normalised(z, n);
  checkTemperature(T_K);
  const warnings: string[] = pairRangeWarnings(sys, T_K, zs);
  let present = 0;
  for (let i = 0; i < n; i++) if (zs[i] > 0) present++;
  if (present < 2) return { split: false, warnings };
  const model = sys.unifac;
  if (start && start[0].length === n && start[1].length === n) {
    // Two liquids of a neighbouring feed: the flash from them finds this feed's split directly.
    const warm = flashFrom(
      model,
      zs,
      T_K,
      Float64Array.from(start[0]),
      Float64Array.from(start[1]),
    );
    if (warm?.converged) return orderedSplit(warm, warnings);
  }
  const lnGz = model.lnGammas(zs, T_K, new Float64Array(n));
  const d = new Float64Array(n);
  for (let i = 0; i < n; i++) d[i] = zs[i] > 0 ? Math.log(zs[i]) + lnGz[i] : -Infinity;

  // Stability test.
  let bestTrial: Float64Array | null = null;
  let bestSum = 1 + 1e-8;
  const w = new Float64Array(n);
  const lnGw = new Float64Array(n);
  const W = new Float64Array(n);
  for (let trial = 0; trial < n; trial++) {
    if (zs[trial] === 0) continue;
    let others = 0;
    for (let i = 0; i < n; i++) if (zs[i] > 0 && i !== trial) others++;
    for (let i = 0; i < n; i++) w[i] = zs[i] === 0 ? 0 : i === trial ? 0.999 : 0.001 / others;
    let sumW = 0;
    let onFeed = false;
    let lastDistance = NaN;
    let lastRatio = NaN;
    for (let iter = 0; iter < 300; iter++) {
      model.lnGammas(w, T_K, lnGw);
      sumW = 0;
      for (let i = 0; i < n; i++) {
        W[i] = zs[i] === 0 ? 0 : Math.exp(d[i] - lnGw[i]);
        sumW += W[i];
      }
      let change = 0;
      let distance = 0;
      for (let i = 0; i < n; i++) {
        const next = W[i] / sumW;
        change = Math.max(change, Math.abs(next - w[i]));
        distance = Math.max(distance, Math.abs(next - zs[i]));
        w[i] = next;
      }
      // Stop when converged, when the trial has fallen onto the feed itself (the trivial solution:
      // no split from this start; within 1e-5, the distance below which a trial is not taken
      // anyway: only a trial that came that close and then left the feed is missed), or when it
      // is clearly unstable and close
      // enough to start the flash from (the flash converges to the same phases from there).
      if (change < 1e-12 || distance <= 1e-5 || (sumW > 1 + 1e-4 && change < 1e-6)) break;
      // A trial falling onto the feed shrinks its distance to it by a steady ratio (the linear
      // convergence of successive substitution onto a fixed point that attracts it): once within
      // 1e-3, with two successive ratios below 0.8 and within 0.02 of each other and ΣW ≤ 1 (no sign
      // of instability), it is on its way there and stops.
      const ratio = distance / lastDistance;
      if (distance <= 1e-3 && sumW <= 1 && ratio < 0.8 && Math.abs(ratio - lastRatio) < 0.02) {
        onFeed = true;
        break;
      }
      lastRatio = ratio;
      lastDistance = distance;
    }
    if (onFeed) continue;
    let distance = 0;
    for (let i = 0; i < n; i++) distance = Math.max(distance, Math.abs(w[i] - zs[i]));
    if (distance > 1e-5 && sumW > bestSum) {
      bestSum = sumW;
      bestTrial = Float64Array.from(w);
    }
  }
  if (!bestTrial) return { split: false, warnings };

  // Flash from (z, trial).
  const r = flashFrom(model, zs, T_K, Float64Array.from(zs), bestTrial);
  if (!r) return { split: false, warnings };
  if (!r.converged)
    warnings.push('Liquid–liquid flash did not fully converge; phase compositions approximate.');
  return orderedSplit(r, warnings);
}

/** A converged (or best) two-liquid flash: phase I, phase II, fraction of moles in II. */
interface Flash {
  xI: Float64Array;
  xII: Float64Array;
  beta: number;
  converged: boolean;
}

function orderedSplit(r: Flash, warnings: string[]): LiquidLiquidResult {
  const phaseI = Array.from(r.xI);
  const phaseII = Array.from(r.xII);
  if (phaseI[0] >= phaseII[0])
    return { split: true, phases: [phaseI, phaseII], phaseFraction: r.beta, warnings };
  return { split: true, phases: [phaseII, phaseI], phaseFraction: 1 - r.beta, warnings };
}

/**
 * Two-liquid flash of z at T from starting phases xI, xII (modified in place):
 * successive substitution on K_i = γ_i^I/γ_i^II with Rachford–Rice, to
 * max |Δ ln K| < 1e-10. Null when the feed does not split (β leaves (0, 1)
 * or the phases become equal to 1e-6).
 */
function flashFrom(
  model: UnifacModel,
  zs: Float64Array,
  T_K: number,
  xI: Float64Array,
  xII: Float64Array,
  maxIterations = 2000,
): Flash | null {
  const n = zs.length;
  const { lnGI, lnGII, K } = vleScratch(model);
  let beta = 0.5;
  let converged = false;
  for (let iter = 0; iter < maxIterations; iter++) {
    model.lnGammas(xI, T_K, lnGI);
    model.lnGammas(xII, T_K, lnGII);
    let change = 0;
    for (let i = 0; i < n; i++) {
      const next = Math.exp(lnGI[i] - lnGII[i]);
      if (iter > 0 && zs[i] > 0) change = Math.max(change, Math.abs(Math.log(next / K[i])));
      K[i] = next;
    }
    if (iter > 0 && change < 1e-10) {
      converged = true;
      break;
    }
    beta = solveRachfordRice(zs, K);
    if (beta <= 0 || beta >= 1) return null;
    let sI = 0;
    let sII = 0;
    for (let i = 0; i < n; i++) {
      xI[i] = zs[i] / (1 + beta * (K[i] - 1));
      xII[i] = K[i] * xI[i];
      sI += xI[i];
      sII += xII[i];
    }
    for (let i = 0; i < n; i++) {
      xI[i] /= sI;
      xII[i] /= sII;
    }
  }
  let distance = 0;
  for (let i = 0; i < n; i++) distance = Math.max(distance, Math.abs(xI[i] - xII[i]));
  if (distance < 1e-6) return null;
  return { xI, xII, beta, converged };
}

/** Result of a boiling point of a liquid that may split into two liquids. */
export interface HeterogeneousBubblePoint {
  /** Boiling temperature [K]. */
  T_K: number;
  /** Vapour mole fractions [–]. */
  y: number[];
  /** Liquid phases present at the boiling point: 1 or 2. */
  liquidPhases: number;
  /** With two liquids: their compositions [–], phases[0] the richer in the first component. */
  phases?: [number[], number[]];
  /** With two liquids: fraction of all liquid moles in phases[1] [–]. */
  phaseFraction?: number;
  warnings: string[];
}

/**
 * Boiling point at P of a liquid that may split into two liquid phases.
 *
 * Purpose: distillation of partly miscible mixtures (water + toluene, water +
 * ethyl acetate, water + 1-butanol): while two liquids are present the pot
 * boils at the heteroazeotrope temperature, below both pure boiling points.
 *
 * Source: see the module comment (modified Raoult's law: Smith, Van Ness &
 * Abbott 7th ed. §10.5; Poling et al. 5th ed. §8-4; LLE: Michelsen 1982,
 * Rachford & Rice 1952).
 *
 * Method: if the liquid is stable at its homogeneous bubble point, that is
 * the answer (liquidPhases 1). Otherwise find T where the bubble pressure of
 * one of the coexisting liquids, Σ_i x_i^I γ_i^I P_i^sat, equals P (both
 * liquids have equal activities, hence equal partial pressures): a bracket
 * in 1/T grown from 2 K below the homogeneous bubble point (at most 200 K
 * either way), then Brent's method (numerics/roots.ts) on
 * ln P_calc(T) − ln P to 1e-12, or T to 1e-9 K.
 *
 * @param sys   system from createVleSystem
 * @param z     overall liquid mole fractions [–], summing to 1
 * @param P_Pa  pressure [Pa]
 * @param opts  previous: the result at a neighbouring composition (the last step of a distillation),
 *              to start from: while both liquids remain, the flash and T start from its phases and
 *              temperature [K], and the stability test is not repeated (same answer to the tolerances)
 * @returns T_K [K], y [–] vapour, liquidPhases 1 or 2, the two liquids [–] and the fraction [–]
 *          of moles in phases[1] when split, warnings
 *
 * Validity: as bubblePoint and liquidLiquidSplit; heteroazeotropes of the
 * regressed water pairs within 1.5 K of the handbook (docs/methods.md).
 *
 * Example: toluene–water z = [0.5, 0.5] at 101 325 Pa → ≈ 357 K (handbook heteroazeotrope 84.1 °C).
 */
export function heterogeneousBubblePoint(
  sys: VleSystem,
  z: readonly number[],
  P_Pa: number,
  opts?: { previous?: HeterogeneousBubblePoint },
): HeterogeneousBubblePoint {
  const n = sys.components.length;
  const zs = Array.from(normalised(z, n));
  checkPressure(P_Pa);
  const previous = opts?.previous;
  if (previous?.liquidPhases === 2 && previous.phases) {
    const warm = threePhaseFrom(sys, zs, P_Pa, previous);
    if (warm) return warm;
  }
  const homogeneous = bubblePoint(sys, zs, P_Pa, { T0_K: previous?.T_K });
  const atHomogeneous = liquidLiquidSplit(sys, zs, homogeneous.T_K);
  if (!atHomogeneous.split) {
    return {
      T_K: homogeneous.T_K,
      y: homogeneous.y,
      liquidPhases: 1,
      warnings: homogeneous.warnings,
    };
  }
  // The three-phase point from the split found at the homogeneous bubble point (Newton with warm
  // flashes); the bracketing search below when that fails.
  const fromSplit = threePhaseFrom(sys, zs, P_Pa, {
    T_K: homogeneous.T_K,
    y: homogeneous.y,
    liquidPhases: 2,
    phases: atHomogeneous.phases,
    warnings: [],
  });
  if (fromSplit) return fromSplit;
  type Evaluated = { f: number; y: number[]; phases: number; split: LiquidLiquidResult };
  const evaluate = (T: number): Evaluated => {
    const s = liquidLiquidSplit(sys, zs, T);
    const liquid = s.split ? s.phases[0] : zs;
    const b = bubblePressure(sys, liquid, T);
    return { f: Math.log(b.P_Pa / P_Pa), y: b.y, phases: s.split ? 2 : 1, split: s };
  };
  // Root of ln P_calc − ln P in u = 1000/T (nearly linear there, Clausius–Clapeyron): the bracket is
  // grown from 2 K below the homogeneous bubble point (the three-phase point lies below it), then
  // Brent's method (numerics/roots.ts) to 1e-9 K.
  const T0 = homogeneous.T_K;
  let last: { u: number; value: Evaluated } | null = null;
  const fOfU = (u: number): number => {
    const value = evaluate(1000 / u);
    last = { u, value };
    return value.f;
  };
  const solution = findRoot(fOfU, 1000 / T0, 1000 / (T0 - 2), {
    lower: 1000 / (T0 + 200),
    upper: 1000 / Math.max(T0 - 200, 1),
    xtol: 1e-9 * (1000 / (T0 * T0)),
    rtol: 0,
    ftol: 1e-12,
  });
  if (solution.reason === 'no-bracket' || solution.reason === 'not-finite') {
    throw new EngineError(
      'no-convergence',
      'Could not bracket the boiling point of the two-phase liquid.',
      { P_Pa },
    );
  }
  const T = 1000 / solution.root;
  const kept = last as { u: number; value: Evaluated } | null;
  const current = kept && kept.u === solution.root ? kept.value : evaluate(T);
  const warnings = saturationWarnings(sys, T, zs);
  if (current.split.split) {
    warnings.push(THREE_PHASE_NOTE);
    return {
      T_K: T,
      y: current.y,
      liquidPhases: 2,
      phases: current.split.phases,
      phaseFraction: current.split.phaseFraction,
      warnings,
    };
  }
  return { T_K: T, y: current.y, liquidPhases: 1, warnings };
}

const THREE_PHASE_NOTE = 'Two liquid phases boil together (heterogeneous boiling).';

/** Result of a bubble pressure of a liquid that may split into two liquids. */
export interface HeterogeneousBubblePressure {
  /** Boiling pressure [Pa]. */
  P_Pa: number;
  /** Vapour mole fractions [–]. */
  y: number[];
  /** Liquid phases present at T: 1 or 2. */
  liquidPhases: number;
  /** With two liquids: their compositions [–], phases[0] the richer in the first component. */
  phases?: [number[], number[]];
  warnings: string[];
}

/**
 * Boiling pressure at T of a liquid that may split into two liquid phases: the
 * counterpart at a set temperature of heterogeneousBubblePoint.
 *
 * Source: see the module comment (modified Raoult's law: Smith, Van Ness &
 * Abbott 7th ed. §10.5; LLE: Michelsen 1982, Rachford & Rice 1952).
 *
 * Method: the liquid–liquid equilibrium does not depend on pressure in this
 * model (activity coefficients of x and T only, ideal vapour), so the liquids
 * that boil together at T are the split at T itself (liquidLiquidSplit); the
 * pressure is the bubble pressure of one of them, P = Σ_i x_i^I γ_i^I P_i^sat
 * (both liquids have equal activities, hence equal partial pressures). With no
 * split, the homogeneous bubble pressure of the feed. No iteration on P: the
 * same point heterogeneousBubblePoint finds at that P, without its root search.
 *
 * @param sys    system from createVleSystem
 * @param z      overall liquid mole fractions [–], summing to 1
 * @param T_K    temperature [K]
 * @param start  the two liquids of a neighbouring feed at the same T [–] (the previous step of a
 *               distillation), handed to liquidLiquidSplit to start its flash from
 * @returns P_Pa [Pa], y [–], liquidPhases 1 or 2, the two liquids [–] when split, warnings
 *
 * Validity: as bubblePressure and liquidLiquidSplit.
 */
export function heterogeneousBubblePressure(
  sys: VleSystem,
  z: readonly number[],
  T_K: number,
  start?: readonly [readonly number[], readonly number[]],
): HeterogeneousBubblePressure {
  const split = liquidLiquidSplit(sys, z, T_K, start);
  if (!split.split) {
    const b = bubblePressure(sys, z, T_K);
    return { P_Pa: b.P_Pa, y: b.y, liquidPhases: 1, warnings: [...split.warnings, ...b.warnings] };
  }
  const b = bubblePressure(sys, split.phases[0], T_K);
  return {
    P_Pa: b.P_Pa,
    y: b.y,
    liquidPhases: 2,
    phases: split.phases,
    warnings: [...split.warnings, ...b.warnings, THREE_PHASE_NOTE],
  };
}

/**
 * The three-phase boiling point started from a neighbouring solution (the
 * previous step of a distillation): the two-liquid flash at each trial T
 * starts from the previous phases (flashFrom, a few substitutions instead of
 * a stability test and a cold flash), and T is found by the safeguarded
 * Newton iteration of bubblePoint on ln Σ x_i^I γ_i^I P_i^sat − ln P, from
 * the previous T, to |f| < 1e-12. Null when the liquid no longer splits or
 * the iteration does not converge: the caller then solves from cold.
 */
function threePhaseFrom(
  sys: VleSystem,
  zs: number[],
  P_Pa: number,
  previous: HeterogeneousBubblePoint,
): HeterogeneousBubblePoint | null {
  const n = sys.components.length;
  const z = Float64Array.from(zs);
  const xI = Float64Array.from(previous.phases![0]);
  const xII = Float64Array.from(previous.phases![1]);
  const lnP = new Float64Array(n);
  const slope = new Float64Array(n);
  const lnG = new Float64Array(n);
  const lnTarget = Math.log(P_Pa);
  let flash: Flash | null = null;
  let failed = false;
  // The previous residual and its vapour-pressure slope, for the share of f'(T) that the activity
  // coefficients and the moving liquid compositions carry (below).
  let previousT = NaN;
  let previousF = NaN;
  let previousSlope = NaN;
  const solution = newtonSafe(
    (T) => {
      flash = failed ? null : flashFrom(sys.unifac, z, T, xI, xII, 300);
      if (!flash || !flash.converged) {
        failed = true;
        return { f: NaN, df: 1 };
      }
      saturationPressures(sys, T, lnP, slope);
      sys.unifac.lnGammas(xI, T, lnG);
      let sum = 0;
      let dsum = 0;
      for (let i = 0; i < n; i++) {
        if (xI[i] === 0 || lnP[i] === -Infinity) continue;
        const p = xI[i] * Math.exp(lnG[i] + lnP[i]);
        sum += p;
        dsum += p * slope[i];
      }
      const f = Math.log(sum) - lnTarget;
      const raoult = dsum / sum;
      // As in bubblePoint: the vapour pressures' share of f'(T) is exact; the share of the activity
      // coefficients and of the two liquids' compositions (both move with T along the split) is
      // taken from the secant through the previous residual less the vapour pressures' mean slope
      // there, kept only within a factor of 2 of the vapour pressures' share: superlinear where the
      // plain step converges linearly.
      let df = raoult;
      const dT = T - previousT;
      if (dT !== 0 && Number.isFinite(dT)) {
        const corrected = raoult + (f - previousF) / dT - 0.5 * (raoult + previousSlope);
        if (corrected > 0.5 * raoult && corrected < 2 * raoult) df = corrected;
      }
      previousT = T;
      previousF = f;
      previousSlope = raoult;
      return { f, df };
    },
    previous.T_K,
    { lower: 1, maxStep: 10, ftol: 1e-12, xtol: 1e-9, rtol: 0, maxIterations: 40 },
  );
  if (failed || !solution.converged || !flash) return null;
  const T = solution.root;
  const done = flash as Flash;
  // The vapour from phase I at the root (both liquids give the same partial pressures).
  saturationPressures(sys, T, lnP, slope);
  sys.unifac.lnGammas(done.xI, T, lnG);
  const y = new Array<number>(n);
  let sumY = 0;
  for (let i = 0; i < n; i++) {
    y[i] = lnP[i] === -Infinity ? 0 : done.xI[i] * Math.exp(lnG[i] + lnP[i]);
    sumY += y[i];
  }
  for (let i = 0; i < n; i++) y[i] /= sumY;
  const split = orderedSplit(done, []) as Extract<LiquidLiquidResult, { split: true }>;
  const warnings = saturationWarnings(sys, T, zs);
  warnings.push(THREE_PHASE_NOTE);
  return {
    T_K: T,
    y,
    liquidPhases: 2,
    phases: split.phases,
    phaseFraction: split.phaseFraction,
    warnings,
  };
}
