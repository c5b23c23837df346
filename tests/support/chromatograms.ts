/**
 * Chromatogram files for tests, made from Gaussian peaks whose areas are
 * known analytically (invented data): area = h·σ·√(2π).
 */
export interface GaussianPeak {
  /** Retention time [min]. */
  tR: number;
  /** Height [signal units]. */
  h: number;
  /** Standard deviation [min]. */
  sigma: number;
}

export const gaussianPeakArea = (p: GaussianPeak) => p.h * p.sigma * Math.sqrt(2 * Math.PI);

/** A CSV export: a metadata line, a header, then time [min] and signal columns. */
export function gaussianCsv(options: {
  peaks: GaussianPeak[];
  endMin?: number;
  points?: number;
  /** Extra signal columns: name → peaks. */
  extraSignals?: Record<string, GaussianPeak[]>;
  decimalComma?: boolean;
}): string {
  const endMin = options.endMin ?? 10;
  const points = options.points ?? 3001;
  const signals: Array<[string, GaussianPeak[]]> = [
    ['UV 254 nm (mAU)', options.peaks],
    ...Object.entries(options.extraSignals ?? {}),
  ];
  const separator = options.decimalComma ? ';' : ',';
  const format = (v: number) =>
    options.decimalComma ? v.toFixed(6).replace('.', ',') : v.toFixed(6);
  const lines = [
    '# Invented test chromatogram',
    ['Time (min)', ...signals.map(([name]) => name)].join(separator),
  ];
  for (let i = 0; i < points; i++) {
    const t = (endMin * i) / (points - 1);
    const values = signals.map(([, peaks]) =>
      peaks.reduce((sum, p) => sum + p.h * Math.exp(-((t - p.tR) ** 2) / (2 * p.sigma ** 2)), 0),
    );
    lines.push([format(t), ...values.map(format)].join(separator));
  }
  return lines.join('\n') + '\n';
}

/** Three peaks of the demo route: the product, the des-chloro impurity and the acid (invented). */
export const DEMO_PEAKS: GaussianPeak[] = [
  { tR: 2.5, h: 20, sigma: 0.05 },
  { tR: 4.0, h: 400, sigma: 0.06 },
  { tR: 6.2, h: 8, sigma: 0.07 },
];
