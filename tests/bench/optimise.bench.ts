/**
 * Route optimiser on the demo route (`npm run bench -- optimise`).
 *
 * The demo route (invented amide isolation, tests/fixtures/routes) is
 * optimised for the least PMI at ≥ 99.5 % solvent-free purity within the ICH
 * residual-solvent limits, freeing the parameters a chemist frees on the
 * optimiser screen with the bounds the screen proposes (½× to 1½× the route's
 * value; cycles ± 2):
 *   2 free: antisolvent volume, put-and-take cycles of the swap;
 *   4 free: + the HCl and NaHCO3 wash volumes;
 *   6 free: + the brine wash volume and the volume added per swap cycle.
 *
 * For each set, a long run (MAX_EVALUATIONS evaluations, seed 101)
 * establishes the feasible optimum; a second run (seed 1, TIMED_BUDGET
 * evaluations) is timed evaluation by evaluation, and the time until its best
 * feasible PMI is within 1 % of that optimum is recorded, with the
 * evaluations per second. The population does not depend on the budget, so a
 * run with the screen's default budget (100 + 100 per free parameter) is the
 * first part of the timed run: the bench says whether the default budget
 * reaches 1 %, and times a whole run with it (search and the 24-draw spread
 * at the chosen point). The reference is the least feasible PMI any run of
 * the set found, so a timed run that beats the long run still counts against
 * the best known point.
 *
 * One optimisation runs in one engine worker, single-threaded: this bench runs
 * in one thread too. Target (issue 16): within 1 % of the optimum in ≤ 30 s on
 * the 2-core machine.
 */
import demo from '../fixtures/routes/demo-amide-isolation.json';
import type { RouteDocument } from '../../shared/engine/document';
import {
  MAX_EVALUATIONS,
  defaultEvaluations,
  runOptimiseChunk,
  setUpOptimise,
  startOptimise,
  type FreeParam,
  type OptimiseRequest,
  type OptimiseState,
} from '../../shared/engine/optimise';
import type { BenchResult } from './harness';

const TARGET_S = 30;
const WITHIN = 0.01;
/** Evaluations per timed step: small, so the time of reaching the optimum is resolved finely. */
const STEP = 2;
/** Evaluations of the timed run: about 30 s of work at the measured rate. */
const TIMED_BUDGET = 1000;

const FREE_6: FreeParam[] = [
  { stepId: 'antisolvent', param: 'mode.volume', min: 3, max: 9 },
  { stepId: 'swap', param: 'mode.cycles', min: 2, max: 6, integer: true },
  { stepId: 'acid-wash', param: 'addedLiquid.volume', min: 1.5, max: 4.5 },
  { stepId: 'base-wash', param: 'addedLiquid.volume', min: 1.5, max: 4.5 },
  { stepId: 'brine-wash', param: 'addedLiquid.volume', min: 1, max: 3 },
  { stepId: 'swap', param: 'mode.addVolume', min: 5, max: 15 },
];

function request(free: FreeParam[], seed: number, evaluations: number): OptimiseRequest {
  return {
    document: demo as unknown as RouteDocument,
    free,
    objective: 'pmi',
    constraints: { minSolventFreePurityPct: 99.5, ichResidualSolvents: true },
    seed,
    budget: { evaluations },
  };
}

/** Least PMI among the feasible candidates evaluated so far (Infinity if none). */
function bestFeasiblePmi(state: OptimiseState): number {
  let best = Infinity;
  for (const e of state.evaluated)
    if (e.totals && e.unmet.length === 0 && e.totals.pmi !== null && e.totals.pmi < best)
      best = e.totals.pmi;
  return best;
}

interface TimedRun {
  bestPmi: number;
  searchEvaluations: number;
  searchS: number;
  totalS: number;
  /** [seconds since start, evaluations so far, best feasible PMI] after each step of the search. */
  trace: Array<[number, number, number]>;
}

function timedRun(req: OptimiseRequest): TimedRun {
  const t0 = performance.now();
  const setup = setUpOptimise(req);
  let state = startOptimise(req);
  const trace: Array<[number, number, number]> = [];
  let searchEnd = 0;
  let searchEvaluations = 0;
  while (state.phase !== 'done') {
    const before = state.phase;
    state = runOptimiseChunk(setup, state, STEP);
    if (before !== 'uncertainty') {
      const s = (performance.now() - t0) / 1000;
      trace.push([s, state.evaluated.length, bestFeasiblePmi(state)]);
      searchEnd = s;
      searchEvaluations = state.evaluated.length;
    }
  }
  return {
    bestPmi: bestFeasiblePmi(state),
    searchEvaluations,
    searchS: searchEnd,
    totalS: (performance.now() - t0) / 1000,
    trace,
  };
}

const us = (s: number) => s * 1e6;

export async function run(): Promise<BenchResult[]> {
  const results: BenchResult[] = [];
  for (const k of [2, 4, 6]) {
    const free = FREE_6.slice(0, k);
    const long = timedRun(request(free, 101, MAX_EVALUATIONS));
    const budget = defaultEvaluations(k);
    const timed = timedRun(request(free, 1, TIMED_BUDGET));
    const whole = timedRun(request(free, 1, budget));
    const optimum = Math.min(long.bestPmi, timed.bestPmi, whole.bestPmi);
    const reached = timed.trace.find(([, , pmi]) => pmi <= optimum * (1 + WITHIN));
    const perSecond = timed.searchEvaluations / timed.searchS;
    const defaultGapPct = ((whole.bestPmi - optimum) / optimum) * 100;
    console.log(
      `${k} free: optimum PMI ${optimum.toFixed(3)} (long run ${long.bestPmi.toFixed(3)}, ${long.searchEvaluations} evaluations in ${long.searchS.toFixed(1)} s); ` +
        (reached
          ? `within 1 % at ${reached[0].toFixed(1)} s (${reached[1]} evaluations)`
          : `not within 1 % in ${timed.searchEvaluations} evaluations`) +
        `; default budget ${budget}: ${whole.bestPmi.toFixed(3)} (${defaultGapPct.toFixed(2)} % above) in ${whole.totalS.toFixed(1)} s`,
    );
    const name = `${k} free parameters: time to within 1 % of the feasible optimum PMI`;
    const target = k === 6 ? { target: `≤ ${TARGET_S} s` } : {};
    results.push(
      reached
        ? {
            name,
            medianUs: us(reached[0]),
            p95Us: us(reached[0]),
            iterations: reached[1],
            ...target,
            ...(k === 6 ? { meetsTarget: reached[0] <= TARGET_S } : {}),
            note: `after ${reached[1]} evaluations (seed 1); optimum PMI ${optimum.toFixed(2)} from a ${MAX_EVALUATIONS}-evaluation run (seed 101); ${perSecond.toFixed(1)} evaluations/s`,
          }
        : {
            name,
            medianUs: us(timed.searchS),
            p95Us: us(timed.searchS),
            iterations: timed.searchEvaluations,
            ...target,
            ...(k === 6 ? { meetsTarget: false } : {}),
            note: `NOT reached in ${timed.searchEvaluations} evaluations: best ${timed.bestPmi.toFixed(2)} against the optimum ${optimum.toFixed(2)}; ${perSecond.toFixed(1)} evaluations/s`,
          },
    );
    results.push({
      name: `${k} free parameters: whole run with the screen's budget (${budget} evaluations + 24-draw spread)`,
      medianUs: us(whole.totalS),
      p95Us: us(whole.totalS),
      iterations: whole.searchEvaluations,
      note: `best PMI ${whole.bestPmi.toFixed(2)}, ${defaultGapPct.toFixed(2)} % above the optimum (${defaultGapPct <= WITHIN * 100 ? 'within' : 'NOT within'} 1 %); ${(whole.searchEvaluations / whole.searchS).toFixed(1)} evaluations/s`,
    });
  }
  return results;
}
