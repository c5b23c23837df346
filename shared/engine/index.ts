/** Public exports of the engine. Each area adds its own lines. */
export {
  evaluateRoute,
  parseRoute,
  prepareRoute,
  evaluatePrepared,
  ENGINE_VERSION,
  PROCESS_SAFETY_NOTE,
  MASS_BALANCE_TOLERANCE,
} from './route/evaluate';
export type {
  RouteResult,
  RouteTotals,
  PurgeEntry,
  ImpurityLevel,
  PreparedRoute,
} from './route/evaluate';
export { groupWarnings, type GroupedWarning } from './route/cautions';
export { purgeCascades, type PurgeCascade, type PurgeCascadeRow } from './route/purge';
export { RouteValidationError, type RouteIssue } from './route/errors';
export type { Stream, StepResult } from './route/types';
export {
  monteCarlo,
  monteCarloChunks,
  startMonteCarlo,
  runMonteCarloChunk,
  runMonteCarloBlock,
  mergeMonteCarloBlocks,
  monteCarloBlockCount,
  MONTE_CARLO_BLOCK_DRAWS,
  summariseMonteCarlo,
  type MonteCarloBlock,
  type MonteCarloResult,
  type MonteCarloState,
} from './route/monte-carlo';
export { createRandom, createStreamRandom, type SeededRandom } from './random';
