/**
 * Batch distillation with constant relative volatility: the integrator
 * against the closed-form Rayleigh equation
 *   ln(W/F) = 1/(α − 1) ln[x_W (1 − x_F)/(x_F (1 − x_W))] + ln[(1 − x_F)/(1 − x_W)]
 * (Wankat, Separation Process Engineering, chapter on batch distillation,
 * simple Rayleigh distillation with constant α — equation cited from
 * memory; it is the exact integral of dN/N = dx/(y − x) with
 * y = αx/(1 + (α − 1)x), which the test also checks numerically).
 */
import { describe, expect, it } from 'vitest';
import { rayleighConstantAlphaResidueFraction, rayleighToVolume } from '../../../shared/engine/unitops/rayleigh';

function constantAlpha(alpha: number) {
  return (m: Float64Array) => {
    const x = m[0] / (m[0] + m[1]);
    const y = (alpha * x) / (1 + (alpha - 1) * x);
    return { T_K: 350, P_Pa: 101325, y: [y, 1 - y] };
  };
}

describe('Rayleigh batch distillation, constant α', () => {
  // Benzene–toluene-like example: α = 2.5, x_F = 0.5, distil until 60 % of the charge is left.
  const alpha = 2.5;
  const F = 100;
  const W = 60;
  function simulate(increments: number) {
    const r = rayleighToVolume(Float64Array.from([50, 50]), Float64Array.from([1, 1]), 0, W, constantAlpha(alpha), increments);
    return r.moles[0] / (r.moles[0] + r.moles[1]);
  }
  it('the closed form is the integral of dN/N = dx/(y − x)', () => {
    // Numerical quadrature (Simpson) of ∫_{xW}^{xF} dx/(y − x) = ln(F/W).
    const xW = 0.3;
    const f = (x: number) => 1 / ((alpha * x) / (1 + (alpha - 1) * x) - x);
    const n = 2000;
    const h = (0.5 - xW) / n;
    let s = f(xW) + f(0.5);
    for (let i = 1; i < n; i++) s += (i % 2 ? 4 : 2) * f(xW + i * h);
    const lnFW = (s * h) / 3;
    expect(rayleighConstantAlphaResidueFraction(alpha, 0.5, xW)).toBeCloseTo(Math.exp(-lnFW), 8);
  });
  it('integrator with 64 increments matches the closed form to 5e-5 in W/F', () => {
    const xW = simulate(64);
    expect(rayleighConstantAlphaResidueFraction(alpha, 0.5, xW)).toBeCloseTo(W / F, 4);
  });
  it('the engine default (8 increments, Heun) is within 2e-4 in x_W', () => {
    expect(Math.abs(simulate(8) - simulate(256))).toBeLessThan(2e-4);
  });
  it('conserves moles exactly', () => {
    const r = rayleighToVolume(Float64Array.from([50, 50]), Float64Array.from([1, 1]), 0, W, constantAlpha(alpha), 8);
    expect(r.moles[0] + r.distilled[0]).toBeCloseTo(50, 12);
    expect(r.moles[1] + r.distilled[1]).toBeCloseTo(50, 12);
  });
});
