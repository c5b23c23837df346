/**
 * Seeded differential evolution with feasibility rules, as an ask/tell
 * state machine so a background job can run it a few evaluations at a time
 * and store its state between chunks.
 *
 * Method: differential evolution (Storn & Price, "Differential Evolution – A
 * Simple and Efficient Heuristic for global Optimization over Continuous
 * Spaces", J. Global Optim. 11 (1997) 341–359): for each member x_i a mutant
 * is crossed over with x_i binomially at rate CR (one coordinate always taken
 * from the mutant), and the trial replaces x_i when it is not worse. Mutants:
 * DE/rand/1, v = x_r1 + F·(x_r2 − x_r3), the paper's scheme; or
 * DE/current-to-best/1, v = x_i + F·(x_best − x_i) + F·(x_r1 − x_r2) (Price,
 * Storn & Lampinen, Differential Evolution: A Practical Approach to Global
 * Optimization, Springer 2005), which converges in far fewer evaluations on
 * the smooth, nearly unimodal responses of a route and is the default. Constraints by Deb's feasibility rules (Deb, "An efficient
 * constraint handling method for genetic algorithms", Comput. Methods Appl.
 * Mech. Eng. 186 (2000) 311–338): a feasible point beats an infeasible one,
 * two feasible points compare by objective, two infeasible ones by their
 * total constraint violation — no penalty weight to tune.
 *
 * Bounds: a mutant coordinate outside [min, max] is set to the midpoint of
 * the base coordinate and the bound it crossed (keeps the population inside
 * and lets it reach optima that lie on a bound). Integer coordinates are
 * rounded to the nearest integer before evaluation and stored rounded
 * (Lampinen & Zelinka, "Mixed integer-discrete-continuous optimization by
 * differential evolution", MENDEL 1999), so the optimiser only ever asks for
 * whole stages or cycles.
 *
 * Where the references were read: Storn & Price 1997 (J. Global Optim. 11,
 * 341–359), Price, Storn & Lampinen 2005 (Springer, Berlin) and Lampinen &
 * Zelinka's 1999 chapter "Mechanical engineering design optimization by
 * differential evolution" (in Corne, Dorigo & Glover (eds.), New Ideas in
 * Optimization, McGraw-Hill, pp. 127–146) in the reference list of the R
 * package ROI.plugin.deoptim (CRAN reference manual); Deb 2000 (Comput. Methods
 * Appl. Mech. Eng. 186, 311–338) in the documentation of the metalforge crate
 * (docs.rs, module constraint), which states the same three feasibility
 * rules. The MENDEL 1999 citation for rounding integer coordinates is recalled:
 * it was not found in the reference lists read. The papers' own text was not
 * read; the project's tests check the implementation against published test
 * functions rather than against the papers' tables.
 *
 * Reproducible: the generator state travels in the state, and the trials of
 * a generation are drawn together at its start, so the answer does not
 * depend on how the run is cut into chunks.
 *
 * No maintained npm package offers a seeded, resumable, constrained DE for
 * TypeScript; this one is tested against published test functions (sphere,
 * Rosenbrock, and Deb's constrained problem) in
 * tests/unit/optimise/differential-evolution.test.ts.
 */
import { createRandom } from '../random';

export interface Bound {
  min: number;
  max: number;
  integer?: boolean;
}

/** What one evaluation gave: the objective (to minimise) and the total violation (0 = feasible). */
export interface Score {
  objective: number;
  violation: number;
}

export type DeStrategy = 'rand/1' | 'current-to-best/1';

export interface DeOptions {
  bounds: Bound[];
  seed: number;
  /** Evaluations allowed in all (the initial population included). */
  budget: number;
  /** Population size; default max(8, min(30, 6·dimensions)). */
  populationSize?: number;
  /** Differential weight F; default 0.6. */
  weight?: number;
  /** Crossover rate CR; default 0.9. */
  crossover?: number;
  /** Mutation scheme; default 'current-to-best/1'. */
  strategy?: DeStrategy;
  /** Points to put in the initial population first (e.g. the current route). */
  initial?: number[][];
}

export interface DeState {
  bounds: Bound[];
  budget: number;
  weight: number;
  crossover: number;
  strategy: DeStrategy;
  populationSize: number;
  rngState: [number, number, number, number];
  population: number[][];
  scores: Array<Score | null>;
  /** Points waiting to be evaluated, with the member they compete against (-1: initial population). */
  pending: Array<{ x: number[]; against: number }>;
  /** Results of the pending points evaluated so far in this generation. */
  told: Score[];
  generation: number;
  evaluations: number;
}

function clampRound(v: number, b: Bound): number {
  const x = Math.min(b.max, Math.max(b.min, v));
  return b.integer ? Math.min(b.max, Math.max(b.min, Math.round(x))) : x;
}

/**
 * Whether score a is better than or as good as score b by Deb's feasibility
 * rules: both feasible (violation 0) → a.objective ≤ b.objective; only a
 * feasible → true; only b feasible → false; both infeasible →
 * a.violation ≤ b.violation.
 *
 * Source: Deb, Comput. Methods Appl. Mech. Eng. 186 (2000) 311–338 (the
 * tournament rules, used here as the selection of differential evolution).
 * Validity: any finite scores; objective and violation in the caller's units
 * (the route optimiser: the objective's unit, violation dimensionless ≥ 0).
 * @param a  the challenger (objective [objective's unit], violation [–], 0 = feasible)
 * @param b  the incumbent (objective [objective's unit], violation [–], 0 = feasible)
 * @returns true when a is not worse than b
 */
export function notWorse(a: Score, b: Score): boolean {
  if (a.violation === 0 && b.violation === 0) return a.objective <= b.objective;
  if (a.violation === 0) return true;
  if (b.violation === 0) return false;
  return a.violation <= b.violation;
}

/**
 * Starts a differential-evolution run: the initial population is the given
 * points (clamped to the bounds, integers rounded) and the rest by Latin
 * hypercube sampling, each parameter's range [min, max] cut into N equal
 * strata with one point uniformly in each, strata shuffled per parameter.
 * Population size N = max(8, min(30, 6·d)) for d free parameters unless given.
 *
 * Source: Storn & Price, J. Global Optim. 11 (1997) 341 (the method and the
 * defaults F = 0.6, CR = 0.9 within their recommended ranges); Latin
 * hypercube: McKay, Beckman & Conover, Technometrics 21 (1979) 239.
 * Validity: finite bounds with min ≤ max (RangeError otherwise), at least one
 * parameter; any seed (the same seed gives the same run).
 * @param options.bounds      range of each parameter [parameter's own unit], integer flag
 * @param options.seed        seed of the generator [–]
 * @param options.budget      evaluations allowed in all, the initial population included [–]
 * @param options.populationSize  population size N [–]
 * @param options.weight      differential weight F [–] (default 0.6)
 * @param options.crossover   crossover rate CR [–] (default 0.9)
 * @param options.strategy    mutation scheme ('current-to-best/1' by default)
 * @param options.initial     points to evaluate first [parameters' own units]
 * @returns the state, with the initial population pending evaluation
 */
export function startDe(options: DeOptions): DeState {
  const n = options.bounds.length;
  if (n === 0) throw new RangeError('at least one free parameter is needed');
  for (const b of options.bounds)
    if (!(Number.isFinite(b.min) && Number.isFinite(b.max) && b.min <= b.max))
      throw new RangeError('every bound needs finite min ≤ max');
  const populationSize = options.populationSize ?? Math.max(8, Math.min(30, 6 * n));
  const rng = createRandom(options.seed);
  const pending: DeState['pending'] = [];
  for (const x of options.initial ?? []) {
    if (pending.length >= populationSize) break;
    pending.push({ x: x.map((v, i) => clampRound(v, options.bounds[i])), against: -1 });
  }
  // The rest by Latin hypercube sampling (McKay, Beckman & Conover, Technometrics 21 (1979) 239): each
  // parameter's range cut into equal strata, one point in each, strata shuffled per parameter.
  const rest = populationSize - pending.length;
  const columns = options.bounds.map((b) => {
    const strata = Array.from({ length: rest }, (_, k) => (k + rng.next()) / rest);
    for (let k = rest - 1; k > 0; k--) {
      const j = Math.floor(rng.next() * (k + 1));
      [strata[k], strata[j]] = [strata[j], strata[k]];
    }
    return strata.map((u) => clampRound(b.min + u * (b.max - b.min), b));
  });
  for (let k = 0; k < rest; k++) pending.push({ x: columns.map((c) => c[k]), against: -1 });
  return {
    bounds: options.bounds,
    budget: Math.max(1, Math.floor(options.budget)),
    weight: options.weight ?? 0.6,
    crossover: options.crossover ?? 0.9,
    strategy: options.strategy ?? 'current-to-best/1',
    populationSize,
    rngState: rng.state(),
    population: [],
    scores: [],
    pending,
    told: [],
    generation: 0,
    evaluations: 0,
  };
}

/**
 * True when the evaluation budget is spent (evaluations ≥ budget).
 * Source: this project's own bookkeeping (no external source).
 * Validity: any state startDe or deTell returned.
 * @param state  the run's state
 * @returns whether the run is finished
 */
export function deFinished(state: DeState): boolean {
  return state.evaluations >= state.budget;
}

/**
 * The next point to evaluate (the ask half of ask/tell), or null when the
 * budget is spent.
 * Source: this project's own bookkeeping (no external source); the points are
 * drawn by startDe and the generation step (Storn & Price 1997).
 * Validity: any state startDe or deTell returned.
 * @param state  the run's state
 * @returns the parameter vector [parameters' own units] or null
 */
export function deAsk(state: DeState): number[] | null {
  if (deFinished(state)) return null;
  return state.pending[state.told.length].x;
}

/**
 * Records the score of the point deAsk gave (the tell half); when the
 * generation is complete, selection (a trial replaces its member when
 * notWorse) and the next generation's trials: DE/current-to-best/1
 * v = x_i + F(x_best − x_i) + F(x_r1 − x_r2) or DE/rand/1
 * v = x_r1 + F(x_r2 − x_r3), binomial crossover at rate CR with one
 * coordinate always from the mutant, a coordinate past a bound set to the
 * midpoint of the base and that bound, integers rounded. The input state is
 * not modified.
 *
 * Source: Storn & Price, J. Global Optim. 11 (1997) 341; current-to-best:
 * Price, Storn & Lampinen, Differential Evolution, Springer 2005; integers:
 * Lampinen & Zelinka, MENDEL 1999; selection: Deb 2000.
 * Validity: a score for the point deAsk last gave; finite objective and
 * violation ≥ 0.
 * @param state  the run's state
 * @param score  objective [objective's unit] and total violation [–] of the point
 * @returns the new state
 */
export function deTell(state: DeState, score: Score): DeState {
  const s: DeState = { ...state, told: [...state.told, score], evaluations: state.evaluations + 1 };
  if (s.told.length < s.pending.length && !deFinished(s)) return s;
  // The generation is complete (or the budget spent): selection, then the next generation's trials.
  const population = [...s.population];
  const scores = [...s.scores];
  s.pending.forEach((p, k) => {
    const told = s.told[k];
    if (!told) return;
    if (p.against < 0) {
      population.push(p.x);
      scores.push(told);
    } else if (notWorse(told, scores[p.against]!)) {
      population[p.against] = p.x;
      scores[p.against] = told;
    }
  });
  const next: DeState = { ...s, population, scores, pending: [], told: [] };
  if (deFinished(next)) return next;
  next.generation = s.generation + 1;
  next.pending = trials(next);
  return next;
}

function trials(state: DeState): DeState['pending'] {
  const rng = createRandom(state.rngState);
  const { population, bounds } = state;
  const np = population.length;
  const n = bounds.length;
  const pick = (exclude: number[]) => {
    for (;;) {
      const r = Math.floor(rng.next() * np);
      if (!exclude.includes(r)) return r;
    }
  };
  const best = population[deBest(state)];
  const F = state.weight;
  const out: DeState['pending'] = [];
  for (let i = 0; i < np; i++) {
    const r1 = pick([i]);
    const r2 = pick([i, r1]);
    const r3 = pick([i, r1, r2]);
    const jRand = Math.floor(rng.next() * n);
    const x = population[i].map((xi, j) => {
      if (j !== jRand && rng.next() >= state.crossover) return xi;
      const b = bounds[j];
      const toBest = state.strategy === 'current-to-best/1';
      const base = toBest ? xi : population[r1][j];
      let v = toBest
        ? xi + F * (best[j] - xi) + F * (population[r1][j] - population[r2][j])
        : base + F * (population[r2][j] - population[r3][j]);
      if (v < b.min) v = (base + b.min) / 2;
      if (v > b.max) v = (base + b.max) / 2;
      return clampRound(v, b);
    });
    out.push({ x, against: i });
  }
  state.rngState = rng.state();
  return out;
}

/**
 * Index of the best member of the population by Deb's rules (strictly better
 * replaces; the first of equals is kept), or -1 before any is scored.
 * Source: Deb, Comput. Methods Appl. Mech. Eng. 186 (2000) 311–338.
 * Validity: any state startDe or deTell returned.
 * @param state  the run's state
 * @returns the index [–] or -1
 */
export function deBest(state: DeState): number {
  let best = -1;
  state.scores.forEach((s, i) => {
    if (s && (best < 0 || lessThan(s, state.scores[best]!))) best = i;
  });
  return best;
}

function lessThan(a: Score, b: Score): boolean {
  return notWorse(a, b) && !notWorse(b, a);
}

/**
 * Minimises f over the bounds in one call (startDe, then deAsk/deTell until
 * the budget is spent), for tests and small problems.
 * Source: Storn & Price, J. Global Optim. 11 (1997) 341, with Deb's (2000)
 * constraint rules; checked on the sphere, Rosenbrock and Deb's constrained
 * problem in tests/unit/optimise/differential-evolution.test.ts.
 * Validity: as startDe; a stochastic search: the answer is the best point
 * seen within the budget, not a proven optimum.
 * @param f        the objective: objective [its own unit] and total constraint violation [–] of a point
 * @param options  as startDe (bounds [parameters' own units], seed [–], budget [–], F [–], CR [–])
 * @returns the best point [parameters' own units], its score and the evaluations used [–]
 */
export function minimise(
  f: (x: number[]) => Score,
  options: DeOptions,
): { x: number[]; score: Score; evaluations: number } {
  let state = startDe(options);
  for (let x = deAsk(state); x; x = deAsk(state)) state = deTell(state, f(x));
  const i = deBest(state);
  return { x: state.population[i], score: state.scores[i]!, evaluations: state.evaluations };
}
