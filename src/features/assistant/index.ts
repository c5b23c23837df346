// The assistant feature's public face: what other features may import.
export { AdvisorPanel } from './components/advisor-panel';
export { Optimiser } from './components/optimiser';
