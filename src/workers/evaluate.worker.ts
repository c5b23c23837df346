/// <reference lib="webworker" />
/**
 * Runs the shared route engine off the main thread, so typing in the editor
 * never waits for a mass balance. One message in (a document and its
 * revision), one message out (the result, or the issues naming step and field).
 */
import { evaluateRoute } from '@shared/engine/route/evaluate';
import { RouteValidationError } from '@shared/engine/route/errors';

export type EvaluateRequest = { revision: number; document: unknown };
export type EvaluateReply =
  | { revision: number; ok: true; result: ReturnType<typeof evaluateRoute>; ms: number }
  | { revision: number; ok: false; issues: Array<{ stepId: string | null; field: string; message: string }>; ms: number };

self.onmessage = (event: MessageEvent<EvaluateRequest>) => {
  const { revision, document } = event.data;
  const t0 = performance.now();
  let reply: EvaluateReply;
  try {
    const result = evaluateRoute(document);
    reply = { revision, ok: true, result, ms: performance.now() - t0 };
  } catch (error) {
    const issues =
      error instanceof RouteValidationError
        ? error.issues
        : [{ stepId: null, field: '', message: error instanceof Error ? error.message : 'The route could not be evaluated.' }];
    reply = { revision, ok: false, issues, ms: performance.now() - t0 };
  }
  (self as unknown as DedicatedWorkerGlobalScope).postMessage(reply);
};
