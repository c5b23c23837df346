/** The route optimiser: seeded differential evolution over the parameters the chemist frees. */
export * from './optimise';
export { paramLabel, readParam, withParams, isIntegerParam } from './route-params';
export {
  minimise,
  startDe,
  deAsk,
  deTell,
  deBest,
  notWorse,
  type Bound,
  type DeOptions,
  type DeState,
  type Score,
} from './differential-evolution';
