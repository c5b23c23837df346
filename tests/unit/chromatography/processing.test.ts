import { describe, expect, it } from 'vitest';
import {
  plateNumber,
  processTrace,
  resolution,
  symmetryFactor,
  TraceError,
} from '@shared/chromatography';
import { gaussianArea, HALF_WIDTH_FACTOR, synthesize, type PeakSpec } from './synthetic';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('USP <621> / Ph. Eur. 2.2.46 formulas against values computed by hand', () => {
  // Formulas as printed in USP <621> (harmonised text) and Ph. Eur. 2.2.46, quoted
  // from memory (the primary text was not at hand); the numbers below are worked by hand.
  it('plate number N = 5.54 (tR / w0.5)²', () => {
    // tR = 10 min, w0.5 = 0.2 min: 5.54 × 50² = 13 850.
    expect(plateNumber(10, 0.2)).toBeCloseTo(13850, 6);
  });
  it('resolution Rs = 1.18 (tR2 − tR1)/(w0.5,1 + w0.5,2)', () => {
    // 1.18 × 0.5 / 0.22 = 2.681818…
    expect(resolution(5, 5.5, 0.1, 0.12)).toBeCloseTo(2.681818, 5);
  });
  it('symmetry factor As = w0.05 / 2d', () => {
    // w0.05 = 0.30 min, d = 0.10 min: 0.30 / 0.20 = 1.5.
    expect(symmetryFactor(0.3, 0.1)).toBeCloseTo(1.5, 12);
  });
});

describe('one Gaussian peak on a flat baseline (no noise)', () => {
  const peak: PeakSpec = { tR: 6, h: 80, sigma: 0.05 };
  const trace = synthesize({ peaks: [peak], points: 6000, endMin: 12, baseline: () => 1.5 });
  const result = processTrace(trace);

  it('finds exactly one peak', () => {
    expect(result.peaks).toHaveLength(1);
    expect(result.warnings).toEqual([]);
  });
  it('integrates the analytic area h·σ·√(2π) within 0.05 %', () => {
    const p = result.peaks[0];
    // 80 × 0.05 × 2.50663 = 10.0265 signal·min.
    expect(gaussianArea(peak)).toBeCloseTo(10.02651, 4);
    expect(rel(p.area, gaussianArea(peak))).toBeLessThan(5e-4);
    expect(p.areaPct).toBeCloseTo(100, 10);
  });
  it('places the apex and measures the height', () => {
    const p = result.peaks[0];
    expect(p.retentionMin).toBeCloseTo(6, 4);
    expect(rel(p.height, 80)).toBeLessThan(1e-3);
  });
  it('measures w0.5 = 2σ√(2 ln 2), N, and As = 1 for a symmetric peak', () => {
    const p = result.peaks[0];
    const w = HALF_WIDTH_FACTOR * 0.05; // 0.117741 min
    expect(rel(p.widthHalfMin!, w)).toBeLessThan(2e-3);
    // N = 5.54 (6 / 0.117741)² = 14 386 (worked by hand).
    expect(rel(p.plates!, 14386)).toBeLessThan(5e-3);
    expect(p.symmetry!).toBeCloseTo(1, 2);
    expect(p.resolution).toBeNull();
  });
});

describe('several peaks on a sloping, curved baseline', () => {
  const peaks: PeakSpec[] = [
    { tR: 3, h: 100, sigma: 0.04 },
    { tR: 3.3, h: 5, sigma: 0.04 },
    { tR: 8, h: 40, sigma: 0.1 },
    { tR: 15, h: 1, sigma: 0.08 },
  ];
  const trace = synthesize({
    peaks,
    points: 20000,
    endMin: 20,
    baseline: (t) => 2 + 0.1 * t + 0.002 * t * t,
  });
  const result = processTrace(trace);

  it('finds the four peaks in order', () => {
    expect(result.peaks.map((p) => Number(p.retentionMin.toFixed(2)))).toEqual([3, 3.3, 8, 15]);
  });
  it('integrates each within 0.5 % of h·σ·√(2π), the small late one included', () => {
    result.peaks.forEach((p, k) => expect(rel(p.area, gaussianArea(peaks[k]))).toBeLessThan(5e-3));
  });
  it('area % adds to 100', () => {
    expect(result.peaks.reduce((s, p) => s + p.areaPct, 0)).toBeCloseTo(100, 9);
  });
  it('gives the resolution of neighbours from their widths (hand check for the first pair)', () => {
    // Rs = 1.18 × 0.3 / (2 × 2.35482 × 0.04) = 1.8793.
    expect(result.peaks[1].resolution!).toBeCloseTo(1.8793, 2);
  });
});

describe('a tailing peak (bi-Gaussian, σ behind = 3 σ in front)', () => {
  const peak: PeakSpec = { tR: 5, h: 50, sigma: 0.04, sigmaBack: 0.12 };
  const result = processTrace(synthesize({ peaks: [peak], points: 8000, endMin: 10 }));
  it('gives As = (σf + σb)/(2σf) = 2 and the analytic area', () => {
    const p = result.peaks[0];
    expect(rel(p.symmetry!, 2)).toBeLessThan(0.02);
    expect(rel(p.area, gaussianArea(peak))).toBeLessThan(1e-3);
  });
});

describe('where the processing is pushed', () => {
  it('a narrow peak with five points across its half width: area within 0.1 %, width within 3 %', () => {
    // dt = 0.01 min, σ = 0.02 min: 2 points per σ.
    const peak: PeakSpec = { tR: 4, h: 10, sigma: 0.02 };
    const result = processTrace(synthesize({ peaks: [peak], points: 801, endMin: 8 }));
    expect(result.peaks).toHaveLength(1);
    const p = result.peaks[0];
    expect(rel(p.area, gaussianArea(peak))).toBeLessThan(1e-3);
    expect(rel(p.widthHalfMin!, HALF_WIDTH_FACTOR * 0.02)).toBeLessThan(0.03);
    expect(rel(p.height, 10)).toBeLessThan(0.02);
  });

  it('noise: the peak area stays within 1 % at S/N (h/σ) = 500 and 3 % at 50, over five seeds', () => {
    const peak: PeakSpec = { tR: 5, h: 1, sigma: 0.08 };
    for (const [noise, tol] of [
      [0.002, 0.01],
      [0.02, 0.03],
    ] as const) {
      for (let seed = 1; seed <= 5; seed++) {
        const r = processTrace(
          synthesize({
            peaks: [peak],
            points: 10000,
            endMin: 10,
            noise,
            seed,
            baseline: () => 0.5,
          }),
        );
        expect(r.peaks).toHaveLength(1);
        expect(rel(r.peaks[0].area, gaussianArea(peak))).toBeLessThan(tol);
      }
    }
  });

  it('noise on a peak top with hundreds of points per width gives one peak, not many', () => {
    const r = processTrace(
      synthesize({ peaks: [{ tR: 5, h: 1, sigma: 0.2 }], points: 50000, endMin: 10, noise: 0.02 }),
    );
    expect(r.peaks).toHaveLength(1);
  });

  it('fused peaks (Rs ≈ 0.8): a perpendicular drop; the sum is right, the split is biased and widths may be missing', () => {
    const peaks: PeakSpec[] = [
      { tR: 5, h: 10, sigma: 0.1 },
      { tR: 5.3, h: 10, sigma: 0.1 },
    ];
    const r = processTrace(synthesize({ peaks, points: 4000, endMin: 10 }));
    expect(r.peaks).toHaveLength(2);
    const total = r.peaks[0].area + r.peaks[1].area;
    expect(rel(total, 2 * gaussianArea(peaks[0]))).toBeLessThan(1e-3);
    // Equal peaks split at the valley: each half is exact by symmetry.
    expect(rel(r.peaks[0].area, gaussianArea(peaks[0]))).toBeLessThan(1e-2);
    expect(r.peaks[1].startMin).toBe(r.peaks[0].endMin);
  });

  it('a flat noisy trace has no peaks, and says so', () => {
    const r = processTrace(synthesize({ peaks: [], points: 3000, endMin: 10, noise: 0.01 }));
    expect(r.peaks).toEqual([]);
    expect(r.warnings.join(' ')).toMatch(/No peak/);
  });

  it('100 000 points are processed (no timing asserted: see tests/bench)', () => {
    const r = processTrace(
      synthesize({
        peaks: [
          { tR: 5, h: 100, sigma: 0.03 },
          { tR: 12, h: 3, sigma: 0.05 },
        ],
        points: 100000,
        endMin: 20,
        noise: 0.01,
      }),
    );
    expect(r.peaks.map((p) => Math.round(p.retentionMin))).toEqual([5, 12]);
  });
});

describe('integration limits set by hand', () => {
  const peaks: PeakSpec[] = [
    { tR: 5, h: 10, sigma: 0.1 },
    { tR: 5.3, h: 10, sigma: 0.1 },
    { tR: 8, h: 4, sigma: 0.1 },
  ];
  const trace = synthesize({ peaks, points: 4000, endMin: 10, baseline: () => 1 });

  it('one window over the fused pair gives one peak with both areas', () => {
    const r = processTrace(trace, {
      integration: [
        { startMin: 4.4, endMin: 5.9 },
        { startMin: 7.4, endMin: 8.6 },
      ],
    });
    expect(r.integration).toBe('manual');
    expect(r.peaks).toHaveLength(2);
    expect(rel(r.peaks[0].area, 2 * gaussianArea(peaks[0]))).toBeLessThan(1e-3);
    expect(rel(r.peaks[1].area, gaussianArea(peaks[2]))).toBeLessThan(1e-3);
    expect(r.peaks[0].startMin).toBeCloseTo(4.4, 2);
  });

  it('moving a limit further out along the baseline keeps the area; cutting into the peak loses area', () => {
    const wide = processTrace(trace, { integration: [{ startMin: 7, endMin: 9.2 }] });
    expect(rel(wide.peaks[0].area, gaussianArea(peaks[2]))).toBeLessThan(1e-3);
    const cut = processTrace(trace, { integration: [{ startMin: 7.9, endMin: 8.6 }] });
    expect(cut.peaks[0].area).toBeLessThan(0.8 * gaussianArea(peaks[2]));
    expect(cut.peaks[0].startMin).toBeCloseTo(7.9, 2);
  });

  it('windows outside the run, overlapping or back to front are left out with a reason', () => {
    const r = processTrace(trace, {
      integration: [
        { startMin: 7.4, endMin: 8.6 },
        { startMin: 8.0, endMin: 9.0 },
        { startMin: 12, endMin: 13 },
        { startMin: 3, endMin: 2 },
      ],
    });
    expect(r.peaks).toHaveLength(1);
    expect(r.warnings.join(' ')).toMatch(/overlaps/);
    expect(r.warnings.join(' ')).toMatch(/outside the run/);
    expect(r.warnings.join(' ')).toMatch(/ends before it starts/);
  });
});

describe('traces that cannot be processed', () => {
  it('refuses times that do not increase, naming the point', () => {
    expect(() =>
      processTrace({ timeMin: [0, 1, 2, 2, 3, 4, 5, 6, 7, 8], signal: new Array(10).fill(0) }),
    ).toThrow(/point 4/);
  });
  it('refuses fewer than ten points', () => {
    expect(() => processTrace({ timeMin: [0, 1, 2], signal: [0, 1, 0] })).toThrow(TraceError);
  });
  it('refuses a value that is not a number', () => {
    const t = Array.from({ length: 12 }, (_, i) => i);
    const y = t.map(() => 0);
    y[5] = Number.NaN;
    expect(() => processTrace({ timeMin: t, signal: y })).toThrow(/point 6 is not a number/);
  });
});
