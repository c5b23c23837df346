import { describe, expect, it } from 'vitest';
import { levenbergMarquardt } from '@shared/engine/numerics';

describe('levenbergMarquardt', () => {
  it('finds the minimum of the Rosenbrock function written as residuals (10(y − x²), 1 − x)', () => {
    // Minimum at (1, 1) with zero sum; the classic hard start (−1.2, 1) (Moré, Garbow &
    // Hillstrom, ACM TOMS 1981, 7, 17, problem 1).
    const r = levenbergMarquardt((p) => [10 * (p[1] - p[0] * p[0]), 1 - p[0]], [-1.2, 1]);
    expect(r.converged).toBe(true);
    expect(r.x[0]).toBeCloseTo(1, 5);
    expect(r.x[1]).toBeCloseTo(1, 5);
    expect(r.sumOfSquares).toBeLessThan(1e-10);
  });

  it('fits an over-determined straight line to its least-squares solution (normal equations)', () => {
    const xs = [0, 1, 2, 3, 4];
    const ys = [1.1, 2.9, 5.2, 7.1, 8.8];
    // Closed form: slope = Σ(x−x̄)(y−ȳ)/Σ(x−x̄)², intercept = ȳ − slope x̄.
    const xm = 2;
    const ym = ys.reduce((a, b) => a + b, 0) / 5;
    const slope = xs.reduce((a, x, i) => a + (x - xm) * (ys[i] - ym), 0) / 10;
    const r = levenbergMarquardt((p) => xs.map((x, i) => p[0] + p[1] * x - ys[i]), [0, 0]);
    expect(r.converged).toBe(true);
    expect(r.x[1]).toBeCloseTo(slope, 8);
    expect(r.x[0]).toBeCloseTo(ym - slope * xm, 8);
    expect(r.sumOfSquares).toBeGreaterThan(0);
  });

  it('steps away from parameters where the model fails (non-finite residuals) instead of stopping there', () => {
    // ln(p) − ln(4) has its root at 4; residuals are NaN for p ≤ 0, which a full step from 0.5 can reach.
    const r = levenbergMarquardt((p) => [p[0] > 0 ? Math.log(p[0]) - Math.log(4) : NaN], [0.5]);
    expect(r.converged).toBe(true);
    expect(r.x[0]).toBeCloseTo(4, 6);
  });

  it('says when it starts where the model fails', () => {
    const r = levenbergMarquardt(() => [NaN], [1]);
    expect(r.converged).toBe(false);
  });
});
