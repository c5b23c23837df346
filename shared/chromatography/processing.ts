/**
 * Chromatogram processing: smoothing, baseline, peak detection, integration
 * and the system-suitability figures. Pure: plain arrays in, plain data out,
 * no I/O. docs/methods.md ("Chromatograms") states every method with its source.
 *
 * Units: time in minutes, signal in the detector's unit, area in signal × min.
 *
 * 1. Smoothing — Savitzky–Golay, cubic, window of 9 points by default
 *    (Savitzky & Golay, Anal. Chem. 36 (1964) 1627; the ml.js
 *    `ml-savitzky-golay-generalized` implementation, which accepts uneven
 *    spacing). The smoothed trace is used to find apexes, limits and widths;
 *    areas are taken from the raw signal.
 * 2. Global baseline — a morphological opening (flat rolling ball) of the
 *    smoothed trace over a window of a tenth of the run (wider when a peak is
 *    broad), refined four times on its own residual so that a sloping
 *    baseline does not ride high under a peak. It serves to find the peaks and
 *    where they return to the baseline; it is not the integration baseline.
 *    (airPLS, `ml-airpls`, was tried first: on a noise-free trace it stops
 *    after a few iterations a visible offset above the true baseline.)
 * 3. Detection — local maxima of the baseline-corrected smoothed trace whose
 *    height and topographic prominence (height above the higher of the two
 *    lowest points that separate it from a taller maximum) both reach
 *    10 × the noise standard deviation and 0.05 % of the tallest peak. The
 *    prominence test drops noise wiggles on a peak top and keeps a real
 *    shoulder with a dip. (ml-gsd was tried first: on traces with tens of
 *    points per peak width and noise it reports the wiggles and misses the peak.)
 * 4. Limits — from each apex outward until the corrected signal falls to
 *    max(3 σ, 10⁻⁴ H), or to the lowest point between two apexes (a valley).
 * 5. Integration — peaks that meet at a valley form a cluster with one
 *    straight baseline from the cluster's start to its end, split by a
 *    perpendicular drop at each valley (common practice of chromatography
 *    data systems; no source). Area = trapezoidal rule of (signal − baseline).
 * 6. System suitability — USP <621> and Ph. Eur. 2.2.46 (harmonised text):
 *      N  = 5.54 (tR / w0.5)²
 *      Rs = 1.18 (tR2 − tR1) / (w0.5,1 + w0.5,2)
 *      As = w0.05 / 2d
 *    with w0.5 and w0.05 the widths at half and at 5 % of the height and d the
 *    distance from the apex to the leading edge at 5 % height.
 */
import { sgg } from 'ml-savitzky-golay-generalized';
import { xyReduce } from 'ml-spectra-processing';
import type {
  IntegrationWindow,
  ProcessedPeak,
  ProcessingOptions,
  ProcessingResult,
  Trace,
} from './types';

/** The trace cannot be processed; the message is a plain sentence for the chemist. */
export class TraceError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'TraceError';
  }
}

export const DEFAULT_SMOOTHING_WINDOW = 9;
export const SG_POLYNOMIAL = 3;
export const DEFAULT_MIN_RELATIVE_HEIGHT = 0.0005;
export const DEFAULT_MIN_SIGNAL_TO_NOISE = 10;
/** Fewest points a trace must have to be processed. */
export const MIN_TRACE_POINTS = 10;
/** Points of the decimated global baseline kept for drawing. */
const BASELINE_DRAW_POINTS = 1000;
/** Limits end where the corrected signal falls below this share of the apex height (noise-free traces). */
const LIMIT_RELATIVE_LEVEL = 1e-4;
/** … or below this multiple of the noise standard deviation of the smoothed, corrected trace. */
const LIMIT_NOISE_MULTIPLE = 1;

/** Checks a trace: equal lengths, finite numbers, strictly increasing times. */
export function checkTrace(trace: Trace): void {
  const { timeMin: t, signal: y } = trace;
  if (t.length !== y.length)
    throw new TraceError('The time and signal columns have different lengths.');
  if (t.length < MIN_TRACE_POINTS)
    throw new TraceError(
      `The trace has ${t.length} data point${t.length === 1 ? '' : 's'}; at least ${MIN_TRACE_POINTS} are needed.`,
    );
  for (let i = 0; i < t.length; i++) {
    if (!Number.isFinite(t[i]) || !Number.isFinite(y[i]))
      throw new TraceError(`Data point ${i + 1} is not a number.`);
    if (i > 0 && !(t[i] > t[i - 1]))
      throw new TraceError(
        `The times do not increase at data point ${i + 1} (${t[i - 1]} then ${t[i]} min).`,
      );
  }
}

/**
 * Processes one trace into its peak table.
 *
 * @param trace times [min] and signal [detector units]
 * @param options smoothing window [points], detection thresholds, hand-set integration windows [min]
 * @returns the peaks with area %, USP/Ph. Eur. figures, the noise and the drawn baseline, with warnings
 */
export function processTrace(trace: Trace, options: ProcessingOptions = {}): ProcessingResult {
  checkTrace(trace);
  const t = Float64Array.from(trace.timeMin);
  const y = Float64Array.from(trace.signal);
  const n = t.length;
  const warnings: string[] = [];

  const noise = noiseStd(y);
  const run = t[n - 1] - t[0];
  const window = smoothingWindow(
    options.smoothingWindow ??
      Math.min(DEFAULT_SMOOTHING_WINDOW, narrowestPeakPoints(t, y, noise, options)),
    n,
  );
  const ys = window >= 5 ? sgg(y, t, { windowSize: window, polynomial: SG_POLYNOMIAL }) : y;
  const edge = Math.max(2, Math.ceil(window / 2));
  // First pass with a window of a tenth of the run; widen it when a peak is broader.
  let structureMin = run / 10;
  let b = morphologicalBaseline(t, ys, structureMin);
  const widest = widestHalfWidth(t, ys, b, edge);
  if (8 * widest > structureMin) {
    structureMin = Math.min(run, 8 * widest);
    b = morphologicalBaseline(t, ys, structureMin);
  }
  const c = new Float64Array(n);
  for (let i = 0; i < n; i++) c[i] = ys[i] - b[i];

  let tallest = 0;
  for (let i = edge; i < n - edge; i++) if (c[i] > tallest) tallest = c[i];
  const minHeight = Math.max(
    (options.minRelativeHeight ?? DEFAULT_MIN_RELATIVE_HEIGHT) * tallest,
    (options.minSignalToNoise ?? DEFAULT_MIN_SIGNAL_TO_NOISE) * noise,
    Number.MIN_VALUE,
  );

  const manual = options.integration && options.integration.length > 0;
  const segments = manual
    ? manualSegments(t, options.integration!, warnings)
    : automaticSegments(t, c, robustStd(c), minHeight, edge);

  const peaks: ProcessedPeak[] = [];
  segments.forEach((cluster, k) => {
    const s0 = cluster.start;
    const e0 = cluster.end;
    // Anchor the line so that noise does not tilt it: a hand-set window on the
    // mean over half a smoothing window around each limit; a detected peak on
    // the mean of the raw signal just outside it (a quarter of its width,
    // short of the neighbouring peaks), at the mean time of those points.
    let a0: [number, number];
    let a1: [number, number];
    if (manual) {
      a0 = [t[s0], anchor(ys, s0, edge)];
      a1 = [t[e0], anchor(ys, e0, edge)];
    } else {
      const reach = Math.max(edge, Math.round((e0 - s0) / 4));
      const before = k > 0 ? segments[k - 1].end : 0;
      const after = k < segments.length - 1 ? segments[k + 1].start : n - 1;
      a0 = outsideMean(t, y, Math.max(before, s0 - reach), s0);
      a1 = outsideMean(t, y, e0, Math.min(after, e0 + reach));
    }
    const line = (i: number) => a0[1] + ((a1[1] - a0[1]) * (t[i] - a0[0])) / (a1[0] - a0[0] || 1);
    for (const [s, e] of cluster.parts) {
      const peak = measurePeak(t, y, ys, line, s, e, window);
      if (peak) peaks.push(peak);
      else
        warnings.push(
          `The window ${t[s].toFixed(3)}–${t[e].toFixed(3)} min holds no peak above its baseline; it was left out.`,
        );
    }
  });

  const total = peaks.reduce((sum, p) => sum + Math.max(p.area, 0), 0);
  for (let k = 0; k < peaks.length; k++) {
    const p = peaks[k];
    p.areaPct = total > 0 ? (100 * Math.max(p.area, 0)) / total : 0;
    const prev = peaks[k - 1];
    p.resolution =
      prev && prev.widthHalfMin !== null && p.widthHalfMin !== null
        ? resolution(prev.retentionMin, p.retentionMin, prev.widthHalfMin, p.widthHalfMin)
        : null;
  }
  if (peaks.some((p) => p.widthHalfMin === null))
    warnings.push(
      'For peaks that do not fall to half height before the next one, width, plate number and resolution are not given.',
    );
  if (!manual && peaks.length === 0)
    warnings.push('No peak rises clearly above the baseline noise. Set the integration by hand.');

  const drawn = xyReduce(
    { x: t, y: b },
    { nbPoints: Math.min(BASELINE_DRAW_POINTS, n), optimize: true },
  );
  return {
    peaks,
    noise,
    baseline: { timeMin: Array.from(drawn.x), signal: Array.from(drawn.y) },
    integration: manual ? 'manual' : 'automatic',
    warnings,
    settings: {
      smoothingWindow: window,
      polynomial: SG_POLYNOMIAL,
      minHeight,
      baselineWindowMin: structureMin,
    },
  };
}

/** Plate number N = 5.54 (tR / w0.5)² (USP <621>; Ph. Eur. 2.2.46). tR, w0.5 [min]. */
export function plateNumber(retentionMin: number, widthHalfMin: number): number {
  return 5.54 * (retentionMin / widthHalfMin) ** 2;
}

/** Resolution Rs = 1.18 (tR2 − tR1)/(w0.5,1 + w0.5,2) (USP <621>; Ph. Eur. 2.2.46). Times [min]. */
export function resolution(
  retention1Min: number,
  retention2Min: number,
  widthHalf1Min: number,
  widthHalf2Min: number,
): number {
  return (1.18 * (retention2Min - retention1Min)) / (widthHalf1Min + widthHalf2Min);
}

/** Symmetry factor As = w0.05 / 2d (USP <621> "tailing factor"; Ph. Eur. 2.2.46). Widths [min]. */
export function symmetryFactor(width5Min: number, front5Min: number): number {
  return width5Min / (2 * front5Min);
}

/** An odd window of at least 5 points, at most a third of the trace; 0 means no smoothing. */
function smoothingWindow(asked: number | undefined, n: number): number {
  let w = Math.round(asked ?? DEFAULT_SMOOTHING_WINDOW);
  w = Math.min(w, Math.floor(n / 3));
  if (w % 2 === 0) w -= 1;
  return w >= 5 ? w : 0;
}

/**
 * Robust noise standard deviation from the point-to-point differences:
 * σ = 1.4826 · MAD(Δy) / √2 (MAD scaled to σ for normal noise; differencing
 * removes slow drift and most of the peaks). Common practice.
 */
export function noiseStd(y: ArrayLike<number>): number {
  const n = y.length;
  if (n < 3) return 0;
  const d = new Float64Array(n - 1);
  for (let i = 0; i < n - 1; i++) d[i] = y[i + 1] - y[i];
  const med = median(d);
  for (let i = 0; i < d.length; i++) d[i] = Math.abs(d[i] - med);
  return (1.4826 * median(d)) / Math.SQRT2;
}

function median(values: Float64Array): number {
  const sorted = Float64Array.from(values).sort();
  const m = sorted.length >> 1;
  return sorted.length % 2 ? sorted[m] : (sorted[m - 1] + sorted[m]) / 2;
}

interface Cluster {
  start: number;
  end: number;
  /** [start, end] index pairs of the peaks in the cluster. */
  parts: Array<[number, number]>;
}

function automaticSegments(
  t: Float64Array,
  c: Float64Array,
  noise: number,
  minHeight: number,
  edge: number,
): Cluster[] {
  const n = t.length;
  const merged = prominentMaxima(c, minHeight, edge);
  const valleys = merged.slice(1).map((a, k) => argMin(c, merged[k], a));
  const spans: Array<{ s: number; e: number; leftValley: boolean; rightValley: boolean }> = [];
  for (let k = 0; k < merged.length; k++) {
    const a = merged[k];
    const level = Math.max(LIMIT_NOISE_MULTIPLE * noise, LIMIT_RELATIVE_LEVEL * c[a]);
    const lo = k > 0 ? valleys[k - 1] : 0;
    const hi = k < merged.length - 1 ? valleys[k] : n - 1;
    let s = a;
    while (s > lo && c[s] > level) s--;
    let e = a;
    while (e < hi && c[e] > level) e++;
    spans.push({
      s,
      e,
      leftValley: s === lo && k > 0,
      rightValley: e === hi && k < merged.length - 1,
    });
  }

  const clusters: Cluster[] = [];
  for (let k = 0; k < spans.length; k++) {
    const span = spans[k];
    const last = clusters[clusters.length - 1];
    if (last && span.leftValley && spans[k - 1].rightValley) {
      last.parts.push([span.s, span.e]);
      last.end = span.e;
    } else {
      clusters.push({ start: span.s, end: span.e, parts: [[span.s, span.e]] });
    }
  }
  return clusters;
}

function manualSegments(
  t: Float64Array,
  windows: IntegrationWindow[],
  warnings: string[],
): Cluster[] {
  const n = t.length;
  const sorted = [...windows].sort((a, b) => a.startMin - b.startMin);
  const clusters: Cluster[] = [];
  let lastEnd = -Infinity;
  for (const w of sorted) {
    if (!(w.endMin > w.startMin)) {
      warnings.push(
        `The window ${w.startMin}–${w.endMin} min ends before it starts; it was left out.`,
      );
      continue;
    }
    if (w.startMin < lastEnd) {
      warnings.push(
        `The window ${w.startMin}–${w.endMin} min overlaps the one before; it was left out.`,
      );
      continue;
    }
    if (w.endMin < t[0] || w.startMin > t[n - 1]) {
      warnings.push(
        `The window ${w.startMin}–${w.endMin} min lies outside the run; it was left out.`,
      );
      continue;
    }
    if (w.startMin < t[0] || w.endMin > t[n - 1])
      warnings.push(
        `The window ${w.startMin}–${w.endMin} min was clipped to the run (${t[0].toFixed(3)}–${t[n - 1].toFixed(3)} min).`,
      );
    const s = Math.max(0, lowerBound(t, w.startMin));
    const e = Math.min(n - 1, upperBound(t, w.endMin) - 1);
    if (e - s < 2) {
      warnings.push(
        `The window ${w.startMin}–${w.endMin} min holds fewer than three data points; it was left out.`,
      );
      continue;
    }
    lastEnd = w.endMin;
    clusters.push({ start: s, end: e, parts: [[s, e]] });
  }
  return clusters;
}

function measurePeak(
  t: Float64Array,
  y: Float64Array,
  ys: ArrayLike<number>,
  line: (i: number) => number,
  s: number,
  e: number,
  window: number,
): ProcessedPeak | null {
  // A narrow peak (fewer than two smoothing windows above half height) is
  // measured on the raw signal: the smoothing would flatten and widen it.
  let rawTop = -Infinity;
  for (let i = s; i <= e; i++) rawTop = Math.max(rawTop, y[i] - line(i));
  let halfPoints = 0;
  for (let i = s; i <= e; i++) if (y[i] - line(i) >= rawTop / 2) halfPoints++;
  const src = halfPoints >= 2 * window ? ys : y;
  let m = s;
  let best = -Infinity;
  for (let i = s; i <= e; i++) {
    const v = src[i] - line(i);
    if (v > best) {
      best = v;
      m = i;
    }
  }
  if (!(best > 0)) return null;
  const z = (i: number) => src[i] - line(i);

  // Parabola through the apex and its neighbours (vertex of the interpolating quadratic).
  let tR = t[m];
  let H = best;
  if (m > s && m < e) {
    const [x0, x1, x2] = [t[m - 1], t[m], t[m + 1]];
    const [f0, f1, f2] = [z(m - 1), z(m), z(m + 1)];
    const d01 = (f1 - f0) / (x1 - x0);
    const d12 = (f2 - f1) / (x2 - x1);
    const a = (d12 - d01) / (x2 - x0);
    if (a < 0) {
      const vertex = (x0 + x1) / 2 - d01 / (2 * a);
      if (vertex > x0 && vertex < x2) {
        tR = vertex;
        H = f1 + d01 * (vertex - x1) + a * (vertex - x0) * (vertex - x1);
        H = Math.max(H, best);
      }
    }
  }

  let area = 0;
  for (let i = s; i < e; i++)
    area += ((y[i] - line(i) + (y[i + 1] - line(i + 1))) * (t[i + 1] - t[i])) / 2;

  const crossing = (fraction: number, dir: -1 | 1): number | null => {
    const level = fraction * H;
    for (let i = m; dir < 0 ? i > s : i < e; i += dir) {
      const j = i + dir;
      const zi = z(i);
      const zj = z(j);
      if (zi >= level && zj < level) return t[i] + ((t[j] - t[i]) * (zi - level)) / (zi - zj);
    }
    return null;
  };
  const l50 = crossing(0.5, -1);
  const r50 = crossing(0.5, 1);
  const l5 = crossing(0.05, -1);
  const r5 = crossing(0.05, 1);
  const widthHalfMin = l50 !== null && r50 !== null ? r50 - l50 : null;
  const width5Min = l5 !== null && r5 !== null ? r5 - l5 : null;
  const front5Min = l5 !== null ? tR - l5 : null;
  return {
    retentionMin: tR,
    height: H,
    area,
    areaPct: 0,
    startMin: t[s],
    endMin: t[e],
    widthHalfMin,
    width5Min,
    front5Min,
    plates: widthHalfMin ? plateNumber(tR, widthHalfMin) : null,
    symmetry: width5Min && front5Min ? symmetryFactor(width5Min, front5Min) : null,
    resolution: null,
    baselineStart: line(s),
    baselineEnd: line(e),
  };
}

/**
 * Global baseline by a morphological opening (a flat "rolling ball"): the
 * sliding minimum, then the sliding maximum of that, over a window of
 * `windowMin` minutes, smoothed by a sliding mean of half that width and
 * raised by the median residual (the opening runs along the lower edge of the
 * noise). Exact for a straight baseline; follows curvature slower than the
 * window. Common practice (morphological baseline estimation, e.g. the
 * rolling-ball method of image processing); no source for the exact recipe.
 *
 * @param t times [min], increasing
 * @param y smoothed signal [detector units]
 * @param windowMin width of the structuring window [min]
 */
export function morphologicalBaseline(
  t: Float64Array,
  y: ArrayLike<number>,
  windowMin: number,
): Float64Array {
  const n = t.length;
  const dt = (t[n - 1] - t[0]) / (n - 1);
  const half = Math.max(1, Math.min(n - 1, Math.round(windowMin / dt / 2)));
  // Point reflection at both ends keeps a sloping baseline straight into the window's overhang.
  const pad = half * 2;
  const open = (v: ArrayLike<number>) => {
    const m = n + 2 * pad;
    const ext = new Float64Array(m);
    for (let i = 0; i < m; i++) {
      const k = i - pad;
      ext[i] =
        k < 0
          ? 2 * v[0] - v[Math.min(n - 1, -k)]
          : k >= n
            ? 2 * v[n - 1] - v[Math.max(0, 2 * (n - 1) - k)]
            : v[k];
    }
    const opened = slidingMean(
      slidingExtreme(slidingExtreme(ext, half, 'min'), half, 'max'),
      Math.max(1, Math.round(half / 2)),
    );
    return opened.subarray(pad, pad + n);
  };
  // On a sloping baseline the opening rides high under a peak (the window's
  // minimum lies beside the peak, up the slope). Opening the residual again
  // takes most of that bias out; two passes leave under 1 % of it.
  const b = Float64Array.from(open(y));
  const r = new Float64Array(n);
  for (let pass = 0; pass < PASSES; pass++) {
    for (let i = 0; i < n; i++) r[i] = y[i] - b[i];
    const correction = open(r);
    for (let i = 0; i < n; i++) b[i] += correction[i];
  }
  for (let i = 0; i < n; i++) r[i] = y[i] - b[i];
  const offset = median(r);
  for (let i = 0; i < n; i++) b[i] += offset;
  return b;
}

const PASSES = 4;

/** Sliding minimum or maximum over i − half … i + half, O(n) with a monotonic deque. */
function slidingExtreme(y: ArrayLike<number>, half: number, kind: 'min' | 'max'): Float64Array {
  const n = y.length;
  const out = new Float64Array(n);
  const dq = new Int32Array(n);
  let head = 0;
  let tail = 0;
  const better =
    kind === 'min' ? (a: number, b: number) => a <= b : (a: number, b: number) => a >= b;
  let next = 0;
  for (let i = 0; i < n; i++) {
    const hi = Math.min(n - 1, i + half);
    while (next <= hi) {
      while (tail > head && better(y[next], y[dq[tail - 1]])) tail--;
      dq[tail++] = next++;
    }
    while (dq[head] < i - half) head++;
    out[i] = y[dq[head]];
  }
  return out;
}

/** Sliding mean over i − half … i + half (shorter at the ends). */
function slidingMean(y: Float64Array, half: number): Float64Array {
  const n = y.length;
  const prefix = new Float64Array(n + 1);
  for (let i = 0; i < n; i++) prefix[i + 1] = prefix[i] + y[i];
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const lo = Math.max(0, i - half);
    const hi = Math.min(n - 1, i + half);
    out[i] = (prefix[hi + 1] - prefix[lo]) / (hi - lo + 1);
  }
  return out;
}

/** Largest width at half height among the maxima standing clearly above a first baseline [min]. */
function widestHalfWidth(t: Float64Array, ys: ArrayLike<number>, b: Float64Array, edge: number) {
  const n = t.length;
  let top = 0;
  for (let i = edge; i < n - edge; i++) top = Math.max(top, ys[i] - b[i]);
  if (!(top > 0)) return 0;
  let widest = 0;
  let i = edge;
  while (i < n - edge) {
    // A run of points above half of 2 % of the tallest: a rough peak body.
    if (ys[i] - b[i] > 0.01 * top) {
      let j = i;
      let m = i;
      while (j < n - 1 && ys[j] - b[j] > 0.01 * top) {
        if (ys[j] - b[j] > ys[m] - b[m]) m = j;
        j++;
      }
      const h = ys[m] - b[m];
      let l = m;
      while (l > i && ys[l] - b[l] > h / 2) l--;
      let r = m;
      while (r < j && ys[r] - b[r] > h / 2) r++;
      widest = Math.max(widest, t[r] - t[l]);
      i = j + 1;
    } else i++;
  }
  return widest;
}

/**
 * Local maxima of c (skipping `edge` points at each end) whose height and
 * topographic prominence both reach `threshold`, in increasing index order.
 * Prominence: the maximum's height above the higher of its two bases, a base
 * being the lowest point between it and the nearest taller maximum on that
 * side (or the end of the trace). O(n) with a monotonic stack.
 */
export function prominentMaxima(c: ArrayLike<number>, threshold: number, edge = 1): number[] {
  const n = c.length;
  const maxima: number[] = [];
  for (let i = Math.max(1, edge); i < n - Math.max(1, edge); i++) {
    if (c[i] > c[i - 1] && c[i] >= c[i + 1]) {
      // A flat top counts once, at its first point.
      maxima.push(i);
    }
  }
  const m = maxima.length;
  if (m === 0) return [];
  // valley[k]: lowest point between maxima k and k+1.
  const valley = new Float64Array(Math.max(0, m - 1));
  for (let k = 0; k < m - 1; k++) {
    let low = Infinity;
    for (let i = maxima[k]; i <= maxima[k + 1]; i++) if (c[i] < low) low = c[i];
    valley[k] = low;
  }
  let headLow = Infinity;
  for (let i = 0; i <= maxima[0]; i++) headLow = Math.min(headLow, c[i]);
  let tailLow = Infinity;
  for (let i = maxima[m - 1]; i < n; i++) tailLow = Math.min(tailLow, c[i]);

  // Walk the maxima in one direction; the stack keeps the taller ones seen so
  // far, each with the lowest point between it and the one below it.
  const bases = (order: number[], gapBefore: (k: number) => number, endLow: number) => {
    const out = new Float64Array(m);
    const stack: Array<{ h: number; link: number }> = [];
    order.forEach((k, step) => {
      const h = c[maxima[k]];
      let low = step === 0 ? endLow : gapBefore(k);
      while (stack.length && stack[stack.length - 1].h <= h) low = Math.min(low, stack.pop()!.link);
      out[k] = low;
      stack.push({ h, link: low });
    });
    return out;
  };
  const idx = Array.from({ length: m }, (_, k) => k);
  const left = bases(idx, (k) => valley[k - 1], headLow);
  const right = bases(idx.reverse(), (k) => valley[k], tailLow);
  const kept: number[] = [];
  for (let k = 0; k < m; k++) {
    const h = c[maxima[k]];
    const prominence = h - Math.max(left[k], right[k]);
    if (h >= threshold && prominence >= threshold) kept.push(maxima[k]);
  }
  return kept;
}

/** [mean time, mean signal] over the indexes lo … hi. */
function outsideMean(t: Float64Array, y: Float64Array, lo: number, hi: number): [number, number] {
  let st = 0;
  let sy = 0;
  for (let j = lo; j <= hi; j++) {
    st += t[j];
    sy += y[j];
  }
  const count = hi - lo + 1;
  return [st / count, sy / count];
}

/**
 * Points across the half height of the narrowest clear peak of the raw
 * trace (Infinity when there is none), so that the smoothing window never
 * spans a whole peak: a wider Savitzky–Golay window flattens a narrow peak
 * and puts ripples beside it.
 */
function narrowestPeakPoints(
  t: Float64Array,
  y: Float64Array,
  noise: number,
  options: ProcessingOptions,
): number {
  const n = t.length;
  const c = new Float64Array(n);
  const b = morphologicalBaseline(t, y, (t[n - 1] - t[0]) / 10);
  let top = 0;
  for (let i = 0; i < n; i++) {
    c[i] = y[i] - b[i];
    top = Math.max(top, c[i]);
  }
  const threshold = Math.max(
    (options.minRelativeHeight ?? DEFAULT_MIN_RELATIVE_HEIGHT) * top,
    // Noise on the raw trace: a higher bar than on the smoothed one.
    2 * (options.minSignalToNoise ?? DEFAULT_MIN_SIGNAL_TO_NOISE) * noise,
    Number.MIN_VALUE,
  );
  let narrowest = Infinity;
  for (const i of prominentMaxima(c, threshold, 2)) {
    let l = i;
    while (l > 0 && c[l - 1] >= c[i] / 2) l--;
    let r = i;
    while (r < n - 1 && c[r + 1] >= c[i] / 2) r++;
    narrowest = Math.min(narrowest, r - l + 1);
  }
  return narrowest;
}

/** Mean of v over i − half … i + half (clipped to the trace). */
function anchor(v: ArrayLike<number>, i: number, half: number): number {
  const lo = Math.max(0, i - half);
  const hi = Math.min(v.length - 1, i + half);
  let sum = 0;
  for (let j = lo; j <= hi; j++) sum += v[j];
  return sum / (hi - lo + 1);
}

/** 1.4826 × median absolute deviation: the standard deviation of the baseline part of a corrected trace. */
function robustStd(v: Float64Array): number {
  const med = median(v);
  const d = new Float64Array(v.length);
  for (let i = 0; i < v.length; i++) d[i] = Math.abs(v[i] - med);
  return 1.4826 * median(d);
}

function argMin(c: Float64Array, from: number, to: number): number {
  let k = from;
  for (let i = from; i <= to; i++) if (c[i] < c[k]) k = i;
  return k;
}

/** First index with t[i] ≥ x. */
function lowerBound(t: Float64Array, x: number): number {
  let lo = 0;
  let hi = t.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (t[mid] < x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** First index with t[i] > x. */
function upperBound(t: Float64Array, x: number): number {
  let lo = 0;
  let hi = t.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (t[mid] <= x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}
