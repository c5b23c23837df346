/**
 * A Monte Carlo run spread over the engine pool gives the numbers of one
 * sequential run in the engine, with one worker or two and whatever order its
 * blocks finish in; a cancel stops the blocks in flight. Real worker threads
 * (no database needed).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RouteDocument } from '@shared/schemas/route';
import {
  MONTE_CARLO_BLOCK_DRAWS,
  monteCarlo,
  monteCarloBlockCount,
} from '@shared/engine/route/monte-carlo';
import demoRoute from '../fixtures/routes/demo-amide-isolation.json';
import { AppError } from '../../server/errors';
import { createEnginePool, type EnginePool } from '../../server/pool';
import { BLOCK_DRAWS, runMonteCarloOnPool } from '../../server/services/monte-carlo-blocks';

const document = demoRoute as unknown as RouteDocument;
/** Three blocks: 20, 20 and 1 draws. */
const draws = 2 * MONTE_CARLO_BLOCK_DRAWS + 1;
const seed = 417;

const pools: EnginePool[] = [];
function pool(size: number): EnginePool {
  const created = createEnginePool({
    size,
    maxQueue: 50,
    taskTimeoutMs: 120_000,
    workerMemoryMb: 512,
  });
  pools.push(created);
  return created;
}

describe('Monte Carlo blocks on the engine pool', () => {
  let sequential: ReturnType<typeof monteCarlo>;
  let one: EnginePool;
  let two: EnginePool;

  beforeAll(() => {
    sequential = monteCarlo(document, { draws, seed });
    one = pool(1);
    two = pool(2);
  });
  afterAll(async () => {
    await Promise.all(pools.map((p) => p.close()));
  });

  it('uses the engine’s block size', () => {
    expect(BLOCK_DRAWS).toBe(MONTE_CARLO_BLOCK_DRAWS);
    expect(monteCarloBlockCount(draws)).toBe(3);
  });

  it('gives the sequential run’s numbers with one worker and with two', async () => {
    const progress: number[] = [];
    const withOne = await runMonteCarloOnPool(
      one,
      { cacheKey: 'one', document, draws, seed },
      { onProgress: (f) => void progress.push(f) },
    );
    expect(withOne).toEqual(sequential);
    expect(progress).toEqual([20 / draws, 40 / draws, 1]);
    const withTwo = await runMonteCarloOnPool(two, { cacheKey: 'two', document, draws, seed });
    expect(withTwo).toEqual(sequential);
    expect(withTwo.draws).toBe(draws);
  });

  it('gives the same numbers when the blocks finish in reverse order', async () => {
    const finished: number[] = [];
    // Every block in flight at once; the pool's answer for block k is held back longer the
    // lower k is, so the last block finishes first.
    const reversing: Pick<EnginePool, 'run' | 'stats'> = {
      stats: () => two.stats(),
      run: (async (name: string, input: { block?: number }, options: unknown) => {
        const out = await (two.run as (...a: unknown[]) => Promise<unknown>)(name, input, options);
        if (name === 'monteCarlo.block') {
          await new Promise((resolve) => setTimeout(resolve, (3 - input.block!) * 400));
          finished.push(input.block!);
        }
        return out;
      }) as EnginePool['run'],
    };
    const result = await runMonteCarloOnPool(
      reversing,
      { cacheKey: 'reversed', document, draws, seed },
      { lanes: 3 },
    );
    expect(finished).toEqual([2, 1, 0]);
    expect(result).toEqual(sequential);
  });

  it('stops the blocks in flight when cancelled', async () => {
    const controller = new AbortController();
    const reason = new Error('cancelled by the chemist');
    const run = runMonteCarloOnPool(
      two,
      { cacheKey: 'cancelled', document, draws: 2000, seed },
      { signal: controller.signal },
    );
    setTimeout(() => controller.abort(reason), 300);
    await expect(run).rejects.toBe(reason);
    expect(two.stats().busy).toBe(0);
    // The pool still answers after its workers were stopped.
    const again = await runMonteCarloOnPool(two, { cacheKey: 'again', document, draws, seed });
    expect(again).toEqual(sequential);
  });

  it('stops the run at the time limit of a block (evaluation_timeout)', async () => {
    // A block of 20 draws of the demo route takes far longer than 50 ms.
    const short = createEnginePool({
      size: 2,
      maxQueue: 50,
      taskTimeoutMs: 50,
      workerMemoryMb: 512,
    });
    pools.push(short);
    const error = await runMonteCarloOnPool(short, {
      cacheKey: 'timed-out',
      document,
      draws: 200,
      seed,
    }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(AppError);
    expect((error as AppError).body.code).toBe('evaluation_timeout');
    expect(short.stats().busy).toBe(0);
  });

  it('stops the run when progress cannot be written (a job cancelled elsewhere)', async () => {
    const gone = new Error('job cancelled on another server');
    let blocksRun = 0;
    const counting: Pick<EnginePool, 'run' | 'stats'> = {
      stats: () => one.stats(),
      run: (async (name: string, input: unknown, options: unknown) => {
        if (name === 'monteCarlo.block') blocksRun++;
        return (one.run as (...a: unknown[]) => Promise<unknown>)(name, input, options);
      }) as EnginePool['run'],
    };
    await expect(
      runMonteCarloOnPool(
        counting,
        { cacheKey: 'elsewhere', document, draws: 200, seed },
        {
          onProgress: () => {
            throw gone;
          },
        },
      ),
    ).rejects.toBe(gone);
    expect(blocksRun).toBe(1);
  });
});
