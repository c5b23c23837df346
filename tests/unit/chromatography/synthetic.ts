/**
 * Synthetic chromatograms with analytically known peaks (invented data).
 * A Gaussian of height h and standard deviation σ has area h·σ·√(2π) and
 * width at half height 2σ·√(2 ln 2); a bi-Gaussian (σf in front, σb behind)
 * has area h·√(2π)·(σf + σb)/2 and symmetry factor As = (σf + σb)/(2σf).
 */
export interface PeakSpec {
  tR: number;
  h: number;
  sigma: number;
  /** Standard deviation of the trailing half; equals sigma when absent (symmetric). */
  sigmaBack?: number;
}

export const gaussianArea = (p: PeakSpec) =>
  (p.h * Math.sqrt(2 * Math.PI) * (p.sigma + (p.sigmaBack ?? p.sigma))) / 2;

export const HALF_WIDTH_FACTOR = 2 * Math.sqrt(2 * Math.LN2); // 2.35482…

/** A deterministic standard normal generator (Park–Miller with Box–Muller). */
export function normalNoise(seed = 1) {
  let s = seed;
  const u = () => {
    s = (s * 16807) % 2147483647;
    return s / 2147483647;
  };
  return () => Math.sqrt(-2 * Math.log(u())) * Math.cos(2 * Math.PI * u());
}

export function synthesize(options: {
  peaks: PeakSpec[];
  points: number;
  endMin: number;
  startMin?: number;
  baseline?: (t: number) => number;
  noise?: number;
  seed?: number;
}) {
  const { points, endMin } = options;
  const start = options.startMin ?? 0;
  const noise = normalNoise(options.seed ?? 7);
  const timeMin = new Float64Array(points);
  const signal = new Float64Array(points);
  for (let i = 0; i < points; i++) {
    const t = start + ((endMin - start) * i) / (points - 1);
    timeMin[i] = t;
    let v = options.baseline ? options.baseline(t) : 0;
    for (const p of options.peaks) {
      const sd = t < p.tR ? p.sigma : (p.sigmaBack ?? p.sigma);
      v += p.h * Math.exp(-((t - p.tR) ** 2) / (2 * sd * sd));
    }
    signal[i] = v + (options.noise ? options.noise * noise() : 0);
  }
  return { timeMin, signal };
}
