import { describe, expect, it } from 'vitest';
import { dormandPrince, type OdeRhs } from '@shared/engine/numerics';

/** Classic fixed-step fourth-order Runge–Kutta, written here as an independent reference. */
function rk4(f: OdeRhs, t0: number, y0: number[], t1: number, steps: number): Float64Array {
  const n = y0.length;
  const y = Float64Array.from(y0);
  const k1 = new Float64Array(n);
  const k2 = new Float64Array(n);
  const k3 = new Float64Array(n);
  const k4 = new Float64Array(n);
  const tmp = new Float64Array(n);
  const h = (t1 - t0) / steps;
  for (let s = 0; s < steps; s++) {
    const t = t0 + s * h;
    f(t, y, k1);
    for (let i = 0; i < n; i++) tmp[i] = y[i] + 0.5 * h * k1[i];
    f(t + 0.5 * h, tmp, k2);
    for (let i = 0; i < n; i++) tmp[i] = y[i] + 0.5 * h * k2[i];
    f(t + 0.5 * h, tmp, k3);
    for (let i = 0; i < n; i++) tmp[i] = y[i] + h * k3[i];
    f(t + h, tmp, k4);
    for (let i = 0; i < n; i++) y[i] += (h / 6) * (k1[i] + 2 * k2[i] + 2 * k3[i] + k4[i]);
  }
  return y;
}

const vanDerPol =
  (mu: number): OdeRhs =>
  (_t, y, dy) => {
    dy[0] = y[1];
    dy[1] = mu * (1 - y[0] * y[0]) * y[1] - y[0];
  };

describe('dormandPrince', () => {
  it('integrates exponential decay with a global error that follows the tolerance', () => {
    const f: OdeRhs = (_t, y, dy) => {
      dy[0] = -y[0];
    };
    for (const tol of [1e-4, 1e-6, 1e-8, 1e-10]) {
      const r = dormandPrince(f, 0, [1], 5, { rtol: tol, atol: tol * 1e-3 });
      expect(r.converged).toBe(true);
      expect(r.t).toBe(5);
      // Relative global error within 10× the local tolerance.
      expect(Math.abs(r.y[0] / Math.exp(-5) - 1)).toBeLessThan(10 * tol);
    }
  });

  it('solves the Prothero–Robinson problem (λ = −1000, stiff): accurate, step limited by stability', () => {
    // Prothero & Robinson, Math. Comp. 1974, 28, 145: y' = λ(y − g) + g', exact y = g = cos t.
    const lambda = -1000;
    const f: OdeRhs = (t, y, dy) => {
      dy[0] = lambda * (y[0] - Math.cos(t)) - Math.sin(t);
    };
    const r = dormandPrince(f, 0, [1], 2, { rtol: 1e-8, atol: 1e-10 });
    expect(r.converged).toBe(true);
    expect(Math.abs(r.y[0] - Math.cos(2))).toBeLessThan(1e-7);
    // The explicit pair is stability-bound (|hλ| ≲ 3.3): hundreds of steps, reported, not hidden.
    expect(r.steps).toBeGreaterThan(400);
    expect(r.steps).toBeLessThan(2000);
  });

  it('matches a converged fixed-step RK4 on Van der Pol, μ = 1, over two limit cycles', () => {
    const f = vanDerPol(1);
    const ref = rk4(f, 0, [2, 0], 20, 200_000);
    const r = dormandPrince(f, 0, [2, 0], 20, { rtol: 1e-10, atol: 1e-12 });
    expect(r.converged).toBe(true);
    expect(Math.abs(r.y[0] - ref[0])).toBeLessThan(1e-8);
    expect(Math.abs(r.y[1] - ref[1])).toBeLessThan(1e-8);
    const loose = dormandPrince(f, 0, [2, 0], 20, { rtol: 1e-5, atol: 1e-8 });
    expect(loose.steps).toBeLessThan(r.steps);
    expect(Math.abs(loose.y[0] - ref[0])).toBeLessThan(1e-3);
  });

  it('closes the Arenstorf orbit after one period (Hairer, Nørsett & Wanner I, §II.0)', () => {
    // Restricted three-body problem with the published initial values and period
    // T = 17.0652165601579625588917206249 (values as printed there and in many solver test suites).
    const mu = 0.012277471;
    const mp = 1 - mu;
    const f: OdeRhs = (_t, y, dy) => {
      const d1 = ((y[0] + mu) ** 2 + y[1] ** 2) ** 1.5;
      const d2 = ((y[0] - mp) ** 2 + y[1] ** 2) ** 1.5;
      dy[0] = y[2];
      dy[1] = y[3];
      dy[2] = y[0] + 2 * y[3] - (mp * (y[0] + mu)) / d1 - (mu * (y[0] - mp)) / d2;
      dy[3] = y[1] - 2 * y[2] - (mp * y[1]) / d1 - (mu * y[1]) / d2;
    };
    const y0 = [0.994, 0, 0, -2.0015851063790824]; // printed: −2.00158510637908252240537862224
    const T = 17.065216560157964; // printed: 17.0652165601579625588917206249
    const r = dormandPrince(f, 0, y0, T, { rtol: 1e-11, atol: 1e-11 });
    expect(r.converged).toBe(true);
    expect(Math.abs(r.y[0] - y0[0])).toBeLessThan(1e-5);
    expect(Math.abs(r.y[1] - y0[1])).toBeLessThan(1e-5);
    // A loose tolerance visibly fails to close the orbit: the test can tell the difference.
    const loose = dormandPrince(f, 0, y0, T, { rtol: 1e-4, atol: 1e-4 });
    expect(Math.hypot(loose.y[0] - y0[0], loose.y[1] - y0[1])).toBeGreaterThan(1e-3);
  });

  it('reports every accepted step, honours a stop condition, and accepts a custom error norm', () => {
    const f: OdeRhs = (_t, y, dy) => {
      dy[0] = -y[0];
    };
    const ts: number[] = [];
    const r = dormandPrince(f, 0, [1], 10, {
      onStep: (t) => ts.push(t),
      stop: (_t, y) => y[0] < 0.5,
      errorNorm: (_y, _yNew, err) => Math.abs(err[0]) / 1e-9,
    });
    expect(r.reason).toBe('stopped');
    expect(r.y[0]).toBeLessThan(0.5);
    expect(r.y[0]).toBeGreaterThan(0.3);
    expect(ts.length).toBe(r.steps);
    expect(ts.every((t, i) => i === 0 || t > ts[i - 1])).toBe(true);
  });

  it('with a lower starting order, cuts a rejected first trial harder (h² law), as accurately', () => {
    // y' = −y under a custom norm far stricter than the tolerances of the starting-step estimate:
    // the first trial is far over the norm. Its cut is read from the stage times (the second
    // stage of a trial of length h sits at h/5).
    const run = (startOrder?: number) => {
      const stageTimes: number[] = [];
      const f: OdeRhs = (t, y, dy) => {
        stageTimes.push(t);
        dy[0] = -y[0];
      };
      const r = dormandPrince(f, 0, [1], 5, {
        rtol: 1e-3,
        atol: 1e-3,
        errorNorm: (_y, _yNew, err) => Math.abs(err[0]) / 1e-12,
        startOrder,
      });
      // Evaluations: 0 the start, 1 the starting-step probe, 2..7 the first trial, 8.. the second.
      return { r, cut: stageTimes[8] / stageTimes[2] };
    };
    const plain = run();
    const low = run(2);
    expect(plain.r.rejected).toBeGreaterThan(0);
    expect(plain.cut).toBeCloseTo(0.2, 12);
    expect(low.cut).toBeLessThan(0.2);
    expect(low.cut).toBeGreaterThanOrEqual(0.02);
    for (const { r } of [plain, low]) expect(Math.abs(r.y[0] - Math.exp(-5))).toBeLessThan(1e-10);
  });

  it('with predictive control, follows an error that grows step after step without rejections, as accurately', () => {
    // y' = (1 + ε − t)^(−1/2) on [0, 1]: the solution steepens towards t = 1 (a near-singular end,
    // like a distillation approaching the point where a liquid phase vanishes), so at a fixed step
    // the error grows from one step to the next and the standard control rejects every other step.
    const eps = 1e-3;
    const f: OdeRhs = (t, _y, dy) => {
      dy[0] = 1 / Math.sqrt(1 + eps - t);
    };
    const exact = 2 * (Math.sqrt(1 + eps) - Math.sqrt(eps));
    const plain = dormandPrince(f, 0, [0], 1, { rtol: 1e-9, atol: 1e-9 });
    const ahead = dormandPrince(f, 0, [0], 1, { rtol: 1e-9, atol: 1e-9, predictive: true });
    expect(plain.rejected).toBeGreaterThan(20);
    expect(ahead.rejected).toBeLessThan(plain.rejected / 4);
    expect(ahead.evaluations).toBeLessThan(plain.evaluations);
    for (const r of [plain, ahead]) expect(Math.abs(r.y[0] - exact)).toBeLessThan(1e-8);
  });

  it('gives the continuous extension of the step that met the stop condition, of order 4', () => {
    // y' = y cos t, exact y = exp(sin t). One step of size h from t = 0.3 (every step accepted):
    // the extension is exact at both ends and its error inside the step falls as h⁵ (Shampine
    // 1986; Hairer, Nørsett & Wanner I §II.6): halving h divides it by about 32, where a cubic
    // Hermite interpolant (order 3) would divide it by 16.
    const f: OdeRhs = (t, y, dy) => {
      dy[0] = y[0] * Math.cos(t);
    };
    const exact = (t: number) => Math.exp(Math.sin(t));
    const midError = (h: number) => {
      const r = dormandPrince(f, 0.3, [exact(0.3)], 10, {
        h0: h,
        hMax: h,
        rtol: 1,
        atol: 1,
        stop: () => true,
      });
      expect(r.reason).toBe('stopped');
      const step = r.lastStep!;
      expect(step.t0).toBe(0.3);
      expect(step.t1).toBeCloseTo(0.3 + h, 15);
      const out = new Float64Array(1);
      step.at(step.t0, out);
      expect(out[0]).toBe(exact(0.3));
      step.at(step.t1, out);
      expect(out[0]).toBeCloseTo(r.y[0], 14);
      let worst = 0;
      for (const theta of [0.25, 0.5, 0.75]) {
        step.at(0.3 + theta * h, out);
        worst = Math.max(worst, Math.abs(out[0] - exact(0.3 + theta * h)));
      }
      return worst;
    };
    const e1 = midError(0.4);
    const e2 = midError(0.2);
    expect(e1).toBeLessThan(1e-4);
    expect(e1 / e2).toBeGreaterThan(24);
    // Without a stop condition there is no extension to give.
    expect(dormandPrince(f, 0, [1], 1).lastStep).toBeUndefined();
  });

  it('retries smaller steps when the right-hand side is not finite in part of the state space', () => {
    // sqrt is undefined below 0: a large first step that overshoots is refused and retried.
    const f: OdeRhs = (_t, y, dy) => {
      dy[0] = y[0] < 0 ? NaN : -Math.sqrt(y[0]);
    };
    const r = dormandPrince(f, 0, [1], 1.9, { rtol: 1e-8, atol: 1e-12, h0: 1.9 });
    expect(r.converged).toBe(true);
    // Exact: y = (1 − t/2)².
    expect(Math.abs(r.y[0] - (1 - 1.9 / 2) ** 2)).toBeLessThan(1e-7);
  });

  it('gives up with max-steps rather than looping', () => {
    const r = dormandPrince(vanDerPol(1), 0, [2, 0], 20, { rtol: 1e-12, maxSteps: 10 });
    expect(r.converged).toBe(false);
    expect(r.reason).toBe('max-steps');
  });
});
