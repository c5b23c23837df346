/// <reference lib="webworker" />
/**
 * Runs the shared route engine off the main thread, so typing in the editor
 * never waits for a mass balance. One message in (a document and its
 * revision), one message out (the result, or the issues naming step and field).
 *
 * The engine's document caches (fitted solubility curves, UNIFAC models) are
 * kept here between messages, keyed by the route's component set, so an edit
 * of a step's setting does not rebuild them; and a step-result memo, so an
 * edit re-evaluates only the edited step and those downstream of it. Both make
 * no number differ from a fresh evaluation (shared/engine/route/step-memo.ts).
 *
 * The answer carries only what changed since the previous answer (result-delta.ts):
 * the page keeps the rest, so less is copied between the threads.
 */
import {
  evaluatePrepared,
  parseRoute,
  prepareRoute,
  type RouteResult,
} from '@shared/engine/route/evaluate';
import { cachesFor, createCachePool, createStepMemo } from '@shared/engine/route/step-memo';
import { RouteValidationError } from '@shared/engine/route/errors';
import { resultDelta, type ResultDelta } from './result-delta';

export type EvaluateRequest = { revision: number; document: unknown };
export type EvaluateReply =
  | { revision: number; ok: true; delta: ResultDelta; ms: number }
  | {
      revision: number;
      ok: false;
      issues: Array<{ stepId: string | null; field: string; message: string }>;
      ms: number;
    };

/** Component sets whose caches are kept (most recently used last); a few cover undo, redo and switching routes. */
const cachePool = createCachePool(4);
/** Step results kept: several versions of a few hundred steps (undo, redo, switching routes). */
const stepMemo = createStepMemo(1000);
/** The result of the last good answer: the next answer says only what differs from it. */
let sent: RouteResult | null = null;

self.onmessage = (event: MessageEvent<EvaluateRequest>) => {
  const { revision, document } = event.data;
  const t0 = performance.now();
  let reply: EvaluateReply;
  try {
    const parsed = parseRoute(document);
    const prepared = prepareRoute(parsed);
    prepared.caches = cachesFor(cachePool, parsed);
    const result = evaluatePrepared(prepared, null, stepMemo);
    const ms = performance.now() - t0;
    const delta = resultDelta(sent, result);
    sent = result;
    reply = { revision, ok: true, delta, ms };
  } catch (error) {
    const issues =
      error instanceof RouteValidationError
        ? error.issues
        : [
            {
              stepId: null,
              field: '',
              message: error instanceof Error ? error.message : 'The route could not be evaluated.',
            },
          ];
    reply = { revision, ok: false, issues, ms: performance.now() - t0 };
  }
  (self as unknown as DedicatedWorkerGlobalScope).postMessage(reply);
};
