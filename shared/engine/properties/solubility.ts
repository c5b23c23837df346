/**
 * Solid–liquid solubility: ideal (Schröder–van Laar), activity-corrected with
 * UNIFAC, fits of measured points (van 't Hoff, modified Apelblat), the
 * Jouyban–Acree cosolvency model, and unit helpers.
 *
 * References:
 *  - J. M. Prausnitz, R. N. Lichtenthaler, E. G. de Azevedo, *Molecular
 *    Thermodynamics of Fluid-Phase Equilibria*, 3rd ed., Prentice Hall 1999,
 *    §11.2 (solubility of solids in liquids; eq. 11-13 without the ΔCp terms).
 *  - A. Apelblat, E. Manzurola, J. Chem. Thermodyn. 1999, 31, 85–91.
 *    doi:10.1006/jcht.1998.0424
 *  - A. Jouyban, J. Pharm. Pharm. Sci. 2008, 11, 32–58 (review of the
 *    Jouyban–Acree model). doi:10.18433/J3PP4K
 *  - S. H. Yalkowsky, T. J. Roseman, in *Techniques of Solubilization of
 *    Drugs*, Dekker 1981 (log-linear cosolvency model).
 */
import { EngineError } from '../errors';
import { R_J_PER_MOL_K } from '../units';
import type { UnifacGroups } from '../data/types';
import { createUnifac, type UnifacModel, type UnifacModelCache } from '../thermo/unifac';
import { liquidLiquidSplit, type VleSystem } from '../thermo/vle';
import { brent } from '../numerics';

/** Temperature range in which the original UNIFAC parameters were fitted
 * (roughly 275–425 K, Fredenslund et al. 1975); outside it results carry a warning. */
const UNIFAC_T_MIN_K = 275;
const UNIFAC_T_MAX_K = 425;

function assertFinite(
  value: number,
  name: string,
  unit: string,
  opts: { positive?: boolean; nonNegative?: boolean } = {},
): void {
  if (!Number.isFinite(value) || (opts.positive && value <= 0) || (opts.nonNegative && value < 0)) {
    const cond = opts.positive ? ' > 0' : opts.nonNegative ? ' ≥ 0' : '';
    throw new EngineError(
      'invalid-input',
      `${name} must be a finite number${cond} ${unit} (got ${value}).`,
      { name, value },
    );
  }
}

export interface IdealSolubilityResult {
  /** Mole fraction of the solute in the saturated solution [-] */
  moleFraction: number;
  method: string;
  warnings: string[];
}

/**
 * Ideal solubility of a solid from its melting point and enthalpy of fusion
 * (Schröder–van Laar; Prausnitz et al. 1999, eq. 11-13 with ΔCp = 0):
 *
 *   ln x = −(ΔHfus / R) · (1/T − 1/Tm)
 *
 * @param input.meltingPointK Tm, normal melting point of the solute [K], > 0
 * @param input.enthalpyFusionJmol ΔHfus at Tm [J/mol], ≥ 0
 * @param input.T_K T, temperature of the solution [K], > 0
 * @returns mole fraction x [-] with the method and warnings
 *
 * Validity: a pure solid solute that does not form solid solutions or
 * solvates; ΔCp of fusion neglected (error grows with Tm − T, typically a
 * few per cent in x at 50 K below Tm). At T ≥ Tm the solute is a liquid:
 * x = 1 is returned with a warning (miscibility is then a liquid–liquid
 * question). Polymorphs: use the Tm and ΔHfus of the form that is present.
 *
 * Example: naphthalene, Tm = 353.35 K, ΔHfus = 18 980 J/mol, T = 298.15 K →
 * x = exp(−18980/8.314 · (1/298.15 − 1/353.35)) = 0.302.
 *
 * Source: Schröder–van Laar equation; Prausnitz, Lichtenthaler & de Azevedo, Molecular
 * Thermodynamics of Fluid-Phase Equilibria, 3rd ed. 1999, eq. 11-13.
 */
export function idealSolubility(input: {
  meltingPointK: number;
  enthalpyFusionJmol: number;
  T_K: number;
}): IdealSolubilityResult {
  const { meltingPointK: Tm, enthalpyFusionJmol: dH, T_K: T } = input;
  assertFinite(Tm, 'Melting point', 'K', { positive: true });
  assertFinite(dH, 'Enthalpy of fusion', 'J/mol', { nonNegative: true });
  assertFinite(T, 'Temperature', 'K', { positive: true });
  const method = 'ideal solubility (Schröder–van Laar, ΔCp neglected)';
  const warnings: string[] = [];
  if (T >= Tm) {
    warnings.push(
      `The temperature ${T.toFixed(2)} K is at or above the melting point ${Tm.toFixed(2)} K: the solute is a liquid, x = 1 returned; miscibility is then a liquid–liquid question.`,
    );
    return { moleFraction: 1, method, warnings };
  }
  if (Tm - T > 100) {
    warnings.push(
      `The temperature is ${(Tm - T).toFixed(0)} K below the melting point; neglecting the heat-capacity change of fusion may bias the result.`,
    );
  }
  const lnx = -(dH / R_J_PER_MOL_K) * (1 / T - 1 / Tm);
  return { moleFraction: Math.exp(lnx), method, warnings };
}

/** How the solute's liquid behaves at the saturation point (see liquidPhaseSeparation). */
export interface OilingOutTest {
  /**
   * - 'none': the solute + solvent liquid is stable at every solute fraction
   *   along the dilution line (no liquid–liquid split);
   * - 'metastable': a liquid–liquid split exists, in the supersaturated
   *   region (solute activity at the split above the solid's): a solution
   *   driven past the solvent-rich binodal before it nucleates separates as
   *   an oil;
   * - 'stable': the split lies below the solid's solubility (solute activity
   *   at the split at or below the solid's): the solute's stable state in this
   *   solvent is an oil, not crystals;
   * - 'not-tested': UNIFAC could not be evaluated (missing parameters).
   */
  kind: 'none' | 'metastable' | 'stable' | 'not-tested';
  /** Solute mole fraction of the solvent-rich liquid at the split [–]. */
  solventRichX?: number;
  /** Solute mole fraction of the solute-rich liquid (the oil) [–]. */
  soluteRichX?: number;
  /** Solute activity (pure subcooled liquid reference) at the split [–]. */
  activity?: number;
  warnings: string[];
}

export interface ActivityCorrectedSolubilityResult {
  /** Mole fraction of the solute in the saturated solution [-] */
  moleFraction: number;
  /** Ideal mole fraction solubility at the same T [-] */
  idealMoleFraction: number;
  /** Activity coefficient of the solute in the saturated solution [-] */
  gamma: number;
  /** Liquid–liquid split (oiling-out) test at T. */
  oilingOut: OilingOutTest;
  method: string;
  warnings: string[];
}

/**
 * Scan grid of the solubility root: logarithmic from 1e−12 to 0.1 (44 steps),
 * then linear to 1 − 1e−9 in steps of 0.025, so that a liquid–liquid split
 * near the solute-rich end is not stepped over.
 */
const SCAN_GRID: readonly number[] = (() => {
  const grid: number[] = [];
  for (let k = 0; k <= 44; k++) grid.push(Math.pow(10, -12 + (11 * k) / 44));
  for (let k = 1; k <= 36; k++) grid.push(0.1 + 0.025 * k);
  grid[grid.length - 1] = 1 - 1e-9;
  return grid;
})();

/** ln of SCAN_GRID. */
const LN_GRID: readonly number[] = SCAN_GRID.map(Math.log);

/** Result of solveActivitySolubility. */
export interface ActivitySolubilityRoot {
  /** Solute mole fraction at saturation [–]. */
  x: number;
  /** ln γ of the solute there [–]. */
  lnGamma: number;
  /** Sign changes of f on the scan grid [–]; more than one means f is not monotonic (a liquid–liquid split). */
  signChanges: number;
  /** False when Brent's method did not meet its tolerance (the best estimate is returned). */
  converged: boolean;
  /** True when the solute is below x = 1e-12 even at the lowest grid point. */
  belowGrid: boolean;
}

/**
 * The one root solver of activity-corrected solubility, used by the
 * calculation API (activityCorrectedSolubility) and by the unit operations
 * (unitops/solubility-model.ts):
 *
 *   f(x) = ln x + ln γ(x) − ln x_ideal = 0
 *
 * f → −∞ as x → 0 and f(1) = −ln x_ideal ≥ 0 (γ = 1 for the pure solute), so a
 * root exists. f is scanned from x = 1e−12 (logarithmic steps to 0.1, then
 * steps of 0.025 to 1 − 1e−9); the first sign change is refined by Brent's method
 * (numerics/roots.ts) on u = ln x (f is nearly linear in ln x) to 1e−13 in
 * u. More than one sign change means f is not monotonic: UNIFAC predicts a
 * liquid–liquid split of the saturated solution (oiling out).
 *
 * @param lnGammaSolute  ln γ of the solute at solute mole fraction x [–], the solvents at their solute-free ratio
 * @param xIdeal         ideal solubility [–], 0 < x_ideal ≤ 1
 * @returns the lowest-concentration root with its convergence flag
 *
 * Validity: as the activity model; deterministic.
 *
 * Source: solid–liquid equilibrium x γ(x, T) = x_ideal(T) (Prausnitz et al. 1999, ch. 11) with
 * UNIFAC activity coefficients.
 */
export function solveActivitySolubility(
  lnGammaSolute: (x: number) => number,
  xIdeal: number,
): ActivitySolubilityRoot {
  return scanAndSolve(lnGammaSolute, xIdeal, null);
}

/**
 * The cold solve of solveActivitySolubility; with `lnA` it also receives
 * ln a = ln x + ln γ at every grid point (NaN above a below-grid answer).
 */
function scanAndSolve(
  lnGammaSolute: (x: number) => number,
  xIdeal: number,
  lnA: Float64Array | null,
): ActivitySolubilityRoot {
  if (xIdeal >= 1)
    return {
      x: 1,
      lnGamma: 0,
      signChanges: 0,
      converged: true,
      belowGrid: false,
    };
  const lnXi = Math.log(xIdeal);
  const f = (x: number): number => Math.log(x) + lnGammaSolute(x) - lnXi;
  let prevX = SCAN_GRID[0];
  let prevF = f(prevX);
  if (lnA) {
    lnA.fill(NaN);
    lnA[0] = prevF + lnXi;
  }
  if (prevF >= 0)
    return {
      x: prevX,
      lnGamma: lnGammaSolute(prevX),
      signChanges: 0,
      converged: true,
      belowGrid: true,
    };
  let lo = NaN;
  let hi = NaN;
  let fLo = NaN;
  let fHi = NaN;
  let signChanges = 0;
  for (let k = 1; k < SCAN_GRID.length; k++) {
    const x = SCAN_GRID[k];
    const fx = f(x);
    if (lnA) lnA[k] = fx + lnXi;
    if (prevF < 0 !== fx < 0) {
      signChanges++;
      if (Number.isNaN(lo)) {
        lo = prevX;
        hi = x;
        fLo = prevF;
        fHi = fx;
      }
    }
    prevX = x;
    prevF = fx;
  }
  if (Number.isNaN(lo)) {
    // f(1) = −ln x_ideal > 0 analytically; f(1 − 1e−9) < 0 only by rounding.
    lo = SCAN_GRID[SCAN_GRID.length - 2];
    hi = 1;
    fLo = f(lo);
    fHi = -lnXi;
  }
  const r = refineRoot(f, lo, hi, fLo, fHi);
  const x = Math.exp(r.root);
  return {
    x,
    lnGamma: lnGammaSolute(x),
    signChanges,
    converged: r.converged,
    belowGrid: false,
  };
}

/** Brent's method on u = ln x over the grid cell [lo, hi] (f(lo) < 0 ≤ f(hi)), to 1e−13 in u. */
function refineRoot(f: (x: number) => number, lo: number, hi: number, fLo: number, fHi: number) {
  return brent(
    (u) => f(Math.exp(u)),
    Math.log(lo),
    Math.log(hi),
    { xtol: 1e-13, rtol: 0 },
    { fa: fLo, fb: fHi },
  );
}

/**
 * Largest temperature step [K] over which a solved temperature of a liquid
 * may start the solve at another (see createActivitySolubilitySolver).
 */
export const WARM_START_MAX_DT_K = 5;

/**
 * Least slope d ln a / d ln x [–] (the thermodynamic factor, averaged over
 * each grid cell) of the dilution line, from its dilute end, below the grid
 * points a warm start leaves unevaluated (see createActivitySolubilitySolver):
 * 1 for an ideal solution, 0 at the limit of stability (spinodal). Over 5 K
 * the non-ideal part 1 − slope of a UNIFAC liquid changes by about
 * a·ΔT/T² (Ψ = exp(−a/T)): about 17 % for a = 3000 K at 300 K, far from
 * taking 0.25 to 0 (this project's own estimate).
 */
export const WARM_START_MIN_SLOPE = 0.25;

/** A temperature solved cold, kept to start later solves of the same liquid. */
interface SolubilityAnchor {
  T_K: number;
  lnXIdeal: number;
  lnX: number;
  /** Grid points 0 … stableTo lie on a stretch where ln a rises with slope ≥ WARM_START_MIN_SLOPE. */
  stableTo: number;
}

/** Solves of one liquid at many temperatures (createActivitySolubilitySolver). */
export interface ActivitySolubilitySolver {
  /**
   * Solute mole fraction at saturation [–]: exactly the x of
   * solveActivitySolubility at this temperature.
   * @param T_K     temperature [K]
   * @param xIdeal  ideal solubility at T_K [–]
   */
  solve(T_K: number, xIdeal: number): number;
  /** Solves by the full scan and by a warm start so far [–]. */
  readonly counts: { cold: number; warm: number };
}

/** Index of the first grid point at or above x (1 … length − 1). */
function gridCellAbove(x: number): number {
  let lo = 1;
  let hi = SCAN_GRID.length - 1;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (SCAN_GRID[mid] >= x) hi = mid;
    else lo = mid + 1;
  }
  return lo;
}

/**
 * Activity-corrected solubility of one liquid (a solute and solvents at a
 * fixed solute-free ratio) at many temperatures, each answer the same number
 * as solveActivitySolubility's (the lowest-concentration root of
 * ln x + ln γ(x, T) = ln x_ideal(T), refined by Brent's method over the first
 * grid cell where f changes sign), at a fraction of its cost.
 *
 * The full scan (81 points) finds that cell; a temperature solved by the scan
 * is kept as an anchor with the stretch of the grid, from its dilute end, on
 * which ln a = ln x + ln γ rises with a slope d ln a / d ln x ≥
 * WARM_START_MIN_SLOPE in every cell (well inside the stability limit: no
 * liquid–liquid split near). A temperature within WARM_START_MAX_DT_K of an
 * anchor starts from the anchor's γ: x₀ = x_ideal(T) / γ_anchor (the ideal
 * solubility corrected by the last activity coefficient); f is evaluated at
 * the two grid points around x₀, then at neighbouring grid points until the
 * cell where f goes from below zero to at or above it (at most 6 steps).
 * When every grid point below the lowest one evaluated lies on the anchor's
 * steep stretch (so f < 0 there, ln a rising to a point where f < 0), that
 * cell and its end values are the ones the scan finds first, and Brent's
 * method returns the same bits. Anything else (no anchor near, the start
 * above the steep stretch, the answer below the grid or in the last cell, a
 * longer walk) is solved by the full scan.
 *
 * @param lnGammaSolute  ln γ of the solute at solute mole fraction x [–] and temperature T [K]
 * @param maxAnchors     anchors kept (the oldest dropped first) [–]
 * @returns the solver
 *
 * Source: solid–liquid equilibrium x γ(x, T) = x_ideal(T) (Prausnitz et al.
 * 1999, ch. 11); the stability condition d ln a / d ln x > 0 of a binary
 * liquid (Prausnitz et al. 1999, ch. 12 on phase stability). The warm start
 * and its limits (5 K, slope 0.5) are this project's own.
 * Validity: the slope test is made on the grid, as the scan itself sees the
 * liquid; a liquid–liquid split that opens within 5 K of a liquid whose
 * thermodynamic factor was 0.5 or more everywhere would be missed, as it
 * would between two scan points.
 */
export function createActivitySolubilitySolver(
  lnGammaSolute: (x: number, T_K: number) => number,
  maxAnchors = 16,
): ActivitySolubilitySolver {
  const anchors: SolubilityAnchor[] = [];
  const lnA = new Float64Array(SCAN_GRID.length);
  const counts = { cold: 0, warm: 0 };
  const cold = (T_K: number, xIdeal: number): number => {
    counts.cold++;
    const r = scanAndSolve((x) => lnGammaSolute(x, T_K), xIdeal, lnA);
    if (r.belowGrid || xIdeal >= 1) return r.x;
    // The grid points up to `stableTo` lie on a stretch where ln a rises steeply enough.
    let stableTo = 0;
    while (
      stableTo + 1 < SCAN_GRID.length &&
      (lnA[stableTo + 1] - lnA[stableTo]) / (LN_GRID[stableTo + 1] - LN_GRID[stableTo]) >=
        WARM_START_MIN_SLOPE
    )
      stableTo++;
    if (stableTo === 0) return r.x;
    if (anchors.length >= maxAnchors) anchors.shift();
    anchors.push({ T_K, lnXIdeal: Math.log(xIdeal), lnX: Math.log(r.x), stableTo });
    return r.x;
  };
  return {
    counts,
    solve(T_K, xIdeal) {
      if (xIdeal >= 1) return 1;
      let near: SolubilityAnchor | undefined;
      for (const a of anchors)
        if (
          Math.abs(a.T_K - T_K) <= WARM_START_MAX_DT_K &&
          (!near || Math.abs(a.T_K - T_K) < Math.abs(near.T_K - T_K))
        )
          near = a;
      if (!near) return cold(T_K, xIdeal);
      const lnXi = Math.log(xIdeal);
      const f = (x: number): number => Math.log(x) + lnGammaSolute(x, T_K) - lnXi;
      let k = gridCellAbove(Math.exp(near.lnX + lnXi - near.lnXIdeal));
      // Every grid point below the lowest one evaluated must lie on the anchor's steep stretch.
      if (k - 1 > near.stableTo) return cold(T_K, xIdeal);
      const last = SCAN_GRID.length - 1;
      let fLo = f(SCAN_GRID[k - 1]);
      let fHi = f(SCAN_GRID[k]);
      for (let step = 0; ; step++) {
        if (fLo < 0 && fHi >= 0) break;
        if (step >= 6) return cold(T_K, xIdeal);
        if (fLo >= 0) {
          // The root lies lower; the scan's answer at k − 1 = 0 would be "below the grid".
          if (k - 1 <= 1) return cold(T_K, xIdeal);
          k--;
          fHi = fLo;
          fLo = f(SCAN_GRID[k - 1]);
        } else {
          // The scan takes the last cell as [g, 1] with f(1) = −ln x_ideal: leave it to the scan.
          if (k + 1 >= last) return cold(T_K, xIdeal);
          k++;
          fLo = fHi;
          fHi = f(SCAN_GRID[k]);
        }
      }
      counts.warm++;
      return Math.exp(refineRoot(f, SCAN_GRID[k - 1], SCAN_GRID[k], fLo, fHi).root);
    },
  };
}

/**
 * Liquid–liquid split of a solute (as its subcooled liquid) with a solvent
 * blend: the oiling-out test.
 *
 * Method: along the dilution line (solute mole fraction x, the solvents at
 * their solute-free ratio) the solute activity a(x) = x γ(x) of a stable
 * liquid rises with x. Where it falls, the liquid is unstable; a UNIFAC
 * liquid–liquid flash (thermo/vle liquidLiquidSplit: tangent-plane test,
 * Michelsen 1982, then Rachford–Rice) from a composition there gives the two
 * coexisting liquids and their common solute activity a_LL. Compared with the
 * solid's solubility (activity x_ideal, Schröder–van Laar): a_LL > x_ideal —
 * the split lies in the supersaturated region ('metastable': oiling out when
 * the solution is driven past the solvent-rich binodal before nucleation);
 * a_LL ≤ x_ideal — the oil is more stable than the crystals ('stable').
 * (Veesler et al., Org. Process Res. Dev. 2006, 10, 841, describe oiling out
 * as such a miscibility gap inside the supersaturated region — citation
 * recalled.)
 *
 * @param input.soluteGroups          UNIFAC subgroups of the solute
 * @param input.solventGroups         UNIFAC subgroups of each solvent
 * @param input.solventMoleFractions  solute-free mole fractions of the solvents [–], summing to 1
 * @param input.T_K                   temperature [K]
 * @param input.xIdeal                ideal solubility of the solid at T [–]
 * @param input.models                UNIFAC model cache (optional; same numbers)
 * @param input.start                 two liquids [–] (solute first) of a split of the same solute and
 *                                    solvents at a neighbouring temperature or ratio: the flash starts
 *                                    from them (thermo/vle liquidLiquidSplit's `start`; the same split to
 *                                    the flash's tolerance, 1e-10 in ln K), optional
 * @param input.onSplit               receives the two liquids when there is a split (a later call's start)
 * @returns the kind of split and, when there is one, the two liquid compositions
 *
 * Validity: UNIFAC's LLE weakness applies (the split's compositions can be
 * off by a factor 2–10); the test is on the pseudo-binary dilution line and
 * does not look for splits of the solvent blend itself.
 *
 * Source: tangent-plane stability (M. L. Michelsen, Fluid Phase Equilib. 1982, 9, 1) and
 * Rachford–Rice flash; oiling out as in Veesler et al., Org. Process Res. Dev. 2006, 10, 841.
 */
export function liquidPhaseSeparation(input: {
  soluteGroups: UnifacGroups;
  solventGroups: UnifacGroups[];
  solventMoleFractions: number[];
  T_K: number;
  xIdeal: number;
  models?: UnifacModelCache;
  start?: readonly [readonly number[], readonly number[]];
  onSplit?: (phases: [number[], number[]]) => void;
}): OilingOutTest {
  const { soluteGroups, solventGroups, solventMoleFractions: z, T_K, xIdeal } = input;
  const components = [soluteGroups, ...solventGroups];
  let model: UnifacModel;
  try {
    model = input.models ? input.models.model(components) : createUnifac(components);
  } catch (e) {
    return { kind: 'not-tested', warnings: [(e as Error).message] };
  }
  const n = components.length;
  const xs = new Float64Array(n);
  const buf = new Float64Array(n);
  const lnA = (x: number): number => {
    xs[0] = x;
    for (let j = 0; j < z.length; j++) xs[j + 1] = (1 - x) * z[j];
    return Math.log(x) + model.lnGammas(xs, T_K, buf)[0];
  };
  // Scan ln a along the dilution line for a falling stretch (instability).
  const N = 60;
  let prev = lnA(1e-6);
  let unstableAt = NaN;
  for (let k = 1; k <= N; k++) {
    const x = 1e-6 * Math.pow((1 - 1e-6) / 1e-6, k / N);
    const v = lnA(Math.min(x, 1 - 1e-9));
    if (v < prev - 1e-12) {
      unstableAt = x;
      break;
    }
    prev = v;
  }
  if (Number.isNaN(unstableAt)) return { kind: 'none', warnings: [] };
  const zAll = [unstableAt, ...z.map((v) => (1 - unstableAt) * v)];
  const sys: VleSystem = {
    components: components.map((g) => ({
      antoine: [],
      unifac: g,
      nonVolatile: true,
    })),
    unifac: model,
    regressedPairs: [],
    warnings: [],
  };
  const split = liquidLiquidSplit(sys, zAll, T_K, input.start);
  if (!split.split) return { kind: 'none', warnings: split.warnings };
  const [p1, p2] = split.phases;
  input.onSplit?.([Array.from(p1), Array.from(p2)]);
  const solventRich = p1[0] <= p2[0] ? p1 : p2;
  const soluteRich = p1[0] <= p2[0] ? p2 : p1;
  const activity = Math.exp(lnA(solventRich[0]));
  return {
    kind: activity <= xIdeal ? 'stable' : 'metastable',
    solventRichX: solventRich[0],
    soluteRichX: soluteRich[0],
    activity,
    warnings: split.warnings,
  };
}

/**
 * Solubility of a solid corrected for non-ideality with UNIFAC: solves
 *
 *   x · γ(x, T) = x_ideal(T)
 *
 * where γ is the solute's UNIFAC activity coefficient in the saturated
 * liquid (solute + the solvent mixture at its solute-free composition), and
 * tests the liquid for a liquid–liquid split (oiling out).
 *
 * @param input.meltingPointK        Tm of the solute [K]
 * @param input.enthalpyFusionJmol   ΔHfus [J/mol]
 * @param input.T_K                  temperature [K]
 * @param input.soluteGroups         UNIFAC subgroups of the solute
 * @param input.solventGroups        UNIFAC subgroups of each solvent
 * @param input.solventMoleFractions solute-free mole fractions of the solvents [–], summing to 1
 * @param input.models               UNIFAC model cache (optional; the same numbers as building afresh)
 * @returns x [–], x_ideal [–], γ at the solution [–], the oiling-out test, method and warnings
 *
 * Numerics: solveActivitySolubility (log scan, then Brent on ln x).
 * Validity: UNIFAC's range (≈ 275–425 K, warned outside); typical error of
 * UNIFAC solubility predictions for drug-like solids is a factor 2–3 in x
 * (common practice). Throws UnifacParameterError (code
 * 'unifac-missing-parameters') when a group pair has no parameter.
 * Example: naphthalene (Tm 353.35 K, ΔHfus 18 980 J/mol) in toluene at
 * 293.15 K → x ≈ 0.264 (Prausnitz et al. tabulate 0.224).
 *
 * Source: Prausnitz et al. 1999, ch. 11 (solid–liquid equilibrium) with UNIFAC (Fredenslund et al.
 * 1975; Hansen et al. 1991).
 */
export function activityCorrectedSolubility(input: {
  meltingPointK: number;
  enthalpyFusionJmol: number;
  T_K: number;
  soluteGroups: UnifacGroups;
  solventGroups: UnifacGroups[];
  solventMoleFractions: number[];
  models?: UnifacModelCache;
}): ActivityCorrectedSolubilityResult {
  const ideal = idealSolubility(input);
  const warnings = [...ideal.warnings];
  const { solventGroups, solventMoleFractions, T_K } = input;
  if (solventGroups.length === 0 || solventGroups.length !== solventMoleFractions.length) {
    throw new EngineError(
      'invalid-input',
      'Give one mole fraction for each solvent (at least one solvent).',
      {
        solvents: solventGroups.length,
        fractions: solventMoleFractions.length,
      },
    );
  }
  let sum = 0;
  for (const z of solventMoleFractions) {
    assertFinite(z, 'Solvent mole fraction', '', { nonNegative: true });
    sum += z;
  }
  if (Math.abs(sum - 1) > 1e-6) {
    throw new EngineError(
      'invalid-input',
      `Solute-free solvent mole fractions must sum to 1 (sum = ${sum}).`,
      { sum },
    );
  }
  if (T_K < UNIFAC_T_MIN_K || T_K > UNIFAC_T_MAX_K) {
    warnings.push(
      `UNIFAC parameters were fitted at about ${UNIFAC_T_MIN_K}–${UNIFAC_T_MAX_K} K; ${T_K.toFixed(1)} K is outside.`,
    );
  }
  const method =
    'ideal solubility (Schröder–van Laar) corrected by UNIFAC activity coefficient (x·γ = x_ideal)';
  const xIdeal = ideal.moleFraction;
  const components = [input.soluteGroups, ...solventGroups];
  const model = input.models ? input.models.model(components) : createUnifac(components);
  if (xIdeal >= 1) {
    return {
      moleFraction: 1,
      idealMoleFraction: 1,
      gamma: 1,
      oilingOut: { kind: 'none', warnings: [] },
      method,
      warnings,
    };
  }
  const n = components.length;
  const xs = new Float64Array(n);
  const buf = new Float64Array(n);
  const lnGamma = (x: number): number => {
    xs[0] = x;
    for (let j = 0; j < solventMoleFractions.length; j++)
      xs[j + 1] = (1 - x) * solventMoleFractions[j];
    return model.lnGammas(xs, T_K, buf)[0];
  };
  const root = solveActivitySolubility(lnGamma, xIdeal);
  if (root.belowGrid) warnings.push('Predicted solubility is below a mole fraction of 1e-12.');
  if (!root.converged)
    warnings.push('The solubility root did not meet its tolerance; the best estimate is given.');
  const oilingOut = liquidPhaseSeparation({
    soluteGroups: input.soluteGroups,
    solventGroups,
    solventMoleFractions,
    T_K,
    xIdeal,
    models: input.models,
  });
  warnings.push(...oilingOutWarnings(oilingOut, 'The solute'));
  return {
    moleFraction: root.x,
    idealMoleFraction: xIdeal,
    gamma: Math.exp(root.lnGamma),
    oilingOut,
    method,
    warnings,
  };
}

/**
 * Plain-language warnings of an oiling-out test.
 * @param t      the test result
 * @param label  how to name the solute in the message (e.g. its name)
 * @returns zero or one message
 *
 * Source: liquidPhaseSeparation (Michelsen 1982; Veesler et al. 2006).
 * Validity: as liquidPhaseSeparation (UNIFAC's liquid–liquid weakness applies).
 */
export function oilingOutWarnings(t: OilingOutTest, label: string): string[] {
  if (t.kind === 'stable')
    return [
      `${label} separates as an oil rather than crystals at this temperature: UNIFAC predicts a liquid–liquid split (solvent-rich liquid at x = ${t.solventRichX!.toPrecision(3)}, oil at x = ${t.soluteRichX!.toPrecision(3)}) below the solid's solubility.`,
    ];
  if (t.kind === 'metastable')
    return [
      `${label} may oil out: UNIFAC predicts a liquid–liquid split in the supersaturated region, from x = ${t.solventRichX!.toPrecision(3)} (oil at x = ${t.soluteRichX!.toPrecision(3)}); seed before the solution reaches it.`,
    ];
  return [];
}

type Point = { T_K: number; moleFraction: number };

function checkPoints(points: Point[], min: number, model: string): void {
  if (points.length < min) {
    throw new EngineError(
      'invalid-input',
      `The ${model} fit needs at least ${min} measured points (got ${points.length}).`,
      { count: points.length },
    );
  }
  for (const p of points) {
    assertFinite(p.T_K, 'Temperature', 'K', { positive: true });
    if (!Number.isFinite(p.moleFraction) || p.moleFraction <= 0 || p.moleFraction > 1) {
      throw new EngineError(
        'invalid-input',
        `A measured mole fraction must lie in (0, 1] (got ${p.moleFraction}).`,
        { value: p.moleFraction },
      );
    }
  }
  const Ts = new Set(points.map((p) => p.T_K));
  if (Ts.size < min) {
    throw new EngineError(
      'invalid-input',
      `The ${model} fit needs at least ${min} distinct temperatures.`,
      { distinct: Ts.size },
    );
  }
}

/** Solve a small dense linear system by Gaussian elimination with partial pivoting. */
function solveLinear(A: number[][], b: number[]): number[] {
  const n = b.length;
  const M = A.map((row, i) => [...row, b[i]]);
  for (let c = 0; c < n; c++) {
    let piv = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(M[r][c]) > Math.abs(M[piv][c])) piv = r;
    if (Math.abs(M[piv][c]) < 1e-300)
      throw new EngineError(
        'invalid-input',
        'The measured points do not determine the fit (singular system).',
        {},
      );
    [M[c], M[piv]] = [M[piv], M[c]];
    for (let r = c + 1; r < n; r++) {
      const fac = M[r][c] / M[c][c];
      for (let k = c; k <= n; k++) M[r][k] -= fac * M[c][k];
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let r = n - 1; r >= 0; r--) {
    let s = M[r][n];
    for (let k = r + 1; k < n; k++) s -= M[r][k] * x[k];
    x[r] = s / M[r][r];
  }
  return x;
}

/** Least squares on columns (already scaled) → coefficients and RMSE. */
function leastSquares(cols: number[][], y: number[]): { coef: number[]; rmse: number } {
  const m = cols.length;
  const A = Array.from({ length: m }, (_, i) =>
    Array.from({ length: m }, (_, j) => cols[i].reduce((s, v, k) => s + v * cols[j][k], 0)),
  );
  const b = cols.map((c) => c.reduce((s, v, k) => s + v * y[k], 0));
  const coef = solveLinear(A, b);
  let ss = 0;
  for (let k = 0; k < y.length; k++) {
    let yhat = 0;
    for (let i = 0; i < m; i++) yhat += coef[i] * cols[i][k];
    ss += (y[k] - yhat) ** 2;
  }
  return { coef, rmse: Math.sqrt(ss / y.length) };
}

export interface FitRange {
  /** Lowest and highest temperature of the fitted points [K] */
  TminK: number;
  TmaxK: number;
  /** Notes on the fit (e.g. as many points as parameters: exact fit, no residual) */
  warnings: string[];
}

/**
 * Van 't Hoff fit of measured solubilities: ln x = a + b/T, least squares in
 * ln x (common practice; b = −ΔHsol/R for an apparent enthalpy of solution).
 *
 * @param points measured (T [K], x [-]) pairs, at least 2 distinct temperatures
 * @returns a [-], b [K], rmseLn (root-mean-square residual in ln x [-]),
 *   the fitted range and predict(T_K) → x [-]
 *
 * Validity: interpolation within the fitted range; extrapolation beyond it
 * is the caller's risk (the range is returned). predict() clips nothing:
 * x > 1 can come out of a wild extrapolation.
 * Example: points (290 K, 0.010), (310 K, 0.020) → b = ln 2 / (1/310 − 1/290) = −3116 K,
 * a = ln 0.010 − b/290 = 6.14.
 *
 * Source: van 't Hoff form ln x = a + b/T, least squares (e.g. Prausnitz et al. 1999, ch. 11).
 */
export function fitVantHoff(points: Point[]): {
  a: number;
  b: number;
  rmseLn: number;
  predict(T_K: number): number;
} & FitRange {
  checkPoints(points, 2, "van 't Hoff");
  const Tref = points.reduce((s, p) => s + p.T_K, 0) / points.length;
  const y = points.map((p) => Math.log(p.moleFraction));
  const cols = [points.map(() => 1), points.map((p) => Tref / p.T_K)];
  const { coef, rmse } = leastSquares(cols, y);
  const a = coef[0];
  const b = coef[1] * Tref;
  const Ts = points.map((p) => p.T_K);
  const warnings =
    new Set(Ts).size === 2
      ? [
          'Two temperatures determine the two parameters exactly; the residual says nothing about the quality of the fit.',
        ]
      : [];
  return {
    a,
    b,
    rmseLn: rmse,
    predict: (T_K: number) => Math.exp(a + b / T_K),
    TminK: Math.min(...Ts),
    TmaxK: Math.max(...Ts),
    warnings,
  };
}

/**
 * Modified Apelblat fit (Apelblat & Manzurola 1999): ln x = A + B/T + C·ln T,
 * least squares in ln x. Solved in scaled variables (T/Tref) for
 * conditioning, then converted back to the published form with T in K.
 *
 * @param points measured (T [K], x [-]) pairs, at least 3 distinct temperatures
 * @returns A [-], B [K], C [-], rmseLn [-], the fitted range, predict(T_K) → x
 *
 * Validity: as for van 't Hoff — a correlation for interpolation; the three
 * parameters are strongly correlated and individually not meaningful.
 *
 * Source: A. Apelblat, E. Manzurola, J. Chem. Thermodyn. 1999, 31, 85.
 */
export function fitApelblat(points: Point[]): {
  A: number;
  B: number;
  C: number;
  rmseLn: number;
  predict(T_K: number): number;
} & FitRange {
  checkPoints(points, 3, 'Apelblat');
  const Tref = points.reduce((s, p) => s + p.T_K, 0) / points.length;
  const y = points.map((p) => Math.log(p.moleFraction));
  const cols = [
    points.map(() => 1),
    points.map((p) => Tref / p.T_K),
    points.map((p) => Math.log(p.T_K / Tref)),
  ];
  const { coef, rmse } = leastSquares(cols, y);
  const C = coef[2];
  const B = coef[1] * Tref;
  const A = coef[0] - C * Math.log(Tref);
  const Ts = points.map((p) => p.T_K);
  const warnings =
    new Set(Ts).size === 3
      ? [
          'Three temperatures determine the three parameters exactly; the residual says nothing about the quality of the fit.',
        ]
      : [];
  return {
    A,
    B,
    C,
    rmseLn: rmse,
    predict: (T_K: number) => Math.exp(A + B / T_K + C * Math.log(T_K)),
    TminK: Math.min(...Ts),
    TmaxK: Math.max(...Ts),
    warnings,
  };
}

/** Jouyban–Acree interaction terms of one solvent pair [K]. */
export interface JouybanPair {
  /** Indices of the two solvents in the lists passed to jouybanAcree [–]. */
  i: number;
  j: number;
  /** J0, J1, J2 [K], fitted for this solute with f_i − f_j as the difference variable. */
  J0: number;
  J1: number;
  J2: number;
}

/**
 * Solubility in a mixed solvent by the Jouyban–Acree model (Jouyban 2008):
 *
 *   binary:  ln x_m,T = f1 ln x1,T + f2 ln x2,T + (f1 f2 / T) Σ_{k=0..2} J_k (f1 − f2)^k
 *   n ≥ 2:   ln x_m,T = Σ_i f_i ln x_i,T + Σ_pairs (f_i f_j / T) Σ_k J_k,ij (f_i − f_j)^k
 *
 * (the multi-solvent form with binary interaction terms only, no ternary
 * term). Without interaction terms the model reduces to the log-linear
 * (Yalkowsky) model, ln x_m = Σ f_i ln x_i.
 *
 * @param input.lnSolubilities natural log of the solute's mole-fraction
 *   solubility in each neat solvent at T [–]
 * @param input.fractions fraction of each solvent in the solute-free blend
 *   [–], summing to 1 (mass, volume or mole fraction — the same basis on
 *   which the J terms were fitted; the log-linear form is usually on volume)
 * @param input.T_K temperature [K]
 * @param input.interaction J0, J1, J2 [K] of a binary solvent (two solvents only)
 * @param input.pairs J terms of any solvent pairs [K] (alternative to interaction)
 * @returns ln x_m [–], natural log of the mole-fraction solubility in the blend
 *
 * Validity: the J terms hold for the solute, solvent pair, fraction basis and
 * temperature range they were fitted on; outside, an extrapolation.
 * Throws EngineError('invalid-input') when lengths differ, fractions do not
 * sum to 1 within 1e−6, J is given as `interaction` for other than two
 * solvents, or a pair index is out of range.
 * Example: ln x1 = −2, ln x2 = −8, f = (0.5, 0.5), no J → −5.
 *
 * Source: A. Jouyban, J. Pharm. Pharm. Sci. 2008, 11, 32.
 */
export function jouybanAcree(input: {
  lnSolubilities: number[];
  fractions: number[];
  T_K: number;
  interaction?: { J0: number; J1: number; J2: number };
  pairs?: readonly JouybanPair[];
}): number {
  const { lnSolubilities: lnx, fractions: f, T_K, interaction } = input;
  if (lnx.length < 2 || lnx.length !== f.length) {
    throw new EngineError(
      'invalid-input',
      'Give the solubility in, and the fraction of, each of at least two solvents.',
      { solubilities: lnx.length, fractions: f.length },
    );
  }
  assertFinite(T_K, 'Temperature', 'K', { positive: true });
  let sum = 0;
  let lnMix = 0;
  for (let i = 0; i < f.length; i++) {
    assertFinite(f[i], 'Solvent fraction', '', { nonNegative: true });
    assertFinite(lnx[i], 'ln solubility', '');
    sum += f[i];
    lnMix += f[i] * lnx[i];
  }
  if (Math.abs(sum - 1) > 1e-6) {
    throw new EngineError('invalid-input', `Solvent fractions must sum to 1 (sum = ${sum}).`, {
      sum,
    });
  }
  const pairs: JouybanPair[] = [...(input.pairs ?? [])];
  if (interaction) {
    if (f.length !== 2) {
      throw new EngineError(
        'invalid-input',
        'Jouyban–Acree interaction terms are defined for a binary solvent only.',
        { solvents: f.length },
      );
    }
    pairs.push({ i: 0, j: 1, ...interaction });
  }
  for (const p of pairs) {
    if (!(p.i >= 0 && p.i < f.length && p.j >= 0 && p.j < f.length && p.i !== p.j))
      throw new EngineError('invalid-input', 'A Jouyban–Acree pair names an unknown solvent.', {
        i: p.i,
        j: p.j,
      });
    for (const [k, v] of Object.entries({ J0: p.J0, J1: p.J1, J2: p.J2 })) assertFinite(v, k, 'K');
    const d = f[p.i] - f[p.j];
    lnMix += ((f[p.i] * f[p.j]) / T_K) * (p.J0 + p.J1 * d + p.J2 * d * d);
  }
  return lnMix;
}

/**
 * Mole fraction → grams of solute per litre of pure solvent.
 *
 *   c = x/(1 − x) · (1000 · ρ_solv / M_solv) · M_solute     [g/L of solvent]
 *
 * @param input.moleFraction x of the solute [-], 0 ≤ x < 1
 * @param input.soluteMolarMassGmol M_solute [g/mol]
 * @param input.solventMolarMassGmol M_solv [g/mol] (for a blend: its mean molar mass)
 * @param input.solventDensityGmL ρ of the pure solvent [g/mL]
 * @returns grams of solute dissolved per litre of solvent [g/L]
 *
 * Basis: per litre of solvent (before dissolution), exact and invertible.
 * Per litre of solution needs the solution's density, which is not known
 * here; for dilute solutions the two agree.
 * Example: naphthalene x = 0.10 in toluene (92.14 g/mol, 0.8623 g/mL):
 * 0.1/0.9 · 9.359 mol/L · 128.17 g/mol = 133.3 g/L.
 *
 * Source: definition (mass balance with the solvent's density; ideal volumes).
 * Validity: dilute to moderate solutions; the solution volume is taken as the solvent volume.
 */
export function moleFractionToGramsPerLitre(input: {
  moleFraction: number;
  soluteMolarMassGmol: number;
  solventMolarMassGmol: number;
  solventDensityGmL: number;
}): number {
  const {
    moleFraction: x,
    soluteMolarMassGmol: Ms,
    solventMolarMassGmol: Mv,
    solventDensityGmL: rho,
  } = input;
  if (!Number.isFinite(x) || x < 0 || x >= 1) {
    throw new EngineError(
      'invalid-input',
      `Mole fraction must lie in [0, 1) for a solution (got ${x}).`,
      { x },
    );
  }
  assertFinite(Ms, 'Solute molar mass', 'g/mol', { positive: true });
  assertFinite(Mv, 'Solvent molar mass', 'g/mol', { positive: true });
  assertFinite(rho, 'Solvent density', 'g/mL', { positive: true });
  return (x / (1 - x)) * ((1000 * rho) / Mv) * Ms;
}

/**
 * Grams of solute per litre of pure solvent → mole fraction (inverse of
 * moleFractionToGramsPerLitre).
 *
 *   r = (c / M_solute) / (1000 · ρ_solv / M_solv);   x = r / (1 + r)
 *
 * @param input.gramsPerLitre c [g solute / L solvent], ≥ 0
 * @param input.soluteMolarMassGmol [g/mol]; input.solventMolarMassGmol [g/mol];
 *   input.solventDensityGmL [g/mL]
 * @returns x [-]
 *
 * Source: definition (inverse of moleFractionToGramsPerLitre).
 * Validity: as moleFractionToGramsPerLitre.
 */
export function gramsPerLitreToMoleFraction(input: {
  gramsPerLitre: number;
  soluteMolarMassGmol: number;
  solventMolarMassGmol: number;
  solventDensityGmL: number;
}): number {
  const {
    gramsPerLitre: c,
    soluteMolarMassGmol: Ms,
    solventMolarMassGmol: Mv,
    solventDensityGmL: rho,
  } = input;
  assertFinite(c, 'Concentration', 'g/L', { nonNegative: true });
  assertFinite(Ms, 'Solute molar mass', 'g/mol', { positive: true });
  assertFinite(Mv, 'Solvent molar mass', 'g/mol', { positive: true });
  assertFinite(rho, 'Solvent density', 'g/mL', { positive: true });
  const r = c / Ms / ((1000 * rho) / Mv);
  return r / (1 + r);
}
