/**
 * Scalar root finding for every solver in the engine: bracket expansion,
 * Brent's method, and a bracket-safeguarded Newton iteration.
 *
 * Every routine returns the root with a convergence flag, the reason it
 * stopped, and its iteration and evaluation counts; none throws on
 * non-convergence, so the caller decides what to tell the chemist.
 *
 * Sources:
 *  - Brent: R. P. Brent, Algorithms for Minimization without Derivatives,
 *    Prentice-Hall, 1973, chapter 4 (procedure zero); the same algorithm as
 *    W. H. Press et al., Numerical Recipes, 3rd ed., CUP 2007, §9.3 (zbrent).
 *  - Bracket expansion: Numerical Recipes, 3rd ed., §9.1 (zbrac), geometric
 *    growth by 1.6 of the interval on the side of the smaller |f|.
 *  - Safeguarded Newton: Numerical Recipes, 3rd ed., §9.4 (rtsafe): Newton
 *    steps accepted only inside the current bracket, bisection otherwise.
 */

/** Why an iteration stopped. */
export type RootStop = 'converged' | 'no-bracket' | 'max-iterations' | 'not-finite';

/** Result of a root search. */
export interface RootResult {
  /** Best estimate of the root [unit of x]. */
  root: number;
  /** f(root) [unit of f]. */
  value: number;
  /** True when the tolerance was met. */
  converged: boolean;
  reason: RootStop;
  /** Iterations of the root finder (not counting bracket expansion) [–]. */
  iterations: number;
  /** Function evaluations in all, expansion included [–]. */
  evaluations: number;
  /** Final bracket [lower, upper] (equal ends when the root was hit exactly) [unit of x]. */
  bracket: [number, number];
}

/** Tolerances of a root search. */
export interface RootTolerance {
  /** Absolute tolerance on x [unit of x] (default 1e-12). */
  xtol?: number;
  /** Relative tolerance on x [–] (default 4·machine epsilon). */
  rtol?: number;
  /** Stop as soon as |f| ≤ ftol [unit of f] (default 0: only the x tolerance). */
  ftol?: number;
  /** Iteration limit [–] (default 200). */
  maxIterations?: number;
}

const EPS = Number.EPSILON;

/** Result of a bracket expansion. */
export interface BracketResult {
  found: boolean;
  /** Lower end [unit of x]. */
  a: number;
  /** Upper end [unit of x]. */
  b: number;
  fa: number;
  fb: number;
  evaluations: number;
}

/**
 * Expand [a, b] until f changes sign across it.
 *
 * Source: Numerical Recipes, 3rd ed., §9.1 (zbrac). Formula: the end with
 * the smaller |f| moves outwards by `factor`·(b − a), clipped at
 * `lower`/`upper`; stops when f(a)·f(b) ≤ 0.
 *
 * @param f              function of x [unit of f]
 * @param a              lower end of the first interval [unit of x]
 * @param b              upper end of the first interval [unit of x], b > a
 * @param opts.factor        growth of the interval per expansion [–] (default 1.6)
 * @param opts.maxExpansions expansion limit [–] (default 60)
 * @param opts.lower         smallest admissible x [unit of x] (default −∞)
 * @param opts.upper         largest admissible x [unit of x] (default +∞)
 * @returns the bracket (found = false when no sign change was met within the limits)
 *
 * Validity: any continuous f; an even number of roots inside [a, b] is not
 * detected (a bracket needs a sign change).
 */
export function expandBracket(
  f: (x: number) => number,
  a: number,
  b: number,
  opts: { factor?: number; maxExpansions?: number; lower?: number; upper?: number } = {},
): BracketResult {
  const factor = opts.factor ?? 1.6;
  const lower = opts.lower ?? -Infinity;
  const upper = opts.upper ?? Infinity;
  let lo = Math.max(lower, Math.min(a, b));
  let hi = Math.min(upper, Math.max(a, b));
  let flo = f(lo);
  let fhi = f(hi);
  let evaluations = 2;
  for (let k = 0; k < (opts.maxExpansions ?? 60); k++) {
    if (flo * fhi <= 0) return { found: true, a: lo, b: hi, fa: flo, fb: fhi, evaluations };
    const width = hi - lo;
    const canLower = lo > lower;
    const canUpper = hi < upper;
    if (!canLower && !canUpper) break;
    const moveLower =
      canLower && (!canUpper || Math.abs(flo) < Math.abs(fhi) || !Number.isFinite(fhi));
    if (moveLower) {
      lo = Math.max(lower, lo - factor * width);
      flo = f(lo);
    } else {
      hi = Math.min(upper, hi + factor * width);
      fhi = f(hi);
    }
    evaluations++;
  }
  return { found: flo * fhi <= 0, a: lo, b: hi, fa: flo, fb: fhi, evaluations };
}

/**
 * The result of a Brent solve (a module-level function rather than a closure per call: the
 * solver runs thousands of times per route evaluation).
 */
function brentResult(
  root: number,
  value: number,
  reason: RootStop,
  iterations: number,
  lo: number,
  hi: number,
  evaluations: number,
): RootResult {
  return {
    root,
    value,
    converged: reason === 'converged',
    reason,
    iterations,
    evaluations,
    bracket: [Math.min(lo, hi), Math.max(lo, hi)],
  };
}

/**
 * Brent's method on a bracket [a, b] with f(a)·f(b) ≤ 0.
 *
 * Source: Brent 1973, ch. 4 (zero); Numerical Recipes 3rd ed. §9.3.
 * Formula: inverse quadratic (or secant) interpolation through the last
 * three points, accepted only when it falls inside the bracket and shrinks
 * the step by more than half of the step before; bisection otherwise.
 * Converged when the bracket half-width ≤ 2·rtol·|x| + xtol/2, or |f| ≤ ftol.
 * A bisection is forced when three steps have not halved the bracket, so
 * convergence is guaranteed for a continuous f and never much slower than
 * bisection (multiple roots, flat functions).
 *
 * @param f     function of x [unit of f]
 * @param a     one end of the bracket [unit of x]
 * @param b     other end of the bracket [unit of x]
 * @param tol   tolerances (see RootTolerance)
 * @param known optional f(a) and f(b) already computed [unit of f]
 * @returns the root with its convergence flag ('no-bracket' when f(a)·f(b) > 0)
 *
 * Validity: any f continuous on [a, b]; at a discontinuity with a sign
 * change it returns the jump point.
 */
export function brent(
  f: (x: number) => number,
  a: number,
  b: number,
  tol: RootTolerance = {},
  known?: { fa: number; fb: number },
): RootResult {
  const xtol = tol.xtol ?? 1e-12;
  const rtol = tol.rtol ?? 4 * EPS;
  const ftol = tol.ftol ?? 0;
  const maxIterations = tol.maxIterations ?? 200;
  let fa = known ? known.fa : f(a);
  let fb = known ? known.fb : f(b);
  let evaluations = known ? 0 : 2;
  if (!Number.isFinite(fa) || !Number.isFinite(fb))
    return brentResult(b, fb, 'not-finite', 0, a, b, evaluations);
  if (fa === 0) return brentResult(a, 0, 'converged', 0, a, a, evaluations);
  if (fb === 0) return brentResult(b, 0, 'converged', 0, b, b, evaluations);
  if (fa * fb > 0)
    return brentResult(
      Math.abs(fa) < Math.abs(fb) ? a : b,
      Math.min(fa, fb),
      'no-bracket',
      0,
      a,
      b,
      evaluations,
    );
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  let widthBefore = Infinity;
  let forceBisection = false;
  for (let iter = 1; iter <= maxIterations; iter++) {
    if ((fb > 0 && fc > 0) || (fb < 0 && fc < 0)) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol1 = 2 * rtol * Math.abs(b) + 0.5 * xtol;
    const xm = 0.5 * (c - b);
    if (Math.abs(xm) <= tol1 || fb === 0 || Math.abs(fb) <= ftol)
      return brentResult(b, fb, 'converged', iter - 1, b, c, evaluations);
    // Safeguard (as in Alefeld, Potra & Shi, ACM TOMS 1995, 21, 327): when three interpolation
    // steps have not halved the bracket, bisect, so that no case is slower than about 3× bisection.
    const width = Math.abs(c - b);
    if (iter % 3 === 1) {
      forceBisection = width > 0.5 * widthBefore;
      widthBefore = width;
    }
    if (!forceBisection && Math.abs(e) >= tol1 && Math.abs(fa) > Math.abs(fb)) {
      // Inverse quadratic interpolation (secant when only two distinct points).
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * xm * s;
        q = 1 - s;
      } else {
        const qq = fa / fc;
        const r = fb / fc;
        p = s * (2 * xm * qq * (qq - r) - (b - a) * (r - 1));
        q = (qq - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      p = Math.abs(p);
      const min1 = 3 * xm * q - Math.abs(tol1 * q);
      const min2 = Math.abs(e * q);
      if (2 * p < Math.min(min1, min2)) {
        e = d;
        d = p / q;
      } else {
        d = xm;
        e = d;
      }
    } else {
      d = xm;
      e = d;
      forceBisection = false;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol1 ? d : tol1 * Math.sign(xm);
    fb = f(b);
    evaluations++;
    if (!Number.isFinite(fb)) return brentResult(a, fa, 'not-finite', iter, a, c, evaluations);
  }
  return brentResult(b, fb, 'max-iterations', maxIterations, b, c, evaluations);
}

/**
 * Root of f near a starting interval: expandBracket, then brent.
 *
 * @param f     function of x [unit of f]
 * @param a     lower end of the starting interval [unit of x]
 * @param b     upper end of the starting interval [unit of x]
 * @param opts  tolerances (RootTolerance) and the expansion limits of expandBracket
 * @returns the root with its convergence flag; reason 'no-bracket' when no sign change was found
 *
 * Source and validity: as expandBracket and brent.
 */
export function findRoot(
  f: (x: number) => number,
  a: number,
  b: number,
  opts: RootTolerance & {
    factor?: number;
    maxExpansions?: number;
    lower?: number;
    upper?: number;
  } = {},
): RootResult {
  const br = expandBracket(f, a, b, opts);
  if (!br.found) {
    return {
      root: Math.abs(br.fa) < Math.abs(br.fb) ? br.a : br.b,
      value: Math.abs(br.fa) < Math.abs(br.fb) ? br.fa : br.fb,
      converged: false,
      reason: 'no-bracket',
      iterations: 0,
      evaluations: br.evaluations,
      bracket: [br.a, br.b],
    };
  }
  const r = brent(f, br.a, br.b, opts, { fa: br.fa, fb: br.fb });
  return { ...r, evaluations: r.evaluations + br.evaluations };
}

/** The bracket seen so far by newtonSafe: [x, x] until both signs of f have been seen. */
function newtonBracket(xNeg: number, xPos: number, x: number): [number, number] {
  return Number.isNaN(xNeg) || Number.isNaN(xPos)
    ? [x, x]
    : [Math.min(xNeg, xPos), Math.max(xNeg, xPos)];
}

/**
 * Newton's method safeguarded by a bracket, for functions whose derivative
 * (or a good approximation of it) is cheap.
 *
 * Source: Numerical Recipes, 3rd ed., §9.4 (rtsafe), extended with a search
 * for the bracket: before a sign change is seen, Newton steps are limited to
 * `maxStep`; once f has changed sign, a Newton step that leaves the bracket
 * or fails to halve |f| over two iterations is replaced by bisection.
 * Converged when |f| ≤ ftol, or the step (or the bracket) is below
 * xtol + rtol·|x|.
 *
 * @param fdf       returns f(x) [unit of f] and df/dx [unit of f / unit of x] (an approximate slope is allowed)
 * @param x0        starting point [unit of x]
 * @param opts.lower     smallest admissible x [unit of x] (default −∞)
 * @param opts.upper     largest admissible x [unit of x] (default +∞)
 * @param opts.maxStep   largest Newton step before a bracket is known [unit of x] (default ∞)
 * @param opts.xtol, opts.rtol, opts.ftol, opts.maxIterations  as RootTolerance (default maxIterations 100)
 * @returns the root with its convergence flag
 *
 * Validity: f continuous; converges quadratically near a simple root with an
 * exact slope, linearly with an approximate one, never slower than bisection
 * once bracketed.
 */
export function newtonSafe(
  fdf: (x: number) => { f: number; df: number },
  x0: number,
  opts: RootTolerance & { lower?: number; upper?: number; maxStep?: number } = {},
): RootResult {
  const xtol = opts.xtol ?? 1e-12;
  const rtol = opts.rtol ?? 4 * EPS;
  const ftol = opts.ftol ?? 0;
  const maxIterations = opts.maxIterations ?? 100;
  const maxStep = opts.maxStep ?? Infinity;
  let lower = opts.lower ?? -Infinity;
  let upper = opts.upper ?? Infinity;
  // Bracket: xNeg has f < 0, xPos has f > 0 (unknown until seen).
  let xNeg = NaN;
  let xPos = NaN;
  let x = Math.min(upper, Math.max(lower, x0));
  let evaluations = 0;
  let prevAbsF = Infinity;
  let lastStep = 0;
  let best = { x, f: NaN };
  for (let iter = 0; iter < maxIterations; iter++) {
    const { f, df } = fdf(x);
    evaluations++;
    if (!Number.isFinite(f)) {
      return {
        root: best.x,
        value: best.f,
        converged: false,
        reason: 'not-finite',
        iterations: iter,
        evaluations,
        bracket: newtonBracket(xNeg, xPos, x),
      };
    }
    if (!(Math.abs(f) >= Math.abs(best.f))) best = { x, f };
    if (Math.abs(f) <= ftol || f === 0) {
      return {
        root: x,
        value: f,
        converged: true,
        reason: 'converged',
        iterations: iter,
        evaluations,
        bracket: newtonBracket(xNeg, xPos, x),
      };
    }
    if (f < 0) xNeg = x;
    else xPos = x;
    const bracketed = !Number.isNaN(xNeg) && !Number.isNaN(xPos);
    if (bracketed) {
      lower = Math.max(lower, Math.min(xNeg, xPos));
      upper = Math.min(upper, Math.max(xNeg, xPos));
    }
    let next = x - f / df;
    if (!bracketed && Math.abs(next - x) > maxStep) next = x + Math.sign(next - x) * maxStep;
    const outside = !Number.isFinite(next) || next <= lower || next >= upper;
    const slow = bracketed && Math.abs(f) > 0.5 * prevAbsF;
    if (outside || slow) {
      if (bracketed) next = 0.5 * (xNeg + xPos);
      else if (!Number.isFinite(next)) next = x + (Number.isFinite(maxStep) ? maxStep : 1);
      else next = Math.min(Math.max(next, 0.5 * (x + lower)), 0.5 * (x + upper));
    }
    if (!bracketed && Math.abs(f) >= 0.9 * prevAbsF && iter > 0) {
      // Newton is not closing in (a cycle, or a step away from the root) and no sign change has
      // been seen: search for a bracket around x on the scale of the last step, then Brent.
      const scale = Math.max(Math.abs(lastStep), xtol + rtol * Math.abs(x), 1e-8);
      const r = findRoot((v) => fdf(v).f, Math.max(lower, x - scale), Math.min(upper, x + scale), {
        xtol,
        rtol,
        ftol,
        maxIterations,
        lower: opts.lower,
        upper: opts.upper,
      });
      return { ...r, iterations: r.iterations + iter, evaluations: r.evaluations + evaluations };
    }
    prevAbsF = Math.abs(f);
    lastStep = next - x;
    const tolX = xtol + rtol * Math.abs(x);
    const [blo, bhi] = newtonBracket(xNeg, xPos, x);
    if (Math.abs(next - x) <= tolX || (bracketed && bhi - blo <= tolX)) {
      const { f: fn } = fdf(next);
      evaluations++;
      return {
        root: next,
        value: fn,
        converged: true,
        reason: 'converged',
        iterations: iter + 1,
        evaluations,
        bracket: newtonBracket(xNeg, xPos, x),
      };
    }
    x = next;
  }
  return {
    root: best.x,
    value: best.f,
    converged: false,
    reason: 'max-iterations',
    iterations: maxIterations,
    evaluations,
    bracket: newtonBracket(xNeg, xPos, x),
  };
}

/** Result of a small nonlinear system solve. */
export interface SystemResult {
  /** Solution [units of the unknowns]. */
  x: number[];
  /** Residuals at x [units of the equations]. */
  residual: number[];
  converged: boolean;
  iterations: number;
}

/**
 * Newton's method for a small system F(x) = 0 (a handful of unknowns), with a
 * forward-difference Jacobian and a backtracking line search on ‖F‖².
 *
 * Source: J. E. Dennis, R. B. Schnabel, Numerical Methods for Unconstrained
 * Optimization and Nonlinear Equations, SIAM 1996, §6.3 (backtracking line
 * search) and §5.4 (finite-difference Jacobian); Numerical Recipes 3rd ed.
 * §9.7 (newt).
 *
 * @param F              residual function of the unknowns [units of the equations]
 * @param x0             starting point [units of the unknowns]
 * @param opts.ftol      converged when max |F_i| ≤ ftol [units of the equations] (default 1e-10)
 * @param opts.maxIterations iteration limit [–] (default 100)
 * @param opts.maxStep   largest change of any unknown in one step [units of the unknowns] (default ∞)
 * @returns the solution, its residuals and a convergence flag
 *
 * Validity: smooth F with a non-singular Jacobian near the root; converges
 * from a starting point in the basin of the root (the line search widens
 * the basin, it does not make convergence global).
 */
export function solveSystem(
  F: (x: readonly number[]) => number[],
  x0: readonly number[],
  opts: { ftol?: number; maxIterations?: number; maxStep?: number } = {},
): SystemResult {
  const ftol = opts.ftol ?? 1e-10;
  const maxIterations = opts.maxIterations ?? 100;
  const maxStep = opts.maxStep ?? Infinity;
  const n = x0.length;
  let x = [...x0];
  let f = F(x);
  const norm2 = (v: number[]) => v.reduce((a, b) => a + b * b, 0);
  for (let iter = 0; iter < maxIterations; iter++) {
    if (f.every((v) => Math.abs(v) <= ftol))
      return { x, residual: f, converged: true, iterations: iter };
    if (f.some((v) => !Number.isFinite(v))) break;
    // Forward-difference Jacobian J[i][j] = ∂F_i/∂x_j.
    const J: number[][] = Array.from({ length: n }, () => new Array<number>(n).fill(0));
    for (let j = 0; j < n; j++) {
      const h = 1e-7 * Math.max(1, Math.abs(x[j]));
      const xp = [...x];
      xp[j] += h;
      const fp = F(xp);
      for (let i = 0; i < n; i++) J[i][j] = (fp[i] - f[i]) / h;
    }
    const dx = gaussSolve(
      J,
      f.map((v) => -v),
    );
    if (!dx) break;
    const biggest = Math.max(...dx.map(Math.abs));
    const scale = biggest > maxStep ? maxStep / biggest : 1;
    let lambda = scale;
    const f0 = norm2(f);
    let accepted = false;
    for (let k = 0; k < 30; k++) {
      const xt = x.map((v, i) => v + lambda * dx[i]);
      const ft = F(xt);
      if (ft.every(Number.isFinite) && norm2(ft) <= (1 - 1e-4 * lambda) * f0) {
        x = xt;
        f = ft;
        accepted = true;
        break;
      }
      lambda *= 0.5;
    }
    if (!accepted) break;
  }
  return {
    x,
    residual: f,
    converged: f.every((v) => Math.abs(v) <= ftol),
    iterations: maxIterations,
  };
}

/**
 * Solves the square linear system A x = b by Gaussian elimination with
 * partial pivoting (A and b are not modified).
 *
 * Source: G. H. Golub, C. F. Van Loan, Matrix Computations, 4th ed., Johns
 * Hopkins 2013, §3.4 (partial pivoting).
 *
 * @param A  square matrix [units of the equations per unit of the unknowns]
 * @param b  right-hand side [units of the equations]
 * @returns x [units of the unknowns], or null when a pivot vanishes (singular A)
 *
 * Validity: small dense systems (a handful of unknowns); no scaling or refinement.
 */
export function gaussSolve(
  A: readonly (readonly number[])[],
  b: readonly number[],
): number[] | null {
  const n = b.length;
  const M = A.map((row, i) => [...row, b[i]]);
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(M[r][c]) > Math.abs(M[p][c])) p = r;
    if (!(Math.abs(M[p][c]) > 1e-300)) return null;
    [M[c], M[p]] = [M[p], M[c]];
    for (let r = c + 1; r < n; r++) {
      const k = M[r][c] / M[c][c];
      for (let j = c; j <= n; j++) M[r][j] -= k * M[c][j];
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let r = n - 1; r >= 0; r--) {
    let s = M[r][n];
    for (let j = r + 1; j < n; j++) s -= M[r][j] * x[j];
    x[r] = s / M[r][r];
  }
  return x;
}
