/**
 * Batch distillation: the adaptive Rayleigh integrator against independent
 * solutions computed here, on steep cases.
 *
 * Exact solution for a binary of constant relative volatility α (the
 * integral of dN/N = dx/(y − x) with y = αx/(1 + (α − 1)x)):
 *   ln(W/F) = 1/(α − 1) · [ln(x_W/x_F) + α ln((1 − x_F)/(1 − x_W))]
 * (Rayleigh, Phil. Mag. 1902, 4, 521; the constant-α form as in Wankat,
 * Separation Process Engineering, chapter "Batch Distillation" — the form is
 * also checked below by quadrature, so it does not rest on the citation). For
 * the constant-volume swap, N dx = −y dF integrates to
 *   F/N = [ln(x₀/x) + (α − 1)(x₀ − x)] / α   (derived here).
 * For a VLE without a closed form, a fixed-step classical RK4 with 20 000
 * steps, written in this file, is the converged reference.
 *
 * The stated accuracy (docs/methods.md): every liquid mole fraction within
 * RAYLEIGH_TOLERANCE_X = 1e-6 of the converged integral.
 */
import { describe, expect, it } from 'vitest';
import {
  RAYLEIGH_TOLERANCE_X,
  rayleighConstantAlphaResidueFraction,
  rayleighConstantVolume,
  rayleighConstantVolumeFeedRatio,
  rayleighToVolume,
  type PotVle,
} from '../../../shared/engine/unitops/rayleigh';
import { bubblePoint, createVleSystem } from '../../../shared/engine/thermo/vle';
import * as F from '../thermo/fixtures';

function constantAlpha(alpha: number): PotVle {
  return (m) => {
    const x = m[0] / (m[0] + m[1]);
    const y = (alpha * x) / (1 + (alpha - 1) * x);
    return { T_K: 350, P_Pa: 101325, y: [y, 1 - y] };
  };
}

/** x_W for a residue fraction W/F at constant α, by bisection on the closed form (independent of the engine). */
function exactResidueX(alpha: number, xF: number, WF: number): number {
  let lo = 1e-300;
  let hi = xF;
  for (let k = 0; k < 2000 && hi - lo > 1e-16 * hi; k++) {
    const mid = lo > 0 && hi / lo > 10 ? Math.sqrt(lo * hi) : 0.5 * (lo + hi);
    if (rayleighConstantAlphaResidueFraction(alpha, xF, mid) > WF) hi = mid;
    else lo = mid;
  }
  return 0.5 * (lo + hi);
}

const ones = Float64Array.from([1, 1]);
const tol = RAYLEIGH_TOLERANCE_X;

describe('Rayleigh closed form', () => {
  it('is the integral of dN/N = dx/(y − x) (Simpson quadrature, 2000 intervals)', () => {
    const alpha = 2.5;
    const xW = 0.3;
    const f = (x: number) => 1 / ((alpha * x) / (1 + (alpha - 1) * x) - x);
    const n = 2000;
    const h = (0.5 - xW) / n;
    let s = f(xW) + f(0.5);
    for (let i = 1; i < n; i++) s += (i % 2 ? 4 : 2) * f(xW + i * h);
    expect(rayleighConstantAlphaResidueFraction(alpha, 0.5, xW)).toBeCloseTo(
      Math.exp((-s * h) / 3),
      8,
    );
  });
});

describe('Rayleigh integration to 1e-6 in x on steep cases', () => {
  it('deep concentration at α = 12: 97 % of the charge distilled', () => {
    const alpha = 12;
    const xF = 0.4;
    const WF = 0.03;
    const r = rayleighToVolume(
      Float64Array.from([40, 60]),
      ones,
      0,
      100 * WF,
      constantAlpha(alpha),
    );
    expect(r.converged).toBe(true);
    const x = r.moles[0] / (r.moles[0] + r.moles[1]);
    const exact = exactResidueX(alpha, xF, WF);
    // Validity: within the stated tolerance of the exact integral.
    expect(Math.abs(x - exact)).toBeLessThan(tol);
    // Regression on this implementation's own value.
    expect(x).toBeCloseTo(exact, 7);
    // The stated pot volume is reached.
    expect(r.moles[0] + r.moles[1]).toBeCloseTo(3, 7);
  });

  it('the light component in traces (x_F = 0.02, α = 30) is stripped to its exact residue', () => {
    const alpha = 30;
    const r = rayleighToVolume(Float64Array.from([2, 98]), ones, 0, 80, constantAlpha(alpha));
    const x = r.moles[0] / (r.moles[0] + r.moles[1]);
    const exact = exactResidueX(alpha, 0.02, 0.8);
    expect(Math.abs(x - exact)).toBeLessThan(tol);
    // The trace itself is followed to 0.1 % of its own amount (residual-solvent accuracy).
    expect(Math.abs(x / exact - 1)).toBeLessThan(1e-3);
    // A fixed 8-step Heun scheme (the former default) was off by far more than 1e-6 here.
    expect(exact).toBeGreaterThan(1e-5);
  });

  it('a very volatile trace (α = 50) stripped through some 8 e-folds keeps 0.1 % of its own residue', () => {
    // The integrator carries ln n for a component that only falls: a trace leaving nearly
    // exponentially is a straight line there. Its residue must still be followed to 0.1 %, and the
    // pot must reach the stated volume exactly.
    const alpha = 50;
    const r = rayleighToVolume(Float64Array.from([5, 95]), ones, 0, 80, constantAlpha(alpha));
    expect(r.converged).toBe(true);
    const x = r.moles[0] / (r.moles[0] + r.moles[1]);
    const exact = exactResidueX(alpha, 0.05, 0.8);
    expect(exact).toBeLessThan(2e-5);
    expect(exact).toBeGreaterThan(5e-6);
    expect(Math.abs(x - exact)).toBeLessThan(tol);
    expect(Math.abs(x / exact - 1)).toBeLessThan(1e-3);
    expect(r.moles[0] + r.moles[1]).toBeCloseTo(80, 10);
  });

  it('four put-and-take cycles at α = 8 match the exact cycle-by-cycle solution', () => {
    const alpha = 8;
    const Nt = 20;
    const Nadd = 60;
    let pot = Float64Array.from([30, 30]);
    let r = rayleighToVolume(pot, ones, 0, Nt, constantAlpha(alpha));
    let exact = exactResidueX(alpha, 0.5, Nt / 60);
    let x = r.moles[0] / Nt;
    expect(Math.abs(x - exact)).toBeLessThan(tol);
    const residues: number[] = [];
    for (let c = 0; c < 4; c++) {
      pot = Float64Array.from([r.moles[0], r.moles[1] + Nadd]);
      r = rayleighToVolume(pot, ones, 0, Nt, constantAlpha(alpha));
      expect(r.converged).toBe(true);
      // The exact cycle starts from the engine's own charge, so each comparison checks one leg.
      const xF = pot[0] / (Nt + Nadd);
      exact = exactResidueX(alpha, xF, Nt / (Nt + Nadd));
      x = r.moles[0] / Nt;
      expect(Math.abs(x - exact)).toBeLessThan(tol);
      residues.push(x);
    }
    // And the chain as a whole, from the exact start: within a few tolerances after five legs.
    let xChain = exactResidueX(alpha, 0.5, Nt / 60);
    for (let c = 0; c < 4; c++)
      xChain = exactResidueX(alpha, (xChain * Nt) / (Nt + Nadd), Nt / (Nt + Nadd));
    expect(Math.abs(residues[3] - xChain)).toBeLessThan(5 * tol);
    expect(residues[3]).toBeLessThan(1e-6 * 1e3);
  });

  it('a constant-volume swap at α = 6, three pot volumes fed, matches the closed form', () => {
    const alpha = 6;
    const x0 = 0.95;
    const N = 50;
    const FN = 3;
    const r = rayleighConstantVolume(
      Float64Array.from([N * x0, N * (1 - x0)]),
      ones,
      1,
      FN * N,
      constantAlpha(alpha),
    );
    expect(r.converged).toBe(true);
    const x = r.moles[0] / (r.moles[0] + r.moles[1]);
    // Exact x from F/N by bisection on the closed form (decreasing in x).
    let lo = 1e-300;
    let hi = x0;
    for (let k = 0; k < 3000 && hi - lo > 1e-17; k++) {
      const mid = hi / lo > 10 ? Math.sqrt(lo * hi) : 0.5 * (lo + hi);
      if (rayleighConstantVolumeFeedRatio(alpha, x0, mid) > FN) lo = mid;
      else hi = mid;
    }
    const exact = 0.5 * (lo + hi);
    expect(Math.abs(x - exact)).toBeLessThan(tol);
    // The original solvent, swapped out to about 2e-6, is followed to 0.1 % of what is left.
    expect(exact).toBeLessThan(5e-6);
    expect(Math.abs(x / exact - 1)).toBeLessThan(1e-3);
    expect(r.moles[0] + r.moles[1]).toBeCloseTo(N, 9);
  });

  it('matches a 20 000-step RK4 when α varies steeply with composition (α from 40 to 1.5)', () => {
    // A VLE with no closed form: α(x) = 1.5 + 38.5 x² (light component very volatile when rich).
    const vle: PotVle = (m) => {
      const x = m[0] / (m[0] + m[1]);
      const a = 1.5 + 38.5 * x * x;
      const y = (a * x) / (1 + (a - 1) * x);
      return { T_K: 350, P_Pa: 1e5, y: [y, 1 - y] };
    };
    const n0 = [70, 30];
    const target = 8;
    const r = rayleighToVolume(Float64Array.from(n0), ones, 0, target, vle);
    // Reference: classical RK4 in the distilled amount s, dn_i/ds = −y_i.
    const steps = 20_000;
    const h = (100 - target) / steps;
    const n = [...n0];
    const d = (m: number[]) => {
      const y = vle(Float64Array.from(m)).y;
      return [-y[0], -y[1]];
    };
    for (let k = 0; k < steps; k++) {
      const k1 = d(n);
      const k2 = d([n[0] + 0.5 * h * k1[0], n[1] + 0.5 * h * k1[1]]);
      const k3 = d([n[0] + 0.5 * h * k2[0], n[1] + 0.5 * h * k2[1]]);
      const k4 = d([n[0] + h * k3[0], n[1] + h * k3[1]]);
      for (let i = 0; i < 2; i++) n[i] += (h / 6) * (k1[i] + 2 * k2[i] + 2 * k3[i] + k4[i]);
    }
    const xRef = n[0] / (n[0] + n[1]);
    const x = r.moles[0] / (r.moles[0] + r.moles[1]);
    expect(Math.abs(x - xRef)).toBeLessThan(tol);
  });

  // Three components of different volatility and unequal molar volumes, against a 20 000-step
  // classical RK4 in the moles (written here): every mole fraction within 1e-6, the lightest (a
  // trace) within 0.1 % of itself, and the pot volume as stated.
  const ternaryAlphas = [8, 3, 1];
  const ternaryMv = Float64Array.from([1.3, 0.8, 1.1]);
  const ternaryVle: PotVle = (m) => {
    let d = 0;
    for (let i = 0; i < 3; i++) d += ternaryAlphas[i] * m[i];
    return { T_K: 350, P_Pa: 1e5, y: ternaryAlphas.map((a, i) => (a * m[i]) / d) };
  };
  /** RK4 of dn_i/ds = feed_i − y_i/Σ y_j v_j over s in [0, S]. */
  function ternaryRk4(n0: number[], S: number, feed: number[]): number[] {
    const steps = 20_000;
    const h = S / steps;
    const n = [...n0];
    const d = (m: number[]): number[] => {
      const y = ternaryVle(Float64Array.from(m)).y as number[];
      const v = y.reduce((a, yi, i) => a + yi * ternaryMv[i], 0);
      return y.map((yi, i) => feed[i] - yi / v);
    };
    const add = (a: number[], b: number[], f: number) => a.map((v, i) => v + f * b[i]);
    for (let k = 0; k < steps; k++) {
      const k1 = d(n);
      const k2 = d(add(n, k1, 0.5 * h));
      const k3 = d(add(n, k2, 0.5 * h));
      const k4 = d(add(n, k3, h));
      for (let i = 0; i < 3; i++) n[i] += (h / 6) * (k1[i] + 2 * k2[i] + 2 * k3[i] + k4[i]);
    }
    return n;
  }
  function expectTernaryClose(got: Float64Array, ref: number[], volume: number) {
    const N = ref.reduce((a, b) => a + b, 0);
    const Ng = got.reduce((a, b) => a + b, 0);
    for (let i = 0; i < 3; i++) expect(Math.abs(got[i] / Ng - ref[i] / N)).toBeLessThan(tol);
    expect(ref[0] / N).toBeGreaterThan(1e-6);
    expect(Math.abs(got[0] / Ng / (ref[0] / N) - 1)).toBeLessThan(1e-3);
    expect(got.reduce((a, m, i) => a + m * ternaryMv[i], 0)).toBeCloseTo(volume, 9);
  }

  it('matches a 20 000-step RK4 for a ternary concentrated to a third (α = 8, 3, 1)', () => {
    const n0 = [10, 30, 60];
    const V0 = n0.reduce((a, n, i) => a + n * ternaryMv[i], 0);
    const target = V0 / 3;
    const r = rayleighToVolume(Float64Array.from(n0), ternaryMv, 0, target, ternaryVle);
    expect(r.converged).toBe(true);
    expectTernaryClose(r.moles, ternaryRk4(n0, V0 - target, [0, 0, 0]), target);
  });

  it('matches a 20 000-step RK4 for a ternary constant-volume swap into the heaviest (α = 8, 3, 1)', () => {
    // The fed solvent is carried as moles, the two leaving as ln n: the pot volume must hold.
    const n0 = [5, 20, 75];
    const V0 = n0.reduce((a, n, i) => a + n * ternaryMv[i], 0);
    const fed = 1.2 * V0;
    const r = rayleighConstantVolume(Float64Array.from(n0), ternaryMv, 2, fed, ternaryVle);
    expect(r.converged).toBe(true);
    expectTernaryClose(r.moles, ternaryRk4(n0, fed, [0, 0, 1 / ternaryMv[2]]), V0);
  });

  it('a constant-volume heptane swap of a wet isopropyl acetate pot (UNIFAC) is within 1e-6 of a tight integral', () => {
    // A real VLE (modified Raoult, UNIFAC): the fed heptane is the bulk of the pot, water leaves
    // entirely and the ester to a trace. Reference: the same integral at a tolerance of 1e-11.
    const sys = createVleSystem([F.water, F.isopropylAcetate, F.heptane]);
    const P = 58_800;
    let T = 340;
    const vle: PotVle = (m) => {
      const N = m[0] + m[1] + m[2];
      const r = bubblePoint(sys, [m[0] / N, m[1] / N, m[2] / N], P, { T0_K: T });
      T = r.T_K;
      return { T_K: r.T_K, P_Pa: P, y: r.y };
    };
    // Molar volumes [L/mol] at 20 °C (water 0.018, isopropyl acetate 0.146, n-heptane 0.147).
    const mv = Float64Array.from([0.018, 0.146, 0.147]);
    const n0 = Float64Array.from([0.037, 0.27, 52]);
    const fed = 6;
    const run = (toleranceX: number) =>
      rayleighConstantVolume(n0, mv, 2, fed, vle, { toleranceX }).moles;
    const got = run(tol);
    const ref = run(1e-11);
    const N = ref.reduce((a, b) => a + b, 0);
    const Ng = got.reduce((a, b) => a + b, 0);
    for (let i = 0; i < 3; i++) expect(Math.abs(got[i] / Ng - ref[i] / N)).toBeLessThan(tol);
    // The ester, left at about 5e-4 of the pot, to 0.1 % of itself (the water is gone entirely).
    expect(ref[1] / N).toBeGreaterThan(1e-4);
    expect(Math.abs(got[1] / ref[1] - 1)).toBeLessThan(1e-3);
  });

  it('converges with the tolerance: a looser tolerance is looser, a tighter one tighter, with more steps', () => {
    const alpha = 12;
    const exact = exactResidueX(alpha, 0.4, 0.03);
    const run = (toleranceX: number) =>
      rayleighToVolume(Float64Array.from([40, 60]), ones, 0, 3, constantAlpha(alpha), {
        toleranceX,
      });
    const loose = run(1e-3);
    const tight = run(1e-9);
    expect(Math.abs(loose.moles[0] / 3 - exact)).toBeLessThan(1e-3);
    expect(Math.abs(tight.moles[0] / 3 - exact)).toBeLessThan(1e-9);
    expect(tight.steps).toBeGreaterThan(loose.steps);
  });

  it('distils to dryness when the solids exceed the target, conserving every mole', () => {
    const r = rayleighToVolume(Float64Array.from([5, 5]), ones, 12, 10, constantAlpha(3));
    expect(r.exhausted).toBe(true);
    expect(r.moles[0]).toBe(0);
    expect(r.moles[1]).toBe(0);
    expect(r.distilled[0]).toBeCloseTo(5, 12);
    expect(r.distilled[1]).toBeCloseTo(5, 12);
  });

  it('conserves moles exactly and returns one profile point per step', () => {
    const r = rayleighToVolume(Float64Array.from([50, 50]), ones, 0, 60, constantAlpha(2.5));
    expect(r.moles[0] + r.distilled[0]).toBeCloseTo(50, 12);
    expect(r.moles[1] + r.distilled[1]).toBeCloseTo(50, 12);
    expect(r.profile.length).toBe(r.steps + 1);
    expect(r.profile[r.profile.length - 1].volume).toBeCloseTo(60, 10);
  });
});
