/**
 * Nonlinear least squares for the engine's regressions (a few parameters,
 * a few residuals): the Levenberg–Marquardt method.
 *
 * Source: K. Levenberg, Q. Appl. Math. 1944, 2, 164; D. W. Marquardt,
 * J. Soc. Ind. Appl. Math. 1963, 11, 431; the damping update of W. H. Press
 * et al., Numerical Recipes, 3rd ed., CUP 2007, §15.5.2 (mrqmin: λ × 10 on a
 * rejected step, λ / 10 on an accepted one; diagonal scaling of JᵀJ).
 */
import { gaussSolve } from './roots';

/** Result of a least-squares fit. */
export interface LeastSquaresResult {
  /** Parameters at the minimum found [units of the parameters]. */
  x: number[];
  /** Residuals at x [units of the residuals]. */
  residual: number[];
  /** Sum of squared residuals at x [units of the residuals squared]. */
  sumOfSquares: number;
  /** True when the relative decrease of the sum of squares fell below the tolerance. */
  converged: boolean;
  iterations: number;
}

/**
 * Minimises Σ r_i(x)² over the parameters x by the Levenberg–Marquardt
 * method with a forward-difference Jacobian: each step solves
 * (JᵀJ + λ diag(JᵀJ)) δ = −Jᵀr, accepted when the sum of squares falls.
 * A residual that is not finite counts as an infinite sum (the step is
 * rejected and λ raised), so a model that fails for some parameters is
 * kept away from them.
 *
 * Source: Levenberg 1944; Marquardt 1963; Numerical Recipes 3rd ed. §15.5.2.
 *
 * @param residuals   residual function of the parameters [units of the residuals]
 * @param x0          starting parameters [units of the parameters]
 * @param opts.rtol   converged when an accepted step lowers the sum of squares by less than this fraction [–] (default 1e-10)
 * @param opts.maxIterations  iteration limit [–] (default 200)
 * @returns the parameters at the minimum found, their residuals and a convergence flag
 *
 * Validity: smooth residuals; finds a local minimum near x0 (start from a
 * grid when several minima are possible).
 */
export function levenbergMarquardt(
  residuals: (x: readonly number[]) => number[],
  x0: readonly number[],
  opts: { rtol?: number; maxIterations?: number } = {},
): LeastSquaresResult {
  const rtol = opts.rtol ?? 1e-10;
  const maxIterations = opts.maxIterations ?? 200;
  const n = x0.length;
  const ss = (r: number[]) =>
    r.every(Number.isFinite) ? r.reduce((a, v) => a + v * v, 0) : Infinity;
  let x = [...x0];
  let r = residuals(x);
  let s = ss(r);
  let lambda = 1e-3;
  for (let iter = 0; iter < maxIterations; iter++) {
    if (!Number.isFinite(s)) break;
    const J = r.map(() => new Array<number>(n).fill(0));
    for (let j = 0; j < n; j++) {
      const h = 1e-7 * Math.max(1, Math.abs(x[j]));
      const xp = [...x];
      xp[j] += h;
      const rp = residuals(xp);
      for (let i = 0; i < r.length; i++) J[i][j] = (rp[i] - r[i]) / h;
    }
    const JtJ = Array.from({ length: n }, (_, a) =>
      Array.from({ length: n }, (_, b) => J.reduce((acc, row) => acc + row[a] * row[b], 0)),
    );
    const Jtr = Array.from({ length: n }, (_, a) =>
      J.reduce((acc, row, i) => acc + row[a] * r[i], 0),
    );
    let accepted = false;
    for (let k = 0; k < 30 && !accepted; k++) {
      const A = JtJ.map((row, a) => row.map((v, b) => (a === b ? v * (1 + lambda) : v)));
      const d = gaussSolve(
        A,
        Jtr.map((v) => -v),
      );
      if (!d || !d.every(Number.isFinite)) {
        lambda *= 10;
        continue;
      }
      const xt = x.map((v, i) => v + d[i]);
      const rt = residuals(xt);
      const st = ss(rt);
      if (st < s) {
        const drop = (s - st) / Math.max(s, 1e-300);
        x = xt;
        r = rt;
        s = st;
        lambda = Math.max(lambda / 10, 1e-12);
        accepted = true;
        if (drop < rtol || s === 0)
          return { x, residual: r, sumOfSquares: s, converged: true, iterations: iter + 1 };
      } else lambda *= 10;
    }
    // No step lowers the sum any more: a minimum to the precision of the Jacobian.
    if (!accepted)
      return {
        x,
        residual: r,
        sumOfSquares: s,
        converged: Number.isFinite(s),
        iterations: iter + 1,
      };
  }
  return { x, residual: r, sumOfSquares: s, converged: false, iterations: maxIterations };
}
