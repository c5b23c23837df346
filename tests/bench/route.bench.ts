/**
 * Route evaluation benchmarks (npm run bench -- route): a 30-step route with
 * 10 components (median ≤ 5 ms), a 200-step route (≤ 50 ms, and no more than
 * 50 MB of heap beyond the loaded engine: heapNeededMB), 1000 Monte Carlo draws of the 30-step route (≤ 5 s, in the
 * engine pool as a background job runs them; also timed on one thread), and
 * the cost against steps and components. Memory is read with
 * process.memoryUsage() here only (the engine itself uses no Node APIs).
 *
 * Each route is timed three ways, side by side: every step evaluated (no step
 * memo: what a route whose steps all changed costs), the same route evaluated
 * again with the step memo (nothing changed: every step reused), and one step
 * in the middle of the order changed before every evaluation (it and the steps
 * after it evaluated, the others reused). A target met only with the memo says so.
 */
import { measure, type BenchResult } from './harness';
import { BENCH_WEIGHTS, generateRoute } from '../fixtures/routes/generate';
import { benchRoute as route } from '../fixtures/routes/corpus';
import {
  evaluatePrepared,
  parseRoute,
  prepareRoute,
  type PreparedRoute,
} from '../../shared/engine/route/evaluate';
import { monteCarlo } from '../../shared/engine/route/monte-carlo';
import { createStepMemo } from '../../shared/engine/route/step-memo';
import type { RouteDocument } from '../../shared/schemas/route';
import { createEnginePool, defaultPoolSize } from '../../server/pool';
import { runMonteCarloOnPool } from '../../server/services/monte-carlo-blocks';
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';

/**
 * The heap the 200-step route needs beyond the loaded engine [MB]: the smallest old-generation cap
 * (--max-old-space-size, 1 MB steps by bisection) under which a fresh process evaluates the route ten
 * times, less the heap in use after loading and one evaluation (after a full collection). A peak of
 * heapUsed sampled between evaluations measures instead when V8 chooses to collect: it holds tens of
 * MB of garbage that a capped heap collects sooner.
 */
function heapNeededMB(): { neededMB: number; baselineMB: number } | null {
  const child = fileURLToPath(new URL('./heap-need-child.ts', import.meta.url));
  const run = (capMB: number | null) => {
    const flags = ['--expose-gc', ...(capMB === null ? [] : [`--max-old-space-size=${capMB}`])];
    const r = spawnSync(process.execPath, [...flags, '--import', 'tsx', child, '10'], {
      encoding: 'utf8',
    });
    if (r.status !== 0) return null;
    return JSON.parse(r.stdout.trim().split('\n').pop()!) as { baselineMB: number };
  };
  const free = run(null);
  if (!free) return null;
  let lo = Math.floor(free.baselineMB);
  let hi = lo + 256;
  if (!run(hi)) return null;
  while (hi - lo > 1) {
    const mid = Math.floor((lo + hi) / 2);
    if (run(mid)) hi = mid;
    else lo = mid;
  }
  return { neededMB: hi - free.baselineMB, baselineMB: free.baselineMB };
}

/** Sets the first number of the step's settings (not an uncertainty) to `value`; returns its original value. */
function setFirstNumber(o: unknown, value: number | null): number | null {
  if (o === null || typeof o !== 'object') return null;
  for (const [k, v] of Object.entries(o as Record<string, unknown>)) {
    if (typeof v === 'number' && v > 0 && k !== 'plusMinus') {
      if (value !== null) (o as Record<string, unknown>)[k] = value;
      return v;
    }
    const inner = setFirstNumber(v, value);
    if (inner !== null) return inner;
  }
  return null;
}

/**
 * Timings with the step memo: the same route again (all steps reused), and one step in the middle
 * of the order changed before each evaluation (a new value each time, within 1 % of the original).
 */
function withMemo(
  label: string,
  p: PreparedRoute,
  targetUs: number,
  opts: { samples: number; batch: number; warmup: number },
): BenchResult[] {
  const memo = createStepMemo(5000);
  evaluatePrepared(p, null, memo);
  const repeated = {
    ...measure(`${label}, repeated unchanged (step memo)`, () => evaluatePrepared(p, null, memo), {
      ...opts,
      targetUs,
    }),
    note: 'CACHED: every step answered from the step memo (an unchanged route evaluated again)',
  };
  const position = Math.floor(p.graph.order.length / 2);
  const step = p.doc.steps.find((s) => s.id === p.graph.order[position])!;
  const original = setFirstNumber(step.params, null)!;
  let i = 0;
  const before = { hits: memo.hits, misses: memo.misses };
  const edited = measure(
    `${label}, one step changed per evaluation (step memo)`,
    () => {
      i++;
      setFirstNumber(step.params, original * (1 + (i % 997) * 1e-5));
      return evaluatePrepared(p, null, memo);
    },
    { ...opts, targetUs },
  );
  setFirstNumber(step.params, original);
  const runs = i;
  const evaluated = (memo.misses - before.misses) / runs;
  return [
    repeated,
    {
      ...edited,
      note: `step ${position + 1} of ${p.graph.order.length} (${step.kind}) changed: ${evaluated.toFixed(1)} steps evaluated per call, the rest reused`,
    },
  ];
}

export async function run(): Promise<BenchResult[]> {
  const out: BenchResult[] = [];
  const d30 = route(30, 10);
  const p30 = prepareRoute(parseRoute(d30));
  const nDist = d30.steps.filter((s) => s.kind === 'distillation').length;
  out.push({
    ...measure(
      '30-step route, 10 components, every step evaluated',
      () => evaluatePrepared(p30, null),
      {
        samples: 60,
        batch: 5,
        warmup: 30,
        targetUs: 5000,
      },
    ),
    note: `UNCACHED steps (no step memo; document caches kept): ${nDist} distillations, ${d30.steps.length} steps, ${d30.components.length} components`,
  });
  const evaluation30Us = out[0].medianUs;
  out.push(...withMemo('30-step route', p30, 5000, { samples: 60, batch: 5, warmup: 30 }));
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
    '200-step route, 10 components, every step evaluated',
    () => {
      const r = evaluatePrepared(p200, null);
      peak = Math.max(peak, process.memoryUsage().heapUsed);
      return r;
    },
    { samples: 20, batch: 2, warmup: 5, targetUs: 50000 },
  );
  clearInterval(timer);
  const peakMB = (peak - before) / 2 ** 20;
  const need = heapNeededMB();
  out.push({
    ...r200,
    note: `UNCACHED steps; heap needed ${need ? `${need.neededMB.toFixed(1)} MB beyond the loaded engine's ${need.baselineMB.toFixed(1)} MB (target ≤ 50 MB, met: ${need.neededMB <= 50 ? 'yes' : 'NO'})` : 'not measured (the capped child process failed)'}; peak heapUsed growth during the runs ${peakMB.toFixed(1)} MB${gc ? '' : ' (no --expose-gc: baseline not collected)'}, garbage V8 had not yet collected included; ${d200.steps.filter((s) => s.kind === 'distillation').length} distillations`,
  });
  out.push(...withMemo('200-step route', p200, 50000, { samples: 20, batch: 2, warmup: 5 }));

  // 1000 draws as a background job runs them: blocks spread over an engine pool with one worker
  // per core (the workers are started, have loaded the engine and are warm before the clock starts).
  const workers = defaultPoolSize();
  let pooled: Awaited<ReturnType<typeof runMonteCarloOnPool>> | undefined;
  const pool = createEnginePool({
    size: workers,
    maxQueue: 100,
    taskTimeoutMs: 600_000,
    workerMemoryMb: 1024,
  });
  try {
    await pool.run('pool.ready', undefined);
    // Warm the workers' compiled code as this thread's is warm from the runs above (a server's
    // workers are warm from earlier requests): 100 draws of another seed, not timed.
    await runMonteCarloOnPool(pool, {
      cacheKey: 'bench-warm-up',
      document: d30 as RouteDocument,
      draws: 100,
      seed: 2,
    });
    const cpu0 = process.cpuUsage();
    const t0 = performance.now();
    pooled = await runMonteCarloOnPool(pool, {
      cacheKey: 'bench',
      document: d30 as RouteDocument,
      draws: 1000,
      seed: 1,
    });
    const poolUs = (performance.now() - t0) * 1000;
    const cpu = process.cpuUsage(cpu0);
    // CPU time of the whole process (the workers' threads included) over the wall time: the
    // cores the run actually had; on a machine shared with other work it can be far below `workers`.
    const cores = (cpu.user + cpu.system) / poolUs;
    out.push({
      name: '1000 Monte Carlo draws, 30-step route',
      medianUs: poolUs,
      p95Us: poolUs,
      iterations: 1,
      target: '≤ 5000000 µs',
      meetsTarget: poolUs <= 5e6,
      note: `one run in the engine pool, ${workers} workers (blocks of 20 draws), ${cores.toFixed(2)} cores used on average; ${pooled.failedDraws} failed draws`,
    });
  } finally {
    await pool.close();
  }
  const cpu0 = process.cpuUsage();
  const t0 = performance.now();
  const sequential = monteCarlo(d30, { draws: 1000, seed: 1 });
  const mcUs = (performance.now() - t0) * 1000;
  const cpu = process.cpuUsage(cpu0);
  out.push({
    name: '1000 Monte Carlo draws, 30-step route, one thread',
    medianUs: mcUs,
    p95Us: mcUs,
    iterations: 1,
    note: `the same run in sequence on this thread, ${((cpu.user + cpu.system) / mcUs).toFixed(2)} cores used on average (the same numbers as in the pool: ${JSON.stringify(sequential) === JSON.stringify(pooled) ? 'yes' : 'NO'}); ${(mcUs / 1000 / 1000).toFixed(2)} ms per draw, ${(mcUs / 1000 / evaluation30Us).toFixed(2)}× the median of one evaluation of the route above (the crystallisation's end temperature is drawn, and the solubility at each new temperature is solved anew, where a repeated evaluation finds it memoised); every draw changes the first step, so the step memo cannot help`,
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
