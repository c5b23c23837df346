import { describe, expect, it } from 'vitest';
import { BENCH_WEIGHTS, generateRoute } from '../../fixtures/routes/generate';

describe('route generator (property tests and benchmarks)', () => {
  it('makes exactly the requested number of steps', () => {
    for (const steps of [4, 5, 6, 7, 10, 30, 31, 57, 200]) {
      for (const seed of [1, 3, 5, 11, 42]) {
        expect(generateRoute({ seed, steps, compounds: 4 }).steps.length).toBe(steps);
      }
    }
  });
  it("the benchmark's 30-step, 10-component route has 30 steps", () => {
    // Built as tests/bench/route.bench.ts does (compounds added until 10 components).
    const make = (compounds: number) =>
      generateRoute({ seed: 11, steps: 30, compounds, weights: BENCH_WEIGHTS });
    const d = make(Math.max(1, 10 - (make(1).components.length - 1)));
    expect(d.components.length).toBe(10);
    expect(d.steps.length).toBe(30);
    expect(d.steps.filter((s) => s.kind === 'distillation').length).toBeGreaterThanOrEqual(1);
  });
});
