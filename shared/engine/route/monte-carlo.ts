/**
 * Monte Carlo evaluation of a route with uncertain parameters.
 *
 * Every parameter written as { value, plusMinus } is drawn uniformly in
 * [value − plusMinus, value + plusMinus] (clipped to the field's range) for
 * each draw, from one seeded sfc32 stream (random.ts); the route is
 * evaluated per draw and p5/p50/p95 of the isolated yield, the purity and
 * each purge factor are reported (percentiles by linear interpolation
 * between order statistics, Hyndman & Fan 1996 definition 7).
 *
 * Reproducible: the same document, seed and number of draws give the same
 * numbers, however the run is cut into chunks — the generator state travels
 * in the run state, so a server job can run chunk by chunk, store the state
 * between chunks and report progress.
 */
import { createRandom } from '../random';
import type { RouteDocument } from '../document';
import { evaluatePrepared, parseRoute, prepareRoute, type PreparedRoute } from './evaluate';
import type { StepMemo } from './step-memo';

export interface Percentiles {
  p5: number | null;
  p50: number | null;
  p95: number | null;
}

export interface MonteCarloResult {
  draws: number;
  seed: number;
  /** Draws whose evaluation failed (e.g. a drawn volume below what a step needs); excluded from the percentiles. */
  failedDraws: number;
  yieldPct: Percentiles;
  purityWtPct: Percentiles;
  /** Purge factor per impurity; a complete purge (nothing in the product) counts as +∞ and shows as null. */
  purgeFactor: Record<string, Percentiles>;
}

/** Serialisable state of a run, for chunked background jobs. */
export interface MonteCarloState {
  seed: number;
  draws: number;
  done: number;
  rngState: [number, number, number, number];
  failedDraws: number;
  samples: { yieldPct: number[]; purityWtPct: number[]; purge: Record<string, number[]> };
}

export const MAX_DRAWS = 100_000;

/**
 * Initial state of a run: no draws done, the generator seeded.
 * Source: Monte Carlo propagation of uniform parameter uncertainty (common
 * practice); sfc32 generator (random.ts); percentiles after Hyndman & Fan,
 * Am. Stat. 1996, 50, 361, definition 7.
 * Validity: 1 ≤ draws ≤ MAX_DRAWS, integer seed (else a RangeError).
 * @param opts.draws  number of draws [–]
 * @param opts.seed   integer seed of the generator [–]
 * @returns the run state
 */
export function startMonteCarlo(opts: { draws: number; seed: number }): MonteCarloState {
  if (!Number.isInteger(opts.draws) || opts.draws < 1 || opts.draws > MAX_DRAWS)
    throw new RangeError(`draws must be an integer in 1..${MAX_DRAWS}`);
  if (!Number.isInteger(opts.seed)) throw new RangeError('seed must be an integer');
  return {
    seed: opts.seed,
    draws: opts.draws,
    done: 0,
    rngState: createRandom(opts.seed).state(),
    failedDraws: 0,
    samples: { yieldPct: [], purityWtPct: [], purge: {} },
  };
}

/**
 * Run up to `chunk` further draws; returns the new state (the input is not
 * modified). A draw whose evaluation fails is counted in failedDraws and
 * left out of the samples.
 * Source: Monte Carlo propagation of uniform parameter uncertainty (common
 * practice); sfc32 generator (random.ts); percentiles after Hyndman & Fan,
 * Am. Stat. 1996, 50, 361, definition 7.
 * Validity: any prepared route; results are reproducible for a seed whatever
 * the chunking.
 * @param route  the prepared route
 * @param state  the run state so far
 * @param chunk  maximum number of draws to run now [–] (at least 1)
 * @param memo   step-result memo of the caller (steps without uncertain
 *               parameters whose inlets are unchanged are reused; the same
 *               numbers), or null
 * @returns the new run state
 */
export function runMonteCarloChunk(
  route: PreparedRoute,
  state: MonteCarloState,
  chunk: number,
  memo: StepMemo | null = null,
): MonteCarloState {
  const rng = createRandom(state.rngState);
  const s: MonteCarloState = {
    ...state,
    samples: {
      yieldPct: [...state.samples.yieldPct],
      purityWtPct: [...state.samples.purityWtPct],
      purge: Object.fromEntries(Object.entries(state.samples.purge).map(([k, v]) => [k, [...v]])),
    },
  };
  const end = Math.min(s.draws, s.done + Math.max(1, Math.floor(chunk)));
  for (; s.done < end; s.done++) {
    try {
      const r = evaluatePrepared(route, rng, memo);
      s.samples.yieldPct.push(r.totals.yieldPct ?? NaN);
      s.samples.purityWtPct.push(r.totals.purityWtPct ?? NaN);
      for (const [id, p] of Object.entries(r.totals.purge))
        (s.samples.purge[id] ??= []).push(p.purgeFactor ?? Infinity);
    } catch {
      s.failedDraws++;
    }
  }
  s.rngState = rng.state();
  return s;
}

/**
 * Percentile p ∈ [0, 1] by linear interpolation between order statistics
 * (Hyndman–Fan 7): h = (n − 1) p, Q = x_⌊h⌋ + (h − ⌊h⌋)(x_⌈h⌉ − x_⌊h⌋).
 * Source: Hyndman & Fan, Am. Stat. 1996, 50, 361, definition 7.
 * Validity: sorted finite samples; null for no samples or when a neighbour is infinite.
 * @param sorted  samples in ascending order [unit of the samples]
 * @param p       probability [–], 0 ≤ p ≤ 1
 * @returns the percentile [unit of the samples], or null
 */
export function percentile(sorted: readonly number[], p: number): number | null {
  if (sorted.length === 0) return null;
  const h = (sorted.length - 1) * p;
  const lo = Math.floor(h);
  const hi = Math.ceil(h);
  const a = sorted[lo];
  const b = sorted[hi];
  if (!Number.isFinite(a) || !Number.isFinite(b)) return null;
  return a + (h - lo) * (b - a);
}

function summarise(values: number[]): Percentiles {
  const v = values.filter((x) => !Number.isNaN(x)).sort((a, b) => a - b);
  return { p5: percentile(v, 0.05), p50: percentile(v, 0.5), p95: percentile(v, 0.95) };
}

/**
 * p5, p50 and p95 of yield, purity and each purge factor over the draws done
 * (NaN samples left out; an infinite purge factor gives null).
 * Source: Monte Carlo propagation of uniform parameter uncertainty (common
 * practice); sfc32 generator (random.ts); percentiles after Hyndman & Fan,
 * Am. Stat. 1996, 50, 361, definition 7.
 * Validity: any run state; percentiles of few draws are rough.
 * @param state  the run state
 * @returns the summary (draws, seed, failed draws, percentiles)
 */
export function summariseMonteCarlo(state: MonteCarloState): MonteCarloResult {
  return {
    draws: state.done,
    seed: state.seed,
    failedDraws: state.failedDraws,
    yieldPct: summarise(state.samples.yieldPct),
    purityWtPct: summarise(state.samples.purityWtPct),
    purgeFactor: Object.fromEntries(
      Object.entries(state.samples.purge).map(([k, v]) => [k, summarise(v)]),
    ),
  };
}

/**
 * Chunked iterator for background jobs: yields progress after each chunk and
 * returns the summary. `for (const p of it) report(p.done / p.total)`.
 * Source: Monte Carlo propagation of uniform parameter uncertainty (common
 * practice); sfc32 generator (random.ts); percentiles after Hyndman & Fan,
 * Am. Stat. 1996, 50, 361, definition 7.
 * Validity: any route document the schema accepts (parsed first; a bad document throws).
 * @param doc               the route document (unparsed)
 * @param opts.draws        number of draws [–]
 * @param opts.seed         integer seed [–]
 * @param opts.chunkSize    draws per chunk [–] (default 50)
 * @returns a generator of progress (done, total [–], state) that returns the summary
 */
export function* monteCarloChunks(
  doc: unknown,
  opts: { draws: number; seed: number; chunkSize?: number },
): Generator<{ done: number; total: number; state: MonteCarloState }, MonteCarloResult> {
  const prepared = prepareRoute(parseRoute(doc));
  let state = startMonteCarlo(opts);
  const chunk = opts.chunkSize ?? 50;
  while (state.done < state.draws) {
    state = runMonteCarloChunk(prepared, state, chunk);
    yield { done: state.done, total: state.draws, state };
  }
  return summariseMonteCarlo(state);
}

/**
 * Run all draws at once, with an optional progress callback (fraction done).
 * Source: Monte Carlo propagation of uniform parameter uncertainty (common
 * practice); sfc32 generator (random.ts); percentiles after Hyndman & Fan,
 * Am. Stat. 1996, 50, 361, definition 7.
 * Validity: any route document the schema accepts (parsed first; a bad document throws).
 * @param doc          the route document
 * @param opts.draws   number of draws [–]
 * @param opts.seed    integer seed [–]
 * @param onProgress   receives the fraction done [–]
 * @returns the summary (percentiles of yield [%], purity [wt %], purge factors [–])
 */
export function monteCarlo(
  doc: unknown | RouteDocument,
  opts: { draws: number; seed: number },
  onProgress?: (fraction: number) => void,
): MonteCarloResult {
  const it = monteCarloChunks(doc, {
    ...opts,
    chunkSize: Math.max(10, Math.ceil(opts.draws / 20)),
  });
  for (;;) {
    const n = it.next();
    if (n.done) return n.value;
    onProgress?.(n.value.done / n.value.total);
  }
}
