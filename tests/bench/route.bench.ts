/**
 * Route evaluation benchmarks (npm run bench -- route): a 30-step route with
 * 10 components (median ≤ 5 ms), a 200-step route (≤ 50 ms, peak heap
 * growth ≤ 50 MB), 1000 Monte Carlo draws of the 30-step route (≤ 5 s), and
 * the cost against steps and components. Memory is read with
 * process.memoryUsage() here only (the engine itself uses no Node APIs).
 */
import { measure, type BenchResult } from './harness';
import { BENCH_WEIGHTS, generateRoute } from '../fixtures/routes/generate';
import { evaluatePrepared, parseRoute, prepareRoute } from '../../shared/engine/route/evaluate';
import { monteCarlo } from '../../shared/engine/route/monte-carlo';

function route(steps: number, components: number, seed = 11) {
  // About two distillations per 30 steps (weights), the rest washes and simple steps;
  // compounds are added until the route has `components` components.
  const make = (compounds: number) =>
    generateRoute({ seed, steps, compounds, weights: BENCH_WEIGHTS });
  const base = make(1).components.length - 1;
  return make(Math.max(1, components - base));
}

export async function run(): Promise<BenchResult[]> {
  const out: BenchResult[] = [];
  const d30 = route(30, 10);
  const p30 = prepareRoute(parseRoute(d30));
  const nDist = d30.steps.filter((s) => s.kind === 'distillation').length;
  out.push({
    ...measure('30-step route, 10 components', () => evaluatePrepared(p30, null), {
      samples: 60,
      batch: 5,
      warmup: 30,
      targetUs: 5000,
    }),
    note: `${nDist} distillations, ${d30.steps.length} steps, ${d30.components.length} components`,
  });
  // The same route with nothing carried over from an earlier evaluation (as for one API request):
  // fresh document caches (UNIFAC models, solubility curves) each call.
  out.push({
    ...measure(
      '30-step route, 10 components, cold caches',
      () => evaluatePrepared({ doc: p30.doc, graph: p30.graph }, null),
      { samples: 60, batch: 5, warmup: 30, targetUs: 5000 },
    ),
    note: 'no caches shared between calls',
  });

  const d200 = route(200, 10, 5);
  const p200 = prepareRoute(parseRoute(d200));
  const gc = (globalThis as { gc?: () => void }).gc;
  gc?.();
  const before = process.memoryUsage().heapUsed;
  let peak = before;
  const timer = setInterval(() => (peak = Math.max(peak, process.memoryUsage().heapUsed)), 1);
  const r200 = measure(
    '200-step route, 10 components',
    () => {
      const r = evaluatePrepared(p200, null);
      peak = Math.max(peak, process.memoryUsage().heapUsed);
      return r;
    },
    { samples: 20, batch: 2, warmup: 5, targetUs: 50000 },
  );
  clearInterval(timer);
  const peakMB = (peak - before) / 2 ** 20;
  out.push({
    ...r200,
    note: `heap growth during the runs ${peakMB.toFixed(1)} MB (target ≤ 50 MB, met: ${peakMB <= 50 ? 'yes' : 'NO'}); ${d200.steps.filter((s) => s.kind === 'distillation').length} distillations`,
  });

  const t0 = performance.now();
  monteCarlo(d30, { draws: 1000, seed: 1 });
  const mcUs = (performance.now() - t0) * 1000;
  out.push({
    name: '1000 Monte Carlo draws, 30-step route',
    medianUs: mcUs,
    p95Us: mcUs,
    iterations: 1,
    target: '≤ 5000000 µs',
    meetsTarget: mcUs <= 5e6,
    note: 'one run, single thread',
  });

  // Cost against steps and components (washes only, no distillation; and with distillations).
  for (const [steps, compounds, dist] of [
    [10, 2, false],
    [30, 2, false],
    [100, 2, false],
    [30, 6, false],
    [30, 12, false],
    [30, 2, true],
  ] as const) {
    const d = generateRoute({
      seed: 3,
      steps,
      compounds,
      weights: { ...BENCH_WEIGHTS, wash: 6, extraction: 0, distillation: dist ? 2 : 0, cvswap: 0 },
    });
    const p = prepareRoute(parseRoute(d));
    out.push({
      ...measure(
        `scaling: ${steps} steps × ${d.components.length} components${dist ? ', with distillations' : ''}`,
        () => evaluatePrepared(p, null),
        { samples: 30, batch: 3, warmup: 10 },
      ),
      note: `${d.steps.filter((s) => s.kind === 'distillation').length} distillations`,
    });
  }
  return out;
}
