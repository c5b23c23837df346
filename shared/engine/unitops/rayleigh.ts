/**
 * Batch (simple, one-stage) distillation by the Rayleigh equation.
 *
 * Purpose: the pot composition and the distillate of a batch distillation
 * from a still pot, for concentrations, solvent swaps and evaporative
 * crystallisation.
 *
 * Formula (Rayleigh 1902; Wankat, Separation Process Engineering, chapter on
 * batch distillation; McCabe, Smith & Harriott, Unit Operations of Chemical
 * Engineering): for each volatile component i,
 *     d n_i = − y_i dV,        y_i = y_i(x, P or T) from the VLE
 * (equivalently dN_L/N_L = dx/(y − x) for a binary). Integrated in the
 * distilled volume with Heun's predictor–corrector (second order): y at the
 * start of an increment, y at the predicted end, their mean for the removal;
 * each increment removes a fixed share of the volume to be distilled, and
 * the last increment lands exactly on the target volume.
 *
 * Units: moles [mol]; volumes in any consistent unit (the caller passes
 * molar volumes [m³/mol] and a fixed non-volatile volume [m³]).
 * Assumptions: the vapour leaving is in equilibrium with the well-mixed pot
 * liquid (one theoretical stage, no reflux, no entrainment); non-volatile
 * solutes stay in the pot. Mass is conserved exactly: every mole removed from
 * the pot is added to the distillate.
 */

export interface VleAtPot {
  /** Pot temperature [K]. */
  T_K: number;
  /** Pressure [Pa]. */
  P_Pa: number;
  /** Vapour mole fractions over the volatile components [-]. */
  y: ArrayLike<number>;
}

/** Vapour in equilibrium with the pot liquid of the given volatile moles. */
export type PotVle = (moles: Float64Array) => VleAtPot;

export interface RayleighPoint {
  T_K: number;
  P_Pa: number;
  /** Pot volume after this increment (same unit as the inputs). */
  volume: number;
  /** Cumulative distilled volume. */
  distilled: number;
  /** Cumulative volume fed (constant-volume mode only). */
  fed?: number;
}

export interface RayleighResult {
  /** Volatile moles left in the pot [mol]. */
  moles: Float64Array;
  /** Moles distilled [mol]. */
  distilled: Float64Array;
  profile: RayleighPoint[];
  /** True when the volatile liquid ran out before the target volume. */
  exhausted: boolean;
}

/**
 * Distil a pot down to `targetVolume`.
 * @param moles        volatile moles in the pot [mol] (not modified)
 * @param molarVolume  molar volume of each volatile [volume/mol]
 * @param fixedVolume  volume of the non-volatile contents [volume]
 * @param targetVolume pot volume to stop at [volume]
 * @param vle          vapour composition at the current pot liquid
 * @param increments   number of increments (≥ 1); 8–16 give < 0.1 % error for smooth VLE
 */
export function rayleighToVolume(
  moles: Float64Array,
  molarVolume: Float64Array,
  fixedVolume: number,
  targetVolume: number,
  vle: PotVle,
  increments: number,
): RayleighResult {
  const n = moles.length;
  const pot = Float64Array.from(moles);
  const distilled = new Float64Array(n);
  const profile: RayleighPoint[] = [];
  const volumeOf = (m: Float64Array) => {
    let v = fixedVolume;
    for (let i = 0; i < n; i++) v += m[i] * molarVolume[i];
    return v;
  };
  const total = (m: Float64Array) => {
    let t = 0;
    for (let i = 0; i < n; i++) t += m[i];
    return t;
  };
  let V = volumeOf(pot);
  const toRemove = V - targetVolume;
  let distilledVolume = 0;
  if (!(toRemove > 0)) return { moles: pot, distilled, profile, exhausted: false };
  const stepVolume = toRemove / Math.max(1, Math.floor(increments));
  const trial = new Float64Array(n);
  const y = new Float64Array(n);
  let exhausted = false;
  let first = vle(pot);
  profile.push({ T_K: first.T_K, P_Pa: first.P_Pa, volume: V, distilled: 0 });
  for (let guard = 0; guard < 10 * increments + 10; guard++) {
    const remaining = V - targetVolume;
    if (remaining <= toRemove * 1e-12) break;
    if (total(pot) <= 1e-14 * total(moles)) {
      exhausted = true;
      break;
    }
    const dVol = Math.min(stepVolume, remaining);
    // Predictor with the vapour at the start of the increment.
    const y0 = first.y;
    let vPerMol = 0;
    for (let i = 0; i < n; i++) vPerMol += y0[i] * molarVolume[i];
    let dn = dVol / vPerMol;
    for (let i = 0; i < n; i++) trial[i] = Math.max(0, pot[i] - dn * y0[i]);
    const end = total(trial) > 0 ? vle(trial) : first;
    // Corrector: mean vapour composition over the increment.
    vPerMol = 0;
    for (let i = 0; i < n; i++) {
      y[i] = 0.5 * (y0[i] + end.y[i]);
      vPerMol += y[i] * molarVolume[i];
    }
    dn = dVol / vPerMol;
    let removedVolume = 0;
    for (let i = 0; i < n; i++) {
      const r = Math.min(pot[i], dn * y[i]);
      pot[i] -= r;
      distilled[i] += r;
      removedVolume += r * molarVolume[i];
    }
    V -= removedVolume;
    distilledVolume += removedVolume;
    if (removedVolume <= 0) {
      exhausted = true;
      break;
    }
    first = total(pot) > 0 ? vle(pot) : end;
    profile.push({ T_K: first.T_K, P_Pa: first.P_Pa, volume: V, distilled: distilledVolume });
  }
  return { moles: pot, distilled, profile, exhausted };
}

/**
 * Closed form of the Rayleigh equation for a binary of constant relative
 * volatility α (Wankat, Separation Process Engineering, batch distillation):
 *   ln(W/F) = 1/(α − 1) · ln[x_W (1 − x_F) / (x_F (1 − x_W))] + ln[(1 − x_F)/(1 − x_W)]
 * x_F, x_W: mole fraction of the more volatile component in the charge and
 * in the final pot [-]; returns W/F [-].
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
 * is fed as fast as vapour is taken, holding the pot volume. With the fed
 * volume V_F as the independent variable, for each volatile i
 *     d n_i / d V_F = δ_i,feed / v_feed − y_i / Σ_j y_j v_j
 * (v: molar volumes; the vapour removed has the same volume as the liquid
 * fed). Integrated with Heun's predictor–corrector in `increments` equal
 * steps of fed volume. For a binary of constant α with equal molar volumes
 * this has the closed form (see rayleighConstantVolumeFeedRatio)
 *     F/N = [ln(x₀/x) + (α − 1)(x₀ − x)] / α,
 * the fraction of the original (more volatile) solvent falling nearly as
 * exp(−α F/N). Mass is conserved exactly: every mole removed from the pot is
 * added to the distillate; the feed is added in full.
 * @param moles       volatile moles in the pot [mol] (not modified)
 * @param molarVolume molar volume of each volatile [volume/mol]
 * @param feedIndex   index of the fed component
 * @param feedVolume  volume fed [same unit as the molar volumes × mol]
 * @param vle         vapour in equilibrium with the pot liquid
 * @param increments  number of equal feed increments (≥ 1)
 * @param fixedVolume volume of the non-volatile contents, reported in the profile only [volume]
 */
export function rayleighConstantVolume(
  moles: Float64Array,
  molarVolume: Float64Array,
  feedIndex: number,
  feedVolume: number,
  vle: PotVle,
  increments: number,
  fixedVolume = 0,
): ConstantVolumeResult {
  const n = moles.length;
  const pot = Float64Array.from(moles);
  const distilled = new Float64Array(n);
  const profile: RayleighPoint[] = [];
  const trial = new Float64Array(n);
  const y = new Float64Array(n);
  const K = Math.max(1, Math.floor(increments));
  const h = feedVolume / K;
  const dFeed = h / molarVolume[feedIndex];
  let fedMoles = 0;
  let distilledVolume = 0;
  let V = fixedVolume;
  for (let i = 0; i < n; i++) V += pot[i] * molarVolume[i];
  let first = vle(pot);
  profile.push({ T_K: first.T_K, P_Pa: first.P_Pa, volume: V, distilled: 0, fed: 0 });
  if (!(feedVolume > 0)) return { moles: pot, distilled, profile, exhausted: false, fedMoles };
  for (let k = 0; k < K; k++) {
    const y0 = first.y;
    let vPerMol = 0;
    for (let i = 0; i < n; i++) vPerMol += y0[i] * molarVolume[i];
    let dn = h / vPerMol;
    for (let i = 0; i < n; i++)
      trial[i] = Math.max(0, pot[i] + (i === feedIndex ? dFeed : 0) - dn * y0[i]);
    const end = vle(trial);
    vPerMol = 0;
    for (let i = 0; i < n; i++) {
      y[i] = 0.5 * (y0[i] + end.y[i]);
      vPerMol += y[i] * molarVolume[i];
    }
    dn = h / vPerMol;
    pot[feedIndex] += dFeed;
    fedMoles += dFeed;
    V += h;
    for (let i = 0; i < n; i++) {
      const r = Math.min(pot[i], dn * y[i]);
      pot[i] -= r;
      distilled[i] += r;
      V -= r * molarVolume[i];
      distilledVolume += r * molarVolume[i];
    }
    first = vle(pot);
    profile.push({
      T_K: first.T_K,
      P_Pa: first.P_Pa,
      volume: V,
      distilled: distilledVolume,
      fed: (k + 1) * h,
    });
  }
  return { moles: pot, distilled, profile, exhausted: false, fedMoles };
}

/**
 * Closed form of the constant-volume swap for a binary of constant relative
 * volatility α (original solvent A more volatile by α over the fed solvent
 * B, equal molar volumes, pot holdup N constant): from N dx = −y dF with
 * y = αx/(1 + (α − 1)x),
 *     F/N = [ln(x₀/x) + (α − 1)(x₀ − x)] / α.
 * x₀, x: mole fraction of A at the start and the end [-]; returns the moles
 * fed per mole of pot holdup, F/N [-]. Derived here (integral of the balance
 * above); the same integral underlies the constant-volume solvent-swap
 * estimate of common practice.
 */
export function rayleighConstantVolumeFeedRatio(alpha: number, x0: number, x: number): number {
  return (Math.log(x0 / x) + (alpha - 1) * (x0 - x)) / alpha;
}
