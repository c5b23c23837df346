import { describe, expect, it } from 'vitest';
import {
  MONTE_CARLO_BLOCK_DRAWS,
  mergeMonteCarloBlocks,
  monteCarlo,
  monteCarloBlockCount,
  monteCarloChunks,
  percentile,
  runMonteCarloBlock,
  runMonteCarloChunk,
  startMonteCarlo,
  summariseMonteCarlo,
} from '../../../shared/engine/route/monte-carlo';
import { parseRoute, prepareRoute } from '../../../shared/engine/route/evaluate';
import { demoAmideIsolation } from '../../fixtures/routes/demo-amide-isolation';
import { createRandom, createStreamRandom } from '../../../shared/engine/random';

describe('Monte Carlo', () => {
  it('is reproducible for a seed and independent of chunking', () => {
    const a = monteCarlo(demoAmideIsolation, { draws: 24, seed: 42 });
    const b = monteCarlo(demoAmideIsolation, { draws: 24, seed: 42 });
    expect(b).toEqual(a);
    const prepared = prepareRoute(parseRoute(demoAmideIsolation));
    let s = startMonteCarlo({ draws: 24, seed: 42 });
    for (const n of [5, 1, 11, 7])
      s = runMonteCarloChunk(prepared, JSON.parse(JSON.stringify(s)), n);
    expect(summariseMonteCarlo(s)).toEqual(a);
  });
  it('gives the same numbers from blocks run in any order as from one sequential run', () => {
    const draws = 2 * MONTE_CARLO_BLOCK_DRAWS + 3;
    const prepared = prepareRoute(parseRoute(demoAmideIsolation));
    const sequential = runMonteCarloChunk(prepared, startMonteCarlo({ draws, seed: 42 }), draws);
    const count = monteCarloBlockCount(draws);
    expect(count).toBe(3);
    // Each block on its own (as on separate workers), computed last block first.
    const blocks = [2, 0, 1].map((block) =>
      runMonteCarloBlock(prepareRoute(parseRoute(demoAmideIsolation)), { draws, seed: 42, block }),
    );
    expect(blocks.map((b) => b.draws)).toEqual([
      3,
      MONTE_CARLO_BLOCK_DRAWS,
      MONTE_CARLO_BLOCK_DRAWS,
    ]);
    const merged = mergeMonteCarloBlocks({ draws, seed: 42 }, blocks);
    expect(merged.samples).toEqual(sequential.samples);
    expect(merged.done).toBe(draws);
    expect(summariseMonteCarlo(merged)).toEqual(
      monteCarlo(demoAmideIsolation, { draws, seed: 42 }),
    );
    // A missing or repeated block is refused, not summarised as a shorter run.
    expect(() => mergeMonteCarloBlocks({ draws, seed: 42 }, blocks.slice(1))).toThrow(RangeError);
    expect(() =>
      mergeMonteCarloBlocks({ draws, seed: 42 }, [blocks[0], blocks[1], blocks[1]]),
    ).toThrow(RangeError);
    expect(() => runMonteCarloBlock(prepared, { draws, seed: 42, block: count })).toThrow(
      RangeError,
    );
  });
  it('draws each block from its own stream of the seed', () => {
    const prepared = prepareRoute(parseRoute(demoAmideIsolation));
    const draws = 2 * MONTE_CARLO_BLOCK_DRAWS;
    const [first, second] = [0, 1].map((block) =>
      runMonteCarloBlock(prepared, { draws, seed: 5, block }),
    );
    // Different streams: no draw of the second block repeats one of the first.
    const firstYields = new Set(first.samples.yieldPct);
    expect(second.samples.yieldPct.some((y) => firstYields.has(y))).toBe(false);
    // Another seed gives another first block.
    const other = runMonteCarloBlock(prepared, { draws, seed: 6, block: 0 });
    expect(other.samples.yieldPct).not.toEqual(first.samples.yieldPct);
  });
  it('derives streams that are reproducible, distinct and uncorrelated', () => {
    const n = 20000;
    const sample = (seed: number, stream: number) => {
      const r = createStreamRandom(seed, stream);
      return Array.from({ length: n }, () => r.next());
    };
    expect(sample(3, 7).slice(0, 10)).toEqual(sample(3, 7).slice(0, 10));
    // Neighbouring streams, the same stream of neighbouring seeds, and stream 0 against the
    // seed's plain generator: no shared values and a correlation within 4 standard errors of 0
    // (1/√n for independent uniforms).
    const pairs: [number[], number[]][] = [
      [sample(3, 0), sample(3, 1)],
      [sample(3, 1), sample(3, 2)],
      [sample(3, 0), sample(4, 0)],
      [sample(0, 0), sample(0, 0xffffffff)],
      [
        sample(3, 0),
        (() => {
          const r = createRandom(3);
          return Array.from({ length: n }, () => r.next());
        })(),
      ],
    ];
    for (const [a, b] of pairs) {
      const seen = new Set(a);
      expect(b.filter((x) => seen.has(x)).length).toBeLessThan(3);
      const ma = a.reduce((s, x) => s + x, 0) / n;
      const mb = b.reduce((s, x) => s + x, 0) / n;
      let sab = 0;
      let saa = 0;
      let sbb = 0;
      for (let i = 0; i < n; i++) {
        sab += (a[i] - ma) * (b[i] - mb);
        saa += (a[i] - ma) ** 2;
        sbb += (b[i] - mb) ** 2;
      }
      expect(Math.abs(sab / Math.sqrt(saa * sbb))).toBeLessThan(4 / Math.sqrt(n));
      expect(ma).toBeCloseTo(0.5, 2);
    }
    expect(() => createStreamRandom(1, -1)).toThrow(RangeError);
    expect(() => createStreamRandom(1, 1.5)).toThrow(RangeError);
  });
  it('spreads the results and orders the percentiles', () => {
    const r = monteCarlo(demoAmideIsolation, { draws: 30, seed: 3 });
    expect(r.draws).toBe(30);
    expect(r.yieldPct.p5!).toBeLessThanOrEqual(r.yieldPct.p50!);
    expect(r.yieldPct.p50!).toBeLessThanOrEqual(r.yieldPct.p95!);
    const imp = r.purgeFactor['deschloro-amide'];
    expect(imp.p95! - imp.p5!).toBeGreaterThan(0);
    const other = monteCarlo(demoAmideIsolation, { draws: 30, seed: 4 });
    expect(other.yieldPct.p50).not.toBe(r.yieldPct.p50);
  });
  it('reports progress from the chunked iterator', () => {
    const it = monteCarloChunks(demoAmideIsolation, { draws: 10, seed: 1, chunkSize: 4 });
    const seen: number[] = [];
    for (;;) {
      const n = it.next();
      if (n.done) break;
      seen.push(n.value.done);
    }
    expect(seen).toEqual([4, 8, 10]);
  });
  it('interpolates percentiles (Hyndman–Fan 7)', () => {
    expect(percentile([1, 2, 3, 4], 0.5)).toBe(2.5);
    expect(percentile([0, 10], 0.05)).toBeCloseTo(0.5, 12);
    expect(percentile([1, Infinity], 0.95)).toBeNull();
  });
  it('seeded generator is deterministic with uniform moments', () => {
    const a = createRandom(9);
    const b = createRandom(9);
    const xs = Array.from({ length: 20000 }, () => a.next());
    expect(xs.slice(0, 5)).toEqual(Array.from({ length: 5 }, () => b.next()));
    const mean = xs.reduce((s, x) => s + x, 0) / xs.length;
    const v = xs.reduce((s, x) => s + (x - mean) ** 2, 0) / xs.length;
    expect(mean).toBeCloseTo(0.5, 2);
    expect(v).toBeCloseTo(1 / 12, 2);
    expect(Math.min(...xs)).toBeGreaterThanOrEqual(0);
    expect(Math.max(...xs)).toBeLessThan(1);
  });
});
