/**
 * Chromatogram reading and processing, shared by the server (the stored
 * record) and the client (the viewer). Pure: no I/O, no database, no DOM.
 * docs/methods.md, "Chromatograms", describes every method and its source.
 */
export * from './types';
export {
  processTrace,
  checkTrace,
  plateNumber,
  resolution,
  symmetryFactor,
  noiseStd,
  morphologicalBaseline,
  prominentMaxima,
  TraceError,
  MIN_TRACE_POINTS,
} from './processing';
export {
  parseDelimitedText,
  parseNumber,
  MAX_HEADER_LINE_CHARS,
  type ParsedTextTrace,
} from './parse-text';
export { parseAndi, isNetcdfClassic, andiTimestamp, type ParsedAndiTrace } from './andi';
export { decimateTrace, MAX_DISPLAY_POINTS } from './decimate';
export {
  backCalculateD,
  kremserRemaining,
  type WashCalibration,
  type WashCalibrationInput,
} from './calibration';
export { predictedLevels, sampledPort, type PredictedLevel } from './levels';
