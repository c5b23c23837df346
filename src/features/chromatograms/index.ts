// The chromatograms feature's public face: what other features may import.
export { StepSamples } from './components/step-samples';
export {
  WashCalibration,
  type MeasuredPartition,
  type WashContext,
} from './components/calibration';
