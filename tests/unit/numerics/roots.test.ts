import { describe, expect, it } from 'vitest';
import { brent, expandBracket, findRoot, newtonSafe } from '@shared/engine/numerics';

describe('brent', () => {
  it("solves Wallis's cubic x³ − 2x − 5 = 0 to the root given by Cardano's formula", () => {
    // Test equation used by Wallis (1685) and in the Newton's-method chapter of most numerical
    // analysis texts; the exact root is computed here by Cardano's formula, independently.
    const p = -2;
    const q = -5;
    const disc = Math.sqrt((q / 2) ** 2 + (p / 3) ** 3);
    const exact = Math.cbrt(-q / 2 + disc) + Math.cbrt(-q / 2 - disc);
    const r = brent((x) => x ** 3 - 2 * x - 5, 2, 3, { xtol: 1e-14 });
    expect(r.converged).toBe(true);
    expect(r.reason).toBe('converged');
    expect(Math.abs(r.root - exact)).toBeLessThan(1e-13);
    expect(exact).toBeCloseTo(2.0945514815423265, 14); // value printed in many texts (recalled)
    expect(r.iterations).toBeLessThan(12);
  });

  it('solves cos x = x (Dottie number) and x e^x = 1 (omega constant) to their fixed points', () => {
    const dottie = brent((x) => Math.cos(x) - x, 0, 1, { xtol: 1e-15 });
    expect(Math.abs(Math.cos(dottie.root) - dottie.root)).toBeLessThan(1e-15);
    const omega = brent((x) => x * Math.exp(x) - 1, 0, 1, { xtol: 1e-15 });
    expect(Math.abs(Math.exp(-omega.root) - omega.root)).toBeLessThan(1e-15);
  });

  it("solves Kepler's equation at high eccentricity (e = 0.99, steep near E = 0)", () => {
    const e = 0.99;
    const M = 0.01;
    const r = brent((E) => E - e * Math.sin(E) - M, 0, Math.PI, { xtol: 1e-15 });
    expect(r.converged).toBe(true);
    expect(Math.abs(r.root - e * Math.sin(r.root) - M)).toBeLessThan(1e-15);
    expect(r.iterations).toBeLessThan(40);
  });

  it('converges on a triple root, where interpolation gives no speed-up, no slower than bisection', () => {
    const r = brent((x) => (x - 1) ** 3, 0, 3, { xtol: 1e-10 });
    expect(r.converged).toBe(true);
    expect(Math.abs(r.root - 1)).toBeLessThan(1e-8);
    // Bisection needs log2(3/1e-10) ≈ 35 halvings; the safeguard bounds Brent at 3 steps per halving.
    expect(r.iterations).toBeLessThanOrEqual(3 * 36);
    // Without interpolation help the count is well above the interpolating cases above.
    expect(r.iterations).toBeGreaterThan(20);
  });

  it('returns the jump of a discontinuous function with a sign change', () => {
    const r = brent((x) => (x < 1 / 3 ? -1 : 1), 0, 1, { xtol: 1e-12 });
    expect(r.converged).toBe(true);
    expect(Math.abs(r.root - 1 / 3)).toBeLessThan(1e-11);
  });

  it('says so instead of guessing when the ends do not bracket a root', () => {
    const r = brent((x) => x * x + 1, -1, 2);
    expect(r.converged).toBe(false);
    expect(r.reason).toBe('no-bracket');
  });

  it('reports max-iterations with the best point when the iteration limit is too small', () => {
    const r = brent((x) => x ** 3 - 2 * x - 5, 2, 3, { xtol: 1e-15, maxIterations: 2 });
    expect(r.converged).toBe(false);
    expect(r.reason).toBe('max-iterations');
    expect(r.bracket[0]).toBeLessThanOrEqual(r.bracket[1]);
  });

  it('stops on |f| ≤ ftol when asked', () => {
    const loose = brent((x) => x - 0.3, 0, 1, { xtol: 0, ftol: 1e-3 });
    expect(loose.converged).toBe(true);
    expect(Math.abs(loose.value)).toBeLessThanOrEqual(1e-3);
  });
});

describe('expandBracket and findRoot', () => {
  it('grow a starting interval until the sign changes, within the limits given', () => {
    const f = (x: number) => Math.log(x) - 5; // root e^5 ≈ 148.4
    const b = expandBracket(f, 1, 2, { lower: 1e-9 });
    expect(b.found).toBe(true);
    expect(b.fa * b.fb).toBeLessThanOrEqual(0);
    const r = findRoot(f, 1, 2, { lower: 1e-9, xtol: 1e-12 });
    expect(r.converged).toBe(true);
    expect(r.root).toBeCloseTo(Math.exp(5), 9);
  });

  it('report no-bracket when the limits forbid reaching the root', () => {
    const r = findRoot((x) => x - 10, 0, 1, { upper: 5 });
    expect(r.converged).toBe(false);
    expect(r.reason).toBe('no-bracket');
  });
});

describe('newtonSafe', () => {
  it('converges quadratically with an exact slope', () => {
    const r = newtonSafe((x) => ({ f: x * x - 2, df: 2 * x }), 1, { xtol: 1e-15 });
    expect(r.converged).toBe(true);
    expect(r.root).toBeCloseTo(Math.SQRT2, 14);
    expect(r.iterations).toBeLessThan(8);
  });

  it('still converges with a slope that is 3 times too small (approximate Jacobians)', () => {
    const r = newtonSafe((x) => ({ f: Math.log(x) - 1, df: 1 / (3 * x) }), 1, {
      lower: 1e-9,
      xtol: 1e-13,
    });
    expect(r.converged).toBe(true);
    expect(r.root).toBeCloseTo(Math.E, 11);
  });

  it('escapes the Newton 2-cycle of x³ − 2x + 2 from x₀ = 0 (a textbook failure of plain Newton)', () => {
    // Plain Newton alternates 0 → 1 → 0 … forever (e.g. Burden & Faires, Numerical Analysis, §2.3 exercises).
    const r = newtonSafe((x) => ({ f: x ** 3 - 2 * x + 2, df: 3 * x * x - 2 }), 0, {
      xtol: 1e-13,
    });
    expect(r.converged).toBe(true);
    expect(Math.abs(r.root ** 3 - 2 * r.root + 2)).toBeLessThan(1e-10);
    expect(r.root).toBeCloseTo(-1.7692923542386314, 10);
  });

  it('keeps the iterate inside its admissible range', () => {
    const seen: number[] = [];
    const r = newtonSafe(
      (x) => {
        seen.push(x);
        return { f: Math.log(x) + 3, df: 1 / x };
      },
      10,
      { lower: 0, xtol: 1e-14 },
    );
    expect(r.converged).toBe(true);
    expect(r.root).toBeCloseTo(Math.exp(-3), 12);
    expect(seen.every((x) => x > 0)).toBe(true);
  });
});
