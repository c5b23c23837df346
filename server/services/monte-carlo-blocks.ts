/**
 * A Monte Carlo run spread over the engine pool: the run's fixed blocks of
 * draws (shared/engine/route/monte-carlo.ts) are handed to the pool's
 * workers, as many at a time as the pool has workers, and the blocks are
 * merged in block order when all have come back, so a seed gives the same
 * numbers with any number of workers and whatever order the blocks finish
 * in. Each lane asks for its next block only when its last one is done, so
 * other requests queued meanwhile are served between blocks: an evaluation
 * that arrives while a run holds every worker waits for the first block in
 * flight to finish (one block is 20 draws of the run's route).
 *
 * This module imports no engine code (the web thread runs it); the block
 * layout is repeated here as a number and checked by the tests.
 */
import type { RouteDocument } from '@shared/schemas/route';
import type { MonteCarloResult } from '@shared/engine/route/monte-carlo';
import type { EnginePool } from '../pool';
import type { TaskOutput } from '../pool/tasks';

/** Draws per block: MONTE_CARLO_BLOCK_DRAWS of the engine (a test checks they agree). */
export const BLOCK_DRAWS = 20;

export interface PooledMonteCarloInput {
  /** Names the run in the workers' caches of prepared routes (a job id). */
  cacheKey: string;
  document: RouteDocument;
  draws: number;
  seed: number;
}

export interface PooledMonteCarloOptions {
  /** Stops every block in flight (the pool stops their workers) and the run. */
  signal?: AbortSignal;
  /** Blocks in flight at once; default the pool's number of workers. */
  lanes?: number;
  /**
   * Called after each block with the fraction of draws done [0, 1]; calls do not overlap. A
   * throw stops the run (a cancelled job).
   */
  onProgress?: (fraction: number) => Promise<void> | void;
}

/** Runs all the draws of a run on the pool; the summary of the merged blocks. */
export async function runMonteCarloOnPool(
  pool: Pick<EnginePool, 'run' | 'stats'>,
  input: PooledMonteCarloInput,
  options: PooledMonteCarloOptions = {},
): Promise<MonteCarloResult> {
  const count = Math.ceil(input.draws / BLOCK_DRAWS);
  const blocks: TaskOutput<'monteCarlo.block'>[] = [];
  const stop = new AbortController();
  const signal = options.signal ? AbortSignal.any([options.signal, stop.signal]) : stop.signal;
  let next = 0;
  let done = 0;
  let reporting: Promise<void> = Promise.resolve();

  async function lane(): Promise<void> {
    while (next < count && !signal.aborted) {
      const block = next++;
      const out = await pool.run('monteCarlo.block', { ...input, block }, { signal });
      blocks.push(out);
      done += out.draws;
      const fraction = done / input.draws;
      reporting = reporting.then(() => options.onProgress?.(fraction));
      await reporting;
    }
  }

  const lanes = Math.max(1, Math.min(count, options.lanes ?? pool.stats().size));
  const settled = await Promise.allSettled(
    Array.from({ length: lanes }, () =>
      lane().catch((error: unknown) => {
        // One lane's failure stops the others' blocks too.
        stop.abort(error);
        throw error;
      }),
    ),
  );
  const failed = settled.find((s): s is PromiseRejectedResult => s.status === 'rejected');
  if (failed) throw stop.signal.aborted ? stop.signal.reason : failed.reason;
  if (options.signal?.aborted) throw options.signal.reason;
  return pool.run('monteCarlo.summarise', {
    cacheKey: input.cacheKey,
    draws: input.draws,
    seed: input.seed,
    blocks,
  });
}
