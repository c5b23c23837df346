/** Shared shape and timing helper for benchmark modules (tests/bench/*.bench.ts). */

export interface BenchResult {
  /** What was timed, e.g. "UNIFAC γ, 10 components". */
  name: string;
  /** Median time per call [µs]. */
  medianUs: number;
  /** 95th percentile per call [µs]. */
  p95Us: number;
  /** Timed calls. */
  iterations: number;
  /** The target, if any, e.g. "≤ 20 µs". */
  target?: string;
  /** Whether the median meets the target (undefined if no target). */
  meetsTarget?: boolean;
  note?: string;
}

/**
 * Times `fn` in batches: each sample is the mean of `batch` calls (to rise
 * above the timer resolution), after `warmup` untimed calls. Returns the
 * median and 95th percentile of the samples, in µs per call.
 */
export function measure(
  name: string,
  fn: () => unknown,
  opts: {
    samples?: number;
    batch?: number;
    warmup?: number;
    targetUs?: number;
    note?: string;
  } = {},
): BenchResult {
  const samples = opts.samples ?? 200;
  const batch = opts.batch ?? 20;
  const warmup = opts.warmup ?? 500;
  let sink = 0;
  for (let i = 0; i < warmup; i++) sink += fn() ? 1 : 0;
  const times: number[] = [];
  for (let s = 0; s < samples; s++) {
    const t0 = performance.now();
    for (let i = 0; i < batch; i++) sink += fn() ? 1 : 0;
    times.push(((performance.now() - t0) * 1000) / batch);
  }
  times.sort((a, b) => a - b);
  const medianUs = times[Math.floor(times.length / 2)];
  const p95Us = times[Math.floor(times.length * 0.95)];
  if (sink < 0) console.log(sink); // keep the calls observable
  return {
    name,
    medianUs,
    p95Us,
    iterations: samples * batch,
    target: opts.targetUs !== undefined ? `≤ ${opts.targetUs} µs` : undefined,
    meetsTarget: opts.targetUs !== undefined ? medianUs <= opts.targetUs : undefined,
    note: opts.note,
  };
}
