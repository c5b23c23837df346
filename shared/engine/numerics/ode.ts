/**
 * Adaptive integration of ordinary differential equations y' = f(t, y) with
 * local error control: the explicit Runge–Kutta pair of Dormand and Prince,
 * order 5 with an embedded order-4 error estimate (DOPRI5).
 *
 * Sources: J. R. Dormand, P. J. Prince, "A family of embedded Runge–Kutta
 * formulae", J. Comput. Appl. Math. 1980, 6, 19–26
 * (doi:10.1016/0771-050X(80)90013-3); coefficients, error norm, step-size
 * control and starting step as in E. Hairer, S. P. Nørsett, G. Wanner,
 * Solving Ordinary Differential Equations I, 2nd ed., Springer 1993, §II.4
 * (eqs. 4.10–4.13, the starting-step algorithm) and §II.5 (Table 5.2).
 *
 * Formula: seven stages k_1…k_7 (FSAL: k_7 of a step is k_1 of the next),
 *   y_{n+1} = y_n + h Σ b_i k_i          (order 5, the solution carried)
 *   err     = h Σ (b_i − b̂_i) k_i         (difference to the order-4 solution)
 * accepted when ‖err‖ ≤ 1 with the scaled norm
 *   ‖err‖ = sqrt( (1/n) Σ_i (err_i / (atol_i + rtol·max(|y_n,i|, |y_{n+1},i|)))² ),
 * and the next step h_new = h · min(5, max(0.2, 0.9 ‖err‖^(−1/5))) (no growth
 * right after a rejection; a caller may ask for a harder cut of a rejected
 * first trial, startOrder). A caller may supply its own error norm (for
 * instance on mole fractions derived from the state).
 *
 * Dense output (when the integration stops on a caller's condition): the
 * continuous extension of order 4 of Shampine (L. F. Shampine, "Some practical
 * Runge–Kutta formulas", Math. Comp. 1986, 46, 135–150), as in Hairer,
 * Nørsett & Wanner I §II.6 (DOPRI5's dense output), on the last step
 * [t_n, t_n + h] with θ = (t − t_n)/h, at no extra right-hand-side evaluation:
 *   y(t) = y_n + θ (Δ + (1 − θ)(B + θ (Δ − h k_7 − B + (1 − θ) h Σ d_i k_i))),
 *   Δ = y_{n+1} − y_n,  B = h k_1 − Δ,
 * exact at both ends of the step (θ = 0, 1).
 *
 * Validity: non-stiff and mildly stiff problems. On a stiff problem the step
 * is limited by stability, not accuracy: it still converges but with many
 * steps (the step count is reported). The local tolerance bounds the error
 * made per step; the global error is typically of the order of the local
 * tolerance times a modest factor, so callers that promise a global accuracy
 * set the local tolerance a decade tighter and check it against a reference.
 */

/** Why an integration stopped. */
export type OdeStop = 'converged' | 'stopped' | 'max-steps' | 'step-too-small' | 'not-finite';

/** Right-hand side: writes dy/dt at (t, y) into dy [unit of y / unit of t]. */
export type OdeRhs = (t: number, y: Float64Array, dy: Float64Array) => void;

/** Options of an adaptive integration. */
export interface OdeOptions {
  /** Relative tolerance per step [–] (default 1e-6). */
  rtol?: number;
  /** Absolute tolerance per step [unit of y], one value or one per component (default 1e-9). */
  atol?: number | readonly number[];
  /** First step [unit of t] (default: Hairer's starting-step algorithm). */
  h0?: number;
  /** Largest step [unit of t] (default: the whole interval). */
  hMax?: number;
  /** Step limit [–] (default 100 000). */
  maxSteps?: number;
  /**
   * Order q assumed when a trial step is rejected before the first accepted one: the step is cut by
   * 0.9 ‖err‖^(−1/q), to at least 1/50 (default 5, the pair's own order, cut at most 5-fold). A
   * caller whose error norm is far from the starting-step estimate (a first trial far too long,
   * whose error grows more slowly than h⁵) passes a lower order to come down in fewer rejections.
   */
  startOrder?: number;
  /**
   * Predictive step-size control (Gustafsson, ACM Trans. Math. Softw. 1994, 20, 496; Hairer &
   * Wanner, Solving ODEs II, 2nd ed., §IV.8): after an accepted step the next is the smaller of the
   * standard proposal and h · 0.9 ‖err‖^(−1/5) · (h/h_prev) · (‖err_prev‖/‖err‖)^(1/5) from the last
   * two accepted steps, so an error that grows step after step (a solution approaching a kink) cuts
   * the step ahead instead of after every other rejection (default false).
   */
  predictive?: boolean;
  /**
   * Error norm of a trial step; ≤ 1 accepts it. Receives the state before the
   * step, the trial state after it and the local error estimate [–].
   */
  errorNorm?: (y: Float64Array, yNew: Float64Array, err: Float64Array) => number;
  /** Called after every accepted step with the new (t, y); may keep a copy. */
  onStep?: (t: number, y: Float64Array) => void;
  /** Checked after every accepted step: returning true ends the integration ('stopped'). */
  stop?: (t: number, y: Float64Array) => boolean;
}

/**
 * The continuous extension over the last accepted step (module comment):
 * y(t) for t in [t0, t1] [unit of y].
 */
export interface OdeStepInterpolant {
  /** Start of the step [unit of t]. */
  t0: number;
  /** End of the step [unit of t]. */
  t1: number;
  /** Writes y(t) [unit of y] into out, for t0 ≤ t ≤ t1. */
  at(t: number, out: Float64Array): void;
}

/** Result of an adaptive integration. */
export interface OdeResult {
  /** Where the integration ended [unit of t] (= t1 when converged). */
  t: number;
  /** State there [unit of y]. */
  y: Float64Array;
  /** True when t1 was reached (or the stop condition met) within the tolerances. */
  converged: boolean;
  reason: OdeStop;
  /** Accepted steps [–]. */
  steps: number;
  /** Rejected trial steps [–]. */
  rejected: number;
  /** Right-hand-side evaluations [–]. */
  evaluations: number;
  /** When stopped by `stop`: the continuous extension over the last step (dense output). */
  lastStep?: OdeStepInterpolant;
}

// Dormand–Prince 5(4) tableau (Hairer, Nørsett & Wanner I, Table 5.2).
const C2 = 1 / 5;
const C3 = 3 / 10;
const C4 = 4 / 5;
const C5 = 8 / 9;
const A21 = 1 / 5;
const A31 = 3 / 40;
const A32 = 9 / 40;
const A41 = 44 / 45;
const A42 = -56 / 15;
const A43 = 32 / 9;
const A51 = 19372 / 6561;
const A52 = -25360 / 2187;
const A53 = 64448 / 6561;
const A54 = -212 / 729;
const A61 = 9017 / 3168;
const A62 = -355 / 33;
const A63 = 46732 / 5247;
const A64 = 49 / 176;
const A65 = -5103 / 18656;
const A71 = 35 / 384;
const A73 = 500 / 1113;
const A74 = 125 / 192;
const A75 = -2187 / 6784;
const A76 = 11 / 84;
// e_i = b_i − b̂_i (order 5 minus order 4).
const E1 = 71 / 57600;
const E3 = -71 / 16695;
const E4 = 71 / 1920;
const E5 = -17253 / 339200;
const E6 = 22 / 525;
const E7 = -1 / 40;
// Shampine's dense output (Hairer, Nørsett & Wanner I §II.6; DOPRI5), d_2 = 0.
const D1 = -12715105075 / 11282082432;
const D3 = 87487479700 / 32700410799;
const D4 = -10690763975 / 1880347072;
const D5 = 701980252875 / 199316789632;
const D6 = -1453857185 / 822651844;
const D7 = 69997945 / 29380423;

/**
 * Integrate y' = f(t, y) from t0 to t1 (t1 > t0) with the Dormand–Prince
 * 5(4) pair and adaptive steps.
 *
 * Source and formula: see the module comment (Dormand & Prince 1980; Hairer,
 * Nørsett & Wanner 1993 §II.4–II.5).
 *
 * @param f     right-hand side, dy/dt [unit of y / unit of t]
 * @param t0    start of the interval [unit of t]
 * @param y0    state at t0 [unit of y] (not modified)
 * @param t1    end of the interval [unit of t], > t0
 * @param opts  tolerances and callbacks (OdeOptions)
 * @returns the state at t1 (or where it stopped), the reason, step and evaluation counts
 *
 * Validity: f continuous in y and piecewise smooth in t; a kink in f is
 * crossed with a few rejected steps. A right-hand side that returns a
 * non-finite value makes the step be retried 5 times smaller.
 */
export function dormandPrince(
  f: OdeRhs,
  t0: number,
  y0: ArrayLike<number>,
  t1: number,
  opts: OdeOptions = {},
): OdeResult {
  const n = y0.length;
  const rtol = opts.rtol ?? 1e-6;
  const atolOpt = opts.atol ?? 1e-9;
  const atol = (i: number) => (typeof atolOpt === 'number' ? atolOpt : atolOpt[i]);
  const maxSteps = opts.maxSteps ?? 100_000;
  const startOrder = opts.startOrder ?? 5;
  const span = t1 - t0;
  const hMax = Math.min(opts.hMax ?? span, span);
  const y = Float64Array.from(y0);
  const yNew = new Float64Array(n);
  const yStage = new Float64Array(n);
  const err = new Float64Array(n);
  const k1 = new Float64Array(n);
  const k2 = new Float64Array(n);
  const k3 = new Float64Array(n);
  const k4 = new Float64Array(n);
  const k5 = new Float64Array(n);
  const k6 = new Float64Array(n);
  const k7 = new Float64Array(n);
  let evaluations = 0;
  let steps = 0;
  let rejected = 0;
  // Dense-output coefficients of the last accepted step (only when the caller can stop it).
  const dense = opts.stop
    ? {
        t0: 0,
        h: 0,
        r1: new Float64Array(n),
        r2: new Float64Array(n),
        r3: new Float64Array(n),
        r4: new Float64Array(n),
        r5: new Float64Array(n),
      }
    : null;
  const result = (t: number, reason: OdeStop): OdeResult => {
    const out: OdeResult = {
      t,
      y: Float64Array.from(y),
      converged: reason === 'converged' || reason === 'stopped',
      reason,
      steps,
      rejected,
      evaluations,
    };
    if (reason === 'stopped' && dense) {
      const { t0: ts, h: hs, r1, r2, r3, r4, r5 } = dense;
      out.lastStep = {
        t0: ts,
        t1: t,
        at(tq: number, target: Float64Array): void {
          const th = Math.min(1, Math.max(0, (tq - ts) / hs));
          const th1 = 1 - th;
          for (let i = 0; i < n; i++)
            target[i] = r1[i] + th * (r2[i] + th1 * (r3[i] + th * (r4[i] + th1 * r5[i])));
        },
      };
    }
    return out;
  };
  if (!(span > 0)) return result(t0, 'converged');

  const defaultNorm = (a: Float64Array, b: Float64Array, e: Float64Array): number => {
    let s = 0;
    for (let i = 0; i < n; i++) {
      const sc = atol(i) + rtol * Math.max(Math.abs(a[i]), Math.abs(b[i]));
      const q = e[i] / sc;
      s += q * q;
    }
    return Math.sqrt(s / n);
  };
  const norm = opts.errorNorm ?? defaultNorm;

  f(t0, y, k1);
  evaluations++;
  for (let i = 0; i < n; i++) if (!Number.isFinite(k1[i])) return result(t0, 'not-finite');

  // Starting step (Hairer, Nørsett & Wanner I, §II.4, "Automatic step size control").
  let h = opts.h0 ?? NaN;
  if (!(h > 0)) {
    let d0 = 0;
    let d1 = 0;
    for (let i = 0; i < n; i++) {
      const sc = atol(i) + rtol * Math.abs(y[i]);
      d0 += (y[i] / sc) ** 2;
      d1 += (k1[i] / sc) ** 2;
    }
    d0 = Math.sqrt(d0 / n);
    d1 = Math.sqrt(d1 / n);
    let h0 = d0 < 1e-5 || d1 < 1e-5 ? 1e-6 * span : (0.01 * d0) / d1;
    h0 = Math.min(h0, hMax);
    for (let i = 0; i < n; i++) yStage[i] = y[i] + h0 * k1[i];
    f(t0 + h0, yStage, k2);
    evaluations++;
    let d2 = 0;
    for (let i = 0; i < n; i++) {
      const sc = atol(i) + rtol * Math.abs(y[i]);
      d2 += ((k2[i] - k1[i]) / sc) ** 2;
    }
    d2 = Number.isFinite(d2) ? Math.sqrt(d2 / n) / h0 : Infinity;
    const h1 =
      Math.max(d1, d2) <= 1e-15
        ? Math.max(1e-6 * span, h0 * 1e-3)
        : (0.01 / Math.max(d1, d2)) ** (1 / 5);
    h = Math.min(100 * h0, h1, hMax);
  }

  let t = t0;
  let lastRejected = false;
  // The last accepted step and its error, for the predictive control.
  const predictive = opts.predictive === true;
  let hAccepted = 0;
  let eAccepted = 0;
  while (steps + rejected < maxSteps) {
    const last = t + h >= t1 - 1e-12 * Math.abs(span);
    if (last) h = t1 - t;
    if (h < 1e-14 * Math.max(Math.abs(t), Math.abs(span))) return result(t, 'step-too-small');
    for (let i = 0; i < n; i++) yStage[i] = y[i] + h * A21 * k1[i];
    f(t + C2 * h, yStage, k2);
    for (let i = 0; i < n; i++) yStage[i] = y[i] + h * (A31 * k1[i] + A32 * k2[i]);
    f(t + C3 * h, yStage, k3);
    for (let i = 0; i < n; i++) yStage[i] = y[i] + h * (A41 * k1[i] + A42 * k2[i] + A43 * k3[i]);
    f(t + C4 * h, yStage, k4);
    for (let i = 0; i < n; i++)
      yStage[i] = y[i] + h * (A51 * k1[i] + A52 * k2[i] + A53 * k3[i] + A54 * k4[i]);
    f(t + C5 * h, yStage, k5);
    for (let i = 0; i < n; i++)
      yStage[i] = y[i] + h * (A61 * k1[i] + A62 * k2[i] + A63 * k3[i] + A64 * k4[i] + A65 * k5[i]);
    f(t + h, yStage, k6);
    for (let i = 0; i < n; i++)
      yNew[i] = y[i] + h * (A71 * k1[i] + A73 * k3[i] + A74 * k4[i] + A75 * k5[i] + A76 * k6[i]);
    f(t + h, yNew, k7);
    evaluations += 6;
    let finite = true;
    for (let i = 0; i < n; i++) {
      err[i] = h * (E1 * k1[i] + E3 * k3[i] + E4 * k4[i] + E5 * k5[i] + E6 * k6[i] + E7 * k7[i]);
      if (!Number.isFinite(err[i]) || !Number.isFinite(yNew[i])) finite = false;
    }
    const e = finite ? norm(y, yNew, err) : Infinity;
    if (e <= 1) {
      steps++;
      if (dense) {
        dense.t0 = t;
        dense.h = h;
        for (let i = 0; i < n; i++) {
          const diff = yNew[i] - y[i];
          const bspl = h * k1[i] - diff;
          dense.r1[i] = y[i];
          dense.r2[i] = diff;
          dense.r3[i] = bspl;
          dense.r4[i] = diff - h * k7[i] - bspl;
          dense.r5[i] =
            h * (D1 * k1[i] + D3 * k3[i] + D4 * k4[i] + D5 * k5[i] + D6 * k6[i] + D7 * k7[i]);
        }
      }
      t = last ? t1 : t + h;
      y.set(yNew);
      k1.set(k7);
      opts.onStep?.(t, y);
      if (last) return result(t1, 'converged');
      if (opts.stop?.(t, y)) return result(t, 'stopped');
      let factor = e === 0 ? 5 : Math.min(5, Math.max(0.2, 0.9 * e ** -0.2));
      // Predictive control (Gustafsson): when the error of consecutive accepted steps grows, the
      // next step is cut ahead by the trend instead of after a rejection; the smaller of the two.
      if (predictive && hAccepted > 0 && e > 0 && eAccepted > 0)
        factor = Math.min(
          factor,
          Math.max(0.2, 0.9 * e ** -0.2 * (h / hAccepted) * (eAccepted / e) ** 0.2),
        );
      if (lastRejected) factor = Math.min(1, factor);
      hAccepted = h;
      eAccepted = e;
      h = Math.min(hMax, h * factor);
      lastRejected = false;
    } else {
      rejected++;
      lastRejected = true;
      if (!Number.isFinite(e)) h *= 0.2;
      else if (steps === 0 && startOrder !== 5)
        h *= Math.max(0.02, Math.min(0.9, 0.9 * e ** (-1 / startOrder)));
      else h *= Math.max(0.2, 0.9 * e ** -0.2);
    }
  }
  return result(t, 'max-steps');
}
