/**
 * Monte Carlo evaluation of a route with uncertain parameters.
 *
 * Every parameter written as { value, plusMinus } is drawn uniformly in
 * [value − plusMinus, value + plusMinus] (clipped to the field's range) for
 * each draw; the route is evaluated per draw and p5/p50/p95 of the isolated
 * yield, the purity and each purge factor are reported (percentiles by
 * linear interpolation between order statistics, Hyndman & Fan 1996
 * definition 7).
 *
 * The draws are cut into fixed blocks of MONTE_CARLO_BLOCK_DRAWS; block k
 * draws from its own sfc32 stream, numbered k, of the seed
 * (createStreamRandom in random.ts). Blocks are independent, so they can run
 * on several engine workers at once, in any order, and their samples are
 * merged in block order: the same document, seed and number of draws give
 * the same numbers whatever the number of workers, the order in which
 * blocks finish, or how a sequential run is cut into chunks (the state of
 * the current block's stream travels in the run state).
 */
import { createRandom, createStreamRandom, type SeededRandom } from '../random';
import type { RouteDocument } from '../document';
import { evaluateDraw, parseRoute, prepareRoute, type PreparedRoute } from './evaluate';
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

/** Samples of the draws that evaluated, in draw order. */
export interface MonteCarloSamples {
  yieldPct: number[];
  purityWtPct: number[];
  /** Purge factor per impurity (+∞ for a complete purge). */
  purge: Record<string, number[]>;
}

/** Serialisable state of a run, for chunked background jobs. */
export interface MonteCarloState {
  seed: number;
  draws: number;
  done: number;
  /** State of the current block's stream; null when the next draw starts a block. */
  rngState: [number, number, number, number] | null;
  failedDraws: number;
  samples: MonteCarloSamples;
}

/** The draws of one block of a run, computed on its own (see runMonteCarloBlock). */
export interface MonteCarloBlock {
  /** Block number, 0-based: draws block·B … block·B + B − 1 of the run. */
  block: number;
  /** Draws in the block (B, fewer in the last block). */
  draws: number;
  failedDraws: number;
  samples: MonteCarloSamples;
}

export const MAX_DRAWS = 100_000;

/**
 * Draws per block (B). Part of the method: block k of a seed always draws from stream k, so
 * changing B changes the numbers a seed gives.
 */
export const MONTE_CARLO_BLOCK_DRAWS = 20;

/**
 * Number of blocks of a run: ⌈draws / MONTE_CARLO_BLOCK_DRAWS⌉.
 * Source: the block layout of this module (common practice for parallel Monte Carlo).
 * Validity: draws ≥ 0.
 * @param draws  number of draws of the run [–]
 * @returns number of blocks [–]
 */
export function monteCarloBlockCount(draws: number): number {
  return Math.ceil(draws / MONTE_CARLO_BLOCK_DRAWS);
}

function checkRun(opts: { draws: number; seed: number }): void {
  if (!Number.isInteger(opts.draws) || opts.draws < 1 || opts.draws > MAX_DRAWS)
    throw new RangeError(`draws must be an integer in 1..${MAX_DRAWS}`);
  if (!Number.isInteger(opts.seed)) throw new RangeError('seed must be an integer');
}

/**
 * One draw: evaluates the route with `rng` (evaluateDraw: the totals of evaluatePrepared, without
 * the cautions and per-step checks no summary reads), appends its samples; false when the
 * evaluation failed.
 */
function runDraw(
  route: PreparedRoute,
  rng: SeededRandom,
  memo: StepMemo | null,
  samples: MonteCarloSamples,
): boolean {
  try {
    const r = evaluateDraw(route, rng, memo);
    samples.yieldPct.push(r.yieldPct ?? NaN);
    samples.purityWtPct.push(r.purityWtPct ?? NaN);
    for (const [id, p] of Object.entries(r.purge))
      (samples.purge[id] ??= []).push(p.purgeFactor ?? Infinity);
    return true;
  } catch {
    return false;
  }
}

/**
 * Initial state of a run: no draws done.
 * Source: Monte Carlo propagation of uniform parameter uncertainty (common
 * practice); sfc32 streams per block (random.ts); percentiles after Hyndman & Fan,
 * Am. Stat. 1996, 50, 361, definition 7.
 * Validity: 1 ≤ draws ≤ MAX_DRAWS, integer seed (else a RangeError).
 * @param opts.draws  number of draws [–]
 * @param opts.seed   integer seed of the generator [–]
 * @returns the run state
 */
export function startMonteCarlo(opts: { draws: number; seed: number }): MonteCarloState {
  checkRun(opts);
  return {
    seed: opts.seed,
    draws: opts.draws,
    done: 0,
    rngState: null,
    failedDraws: 0,
    samples: { yieldPct: [], purityWtPct: [], purge: {} },
  };
}

/**
 * Run up to `chunk` further draws in sequence, block after block; returns the
 * new state (the input is not modified). A draw whose evaluation fails is
 * counted in failedDraws and left out of the samples.
 * Source: Monte Carlo propagation of uniform parameter uncertainty (common
 * practice); sfc32 streams per block (random.ts); percentiles after Hyndman & Fan,
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
  const s: MonteCarloState = {
    ...state,
    samples: {
      yieldPct: [...state.samples.yieldPct],
      purityWtPct: [...state.samples.purityWtPct],
      purge: Object.fromEntries(Object.entries(state.samples.purge).map(([k, v]) => [k, [...v]])),
    },
  };
  const end = Math.min(s.draws, s.done + Math.max(1, Math.floor(chunk)));
  let rng = s.rngState ? createRandom(s.rngState) : null;
  for (; s.done < end; s.done++) {
    if (s.done % MONTE_CARLO_BLOCK_DRAWS === 0)
      rng = createStreamRandom(s.seed, s.done / MONTE_CARLO_BLOCK_DRAWS);
    if (!runDraw(route, rng!, memo, s.samples)) s.failedDraws++;
  }
  s.rngState = s.done % MONTE_CARLO_BLOCK_DRAWS === 0 || !rng ? null : rng.state();
  return s;
}

/**
 * The draws of one block of a run, independent of every other block: block k
 * evaluates draws k·B … min(draws, k·B + B) − 1 (B = MONTE_CARLO_BLOCK_DRAWS)
 * with stream k of the seed. A failed draw is counted and left out of the samples.
 * Source: Monte Carlo propagation of uniform parameter uncertainty (common
 * practice); sfc32 streams per block (random.ts).
 * Validity: 0 ≤ block < monteCarloBlockCount(draws); the same inputs give the
 * same block on any worker.
 * @param route        the prepared route
 * @param opts.seed    integer seed of the run [–]
 * @param opts.draws   number of draws of the whole run [–]
 * @param opts.block   block number [–], 0-based
 * @param memo         step-result memo of the caller (the same numbers), or null
 * @returns the block's samples and failed draws
 */
export function runMonteCarloBlock(
  route: PreparedRoute,
  opts: { seed: number; draws: number; block: number },
  memo: StepMemo | null = null,
): MonteCarloBlock {
  checkRun(opts);
  const blocks = monteCarloBlockCount(opts.draws);
  if (!Number.isInteger(opts.block) || opts.block < 0 || opts.block >= blocks)
    throw new RangeError(`block must be an integer in 0..${blocks - 1}`);
  const first = opts.block * MONTE_CARLO_BLOCK_DRAWS;
  const draws = Math.min(opts.draws, first + MONTE_CARLO_BLOCK_DRAWS) - first;
  const rng = createStreamRandom(opts.seed, opts.block);
  const samples: MonteCarloSamples = { yieldPct: [], purityWtPct: [], purge: {} };
  let failedDraws = 0;
  for (let i = 0; i < draws; i++) if (!runDraw(route, rng, memo, samples)) failedDraws++;
  return { block: opts.block, draws, failedDraws, samples };
}

/**
 * Joins the blocks of a run, given in any order, into its state, their
 * samples concatenated in block order (as a sequential run gives them).
 * Source: the block layout of this module.
 * Validity: every block 0 … monteCarloBlockCount(draws) − 1 exactly once
 * (else a RangeError).
 * @param opts.seed    integer seed of the run [–]
 * @param opts.draws   number of draws of the run [–]
 * @param blocks       the run's blocks
 * @returns the finished run state (summarise with summariseMonteCarlo)
 */
export function mergeMonteCarloBlocks(
  opts: { seed: number; draws: number },
  blocks: readonly MonteCarloBlock[],
): MonteCarloState {
  const state = startMonteCarlo(opts);
  const ordered = [...blocks].sort((a, b) => a.block - b.block);
  if (ordered.length !== monteCarloBlockCount(opts.draws) || ordered.some((b, i) => b.block !== i))
    throw new RangeError('every block of the run is needed exactly once');
  for (const b of ordered) {
    state.done += b.draws;
    state.failedDraws += b.failedDraws;
    state.samples.yieldPct.push(...b.samples.yieldPct);
    state.samples.purityWtPct.push(...b.samples.purityWtPct);
    for (const [id, v] of Object.entries(b.samples.purge))
      (state.samples.purge[id] ??= []).push(...v);
  }
  if (state.done !== opts.draws) throw new RangeError('the blocks do not add up to the run');
  return state;
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
 * practice); sfc32 streams per block (random.ts); percentiles after Hyndman & Fan,
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
 * practice); sfc32 streams per block (random.ts); percentiles after Hyndman & Fan,
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
 * practice); sfc32 streams per block (random.ts); percentiles after Hyndman & Fan,
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
