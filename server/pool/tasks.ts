/**
 * The work the engine pool does, by name. This module runs inside the worker
 * threads only (server/pool/worker.mjs loads it); the web thread imports its
 * types, never its code, so the engine never runs on the thread that answers
 * requests.
 *
 * To add a task: write a function of one structured-cloneable input that
 * returns a structured-cloneable output, and add it to `tasks` under a
 * dotted name. Throw an AppError for an answer the caller should pass on
 * (it crosses the thread boundary as its status, code, message and details).
 */
import { move, transferableSymbol, valueSymbol } from 'piscina';
import type { ApiErrorBody } from '@shared/schemas/errors';
import type { DraftDocument } from '@shared/schemas/routes';
import type { RouteDocument } from '@shared/schemas/route';
import type { PreparedRoute } from '@shared/engine/route/evaluate';
import {
  mergeMonteCarloBlocks,
  runMonteCarloBlock,
  runMonteCarloChunk,
  startMonteCarlo,
  summariseMonteCarlo,
  type MonteCarloBlock,
} from '@shared/engine/route/monte-carlo';
import type { StepMemo } from '@shared/engine/route/step-memo';
import type { Equipment } from '@shared/schemas/equipment';
import {
  checkOptimiseRequest,
  optimiseProgress,
  runOptimiseChunk,
  setUpOptimise,
  startOptimise,
  summariseOptimise,
  type OptimiseRequest,
  type OptimiseSetup,
  type OptimiseState,
} from '@shared/engine/optimise/optimise';
import { ENGINE_VERSION, PROCESS_SAFETY_NOTE } from '@shared/engine/route/evaluate';
import { buildStepList } from '@shared/steplist';
import { apiError, AppError, validationFailed } from '../errors';
import {
  calcActivityCoefficients,
  calcAzeotrope,
  calcBubblePoint,
  calcHansenDistance,
  calcPartition,
  calcSolubility,
  calcVapourPressure,
} from '../services/calc';
import { evaluateDraft } from '../services/draft-evaluation';
import { monteCarloMemo, prepareWithReuse } from '../services/engine-reuse';
import { computeSolventAlternatives } from '../services/solvent-alternatives';
import {
  describeFailure,
  evaluateDocument,
  RouteEvaluationFailed,
  resultTooLarge,
} from '../services/evaluation';

const utf8 = new TextEncoder();

function prepare(document: RouteDocument): PreparedRoute {
  try {
    return prepareWithReuse(document);
  } catch (error) {
    const failure = describeFailure(error, document);
    if (failure) throw new RouteEvaluationFailed(failure);
    throw error;
  }
}

/**
 * Prepared routes of running Monte Carlo jobs (the last four), so each block skips validation and model set-up,
 * with a step memo of the job's own (steps without uncertain settings are reused draw after draw).
 */
const preparedByJob = new Map<string, { prepared: PreparedRoute; memo: StepMemo }>();
function preparedFor(cacheKey: string, document: RouteDocument) {
  let prepared = preparedByJob.get(cacheKey);
  if (!prepared) {
    const route = prepare(document);
    prepared = { prepared: route, memo: monteCarloMemo(route.doc.steps.length) };
    preparedByJob.set(cacheKey, prepared);
    if (preparedByJob.size > 4) preparedByJob.delete(preparedByJob.keys().next().value!);
  }
  return prepared;
}

/** Shared set-up of running optimisations (the engine's caches, the ICH limits). */
const setupByJob = new Map<string, OptimiseSetup>();

const CALCULATIONS = {
  'vapour-pressure': calcVapourPressure,
  'activity-coefficients': calcActivityCoefficients,
  'bubble-point': calcBubblePoint,
  azeotrope: calcAzeotrope,
  partition: calcPartition,
  solubility: calcSolubility,
  'hansen-distance': calcHansenDistance,
} as const;
export type CalculationName = keyof typeof CALCULATIONS;

export const tasks = {
  /** Nothing: answered once the worker has loaded the engine (the pool's start waits for it). */
  'pool.ready': () => null,
  /**
   * One evaluation, answered as the bytes of its JSON (serialised and encoded here, off the web
   * thread; the bytes are moved to the web thread, not copied), refused above maxReplyBytes. The
   * document is the request body the web thread parsed with the route document schema, so the
   * schema is not run again here.
   */
  'route.evaluate': (input: { document: RouteDocument; maxReplyBytes: number }) => {
    const text = JSON.stringify(evaluateDocument(input.document, { schemaChecked: true }));
    if (text.length > input.maxReplyBytes) throw resultTooLarge(text.length, input.maxReplyBytes);
    return { json: utf8.encode(text) };
  },
  /** A draft's totals and cautions; a document the engine rejects gives the reason, not an error. */
  'route.evaluateDraft': (input: { document: DraftDocument }) => evaluateDraft(input.document),
  /** Validates a document for a Monte Carlo run (422 naming the step when it cannot run). */
  'route.check': (input: { document: RouteDocument }) => {
    prepare(input.document);
    return null;
  },
  /** A whole (small) Monte Carlo run. */
  'monteCarlo.run': (input: { document: RouteDocument; draws: number; seed: number }) => {
    const prepared = prepare(input.document);
    const state = runMonteCarloChunk(
      prepared,
      startMonteCarlo({ draws: input.draws, seed: input.seed }),
      input.draws,
      monteCarloMemo(prepared.doc.steps.length),
    );
    return summariseMonteCarlo(state);
  },
  /**
   * One block of draws of a background run (runMonteCarloBlock): blocks of one run go to any
   * worker in any order; the web thread merges them with monteCarlo.summarise.
   */
  'monteCarlo.block': (input: {
    cacheKey: string;
    document: RouteDocument;
    draws: number;
    seed: number;
    block: number;
  }): MonteCarloBlock => {
    const { prepared, memo } = preparedFor(input.cacheKey, input.document);
    return runMonteCarloBlock(prepared, input, memo);
  },
  /** The summary of a run from all its blocks (merged in block order). */
  'monteCarlo.summarise': (input: {
    cacheKey: string;
    draws: number;
    seed: number;
    blocks: MonteCarloBlock[];
  }) => {
    preparedByJob.delete(input.cacheKey);
    return summariseMonteCarlo(mergeMonteCarloBlocks(input, input.blocks));
  },
  /** Checks an optimisation request: 400 naming each free parameter at fault, 422 when the route cannot run. */
  'optimise.check': (input: { request: OptimiseRequest }) => {
    const issues = checkOptimiseRequest(input.request);
    if (issues.length) throw validationFailed(issues);
    prepare(input.request.document);
    return null;
  },
  /** The next few evaluations of a background optimisation; the result once it is finished. */
  'optimise.chunk': (input: {
    cacheKey: string;
    request: OptimiseRequest;
    state: OptimiseState | null;
    evaluations: number;
  }) => {
    let setup = setupByJob.get(input.cacheKey);
    if (!setup) {
      setup = setUpOptimise(input.request);
      setupByJob.set(input.cacheKey, setup);
      if (setupByJob.size > 4) setupByJob.delete(setupByJob.keys().next().value!);
    }
    const state = runOptimiseChunk(
      setup,
      input.state ?? startOptimise(input.request),
      input.evaluations,
    );
    if (state.phase !== 'done') return { state, progress: optimiseProgress(state), result: null };
    setupByJob.delete(input.cacheKey);
    let summary;
    try {
      summary = summariseOptimise(setup, state);
    } catch (error) {
      if (!(error instanceof RangeError)) throw error;
      throw apiError('not_computable', `No candidate route could be evaluated: ${error.message}`);
    }
    return {
      state,
      progress: 1,
      result: {
        ...summary,
        engineVersion: ENGINE_VERSION,
        processSafetyNote: PROCESS_SAFETY_NOTE,
      },
    };
  },
  /** The plant step list of a document already scaled to the batch: its evaluation written as operations. */
  'stepList.build': (input: {
    document: RouteDocument;
    assignments: Record<string, Equipment>;
    available: Equipment[];
  }) => {
    const { result } = evaluateDocument(input.document);
    return buildStepList({ ...input, result });
  },
  /** The solvent substitution advisor: every library solvent tried in one step's role. */
  'solvent.alternatives': computeSolventAlternatives,
  /** One of the calculation API's computations. */
  calculate: (input: { operation: CalculationName; body: unknown }) =>
    (CALCULATIONS[input.operation] as (body: unknown) => unknown)(input.body),
} as const;

export type Tasks = typeof tasks;
export type TaskName = keyof Tasks;
export type TaskInput<K extends TaskName> = Parameters<Tasks[K]>[0];
export type TaskOutput<K extends TaskName> = ReturnType<Tasks[K]>;

/** What crosses back to the web thread: the value, or an API error to pass on. */
export type TaskReply =
  | { ok: true; value: unknown }
  | { ok: false; error: { body: ApiErrorBody; headers?: Record<string, string> } };

/**
 * A reply whose value carries bytes (`json`, a Uint8Array: an evaluation's JSON) moves their
 * buffer to the web thread instead of copying it: the web thread sends them as they are, and a
 * reply of a few hundred kB never becomes a string on its heap.
 */
function moving(reply: TaskReply & { ok: true }): TaskReply {
  const json = (reply.value as { json?: unknown } | null)?.json;
  if (!(json instanceof Uint8Array)) return reply;
  return move({
    get [transferableSymbol]() {
      return json.buffer;
    },
    get [valueSymbol]() {
      return reply;
    },
  }) as unknown as TaskReply;
}

/** The worker's entry: runs the named task. Errors that are not AppErrors are thrown (a server fault). */
export function runTask(message: { name: TaskName; input: unknown }): TaskReply {
  const task = tasks[message.name] as ((input: unknown) => unknown) | undefined;
  if (!task) throw new Error(`unknown pool task ${String(message.name)}`);
  try {
    return moving({ ok: true, value: task(message.input) });
  } catch (error) {
    if (error instanceof AppError)
      return { ok: false, error: { body: error.body, headers: error.headers } };
    throw error;
  }
}
