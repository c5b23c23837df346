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
import {
  evaluateDraw,
  evaluatePrepared,
  parseRoute,
  prepareRoute,
} from '../../../shared/engine/route/evaluate';
import { createStepMemo, stepIsUncertain } from '../../../shared/engine/route/step-memo';
import { demoAmideIsolation } from '../../fixtures/routes/demo-amide-isolation';
import { benchRoute, routeCorpus } from '../../fixtures/routes/corpus';
import { createRandom, createStreamRandom } from '../../../shared/engine/random';

/** JSON in which every number is written exactly (−0, NaN, ±∞ kept apart). */
function exact(value: unknown): string {
  return JSON.stringify(value, (_k, v: unknown) =>
    typeof v === 'number' ? `#${Object.is(v, -0) ? '-0' : String(v)}` : v,
  );
}

/**
 * The unshortened path of a run: every draw a full evaluation (evaluatePrepared), its totals
 * sampled as the run samples them, in blocks of the run's streams; the summary of those samples.
 */
function referenceSummary(doc: unknown, draws: number, seed: number) {
  const prepared = prepareRoute(parseRoute(doc));
  const state = startMonteCarlo({ draws, seed });
  for (let block = 0; block < monteCarloBlockCount(draws); block++) {
    const rng = createStreamRandom(seed, block);
    const n =
      Math.min(draws, (block + 1) * MONTE_CARLO_BLOCK_DRAWS) - block * MONTE_CARLO_BLOCK_DRAWS;
    for (let i = 0; i < n; i++) {
      state.done++;
      let totals;
      try {
        totals = evaluatePrepared(prepared, rng).totals;
      } catch {
        state.failedDraws++;
        continue;
      }
      state.samples.yieldPct.push(totals.yieldPct ?? NaN);
      state.samples.purityWtPct.push(totals.purityWtPct ?? NaN);
      for (const [id, p] of Object.entries(totals.purge))
        (state.samples.purge[id] ??= []).push(p.purgeFactor ?? Infinity);
    }
  }
  return summariseMonteCarlo(state);
}

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
  it('draws the totals of a full evaluation, bit for bit, with the same random numbers', () => {
    // evaluateDraw leaves out the balance check, the per-step purge and the cautions: the totals,
    // and the random numbers drawn, must be those of evaluatePrepared for every draw.
    for (const [name, doc] of routeCorpus().slice(0, 8)) {
      const full = prepareRoute(parseRoute(doc));
      const lean = prepareRoute(parseRoute(doc));
      const a = createStreamRandom(11, 3);
      const b = createStreamRandom(11, 3);
      for (let i = 0; i < 6; i++) {
        let expected: unknown;
        try {
          const t = evaluatePrepared(full, a).totals;
          expected = { yieldPct: t.yieldPct, purityWtPct: t.purityWtPct, purge: t.purge };
        } catch (error) {
          expected = (error as Error).message;
        }
        let got: unknown;
        try {
          got = evaluateDraw(lean, b);
        } catch (error) {
          got = (error as Error).message;
        }
        expect(exact(got), `${name}, draw ${i}`).toBe(exact(expected));
        expect(b.state(), `${name}, draw ${i}`).toEqual(a.state());
      }
    }
  }, 60_000);

  it('pins the summary of a seeded run to the one of full evaluations, bit for bit', () => {
    // The 30-step benchmark route (every draw changes its first step) and the demo route: the
    // summary of monteCarlo, of blocks with a step memo, and of full evaluations agree exactly.
    for (const doc of [benchRoute(30, 10), demoAmideIsolation]) {
      const draws = MONTE_CARLO_BLOCK_DRAWS + 5;
      const reference = referenceSummary(doc, draws, 9);
      expect(exact(monteCarlo(doc, { draws, seed: 9 }))).toBe(exact(reference));
      const prepared = prepareRoute(parseRoute(doc));
      const memo = createStepMemo(200);
      const blocks = [1, 0].map((block) =>
        runMonteCarloBlock(prepared, { draws, seed: 9, block }, memo),
      );
      expect(exact(summariseMonteCarlo(mergeMonteCarloBlocks({ draws, seed: 9 }, blocks)))).toBe(
        exact(reference),
      );
    }
  }, 60_000);

  it('looks up in the step memo only the steps no draw reaches, and keeps their entries complete', () => {
    // Steps with no uncertain setting of their own or upstream of them, in the first corpus route
    // that has such steps and drawn ones.
    const countFixed = (doc: unknown) => {
      const { graph, doc: parsed } = prepareRoute(parseRoute(doc));
      const drawn = new Set<string>();
      for (const id of graph.order) {
        const step = parsed.steps.find((s) => s.id === id)!;
        const upstream = [...graph.incoming.get(id)!.values()].some((c) =>
          drawn.has(c.from.stepId),
        );
        if (upstream || stepIsUncertain(step)) drawn.add(id);
      }
      return { fixed: graph.order.length - drawn.size, drawn: drawn.size };
    };
    const found = routeCorpus().find(([, d]) => {
      const c = countFixed(d);
      return c.fixed > 0 && c.drawn > 0;
    });
    expect(found).toBeDefined();
    const doc = found![1];
    const { fixed } = countFixed(doc);
    const prepared = prepareRoute(parseRoute(doc));
    const memo = createStepMemo(200);
    const rng = createStreamRandom(4, 0);
    for (let i = 0; i < 5; i++) evaluateDraw(prepared, rng, memo);
    expect(memo.misses).toBe(fixed);
    expect(memo.hits).toBe(4 * fixed);
    // What the draws left in the memo is a complete step result (balance and purge included).
    expect(exact(evaluatePrepared(prepared, null, memo))).toBe(
      exact(evaluatePrepared(prepareRoute(parseRoute(doc)), null)),
    );
    expect(memo.hits).toBe(5 * fixed);
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
