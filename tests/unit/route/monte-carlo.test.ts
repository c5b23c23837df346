import { describe, expect, it } from 'vitest';
import {
  monteCarlo,
  monteCarloChunks,
  percentile,
  runMonteCarloChunk,
  startMonteCarlo,
  summariseMonteCarlo,
} from '../../../shared/engine/route/monte-carlo';
import { parseRoute, prepareRoute } from '../../../shared/engine/route/evaluate';
import { demoAmideIsolation } from '../../fixtures/routes/demo-amide-isolation';
import { createRandom } from '../../../shared/engine/random';

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
