/**
 * Batch (simple, one-stage) distillation by the Rayleigh equation.
 *
 * Purpose: the pot composition and the distillate of a batch distillation
 * from a still pot, for concentrations, solvent swaps and evaporative
 * crystallisation.
 *
 * Formula (Lord Rayleigh, Phil. Mag. 1902, 4, 521; Wankat, Separation
 * Process Engineering, chapter on batch distillation; McCabe, Smith &
 * Harriott, Unit Operations of Chemical Engineering): for each volatile
 * component i,
 *     d n_i = − y_i dN_V,        y_i = y_i(x, P or T) from the VLE
 * (equivalently dN_L/N_L = dx/(y − x) for a binary). Written with the
 * distilled liquid volume s as the independent variable,
 *     d n_i / d s = − y_i / Σ_j y_j v_j      (v_j: molar volumes)
 * and integrated adaptively with the Dormand–Prince 5(4) pair
 * (numerics/ode.ts) under an error norm on the liquid mole fractions: every
 * step keeps the local error of every x_i below a tenth of the stated
 * tolerance, so that the end composition is within the tolerance (default
 * RAYLEIGH_TOLERANCE_X = 1e-6) of the converged integral; the reference
 * tests check this against the closed form for constant relative volatility.
 * The integrator carries ln n_i for every component that only leaves the pot,
 *     d ln n_i / d s = − (y_i / n_i) / Σ_j y_j v_j = − K_i / (N Σ_j y_j v_j),
 * which stays smooth as a light component is stripped to traces (n_i falls
 * nearly exponentially, ln n_i nearly linearly): the steps follow the pot as a
 * whole instead of one e-fold of the trace each. The fed solvent of a
 * constant-volume swap is carried as n. The error norm is taken on the moles,
 * with the local error of the pot volume Σ v_i n_i (linear in n, not in ln n)
 * held to the same share of the tolerance, and the end moles are scaled onto
 * the stated pot volume (a common factor: every x_i unchanged).
 *
 * Units: moles [mol]; volumes in any consistent unit (the caller passes
 * molar volumes [m³/mol] and a fixed non-volatile volume [m³]).
 * Assumptions: the vapour leaving is in equilibrium with the well-mixed pot
 * liquid (one theoretical stage, no reflux, no entrainment); non-volatile
 * solutes stay in the pot. Mass is conserved exactly: every mole removed from
 * the pot is added to the distillate.
 */
import { dormandPrince, type OdeStop } from '../numerics';

/** Stated accuracy of every Rayleigh integration: absolute error in any liquid mole fraction [–]. */
export const RAYLEIGH_TOLERANCE_X = 1e-6;

/** Local error per step as a fraction of the stated (global) tolerance [–]. */
const LOCAL_SHARE = 0.1;

/**
 * Order assumed when the first trial step of a leg is rejected (numerics/ode.ts startOrder): the
 * integrator's starting-step estimate knows nothing of the mole-fraction and trace criteria, so a
 * leg's first trial was often tens to hundreds of times over its tolerance, where the error grows
 * about as h² rather than h⁵; cut as for order 2, a leg starts in one or two rejections instead of
 * four to six.
 */
const START_ORDER = 2;

export interface VleAtPot {
  /** Pot temperature [K]. */
  T_K: number;
  /** Pressure [Pa]. */
  P_Pa: number;
  /** Vapour mole fractions over the volatile components [-]. */
  y: ArrayLike<number>;
}

/** Vapour in equilibrium with the pot liquid of the given volatile moles [mol]. */
export type PotVle = (moles: Float64Array) => VleAtPot;

export interface RayleighPoint {
  /** Pot temperature [K]. */
  T_K: number;
  /** Pressure [Pa]. */
  P_Pa: number;
  /** Pot volume after this step (same unit as the inputs). */
  volume: number;
  /** Cumulative distilled volume. */
  distilled: number;
  /** Cumulative volume fed (constant-volume mode only). */
  fed?: number;
  /** Volatile moles in the pot at this point [mol]. */
  moles: Float64Array;
}

export interface RayleighResult {
  /** Volatile moles left in the pot [mol]. */
  moles: Float64Array;
  /** Moles distilled [mol]. */
  distilled: Float64Array;
  /** Start point and one point per accepted integration step. */
  profile: RayleighPoint[];
  /** True when the volatile liquid ran out before the target volume. */
  exhausted: boolean;
  /** True when the integration met its tolerance. */
  converged: boolean;
  /** Why the integration stopped. */
  reason: OdeStop;
  /** Accepted steps and VLE evaluations used [–]. */
  steps: number;
  evaluations: number;
}

/** Options of a Rayleigh integration. */
export interface RayleighOptions {
  /** Tolerance on every liquid mole fraction at the end [–] (default RAYLEIGH_TOLERANCE_X). */
  toleranceX?: number;
}

/** Local relative error allowed per step in the moles of each component [–] (keeps traces positive and accurate). */
const LOCAL_RELATIVE = 1e-4;

/**
 * Error norm of a Rayleigh step for a state of moles n, the larger of
 *  (a) the mole-fraction error: with N = Σ n, δx_i = (δn_i − x_i Σ δn)/N,
 *      max_i |δx_i| / tol (N floored at 1e-9 of the starting moles, so the
 *      last traces before dryness do not force vanishing steps);
 *  (b) the relative error of each component's moles, max_i |δn_i| /
 *      (LOCAL_RELATIVE · n_i + 1e-10 N₀), so that a component being stripped
 *      to traces (a residual solvent) is followed to 1e-4 of its own amount
 *      per step (about 1e-3 of it at the end) and never overshoots below zero.
 */
function rayleighErrorNorm(tol: number, N0: number) {
  const nFloor = 1e-9 * N0;
  const nAbs = 1e-10 * N0;
  return (y: Float64Array, yNew: Float64Array, err: Float64Array): number => {
    let N = 0;
    let sumErr = 0;
    for (let i = 0; i < y.length; i++) {
      N += Math.max(0, yNew[i]);
      sumErr += err[i];
    }
    N = Math.max(N, nFloor);
    let worst = 0;
    for (let i = 0; i < y.length; i++) {
      const x = Math.max(0, yNew[i]) / N;
      worst = Math.max(worst, Math.abs(err[i] - x * sumErr) / N / tol);
      const scale = LOCAL_RELATIVE * Math.min(Math.abs(y[i]), Math.abs(yNew[i])) + nAbs;
      worst = Math.max(worst, Math.abs(err[i]) / scale);
      if (yNew[i] < -nAbs) worst = Math.max(worst, 2);
    }
    return worst;
  };
}

/**
 * The integrator's error control shared by both kinds of leg: the pot's error norm at the local
 * share of the end tolerance, the absolute floor, the gentle first step and predictive step sizes.
 */
function legControl(
  state: ReturnType<typeof potState>,
  tol: number,
  N0: number,
  molarVolume: Float64Array,
) {
  return {
    errorNorm: state.errorNorm(
      rayleighErrorNorm(LOCAL_SHARE * tol, N0),
      molarVolume,
      LOCAL_SHARE * tol,
    ),
    atol: state.atol(N0),
    startOrder: START_ORDER,
    predictive: true,
    rtol: LOCAL_SHARE * tol,
  };
}

/**
 * The state the integrator carries for a pot (module comment): ln n_i for every component present
 * at the start and not fed, whose amount only falls (a trace being stripped decays nearly
 * exponentially, a straight line in ln n that the integrator follows with long steps instead of
 * one e-fold per step), and n_i itself for the fed component and for any component absent at the
 * start (it stays at 0). The error norm is taken on the moles: a local error δ in ln n_i is an
 * error n_i (1 − e^(−δ)) in n_i.
 */
function potState(moles: Float64Array, feedIndex: number) {
  const n = moles.length;
  const logged = new Uint8Array(n);
  for (let i = 0; i < n; i++) logged[i] = moles[i] > 0 && i !== feedIndex ? 1 : 0;
  const toMoles = (z: Float64Array, m: Float64Array): Float64Array => {
    for (let i = 0; i < n; i++) m[i] = logged[i] ? Math.exp(z[i]) : Math.max(0, z[i]);
    return m;
  };
  const finite = (m: Float64Array): boolean => {
    for (let i = 0; i < n; i++) if (!Number.isFinite(m[i])) return false;
    return true;
  };
  const start = new Float64Array(n);
  for (let i = 0; i < n; i++) start[i] = logged[i] ? Math.log(moles[i]) : moles[i];
  /** The error norm of rayleighErrorNorm on the moles, for a step taken in this state. */
  const errorNorm = (
    base: (y: Float64Array, yNew: Float64Array, err: Float64Array) => number,
    molarVolume: Float64Array,
    volumeTol: number,
  ) => {
    const mOld = new Float64Array(n);
    const mNew = new Float64Array(n);
    const errN = new Float64Array(n);
    return (z: Float64Array, zNew: Float64Array, errZ: Float64Array): number => {
      toMoles(z, mOld);
      toMoles(zNew, mNew);
      let dV = 0;
      let V = 0;
      for (let i = 0; i < n; i++) {
        errN[i] = logged[i] ? -mNew[i] * Math.expm1(-errZ[i]) : errZ[i];
        dV += errN[i] * molarVolume[i];
        V += mNew[i] * molarVolume[i];
      }
      return Math.max(base(mOld, mNew, errN), Math.abs(dV) / (volumeTol * V));
    };
  };
  /** Writes dz/ds from dn/ds at the moles m. */
  const rate = (m: Float64Array, dn: number, i: number): number =>
    logged[i] ? (m[i] > 0 ? dn / m[i] : 0) : dn;
  /** Absolute tolerance per state component, for the integrator's starting step only. */
  const atol = (N0: number): number[] =>
    Array.from(logged, (l) => (l ? LOCAL_RELATIVE : 1e-12 * N0));
  /**
   * Scales moles m onto the pot's liquid volume Σ v_i n_i = volume (in place): the volume balance is
   * linear in n, which the integrator keeps exactly in n but not in ln n; a common factor leaves every
   * mole fraction as integrated (projection onto the invariant: Hairer, Lubich & Wanner, Geometric
   * Numerical Integration, 2nd ed., Springer 2006, §IV.4).
   */
  const onVolume = (m: Float64Array, molarVolume: Float64Array, volume: number): Float64Array => {
    let v = 0;
    for (let i = 0; i < n; i++) v += m[i] * molarVolume[i];
    if (v > 0 && volume > 0) for (let i = 0; i < n; i++) m[i] *= volume / v;
    return m;
  };
  return { start, toMoles, finite, errorNorm, rate, atol, onVolume };
}

/**
 * The VLE at the pot moles (negative trial values clipped to 0), remembering
 * the last state: the integrator's last stage of an accepted step is at the
 * new state, so the profile point reuses it instead of a new VLE solve.
 */
function cachedVle(vle: PotVle, n: number) {
  const positive = new Float64Array(n);
  const lastState = new Float64Array(n).fill(NaN);
  let last: VleAtPot | null = null;
  return {
    positive,
    at(m: Float64Array): VleAtPot {
      let same = last !== null;
      for (let i = 0; i < n; i++) {
        positive[i] = Math.max(0, m[i]);
        if (positive[i] !== lastState[i]) same = false;
      }
      if (same && last) return last;
      const v = vle(positive);
      // Keep a copy: a PotVle may reuse its output arrays.
      last = { T_K: v.T_K, P_Pa: v.P_Pa, y: Float64Array.from(v.y as ArrayLike<number>) };
      lastState.set(positive);
      return last;
    },
  };
}

/**
 * Distil a pot down to `targetVolume`.
 *
 * Source and formula: the module comment (Rayleigh 1902; Dormand & Prince
 * 1980 for the integrator).
 *
 * @param moles        volatile moles in the pot [mol] (not modified)
 * @param molarVolume  molar volume of each volatile [volume/mol]
 * @param fixedVolume  volume of the non-volatile contents [volume]
 * @param targetVolume pot volume to stop at [volume]
 * @param vle          vapour composition at the current pot liquid
 * @param opts         toleranceX: end accuracy in every liquid mole fraction [–] (default 1e-6)
 * @returns the pot and distillate moles, a profile (one point per accepted step), exhausted when the pot ran dry
 *
 * Validity: any VLE that is continuous in the pot composition (a kink where
 * a second liquid phase appears or vanishes costs a few rejected steps).
 * When the non-volatile contents exceed the target, the volatile liquid is
 * distilled to dryness and `exhausted` is set.
 */
export function rayleighToVolume(
  moles: Float64Array,
  molarVolume: Float64Array,
  fixedVolume: number,
  targetVolume: number,
  vle: PotVle,
  opts: RayleighOptions = {},
): RayleighResult {
  const n = moles.length;
  const tol = opts.toleranceX ?? RAYLEIGH_TOLERANCE_X;
  let volatileVolume = 0;
  let N0 = 0;
  for (let i = 0; i < n; i++) {
    volatileVolume += moles[i] * molarVolume[i];
    N0 += moles[i];
  }
  const V0 = fixedVolume + volatileVolume;
  const first = vle(moles);
  const start: RayleighPoint = {
    T_K: first.T_K,
    P_Pa: first.P_Pa,
    volume: V0,
    distilled: 0,
    moles: Float64Array.from(moles),
  };
  const toRemoveAsked = V0 - targetVolume;
  if (!(toRemoveAsked > 0) || !(N0 > 0)) {
    return {
      moles: Float64Array.from(moles),
      distilled: new Float64Array(n),
      profile: [start],
      exhausted: false,
      converged: true,
      reason: 'converged',
      steps: 0,
      evaluations: 1,
    };
  }
  // Dryness: the volatile liquid cannot supply the volume asked. Integrate to a trace of it, then
  // take the trace over (the pot is dry).
  const exhausted = toRemoveAsked >= volatileVolume * (1 - 1e-12);
  const toRemove = exhausted ? volatileVolume * (1 - 1e-9) : toRemoveAsked;
  const cached = cachedVle(vle, n);
  const state = potState(moles, -1);
  const m = new Float64Array(n);
  const rhs = (_s: number, z: Float64Array, dz: Float64Array) => {
    // A trial stage far off (ln n overflowing): non-finite, so the integrator retries a shorter step.
    if (!state.finite(state.toMoles(z, m))) return dz.fill(NaN);
    const y = cached.at(m).y;
    let vPerMol = 0;
    for (let i = 0; i < n; i++) vPerMol += y[i] * molarVolume[i];
    for (let i = 0; i < n; i++) dz[i] = state.rate(m, -y[i] / vPerMol, i);
  };
  const profile: RayleighPoint[] = [start];
  const r = dormandPrince(rhs, 0, state.start, toRemove, {
    ...legControl(state, tol, N0, molarVolume),
    onStep: (s, z) => {
      const at = cached.at(state.toMoles(z, m));
      profile.push({
        T_K: at.T_K,
        P_Pa: at.P_Pa,
        volume: V0 - s,
        distilled: s,
        moles: state.onVolume(Float64Array.from(cached.positive), molarVolume, volatileVolume - s),
      });
    },
  });
  const pot = new Float64Array(n);
  const distilled = new Float64Array(n);
  state.onVolume(state.toMoles(r.y, m), molarVolume, volatileVolume - toRemove);
  for (let i = 0; i < n; i++) {
    pot[i] = exhausted ? 0 : Math.min(moles[i], m[i]);
    distilled[i] = moles[i] - pot[i];
  }
  if (exhausted) {
    const last = profile[profile.length - 1];
    last.moles = new Float64Array(n);
    last.volume = fixedVolume;
    last.distilled = volatileVolume;
  }
  return {
    moles: pot,
    distilled,
    profile,
    exhausted,
    converged: r.converged,
    reason: r.reason,
    steps: r.steps,
    evaluations: r.evaluations + 1,
  };
}

/**
 * Closed form of the Rayleigh equation for a binary of constant relative
 * volatility α (Wankat, Separation Process Engineering, batch distillation):
 *   ln(W/F) = 1/(α − 1) · ln[x_W (1 − x_F) / (x_F (1 − x_W))] + ln[(1 − x_F)/(1 − x_W)]
 *
 * @param alpha  relative volatility of the lighter component [–], ≠ 1
 * @param xF     mole fraction of the more volatile component in the charge [–]
 * @param xW     mole fraction of the more volatile component in the final pot [–]
 * @returns W/F, moles left per mole charged [–]
 *
 * Source: Rayleigh 1902 (Phil. Mag.), integrated for constant α as in
 * Wankat, Separation Process Engineering, chapter on batch distillation.
 * Validity: constant α, one equilibrium stage; 0 < x_W, x_F < 1.
 */
export function rayleighConstantAlphaResidueFraction(
  alpha: number,
  xF: number,
  xW: number,
): number {
  const lnWF =
    (1 / (alpha - 1)) * Math.log((xW * (1 - xF)) / (xF * (1 - xW))) + Math.log((1 - xF) / (1 - xW));
  return Math.exp(lnWF);
}

export interface ConstantVolumeResult extends RayleighResult {
  /** Moles of the fed component added [mol]. */
  fedMoles: number;
}

/**
 * Constant-volume batch distillation (solvent swap): component `feedIndex`
 * is fed as fast as vapour is taken, holding the pot volume.
 *
 * Formula: with the fed volume V_F as the independent variable, for each
 * volatile i
 *     d n_i / d V_F = δ_i,feed / v_feed − y_i / Σ_j y_j v_j
 * (v: molar volumes; the vapour removed has the same liquid volume as the
 * liquid fed), integrated adaptively with Dormand–Prince 5(4) under the
 * mole-fraction error norm of rayleighToVolume (end accuracy `toleranceX`).
 * For a binary of constant α with equal molar volumes this has the closed
 * form rayleighConstantVolumeFeedRatio. Mass is conserved exactly: every mole
 * removed from the pot is added to the distillate; the feed is added in full.
 *
 * @param moles       volatile moles in the pot [mol] (not modified)
 * @param molarVolume molar volume of each volatile [volume/mol]
 * @param feedIndex   index of the fed component [–]
 * @param feedVolume  volume fed [volume]
 * @param vle         vapour in equilibrium with the pot liquid
 * @param opts        toleranceX: end accuracy in every liquid mole fraction [–] (default 1e-6)
 * @param fixedVolume volume of the non-volatile contents, reported in the profile only [volume]
 * @returns pot and distillate moles, the moles fed, a profile (one point per accepted step)
 *
 * Source: component balance of a constant-volume (fed) batch still, the
 * Rayleigh balance with a feed term (Rayleigh 1902); integrator Dormand &
 * Prince 1980 (numerics/ode.ts).
 * Validity: as rayleighToVolume; the pot never runs dry (the feed replaces
 * what distils).
 */
export function rayleighConstantVolume(
  moles: Float64Array,
  molarVolume: Float64Array,
  feedIndex: number,
  feedVolume: number,
  vle: PotVle,
  opts: RayleighOptions = {},
  fixedVolume = 0,
): ConstantVolumeResult {
  const n = moles.length;
  const tol = opts.toleranceX ?? RAYLEIGH_TOLERANCE_X;
  let volatileVolume = 0;
  let N0 = 0;
  for (let i = 0; i < n; i++) {
    volatileVolume += moles[i] * molarVolume[i];
    N0 += moles[i];
  }
  const V = fixedVolume + volatileVolume;
  const first = vle(moles);
  const profile: RayleighPoint[] = [
    {
      T_K: first.T_K,
      P_Pa: first.P_Pa,
      volume: V,
      distilled: 0,
      fed: 0,
      moles: Float64Array.from(moles),
    },
  ];
  const vFeed = molarVolume[feedIndex];
  if (!(feedVolume > 0)) {
    return {
      moles: Float64Array.from(moles),
      distilled: new Float64Array(n),
      profile,
      exhausted: false,
      converged: true,
      reason: 'converged',
      steps: 0,
      evaluations: 1,
      fedMoles: 0,
    };
  }
  const cached = cachedVle(vle, n);
  const state = potState(moles, feedIndex);
  const m = new Float64Array(n);
  const rhs = (_f: number, z: Float64Array, dz: Float64Array) => {
    // A trial stage far off (ln n overflowing): non-finite, so the integrator retries a shorter step.
    if (!state.finite(state.toMoles(z, m))) return dz.fill(NaN);
    const y = cached.at(m).y;
    let vPerMol = 0;
    for (let i = 0; i < n; i++) vPerMol += y[i] * molarVolume[i];
    for (let i = 0; i < n; i++)
      dz[i] = state.rate(m, (i === feedIndex ? 1 / vFeed : 0) - y[i] / vPerMol, i);
  };
  const r = dormandPrince(rhs, 0, state.start, feedVolume, {
    ...legControl(state, tol, N0, molarVolume),
    onStep: (fed, z) => {
      const at = cached.at(state.toMoles(z, m));
      profile.push({
        T_K: at.T_K,
        P_Pa: at.P_Pa,
        volume: V,
        distilled: fed,
        fed,
        moles: state.onVolume(Float64Array.from(cached.positive), molarVolume, volatileVolume),
      });
    },
  });
  const fedMoles = feedVolume / vFeed;
  const pot = new Float64Array(n);
  const distilled = new Float64Array(n);
  state.onVolume(state.toMoles(r.y, m), molarVolume, volatileVolume);
  for (let i = 0; i < n; i++) {
    const charged = moles[i] + (i === feedIndex ? fedMoles : 0);
    pot[i] = Math.min(charged, m[i]);
    distilled[i] = charged - pot[i];
  }
  return {
    moles: pot,
    distilled,
    profile,
    exhausted: false,
    converged: r.converged,
    reason: r.reason,
    steps: r.steps,
    evaluations: r.evaluations + 1,
    fedMoles,
  };
}

/**
 * Closed form of the constant-volume swap for a binary of constant relative
 * volatility α (original solvent A more volatile by α over the fed solvent
 * B, equal molar volumes, pot holdup N constant): from N dx = −y dF with
 * y = αx/(1 + (α − 1)x),
 *     F/N = [ln(x₀/x) + (α − 1)(x₀ − x)] / α.
 * Derived here (integral of the balance above); the same integral underlies
 * the constant-volume solvent-swap estimate of common practice.
 *
 * @param alpha  relative volatility of A over B [–]
 * @param x0     mole fraction of A at the start [–]
 * @param x      mole fraction of A at the end [–]
 * @returns moles fed per mole of pot holdup, F/N [–]
 *
 * Source: derived in this module from the balance above (no external source).
 * Validity: constant α, equal molar volumes, 0 < x ≤ x₀ ≤ 1.
 */
export function rayleighConstantVolumeFeedRatio(alpha: number, x0: number, x: number): number {
  return (Math.log(x0 / x) + (alpha - 1) * (x0 - x)) / alpha;
}
