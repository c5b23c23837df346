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
 */
import { solveSystem } from '../numerics';
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
        const tWS = p.p1 / T_K;
        const tSW = p.p2 / T_K;
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
 * UNIFAC with the regressed pair terms added: the activity model of a VLE
 * system whose water–solvent pairs have measured mutual solubilities.
 *
 * @param unifac  the UNIFAC model of the components
 * @param pairs   regressed pairs (may be empty: then it is UNIFAC itself)
 * @returns a model with the UnifacModel interface (γ [–], ln γ [–] at x [–], T [K])
 *
 * Source and validity: module comment.
 */
export function withRegressedPairs(
  unifac: UnifacModel,
  pairs: readonly RegressedPair[],
): UnifacModel {
  if (pairs.length === 0) return unifac;
  const terms = compilePairTerms(unifac.n, pairs);
  return {
    n: unifac.n,
    lnGammas(x, T_K, out) {
      const r = unifac.lnGammas(x, T_K, out);
      terms(x, T_K, r);
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
