// The chromatograms feature's public face: what other features may import.
export { StepSamples } from './components/step-samples';
