/**
 * Shapes of the chromatogram processing: a trace in minutes, the options of
 * the processing, and the peak table it produces. Plain data only, so the
 * same shapes cross the wire and are stored.
 */

/** A detector trace: times in minutes (strictly increasing) and the signal in detector units. */
export interface Trace {
  timeMin: Float64Array | number[];
  signal: Float64Array | number[];
}

/** A hand-set integration window [min]. */
export interface IntegrationWindow {
  startMin: number;
  endMin: number;
}

export interface ProcessingOptions {
  /**
   * Savitzky–Golay window [points, odd, ≥ 5]; the polynomial order is 3.
   * Default: 9 points, or fewer when the trace is short.
   */
  smoothingWindow?: number;
  /**
   * Smallest peak height reported, as a fraction of the tallest peak [-].
   * Default 0.0005 (0.05 %), in the spirit of the usual 0.05 % reporting threshold.
   */
  minRelativeHeight?: number;
  /** Smallest peak height as a multiple of the baseline noise (standard deviation) [-]. Default 10. */
  minSignalToNoise?: number;
  /**
   * Hand-set integration windows. When given, they replace the automatic
   * peak detection: each window is one peak.
   */
  integration?: IntegrationWindow[] | null;
}

/** One row of the peak table. Times and widths in minutes; area in signal units × minutes. */
export interface ProcessedPeak {
  /** Apex time, refined by a parabola through the three highest points [min]. */
  retentionMin: number;
  /** Apex height above the peak's baseline [signal units]. */
  height: number;
  /** Area between the signal and the peak's baseline [signal units × min]. */
  area: number;
  /** Share of the summed area of all peaks [%]. */
  areaPct: number;
  /** Integration limits [min]. */
  startMin: number;
  endMin: number;
  /** Peak width at half height, w0.5 [min]; null when the signal does not fall to half height inside the limits. */
  widthHalfMin: number | null;
  /** Peak width at 5 % of the height, w0.05 [min]; null when not reached inside the limits. */
  width5Min: number | null;
  /** Front half-width at 5 % height, d (apex to leading edge) [min]. */
  front5Min: number | null;
  /** Plate number N = 5.54 (tR / w0.5)² [-]. */
  plates: number | null;
  /** Symmetry factor As = w0.05 / 2d [-]. */
  symmetry: number | null;
  /** Resolution from the previous peak Rs = 1.18 (tR2 − tR1)/(w0.5,1 + w0.5,2) [-]; null for the first peak. */
  resolution: number | null;
  /** The straight baseline under the peak: its value at the start and end limits [signal units]. */
  baselineStart: number;
  baselineEnd: number;
}

export interface ProcessingResult {
  peaks: ProcessedPeak[];
  /** Estimated standard deviation of the baseline noise [signal units]. */
  noise: number;
  /** The global baseline used to find peaks and limits, decimated for drawing. */
  baseline: { timeMin: number[]; signal: number[] };
  /** 'automatic' or 'manual' (hand-set windows). */
  integration: 'automatic' | 'manual';
  /** Plain sentences about anything the chemist should know (limits clipped, widths not measurable ...). */
  warnings: string[];
  /** Settings actually used, for the record. */
  settings: {
    smoothingWindow: number;
    polynomial: number;
    minHeight: number;
    /** Width of the morphological baseline window [min]. */
    baselineWindowMin: number;
  };
}
