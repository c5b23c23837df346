/// <reference lib="webworker" />
/**
 * Runs the shared route engine off the main thread, so typing in the editor
 * never waits for a mass balance. One message in (a document and its
 * revision), one message out (the result, or the issues naming step and field).
 *
 * The engine's document caches (fitted solubility curves, UNIFAC models) are
 * kept here between messages, keyed by the route's component set, so an edit
 * of a step's setting does not rebuild them. They depend on the components
 * only and make no number differ from a fresh evaluation.
 */
import {
  evaluatePrepared,
  parseRoute,
  prepareRoute,
  type RouteResult,
} from '@shared/engine/route/evaluate';
import { createEvaluationCaches, type EvaluationCaches } from '@shared/engine/route/context';
import { RouteValidationError } from '@shared/engine/route/errors';

export type EvaluateRequest = { revision: number; document: unknown };
export type EvaluateReply =
  | { revision: number; ok: true; result: RouteResult; ms: number }
  | {
      revision: number;
      ok: false;
      issues: Array<{ stepId: string | null; field: string; message: string }>;
      ms: number;
    };

/** Component sets whose caches are kept (most recently used last); a few cover undo, redo and switching routes. */
const KEPT = 4;
const kept = new Map<string, EvaluationCaches>();

function cachesFor(components: unknown): EvaluationCaches {
  const key = JSON.stringify(components);
  let caches = kept.get(key);
  if (caches) kept.delete(key);
  else caches = createEvaluationCaches();
  kept.set(key, caches);
  while (kept.size > KEPT) kept.delete(kept.keys().next().value!);
  return caches;
}

self.onmessage = (event: MessageEvent<EvaluateRequest>) => {
  const { revision, document } = event.data;
  const t0 = performance.now();
  let reply: EvaluateReply;
  try {
    const parsed = parseRoute(document);
    const prepared = prepareRoute(parsed);
    prepared.caches = cachesFor(parsed.components);
    const result = evaluatePrepared(prepared, null);
    reply = { revision, ok: true, result, ms: performance.now() - t0 };
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
