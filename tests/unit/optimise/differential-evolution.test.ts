/**
 * The differential evolution against published test functions.
 */
import { describe, expect, it } from 'vitest';
import { minimise, type Score } from '../../../shared/engine/optimise';

const free = (objective: number): Score => ({ objective, violation: 0 });

describe('differential evolution on published test functions', () => {
  // Sphere f(x) = Σ x_i², minimum 0 at the origin: De Jong's F1 (K. A. De Jong, "An analysis of the
  // behavior of a class of genetic adaptive systems", PhD thesis, Univ. Michigan 1975), also the first
  // test function of Storn & Price, J. Global Optim. 11 (1997) 341.
  it('finds the minimum of the 4-D sphere', () => {
    const r = minimise((x) => free(x.reduce((a, v) => a + v * v, 0)), {
      bounds: Array.from({ length: 4 }, () => ({ min: -5.12, max: 5.12 })),
      seed: 7,
      budget: 3000,
    });
    expect(r.score.objective).toBeLessThan(1e-6);
    for (const v of r.x) expect(Math.abs(v)).toBeLessThan(1e-3);
  });

  // Rosenbrock f(x, y) = 100 (y − x²)² + (1 − x)², minimum 0 at (1, 1): H. H. Rosenbrock, "An automatic
  // method for finding the greatest or least value of a function", Comput. J. 3 (1960) 175; De Jong's F2.
  it('finds the minimum of the 2-D Rosenbrock valley', () => {
    const r = minimise(([x, y]) => free(100 * (y - x * x) ** 2 + (1 - x) ** 2), {
      bounds: [
        { min: -2.048, max: 2.048 },
        { min: -2.048, max: 2.048 },
      ],
      seed: 11,
      budget: 4000,
      // The paper's scheme; current-to-best/1 can stall in the curved valley.
      strategy: 'rand/1',
    });
    expect(r.score.objective).toBeLessThan(1e-4);
    expect(r.x[0]).toBeCloseTo(1, 1);
    expect(r.x[1]).toBeCloseTo(1, 1);
  });

  // Problem g06 of the CEC 2006 constrained benchmark (J. J. Liang et al., "Problem definitions and
  // evaluation criteria for the CEC 2006 special session on constrained real-parameter optimization",
  // technical report, 2006; from Floudas & Pardalos 1987): minimise (x1 − 10)³ + (x2 − 20)³ subject to
  // (x1 − 5)² + (x2 − 5)² ≥ 100 and (x1 − 6)² + (x2 − 5)² ≤ 82.81, 13 ≤ x1 ≤ 100, 0 ≤ x2 ≤ 100.
  // Best known f* = −6961.81387558015 at x* = (14.095, 0.84296079) (values from memory of the report;
  // the test checks them loosely and that x* is on both constraints).
  it('finds the constrained optimum of g06 by the feasibility rules', () => {
    const g = ([x1, x2]: number[]) => [
      Math.max(0, 100 - (x1 - 5) ** 2 - (x2 - 5) ** 2),
      Math.max(0, (x1 - 6) ** 2 + (x2 - 5) ** 2 - 82.81),
    ];
    const r = minimise(
      (x) => ({
        objective: (x[0] - 10) ** 3 + (x[1] - 20) ** 3,
        violation: g(x).reduce((a, v) => a + v, 0),
      }),
      {
        bounds: [
          { min: 13, max: 100 },
          { min: 0, max: 100 },
        ],
        seed: 3,
        budget: 20000,
        populationSize: 30,
      },
    );
    expect(r.score.violation).toBe(0);
    expect(r.score.objective).toBeGreaterThanOrEqual(-6961.81387558015 - 1e-6);
    expect(Math.abs(r.score.objective - -6961.81387558015)).toBeLessThan(0.01 * 6961.8);
    expect(r.x[0]).toBeCloseTo(14.095, 1);
  });

  it('asks for whole numbers only where a parameter is an integer', () => {
    const seen: number[][] = [];
    // Minimum of (n − 3.4)² + (v − 0.7)² over whole n: n = 3.
    const r = minimise(
      ([n, v]) => {
        seen.push([n, v]);
        return free((n - 3.4) ** 2 + (v - 0.7) ** 2);
      },
      {
        bounds: [
          { min: 1, max: 10, integer: true },
          { min: 0, max: 2 },
        ],
        seed: 5,
        budget: 600,
      },
    );
    for (const [n] of seen) expect(Number.isInteger(n)).toBe(true);
    expect(seen.some(([, v]) => !Number.isInteger(v))).toBe(true);
    expect(r.x[0]).toBe(3);
    expect(r.x[1]).toBeCloseTo(0.7, 3);
  });

  it('gives the same answer for the same seed and another for another seed', () => {
    const f = (x: number[]) => free(100 * (x[1] - x[0] ** 2) ** 2 + (1 - x[0]) ** 2);
    const opts = {
      bounds: [
        { min: -2, max: 2 },
        { min: -2, max: 2 },
      ],
      budget: 200,
    };
    const a = minimise(f, { ...opts, seed: 42 });
    const b = minimise(f, { ...opts, seed: 42 });
    const c = minimise(f, { ...opts, seed: 43 });
    expect(b).toEqual(a);
    expect(c.x).not.toEqual(a.x);
  });

  it('prefers any feasible point to an infeasible one, and the smaller violation among infeasible ones', () => {
    // Feasible only for x ≥ 0.9, where the objective is larger than anywhere infeasible.
    const r = minimise(([x]) => ({ objective: x, violation: Math.max(0, 0.9 - x) }), {
      bounds: [{ min: 0, max: 1 }],
      seed: 1,
      budget: 400,
    });
    expect(r.score.violation).toBe(0);
    expect(r.x[0]).toBeCloseTo(0.9, 3);
    const none = minimise(([x]) => ({ objective: x, violation: 2 - x }), {
      bounds: [{ min: 0, max: 1 }],
      seed: 1,
      budget: 200,
    });
    expect(none.score.violation).toBeCloseTo(1, 3);
  });
});
