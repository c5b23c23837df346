/**
 * Live evaluation: every change of the route's model sends the document to
 * the engine worker; the latest answer is kept here, beside (never inside)
 * the editor's document. Node cards read their step's part with narrow selectors.
 */
import { create } from 'zustand';
import type { RouteResult } from '@shared/engine/route/evaluate';
import type { EditorDoc } from './document';
import type { EvaluateReply, EvaluateRequest } from '@/workers/evaluate.worker';
import { applyResultDelta } from '@/workers/result-delta';

export type Issue = { stepId: string | null; field: string; message: string };

interface EvaluationState {
  status: 'empty' | 'running' | 'done' | 'invalid';
  /** The last good result (kept while a newer document is being evaluated or is invalid). */
  result: RouteResult | null;
  issues: Issue[];
  revision: number;
  ms: number | null;
}

export const useEvaluation = create<EvaluationState>(() => ({
  status: 'empty',
  result: null,
  issues: [],
  revision: -1,
  ms: null,
}));

let worker: Worker | null = null;
let inFlight = false;
let queued: EvaluateRequest | null = null;
let latest = -1;
/**
 * The worker's last good result, rebuilt from every good answer in the order sent (each says
 * only what changed since the one before), whether or not it is still the newest edit's.
 */
let base: RouteResult | null = null;
const listeners = new Set<(reply: EvaluateReply) => void>();

/** Called with every reply (the benchmark measures edit-to-result with it). */
export function onEvaluated(fn: (reply: EvaluateReply) => void) {
  listeners.add(fn);
  return () => listeners.delete(fn);
}

function getWorker(): Worker {
  if (worker) return worker;
  worker = new Worker(new URL('../../workers/evaluate.worker.ts', import.meta.url), {
    type: 'module',
    name: 'route-engine',
  });
  worker.onmessage = (event: MessageEvent<EvaluateReply>) => {
    inFlight = false;
    const reply = event.data;
    if (reply.ok) base = applyResultDelta(base, reply.delta);
    if (reply.revision === latest) {
      if (reply.ok)
        useEvaluation.setState({
          status: 'done',
          result: base,
          issues: [],
          revision: reply.revision,
          ms: reply.ms,
        });
      else
        useEvaluation.setState({
          status: 'invalid',
          issues: reply.issues,
          revision: reply.revision,
          ms: reply.ms,
        });
    }
    for (const l of listeners) l(reply);
    if (queued) {
      const next = queued;
      queued = null;
      send(next);
    }
  };
  return worker;
}

function send(req: EvaluateRequest) {
  inFlight = true;
  getWorker().postMessage(req);
}

/** Evaluate this document; only the newest request's answer is shown (older queued ones are dropped). */
export function requestEvaluation(doc: EditorDoc, revision: number) {
  latest = revision;
  if (!doc.steps.length) {
    useEvaluation.setState({ status: 'empty', result: null, issues: [], revision, ms: null });
    return;
  }
  useEvaluation.setState({ status: 'running' });
  // Positions do not change results; strip them so the worker receives less.
  const req: EvaluateRequest = {
    revision,
    document: { ...doc, steps: doc.steps.map(({ position: _p, ...s }) => s) },
  };
  if (inFlight) queued = req;
  else send(req);
}

export function resetEvaluation() {
  latest = -1;
  queued = null;
  useEvaluation.setState({ status: 'empty', result: null, issues: [], revision: -1, ms: null });
}
