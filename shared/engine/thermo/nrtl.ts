/**
 * Activity coefficients that honour measured mutual solubilities: UNIFAC
 * plus, for each water–solvent pair whose mutual solubilities are tabulated,
 * a two-parameter excess-Gibbs-energy term regressed so that the model's
 * liquid–liquid equilibrium reproduces the tabulated phases.
 *
 *   G^E/RT = G^E_UNIFAC/RT + Σ_pairs g_pair,   ln γ_i = ln γ_i^UNIFAC + ∂(n Σ g)/∂n_i
 *
 * The sum of excess Gibbs energies is itself one, so the model stays
 * thermodynamically consistent (Gibbs–Duhem) and applies unchanged to
 * multicomponent liquids, to the three-phase boiling point and to azeotrope
 * searches: washes, heteroazeotropes and drying by distillation all see the
 * same liquid.
 *
 * The pair term is NRTL (H. Renon, J. M. Prausnitz, AIChE J. 1968, 14, 135,
 * doi:10.1002/aic.690140124) with α = 0.2, else 0.3 (their range for partly
 * miscible pairs); where neither gives a binary that is stable at the
 * tabulated phases, the three-suffix Margules equation (M. Margules, Sitzungsber.
 * Akad. Wiss. Wien 1895, 104, 1243; G^E/RT = x_w x_s (A x_w + B x_s)).
 * Regressing two parameters to the two mutual solubilities of a binary is the
 * textbook use of these models (Prausnitz, Lichtenthaler & de Azevedo,
 * Molecular Thermodynamics of Fluid-Phase Equilibria, 3rd ed., ch. 6–7 —
 * chapter recalled). A root is kept only if the fitted binary is globally
 * stable at the tabulated phases (no part of its Gibbs energy of mixing lies
 * below their common tangent): equal activities alone also admit unstable
 * roots.
 *
 * Temperature dependence: with one tabulated temperature the interaction
 * energies are constant (NRTL τ = b/T; Margules A, B ∝ 1/T); the UNIFAC part
 * carries its own temperature dependence.
 *
 * Replacing pairs: where the mutual solubility is tabulated at several
 * temperatures, or no added term is stable (2-MeTHF–water: UNIFAC's water
 * activity in the solvent-rich phase is half the measured one), NRTL takes
 * the place of UNIFAC for the binary instead:
 *   G^E/RT += (x_w + x_s)[g_NRTL(z) − g_UNIFAC(z)],  z = (x_w, x_s)/(x_w + x_s),
 * so the binary alone is NRTL exactly and every other interaction stays on
 * UNIFAC; ln γ_w and ln γ_s gain ln γ^NRTL(z) − ln γ^UNIFAC(z) of the binary,
 * the others nothing (the derivative of n_ws h(z) with respect to n_k).
 * τ = a + b/T with the temperature dependence fitted to the tabulated points
 * (regressReplacingWaterPair).
 */
import { EngineError } from '../errors';
import { levenbergMarquardt, solveSystem } from '../numerics';
import type { UnifacModel } from './unifac';

/** Models tried, in order, for a regressed pair. */
export const PAIR_MODELS = [
  { kind: 'nrtl', alpha: 0.2 },
  { kind: 'nrtl', alpha: 0.3 },
  { kind: 'margules', alpha: 0 },
] as const;

/**
 * A regressed water–solvent pair. NRTL: τ_ws = p1/T, τ_sw = p2/T, α.
 * Margules: A = p1/T, B = p2/T in G^E/RT = x_w x_s (A x_w + B x_s).
 */
export interface RegressedPair {
  /** Index of water in the system [–]. */
  water: number;
  /** Index of the solvent [–]. */
  solvent: number;
  kind: 'nrtl' | 'margules';
  /** First energy parameter [K]. */
  p1: number;
  /** Second energy parameter [K]. */
  p2: number;
  /** NRTL non-randomness α [–] (0 for Margules). */
  alpha: number;
  /**
   * 'added' (default): the term is added to UNIFAC's G^E. 'replacing': NRTL
   * takes the place of UNIFAC for this binary (replacingPairLnGammas).
   */
  form?: 'added' | 'replacing';
  /** Constant part of τ_ws [–] (NRTL τ_ws = a1 + p1/T); 0 when absent. */
  a1?: number;
  /** Constant part of τ_sw [–] (NRTL τ_sw = a2 + p2/T); 0 when absent. */
  a2?: number;
  /** Temperature range of the data the pair was fitted to [K]; outside it the pair is extrapolated. */
  fittedRangeK?: [number, number];
}

/**
 * ln γ_i of the pair terms (multicomponent NRTL with only the given pairs
 * non-zero, and Margules pair terms), added into `out`.
 *
 * Source: Renon & Prausnitz, AIChE J. 1968, 14, 135; Margules 1895.
 *
 * Formula: NRTL (Renon & Prausnitz 1968)
 *   ln γ_i = Σ_j x_j τ_ji G_ji / Σ_k x_k G_ki
 *          + Σ_j [x_j G_ij / Σ_k x_k G_kj] (τ_ij − Σ_m x_m τ_mj G_mj / Σ_k x_k G_kj),
 *   G_ij = exp(−α τ_ij), τ = 0 and G = 1 for every other pair;
 * Margules pair g = x_w x_s (A x_w + B x_s):
 *   ln γ_w += x_s (2A x_w + B x_s) − 2g,  ln γ_s += x_w (A x_w + 2B x_s) − 2g,  others −2g.
 *
 * @param x      mole fractions [–], summing to 1
 * @param T_K    temperature [K]
 * @param pairs  regressed pairs (energies in K)
 * @param out    ln γ [–] to add into
 *
 * Validity: any composition; the parameters hold near the temperature they were regressed at.
 */
export function addPairLnGammas(
  x: ArrayLike<number>,
  T_K: number,
  pairs: readonly RegressedPair[],
  out: Float64Array,
): void {
  compilePairTerms(x.length, pairs)(x, T_K, out);
}

/** ln γ of the pair terms added into `out`, for a fixed component count and pair list. */
type PairTerms = (x: ArrayLike<number>, T_K: number, out: Float64Array) => void;

/**
 * The pair terms of addPairLnGammas prepared once for a fixed component count
 * and pair list: the NRTL τ and G matrices are kept for the last temperature
 * and the work arrays are allocated once, so a call allocates nothing (the
 * activity model is called millions of times in a route's distillations).
 */
function compilePairTerms(n: number, pairs: readonly RegressedPair[]): PairTerms {
  const margules = pairs.filter((p) => p.kind === 'margules');
  const nrtl = pairs.filter((p) => p.kind === 'nrtl');
  const tau = new Float64Array(n * n);
  const G = new Float64Array(n * n).fill(1);
  const S = new Float64Array(n);
  const C = new Float64Array(n);
  let lastT = NaN;
  return (x, T_K, out) => {
    for (const p of margules) {
      const A = p.p1 / T_K;
      const B = p.p2 / T_K;
      const xw = x[p.water];
      const xs = x[p.solvent];
      const g = xw * xs * (A * xw + B * xs);
      for (let k = 0; k < n; k++) out[k] -= 2 * g;
      out[p.water] += xs * (2 * A * xw + B * xs);
      out[p.solvent] += xw * (A * xw + 2 * B * xs);
    }
    if (nrtl.length === 0) return;
    if (T_K !== lastT) {
      for (const p of nrtl) {
        const tWS = (p.a1 ?? 0) + p.p1 / T_K;
        const tSW = (p.a2 ?? 0) + p.p2 / T_K;
        tau[p.water * n + p.solvent] = tWS;
        tau[p.solvent * n + p.water] = tSW;
        G[p.water * n + p.solvent] = Math.exp(-p.alpha * tWS);
        G[p.solvent * n + p.water] = Math.exp(-p.alpha * tSW);
      }
      lastT = T_K;
    }
    for (let j = 0; j < n; j++) {
      let s = 0;
      let c = 0;
      for (let k = 0; k < n; k++) {
        const g = G[k * n + j];
        s += x[k] * g;
        c += x[k] * tau[k * n + j] * g;
      }
      S[j] = s;
      C[j] = c / s;
    }
    for (let i = 0; i < n; i++) {
      let v = C[i];
      for (let j = 0; j < n; j++) v += ((x[j] * G[i * n + j]) / S[j]) * (tau[i * n + j] - C[j]);
      out[i] += v;
    }
  };
}

/**
 * The replacing pair term of one water–solvent binary, for a fixed pair:
 * ln γ added into `out` for water and the solvent (others are unchanged).
 *
 * With z the binary-renormalised composition (z_w = x_w/(x_w + x_s)), the
 * term g_E/RT = (x_w + x_s)[g_NRTL(z) − g_UNIFAC(z)] swaps UNIFAC's binary
 * for NRTL; its derivative ∂(n g)/∂n_i is, for i = w, s, the binary's
 * ln γ_i^NRTL(z) − ln γ_i^UNIFAC(z), and 0 for every other component. For
 * the binary alone the liquid is NRTL exactly; in a multicomponent liquid
 * UNIFAC still gives every other interaction.
 */
function compileReplacingTerm(pair: RegressedPair, binary: UnifacModel): PairTerms {
  const nrtl = compilePairTerms(2, [{ ...pair, water: 0, solvent: 1, form: 'added' }]);
  const z = new Float64Array(2);
  const lnN = new Float64Array(2);
  const lnU = new Float64Array(2);
  return (x, T_K, out) => {
    const sum = x[pair.water] + x[pair.solvent];
    if (!(sum > 0)) return;
    z[0] = x[pair.water] / sum;
    z[1] = x[pair.solvent] / sum;
    lnN[0] = 0;
    lnN[1] = 0;
    nrtl(z, T_K, lnN);
    const u = binary.lnGammas(z, T_K, lnU);
    out[pair.water] += lnN[0] - u[0];
    out[pair.solvent] += lnN[1] - u[1];
  };
}

/**
 * UNIFAC with the regressed pair terms: the activity model of a VLE system
 * whose water–solvent pairs have measured mutual solubilities. 'added' pairs
 * add their NRTL/Margules term to UNIFAC; 'replacing' pairs put NRTL in the
 * place of UNIFAC's binary (module comment).
 *
 * @param unifac          the UNIFAC model of the components
 * @param pairs           regressed pairs (may be empty: then it is UNIFAC itself)
 * @param binaryUnifacOf  UNIFAC model of [water, solvent] of a replacing pair (needed when any pair is 'replacing')
 * @returns a model with the UnifacModel interface (γ [–], ln γ [–] at x [–], T [K])
 *
 * Source: Renon & Prausnitz 1968 (NRTL); Margules 1895; UNIFAC (thermo/unifac.ts).
 * Validity: module comment.
 */
export function withRegressedPairs(
  unifac: UnifacModel,
  pairs: readonly RegressedPair[],
  binaryUnifacOf?: (pair: RegressedPair) => UnifacModel,
): UnifacModel {
  if (pairs.length === 0) return unifac;
  const added = pairs.filter((p) => p.form !== 'replacing');
  const terms: PairTerms[] = added.length > 0 ? [compilePairTerms(unifac.n, added)] : [];
  for (const p of pairs) {
    if (p.form !== 'replacing') continue;
    if (!binaryUnifacOf)
      throw new EngineError(
        'invalid-input',
        'A replacing pair term needs the UNIFAC model of its binary.',
      );
    terms.push(compileReplacingTerm(p, binaryUnifacOf(p)));
  }
  return {
    n: unifac.n,
    lnGammas(x, T_K, out) {
      const r = unifac.lnGammas(x, T_K, out);
      for (const t of terms) t(x, T_K, r);
      return r;
    },
    gammas(x, T_K, out) {
      const r = this.lnGammas(x, T_K, out);
      for (let i = 0; i < r.length; i++) r[i] = Math.exp(r[i]);
      return r;
    },
  };
}

/** Tabulated mutual solubility of a binary, as mole fractions at one temperature. */
export interface MutualSolubilityPoint {
  /** Mole fraction of the solvent in the water-rich phase [–]. */
  xSolventInWater: number;
  /** Mole fraction of water in the solvent-rich phase [–]. */
  xWaterInSolvent: number;
  /** Temperature [K]. */
  T_K: number;
}

/** Gibbs energy of mixing / RT of a binary [water, solvent] at solvent mole fraction xs. */
function gMix(model: UnifacModel, xs: number, T_K: number, buf: Float64Array): number {
  const xw = 1 - xs;
  const l = model.lnGammas([xw, xs], T_K, buf);
  return xw * (Math.log(xw) + l[0]) + xs * (Math.log(xs) + l[1]);
}

/**
 * Whether a binary model is globally stable at two phases: its Gibbs energy
 * of mixing nowhere lies below their common tangent (Baker, Pierce & Luks,
 * Soc. Pet. Eng. J. 1982, 22, 731 — the tangent-plane criterion), checked
 * on 600 compositions spaced logarithmically towards both pure ends.
 *
 * Source: Baker, Pierce & Luks 1982 (criterion). Validity: binary models;
 * a dip narrower than the grid spacing (1e-9 to 0.5 in both ends) can be missed.
 *
 * @param model  binary activity model [water, solvent]
 * @param xI     solvent mole fraction of the water-rich phase [–]
 * @param xII    solvent mole fraction of the solvent-rich phase [–]
 * @param T_K    temperature [K]
 * @returns true when no composition lies more than 1e-7 below the tangent
 */
export function binaryStableAt(model: UnifacModel, xI: number, xII: number, T_K: number): boolean {
  const buf = new Float64Array(2);
  const gI = gMix(model, xI, T_K, buf);
  const gII = gMix(model, xII, T_K, buf);
  const slope = (gII - gI) / (xII - xI);
  for (let k = 1; k < 300; k++) {
    const u = k / 300;
    for (const xs of [1e-9 ** (1 - u) * 0.5 ** u, 1 - 1e-9 ** (1 - u) * 0.5 ** u]) {
      if (gMix(model, xs, T_K, buf) - (gI + slope * (xs - xI)) < -1e-7) return false;
    }
  }
  return true;
}

/**
 * Source: Renon & Prausnitz 1968 (NRTL), Margules 1895; Dennis & Schnabel
 * (Newton's method, numerics solveSystem).
 *
 * Regress one water–solvent pair so that UNIFAC + the pair term puts the two
 * liquid phases of the binary at the tabulated mutual solubilities: solve,
 * for the two energy parameters,
 *   ln(x_w^I γ_w^I) = ln(x_w^II γ_w^II),  ln(x_s^I γ_s^I) = ln(x_s^II γ_s^II)
 * (I: water-rich phase, II: solvent-rich phase) by Newton's method (numerics
 * solveSystem) from a grid of starts, for NRTL α = 0.2, then 0.3, then
 * Margules; the first root whose binary is globally stable at the tabulated
 * phases (binaryStableAt) is kept.
 *
 * @param binary  UNIFAC model of [water, solvent] (index 0 water, 1 solvent)
 * @param data    tabulated mutual solubility (mole fractions [–], T [K])
 * @returns the pair (water 0, solvent 1; energies in K) or null when no stable root exists
 *
 * Validity: a partly miscible pair with both mutual solubilities between
 * about 1e-7 and 0.45 in mole fraction.
 */
export function regressWaterPair(
  binary: UnifacModel,
  data: MutualSolubilityPoint,
): RegressedPair | null {
  const T = data.T_K;
  const xI = [1 - data.xSolventInWater, data.xSolventInWater];
  const xII = [data.xWaterInSolvent, 1 - data.xWaterInSolvent];
  const lnI = binary.lnGammas(xI, T, new Float64Array(2));
  const lnII = binary.lnGammas(xII, T, new Float64Array(2));
  for (const m of PAIR_MODELS) {
    const pairOf = (p: readonly number[]): RegressedPair => ({
      water: 0,
      solvent: 1,
      kind: m.kind,
      p1: p[0],
      p2: p[1],
      alpha: m.alpha,
    });
    const residual = (p: readonly number[]): number[] => {
      const gI = Float64Array.from(lnI);
      const gII = Float64Array.from(lnII);
      addPairLnGammas(xI, T, [pairOf(p)], gI);
      addPairLnGammas(xII, T, [pairOf(p)], gII);
      return [
        Math.log(xI[0]) + gI[0] - Math.log(xII[0]) - gII[0],
        Math.log(xI[1]) + gI[1] - Math.log(xII[1]) - gII[1],
      ];
    };
    const grid = m.kind === 'nrtl' ? [-600, 0, 600, 1200, 2400] : [-1200, -600, 0, 600, 1200];
    for (const a of grid) {
      for (const b of grid) {
        const r = solveSystem(residual, [a, b], { ftol: 1e-10, maxIterations: 40, maxStep: 300 });
        if (!r.converged) continue;
        const pair = pairOf(r.x);
        if (binaryStableAt(withRegressedPairs(binary, [pair]), xI[1], xII[1], T)) return pair;
      }
    }
  }
  return null;
}

/** A measured mutual solubility of water and a solvent at one temperature: either phase or both. */
export interface MutualSolubilityCurvePoint {
  /** Temperature [K]. */
  T_K: number;
  /** Mole fraction of the solvent in the water-rich phase [–], when measured. */
  xSolventInWater?: number;
  /** Mole fraction of water in the solvent-rich phase [–], when measured. */
  xWaterInSolvent?: number;
}

/** The pure binary NRTL liquid [water, solvent] of a pair, with the UnifacModel interface. */
function binaryNrtlModel(pair: RegressedPair): UnifacModel {
  const terms = compilePairTerms(2, [{ ...pair, water: 0, solvent: 1, form: 'added' }]);
  return {
    n: 2,
    lnGammas(x, T_K, out) {
      const r = out ?? new Float64Array(2);
      r[0] = 0;
      r[1] = 0;
      terms(x, T_K, r);
      return r;
    },
    gammas(x, T_K, out) {
      const r = this.lnGammas(x, T_K, out);
      for (let i = 0; i < 2; i++) r[i] = Math.exp(r[i]);
      return r;
    },
  };
}

/**
 * The two liquid phases of a pair's binary NRTL liquid at T: solves
 *   ln(x_w^I γ_w^I) = ln(x_w^II γ_w^II),  ln(x_s^I γ_s^I) = ln(x_s^II γ_s^II)
 * for ln x_s^I and ln x_w^II (each below 0.5, which excludes the trivial
 * solution of one phase twice) by Newton's method (numerics solveSystem).
 *
 * Source: Renon & Prausnitz 1968 (NRTL); Dennis & Schnabel 1996 (Newton).
 *
 * @param pair   the pair (its NRTL τ = a + p/T, α)
 * @param T_K    temperature [K]
 * @param guess  starting mole fractions [–]: solvent in the water-rich phase, water in the solvent-rich phase
 * @returns the mole fractions [–] of both phases, or null when no split is found from the guess
 *
 * Validity: NRTL pairs with both mutual solubilities below 0.5 in mole fraction.
 */
export function binaryNrtlPhases(
  pair: RegressedPair,
  T_K: number,
  guess: { xSolventInWater: number; xWaterInSolvent: number },
): { xSolventInWater: number; xWaterInSolvent: number } | null {
  const model = binaryNrtlModel(pair);
  const gI = new Float64Array(2);
  const gII = new Float64Array(2);
  const F = (u: readonly number[]): number[] => {
    const a = Math.exp(u[0]);
    const b = Math.exp(u[1]);
    if (!(a < 0.5 && b < 0.5)) return [NaN, NaN];
    model.lnGammas([1 - a, a], T_K, gI);
    model.lnGammas([b, 1 - b], T_K, gII);
    return [
      Math.log(1 - a) + gI[0] - Math.log(b) - gII[0],
      Math.log(a) + gI[1] - Math.log(1 - b) - gII[1],
    ];
  };
  const r = solveSystem(F, [Math.log(guess.xSolventInWater), Math.log(guess.xWaterInSolvent)], {
    ftol: 1e-12,
    maxIterations: 100,
    maxStep: 1,
  });
  return r.converged
    ? { xSolventInWater: Math.exp(r.x[0]), xWaterInSolvent: Math.exp(r.x[1]) }
    : null;
}

/** NRTL non-randomness values tried for a replacing pair, in order (Renon & Prausnitz's 0.3 first). */
export const REPLACING_PAIR_ALPHAS = [0.3, 0.4, 0.2] as const;

/**
 * Regress a replacing pair (NRTL in the place of UNIFAC for the binary) to
 * the tabulated mutual solubilities of water and a solvent, with its
 * temperature dependence where more temperatures are measured.
 *
 * Method: at the reference point (both phases at T0) the NRTL τ_ws, τ_sw
 * are solved exactly from the two equal-activity equations; their
 * temperature dependence τ(T) = τ(T0) + c (T0/T − 1) (the form τ = a + b/T
 * of Renon & Prausnitz 1968, anchored at T0) is then fitted by least
 * squares (Levenberg–Marquardt, numerics) to ln x of every further measured
 * phase composition, each computed as the binary's liquid–liquid split
 * (binaryNrtlPhases). With no further temperature the energies are constant
 * (τ = b/T). α is 0.3, else 0.4, else 0.2 (REPLACING_PAIR_ALPHAS); a fit is
 * kept only if the binary is globally stable (binaryStableAt) at the
 * reference point and at every measured temperature.
 *
 * Source: Renon & Prausnitz, AIChE J. 1968, 14, 135 (NRTL, τ = a + b/T);
 * Levenberg 1944 / Marquardt 1963 (least squares); Baker, Pierce & Luks 1982
 * (stability).
 *
 * @param reference  both phases at one temperature (mole fractions [–], T [K])
 * @param curve      further measured points (mole fractions [–], T [K]); may be empty
 * @returns the pair (water 0, solvent 1, form 'replacing', τ = a + p/T with p in K,
 *          fittedRangeK the span of the data [K]) or null when no stable fit exists
 *
 * Validity: the temperature range of the data; outside it the fitted τ(T)
 * is extrapolated (callers warn: fittedRangeK).
 */
export function regressReplacingWaterPair(
  reference: MutualSolubilityPoint,
  curve: readonly MutualSolubilityCurvePoint[],
): RegressedPair | null {
  const T0 = reference.T_K;
  const A = reference.xSolventInWater;
  const B = reference.xWaterInSolvent;
  const temps = [T0, ...curve.map((p) => p.T_K)];
  const fittedRangeK: [number, number] = [Math.min(...temps), Math.max(...temps)];
  for (const alpha of REPLACING_PAIR_ALPHAS) {
    const pairOf = (t0: readonly number[], c: readonly number[]): RegressedPair => ({
      water: 0,
      solvent: 1,
      kind: 'nrtl',
      form: 'replacing',
      alpha,
      a1: t0[0] - c[0],
      p1: c[0] * T0,
      a2: t0[1] - c[1],
      p2: c[1] * T0,
      fittedRangeK,
    });
    const stableAt = (
      pair: RegressedPair,
      T_K: number,
      guess: { xSolventInWater: number; xWaterInSolvent: number },
    ) => {
      const ph = binaryNrtlPhases(pair, T_K, guess);
      return (
        ph !== null &&
        binaryStableAt(binaryNrtlModel(pair), ph.xSolventInWater, 1 - ph.xWaterInSolvent, T_K)
      );
    };
    // τ at the reference temperature, exactly (c = 0: constant τ while solving at T0).
    const anchorResidual = (t: readonly number[]): number[] => {
      const m = binaryNrtlModel(pairOf(t, [0, 0]));
      const gI = m.lnGammas([1 - A, A], T0);
      const gII = m.lnGammas([B, 1 - B], T0);
      return [
        Math.log(1 - A) + gI[0] - Math.log(B) - gII[0],
        Math.log(A) + gI[1] - Math.log(1 - B) - gII[1],
      ];
    };
    let t0: number[] | null = null;
    for (const a of [3, 2, 4, 1, 5, 0]) {
      for (const b of [1, 0, 2, -1, 3]) {
        const r = solveSystem(anchorResidual, [a, b], {
          ftol: 1e-12,
          maxIterations: 60,
          maxStep: 1,
        });
        if (!r.converged) continue;
        if (binaryStableAt(binaryNrtlModel(pairOf(r.x, [0, 0])), A, 1 - B, T0)) {
          t0 = r.x;
          break;
        }
      }
      if (t0) break;
    }
    if (!t0) continue;
    const tau0 = t0;
    // No further temperature: constant interaction energies, τ = b/T (c = τ(T0)).
    if (curve.length === 0) return { ...pairOf(tau0, tau0), fittedRangeK: undefined };
    const guess = { xSolventInWater: A, xWaterInSolvent: B };
    const residuals = (c: readonly number[]): number[] => {
      const pair = pairOf(tau0, c);
      const out: number[] = [];
      for (const p of curve) {
        const ph = binaryNrtlPhases(pair, p.T_K, guess);
        if (p.xSolventInWater !== undefined)
          out.push(ph ? Math.log(ph.xSolventInWater / p.xSolventInWater) : NaN);
        if (p.xWaterInSolvent !== undefined)
          out.push(ph ? Math.log(ph.xWaterInSolvent / p.xWaterInSolvent) : NaN);
      }
      return out;
    };
    let best: { c: number[]; ss: number } | null = null;
    for (const start of [tau0, [0, 0], [-4, 0], [-6, 2], [4, 0], [0, -4]]) {
      const fit = levenbergMarquardt(residuals, start, { maxIterations: 100 });
      if (!fit.converged || !Number.isFinite(fit.sumOfSquares)) continue;
      if (!best || fit.sumOfSquares < best.ss) best = { c: fit.x, ss: fit.sumOfSquares };
    }
    if (!best) continue;
    const pair = pairOf(tau0, best.c);
    if (temps.every((T) => stableAt(pair, T, guess))) return pair;
  }
  return null;
}
