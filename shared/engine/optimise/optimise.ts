/**
 * The route optimiser: minimise PMI, solvent use or cycle time over the
 * parameters the chemist freed, subject to the product specification
 * (solvent-free purity, each named impurity), the isolated yield, the ICH
 * Q3C limits of the residual solvents and the vessel's working volume.
 *
 * Search: seeded differential evolution with Deb's feasibility rules
 * (./differential-evolution.ts). Each candidate is a copy of the document
 * with the free parameters set, evaluated nominally (no ± draws) by the
 * route engine. The current route (its values brought inside the bounds)
 * is in the first population, so the answer is never worse than it when it
 * is feasible. A candidate the engine cannot evaluate counts as infeasible.
 *
 * Then the Monte Carlo spread (p5/p50/p95) of the constrained figures at
 * the chosen point, over the ± ranges the document gives, seeded.
 *
 * Runs as a state machine (startOptimise → runOptimiseChunk … →
 * summariseOptimise) so a background job can stop between chunks; the
 * answer does not depend on the chunk size.
 *
 * Results are model results: confirm them at the bench and through the
 * site's process-safety review before use.
 */
import { createStepMemo, type StepMemo } from '../route/step-memo';
import type { RouteDocument } from '../document';
import { createRandom } from '../random';
import { buildContext, createEvaluationCaches, type EvaluationCaches } from '../route/context';
import {
  evaluatePrepared,
  parseRoute,
  prepareRoute,
  type PreparedRoute,
  type RouteResult,
} from '../route/evaluate';
import { percentile, type Percentiles } from '../route/monte-carlo';
import {
  deAsk,
  deFinished,
  deTell,
  notWorse,
  startDe,
  type DeState,
  type Score,
} from './differential-evolution';
import { isIntegerParam, paramLabel, readParam, withParams } from './route-params';

export const OBJECTIVES = ['pmi', 'solventLPerKg', 'cycleTimeH'] as const;
export type Objective = (typeof OBJECTIVES)[number];

export interface FreeParam {
  stepId: string;
  param: string;
  min: number;
  max: number;
  integer?: boolean;
}

export interface OptimiseConstraints {
  minSolventFreePurityPct?: number;
  maxImpurityPct?: Record<string, number>;
  minYieldPct?: number;
  ichResidualSolvents?: true;
  maxVolumeL?: number;
}

export interface OptimiseRequest {
  document: RouteDocument;
  free: FreeParam[];
  objective: Objective;
  constraints: OptimiseConstraints;
  seed: number;
  budget?: { evaluations: number };
}

/** The figures of one evaluated candidate. */
export interface CandidateTotals {
  pmi: number | null;
  solventLPerKg: number | null;
  cycleTimeH: number;
  yieldPct: number | null;
  purityWtPct: number | null;
  solventFreePurityPct: number | null;
  /** Each impurity's level in the isolated solid, solvent-free basis [%]. */
  impurityPct: Record<string, number>;
  /** Largest liquid volume in any step [L]. */
  peakVolumeL: number;
  /** Each residual solvent in the isolated solid [ppm]. */
  residualSolventPpm: Record<string, number>;
}

export interface Candidate {
  /** `{ "<stepId>.<param>": value }`. */
  params: Record<string, number>;
  totals: CandidateTotals;
  feasible: boolean;
}

interface Evaluated {
  x: number[];
  totals: CandidateTotals | null;
  score: Score;
  /** Constraints not met, in the chemist's words. */
  unmet: string[];
}

/** One problem with the request: the field ("free.0.param") and what is wrong. */
export interface OptimiseIssue {
  path: string;
  message: string;
}

export const MAX_EVALUATIONS = 2000;
/** Draws of the Monte Carlo spread at the chosen point. */
export const UNCERTAINTY_DRAWS = 24;
/** A failed evaluation's violation: worse than any evaluated candidate's. */
const FAILED_VIOLATION = 1e9;
/** Nothing isolated: worse than any candidate that isolates the product. */
const NOTHING_ISOLATED_VIOLATION = 1e6;

/**
 * Evaluations a run gets when the request names no budget: 100 + 100 per free
 * parameter, at most MAX_EVALUATIONS (2000). The optimiser benchmark
 * (docs/performance.md, optimise) found 50 + 50 per parameter stopping 1.2 %
 * above the demo route's optimum PMI with 6 free parameters; it gets within
 * 1 % after about 400 evaluations.
 * Source: this project's own choice (common practice for differential
 * evolution is 10–100 evaluations per dimension — recalled from memory, no
 * source checked in this project).
 * Validity: 1 or more free parameters.
 * @param freeCount  number of free parameters [–]
 * @returns the evaluation budget [–]
 */
export function defaultEvaluations(freeCount: number): number {
  return Math.min(MAX_EVALUATIONS, 100 + 100 * freeCount);
}

/**
 * Checks the request against the document: every free parameter addresses a
 * number of an existing step, its bounds lie inside the field's range, the
 * named impurities exist, and the route has a product. Returns every problem.
 * Source: this project's own bookkeeping (no external source).
 * Validity: any request the optimisation schema accepts.
 * @param request  the route document, free parameters (bounds in the document's unit of each field), objective, constraints, seed
 * @returns every problem, each with its field and the chemist's words (empty when the request is sound)
 */
export function checkOptimiseRequest(request: OptimiseRequest): OptimiseIssue[] {
  const issues: OptimiseIssue[] = [];
  const doc = request.document;
  const seen = new Set<string>();
  request.free.forEach((f, i) => {
    const step = doc.steps.find((s) => s.id === f.stepId);
    if (!step) {
      issues.push({ path: `free.${i}.stepId`, message: `The route has no step “${f.stepId}”.` });
      return;
    }
    const label = paramLabel(step, f.param);
    const key = `${f.stepId}.${f.param}`;
    if (seen.has(key))
      issues.push({ path: `free.${i}.param`, message: `${cap(label)} is freed twice.` });
    seen.add(key);
    if (readParam(doc, f.stepId, f.param) === null) {
      issues.push({
        path: `free.${i}.param`,
        message: `Step “${step.name || step.id}” has no number at “${f.param}” to vary; give the path of a volume, temperature, pH, number of stages or cycles inside the step's parameters.`,
      });
      return;
    }
    if (!(f.min <= f.max)) {
      issues.push({
        path: `free.${i}.max`,
        message: `The upper bound of ${label} is below its lower bound.`,
      });
      return;
    }
    if ((f.integer || isIntegerParam(f.param)) && Math.ceil(f.min) > Math.floor(f.max))
      issues.push({
        path: `free.${i}.max`,
        message: `No whole number lies between the bounds of ${label}.`,
      });
    for (const bound of ['min', 'max'] as const) {
      try {
        parseRoute(withParams(doc, [{ stepId: f.stepId, param: f.param, value: f[bound] }]));
      } catch {
        issues.push({
          path: `free.${i}.${bound}`,
          message: `The ${bound === 'min' ? 'lower' : 'upper'} bound ${f[bound]} is outside what ${label} accepts.`,
        });
      }
    }
  });
  const ids = new Set(
    doc.components.map((c) => (c.kind === 'aqueous-solute' ? (c.id ?? c.soluteId) : c.id)),
  );
  for (const id of Object.keys(request.constraints.maxImpurityPct ?? {}))
    if (!ids.has(id))
      issues.push({
        path: `constraints.maxImpurityPct.${id}`,
        message: `The route has no component “${id}” to limit.`,
      });
  if (!doc.components.some((c) => c.kind === 'compound' && c.role === 'product'))
    issues.push({
      path: 'document',
      message:
        'No component of the route is the product: there is no yield, purity or PMI to optimise.',
    });
  return issues;
}

function cap(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}

interface Setup {
  /** The request, its document parsed (defaults filled in). */
  request: OptimiseRequest;
  bounds: Array<{ min: number; max: number; integer: boolean }>;
  caches: EvaluationCaches;
  /** Step results of earlier candidates: steps before the first free parameter are evaluated once (same numbers). */
  memo: StepMemo;
  ichLimitPpm: Map<string, { name: string; limitPpm: number }>;
  names: Map<string, string>;
}

/**
 * Builds what every evaluation of this request shares: the parsed document,
 * the engine's caches, the ICH Q3C limit of each residual solvent and the
 * components' names.
 * Source: this project's own bookkeeping (no external source); ICH Q3C
 * limits from the solvent library (docs/data-sources.md).
 * Validity: a request checkOptimiseRequest accepts.
 * @param input  the optimisation request
 * @returns the shared setup
 */
export function setUpOptimise(input: OptimiseRequest): Setup {
  const request = { ...input, document: parseRoute(input.document) };
  const { ctx } = buildContext(request.document);
  const ichLimitPpm = new Map<string, { name: string; limitPpm: number }>();
  const names = new Map<string, string>();
  for (const [id, c] of ctx.comps) {
    names.set(id, c.name);
    const limit = c.solvent?.ich.value.limitPpm ?? null;
    if (c.solvent && !c.isWater && limit !== null)
      ichLimitPpm.set(id, { name: c.name, limitPpm: limit });
  }
  return {
    request,
    bounds: request.free.map((f) => ({
      min: f.min,
      max: f.max,
      integer: Boolean(f.integer) || isIntegerParam(f.param),
    })),
    caches: createEvaluationCaches(),
    memo: createStepMemo(Math.max(64, 8 * request.document.steps.length)),
    ichLimitPpm,
    names,
  };
}

function documentAt(setup: Setup, x: number[]): RouteDocument {
  return withParams(
    setup.request.document,
    setup.request.free.map((f, i) => ({ stepId: f.stepId, param: f.param, value: x[i] })),
  );
}

function prepared(setup: Setup, doc: RouteDocument): PreparedRoute {
  return { ...prepareRoute(doc), caches: setup.caches };
}

function totalsOf(setup: Setup, result: RouteResult): CandidateTotals {
  const t = result.totals;
  const residualSolventPpm: Record<string, number> = {};
  for (const term of result.terminals) {
    if (!term.isolated) continue;
    let total = 0;
    for (const kg of Object.values(term.stream.kg)) total += kg;
    if (!(total > 0)) continue;
    for (const id of setup.ichLimitPpm.keys()) {
      const kg = term.stream.kg[id] ?? 0;
      if (kg > 0)
        residualSolventPpm[id] = Math.max(residualSolventPpm[id] ?? 0, (kg / total) * 1e6);
    }
  }
  return {
    pmi: t.pmi,
    solventLPerKg: t.solventUseLPerKg,
    cycleTimeH: t.cycleTimeH,
    yieldPct: t.yieldPct,
    purityWtPct: t.purityWtPct,
    solventFreePurityPct: t.solventFreePurityPct,
    impurityPct: Object.fromEntries(t.impurities.map((i) => [i.componentId, i.levelPct])),
    peakVolumeL: Math.max(0, ...Object.values(t.peakVolumeL)),
    residualSolventPpm,
  };
}

const fmt = (v: number, digits = 2) =>
  Number(v.toPrecision(4))
    .toFixed(digits)
    .replace(/\.?0+$/, '');

/**
 * The objective and the total constraint violation of one candidate:
 * violation = Σ shortfall/bound over the constraints, each shortfall
 * relative to its bound so constraints of different units add
 * (purity: (p_min − p)/(100 − p_min); impurity: (L − L_max)/L_max; yield:
 * (y_min − y)/y_min; residual solvent: (ppm − limit)/limit; volume:
 * (V − V_max)/V_max); 0 = feasible. A candidate that isolates nothing scores
 * worse than any that does.
 * Source: relative constraint violation summed for Deb's feasibility rules
 * (Deb, Comput. Methods Appl. Mech. Eng. 186 (2000) 311–338).
 * Validity: totals of a route the engine evaluated.
 * @param setup   the request, the ICH limits [ppm] and the components' names
 * @param totals  the candidate's figures (PMI [kg/kg], solvent [L/kg], cycle time [h], yield [%], purity [%], impurities [%], residual solvents [ppm], peak volume [L])
 * @returns the score (objective [its unit], violation [–]) and the unmet constraints in the chemist's words
 */
export function scoreTotals(
  setup: Pick<Setup, 'request' | 'ichLimitPpm' | 'names'>,
  totals: CandidateTotals,
): { score: Score; unmet: string[] } {
  const c = setup.request.constraints;
  const value = totals[setup.request.objective];
  if (value === null || !(totals.yieldPct! > 0))
    return {
      score: { objective: Number.MAX_VALUE, violation: NOTHING_ISOLATED_VIOLATION },
      unmet: ['Nothing is isolated with these values, so there is no yield, purity or PMI.'],
    };
  let violation = 0;
  const unmet: string[] = [];
  if (c.minSolventFreePurityPct !== undefined) {
    const p = totals.solventFreePurityPct;
    if (p !== null && p < c.minSolventFreePurityPct) {
      violation +=
        (c.minSolventFreePurityPct - p) / Math.max(1e-6, 100 - c.minSolventFreePurityPct);
      unmet.push(
        `Solvent-free purity ${fmt(p, 3)} % is below the ${c.minSolventFreePurityPct} % asked for.`,
      );
    }
  }
  for (const [id, max] of Object.entries(c.maxImpurityPct ?? {})) {
    const level = totals.impurityPct[id] ?? 0;
    if (level > max) {
      violation += (level - max) / Math.max(max, 1e-3);
      unmet.push(`${setup.names.get(id) ?? id} at ${fmt(level, 3)} % is above its ${max} % limit.`);
    }
  }
  if (c.minYieldPct !== undefined) {
    const y = totals.yieldPct ?? 0;
    if (y < c.minYieldPct) {
      violation += (c.minYieldPct - y) / Math.max(c.minYieldPct, 1);
      unmet.push(`Yield ${fmt(y, 1)} % is below the ${c.minYieldPct} % asked for.`);
    }
  }
  if (c.ichResidualSolvents) {
    for (const [id, ppm] of Object.entries(totals.residualSolventPpm)) {
      const limit = setup.ichLimitPpm.get(id);
      if (limit && ppm > limit.limitPpm) {
        violation += (ppm - limit.limitPpm) / limit.limitPpm;
        unmet.push(
          `Residual ${limit.name} ${fmt(ppm, 0)} ppm is above its ICH Q3C limit of ${limit.limitPpm} ppm.`,
        );
      }
    }
  }
  if (c.maxVolumeL !== undefined && totals.peakVolumeL > c.maxVolumeL) {
    violation += (totals.peakVolumeL - c.maxVolumeL) / Math.max(c.maxVolumeL, 1e-6);
    unmet.push(
      `The largest volume, ${fmt(totals.peakVolumeL, 1)} L, is above the vessel's ${c.maxVolumeL} L working volume.`,
    );
  }
  return { score: { objective: value, violation }, unmet };
}

function evaluateAt(setup: Setup, x: number[], doc = documentAt(setup, x)): Evaluated {
  try {
    const totals = totalsOf(setup, evaluatePrepared(prepared(setup, doc), null, setup.memo));
    return { x, totals, ...scoreTotals(setup, totals) };
  } catch (error) {
    const reason = error instanceof Error ? error.message : 'the engine could not evaluate it';
    return {
      x,
      totals: null,
      score: { objective: Number.MAX_VALUE, violation: FAILED_VIOLATION },
      unmet: [`The route cannot be evaluated with these values: ${reason}`],
    };
  }
}

export interface UncertaintySamples {
  rngState: [number, number, number, number];
  draws: number;
  done: number;
  failedDraws: number;
  objective: number[];
  yieldPct: number[];
  solventFreePurityPct: number[];
  peakVolumeL: number[];
  impurityPct: Record<string, number[]>;
}

/** Serialisable state of a run. */
export interface OptimiseState {
  phase: 'current' | 'search' | 'uncertainty' | 'done';
  de: DeState;
  current: Evaluated | null;
  evaluated: Evaluated[];
  failedEvaluations: number;
  best: number;
  uncertainty: UncertaintySamples | null;
}

/**
 * Starts a run: the current route's values (clamped into the bounds) first in
 * the initial population, the budget from the request or defaultEvaluations.
 * Source: differential evolution (Storn & Price, J. Global Optim. 11 (1997)
 * 341) via startDe.
 * Validity: a request checkOptimiseRequest accepts.
 * @param request  the optimisation request (bounds in the document's unit of each field)
 * @returns the serialisable state of the run
 */
export function startOptimise(request: OptimiseRequest): OptimiseState {
  const evaluations = Math.min(
    MAX_EVALUATIONS,
    request.budget?.evaluations ?? defaultEvaluations(request.free.length),
  );
  const currentX = request.free.map((f) => readParam(request.document, f.stepId, f.param) ?? f.min);
  return {
    phase: 'current',
    de: startDe({
      bounds: request.free.map((f) => ({
        min: f.min,
        max: f.max,
        integer: Boolean(f.integer) || isIntegerParam(f.param),
      })),
      seed: request.seed,
      budget: evaluations,
      initial: [currentX],
    }),
    current: null,
    evaluated: [],
    failedEvaluations: 0,
    best: -1,
    uncertainty: null,
  };
}

/**
 * The share of the work done, 0.9 × evaluations/budget + 0.1 × draws done of
 * the spread at the chosen point, 1 when done.
 * Source: this project's own bookkeeping (no external source).
 * Validity: any state of a run.
 * @param state  the run's state
 * @returns the fraction done [–], 0..1
 */
export function optimiseProgress(state: OptimiseState): number {
  if (state.phase === 'done') return 1;
  const search = state.de.evaluations / state.de.budget;
  const mc = state.uncertainty ? state.uncertainty.done / state.uncertainty.draws : 0;
  return Math.min(1, 0.9 * search + 0.1 * mc);
}

/**
 * Runs up to `chunk` further evaluations (the current route, the search,
 * then the Monte Carlo draws at the chosen point over the document's ±
 * ranges); returns the new state (the input is not modified).
 * Source: differential evolution with Deb's rules (./differential-evolution.ts);
 * Monte Carlo percentiles as route/monte-carlo.ts.
 * Validity: the setup and state of the same request; the result does not
 * depend on the chunk size.
 * @param setup  the shared setup of the request
 * @param input  the run's state
 * @param chunk  evaluations to run at most [–] (at least 1)
 * @returns the new state
 */
export function runOptimiseChunk(setup: Setup, input: OptimiseState, chunk: number): OptimiseState {
  const state: OptimiseState = { ...input, evaluated: [...input.evaluated] };
  let left = Math.max(1, Math.floor(chunk));
  if (state.phase === 'current') {
    const x = setup.request.free.map(
      (f) => readParam(setup.request.document, f.stepId, f.param) ?? f.min,
    );
    state.current = evaluateAt(setup, x, setup.request.document);
    state.phase = 'search';
    left--;
  }
  while (state.phase === 'search' && left > 0) {
    const x = deAsk(state.de);
    if (!x) break;
    const e = evaluateAt(setup, x);
    state.de = deTell(state.de, e.score);
    if (e.totals === null) state.failedEvaluations++;
    state.evaluated.push(e);
    const i = state.evaluated.length - 1;
    if (state.best < 0 || !notWorse(state.evaluated[state.best].score, e.score)) state.best = i;
    left--;
  }
  if (state.phase === 'search' && deFinished(state.de)) {
    state.phase = 'uncertainty';
    state.uncertainty = {
      rngState: createRandom(setup.request.seed).state(),
      draws: UNCERTAINTY_DRAWS,
      done: 0,
      failedDraws: 0,
      objective: [],
      yieldPct: [],
      solventFreePurityPct: [],
      peakVolumeL: [],
      impurityPct: {},
    };
  }
  if (state.phase === 'uncertainty' && left > 0) {
    const best = state.evaluated[state.best];
    const u = structuredClone(state.uncertainty!);
    const rng = createRandom(u.rngState);
    const route = prepared(setup, documentAt(setup, best.x));
    const limited = Object.keys(setup.request.constraints.maxImpurityPct ?? {});
    for (; u.done < u.draws && left > 0; u.done++, left--) {
      try {
        const totals = totalsOf(setup, evaluatePrepared(route, rng, setup.memo));
        u.objective.push(totals[setup.request.objective] ?? NaN);
        u.yieldPct.push(totals.yieldPct ?? NaN);
        u.solventFreePurityPct.push(totals.solventFreePurityPct ?? NaN);
        u.peakVolumeL.push(totals.peakVolumeL);
        for (const id of limited) (u.impurityPct[id] ??= []).push(totals.impurityPct[id] ?? 0);
      } catch {
        u.failedDraws++;
      }
    }
    u.rngState = rng.state();
    state.uncertainty = u;
    if (u.done >= u.draws) state.phase = 'done';
  }
  return state;
}

export interface OptimiseUncertainty {
  draws: number;
  failedDraws: number;
  objective: Percentiles;
  yieldPct: Percentiles;
  solventFreePurityPct: Percentiles;
  peakVolumeL: Percentiles;
  impurityPct: Record<string, Percentiles>;
}

export interface OptimiseResult {
  objective: Objective;
  /** A candidate meets every constraint. */
  feasible: boolean;
  /** What the answer means, in the chemist's words ("no feasible route ..." when none met the constraints). */
  message: string;
  /** The chosen candidate: the best feasible one, or the closest to feasible when none is. */
  best: Candidate & {
    document: RouteDocument;
    uncertainty: OptimiseUncertainty;
    /** Constraints the chosen candidate does not meet (empty when feasible). */
    unmet: string[];
  };
  /** The route as it was, for the picture. */
  current: (Candidate & { unmet: string[] }) | null;
  /** Every candidate the engine could evaluate, in the order evaluated (repeats left out). */
  candidates: Candidate[];
  evaluations: number;
  failedEvaluations: number;
  seed: number;
}

function spread(values: number[]): Percentiles {
  const v = values.filter((x) => Number.isFinite(x)).sort((a, b) => a - b);
  return { p5: percentile(v, 0.05), p50: percentile(v, 0.5), p95: percentile(v, 0.95) };
}

function paramsOf(request: OptimiseRequest, x: number[]): Record<string, number> {
  return Object.fromEntries(request.free.map((f, i) => [`${f.stepId}.${f.param}`, x[i]]));
}

/**
 * The result of a finished run: the best candidate by Deb's rules with its
 * document, figures, unmet constraints and spread (p5/p50/p95), the current
 * route's figures, every distinct candidate and a message in the chemist's
 * words ("No feasible route …" when none meets every constraint). Throws
 * when no candidate could be evaluated.
 * Source: this project's own bookkeeping (no external source); percentiles
 * as route/monte-carlo.ts.
 * Validity: a state whose phase is done.
 * @param setup  the shared setup of the request
 * @param state  the finished run's state
 * @returns the optimisation result
 */
export function summariseOptimise(setup: Setup, state: OptimiseState): OptimiseResult {
  const { request } = setup;
  const best = state.evaluated[state.best];
  if (!best || !best.totals) {
    throw new RangeError(
      best ? best.unmet[0] : 'No candidate was evaluated; give a larger budget of evaluations.',
    );
  }
  const feasible = best.score.violation === 0;
  const u = state.uncertainty;
  const seen = new Set<string>();
  const candidates: Candidate[] = [];
  for (const e of state.evaluated) {
    if (!e.totals) continue;
    const key = e.x.join(',');
    if (seen.has(key)) continue;
    seen.add(key);
    candidates.push({
      params: paramsOf(request, e.x),
      totals: e.totals,
      feasible: e.score.violation === 0,
    });
  }
  const cur = state.current;
  return {
    objective: request.objective,
    feasible,
    message: feasible
      ? `Best of ${state.de.evaluations} evaluated routes that meet every constraint. A model result: confirm it at the bench and through the site's process-safety review.`
      : `No feasible route: none of the ${state.de.evaluations} evaluated routes meets every constraint within the bounds given. The closest candidate is shown; widen the bounds or relax a constraint.`,
    best: {
      params: paramsOf(request, best.x),
      totals: best.totals,
      feasible,
      document: documentAt(setup, best.x),
      unmet: best.unmet,
      uncertainty: {
        draws: u?.done ?? 0,
        failedDraws: u?.failedDraws ?? 0,
        objective: spread(u?.objective ?? []),
        yieldPct: spread(u?.yieldPct ?? []),
        solventFreePurityPct: spread(u?.solventFreePurityPct ?? []),
        peakVolumeL: spread(u?.peakVolumeL ?? []),
        impurityPct: Object.fromEntries(
          Object.entries(u?.impurityPct ?? {}).map(([id, v]) => [id, spread(v)]),
        ),
      },
    },
    current:
      cur && cur.totals
        ? {
            params: paramsOf(request, cur.x),
            totals: cur.totals,
            feasible: cur.score.violation === 0,
            unmet: cur.unmet,
          }
        : null,
    candidates,
    evaluations: state.de.evaluations,
    failedEvaluations: state.failedEvaluations,
    seed: request.seed,
  };
}

/**
 * Runs a whole optimisation at once (tests, benchmarks): setUpOptimise,
 * startOptimise, runOptimiseChunk in chunks of 25, summariseOptimise.
 * Source: seeded differential evolution with Deb's feasibility rules
 * (Storn & Price 1997; Deb 2000), see the module comment.
 * Validity: a request checkOptimiseRequest accepts; a model result within
 * the budget, not a proven optimum.
 * @param request     the optimisation request (bounds in the document's unit of each field)
 * @param onProgress  called with the fraction done [–] after each chunk
 * @returns the optimisation result
 */
export function optimiseRoute(
  request: OptimiseRequest,
  onProgress?: (fraction: number) => void,
): OptimiseResult {
  const setup = setUpOptimise(request);
  let state = startOptimise(request);
  while (state.phase !== 'done') {
    state = runOptimiseChunk(setup, state, 25);
    onProgress?.(optimiseProgress(state));
  }
  return summariseOptimise(setup, state);
}

export type { Setup as OptimiseSetup };
