/** The route optimiser: seeded differential evolution over the parameters the chemist frees. */
export * from './optimise';
export {
  freeParamChoices,
  isIntegerParam,
  paramLabel,
  readParam,
  withParams,
  type FreeParamChoice,
} from './route-params';
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
