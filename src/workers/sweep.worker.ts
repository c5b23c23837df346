/// <reference lib="webworker" />
/**
 * What-if curves for one step: the route is evaluated again with one of the
 * step's parameters set to each value of a sweep (end temperature of a
 * crystallisation, number of stages of a wash or extraction). The document is
 * copied for every variant; the engine stays pure and nothing is written back.
 *
 * One variant is evaluated per task, so a newer request (or a cancel) that
 * arrives meanwhile stops an older sweep instead of waiting behind it. The
 * variants share the components, hence the engine's document caches.
 */
import {
  evaluatePrepared,
  parseRoute,
  prepareRoute,
  type RouteResult,
} from '@shared/engine/route/evaluate';
import { createEvaluationCaches, type EvaluationCaches } from '@shared/engine/route/context';

export type SweepKind = 'crystallisation-end-temperature' | 'stages';
export type SweepRequest = {
  id: number;
  document: { steps: Array<{ id: string; kind: string; params: Record<string, unknown> }> };
  stepId: string;
  sweep: SweepKind;
  values: number[];
};
/** Stop every sweep requested before (and including) this id. */
export type SweepCancel = { cancel: number };
export type SweepPoint = { x: number; y: number | null };
export type SweepReply = { id: number; points: SweepPoint[] };

/** The document with the step's swept parameter set to `x`. */
export function variant(
  doc: SweepRequest['document'],
  stepId: string,
  sweep: SweepKind,
  x: number,
): SweepRequest['document'] {
  return {
    ...doc,
    steps: doc.steps.map((s) => {
      if (s.id !== stepId) return s;
      if (sweep === 'stages') return { ...s, params: { ...s.params, stages: x } };
      const mode = s.params.mode as Record<string, unknown>;
      const field = mode.kind === 'cooling' ? 'endC' : 'temperatureC';
      return { ...s, params: { ...s.params, mode: { ...mode, [field]: x } } };
    }),
  };
}

/** The step's own figure of merit in a result: crystallisation yield, or the product recovery of a wash or extraction. */
function measure(result: RouteResult, stepId: string, sweep: SweepKind): number | null {
  const step = result.steps[stepId];
  if (!step) return null;
  if (sweep === 'stages') {
    const v = step.summary['product recovery %'];
    return typeof v === 'number' ? v : null;
  }
  const v = step.details.yieldPct;
  return typeof v === 'number' ? v : null;
}

/** Caches of the last component set swept (the variants of one sweep, and the sweeps after it, share them). */
let kept: { key: string; caches: EvaluationCaches } | null = null;
function cachesFor(components: unknown): EvaluationCaches {
  const key = JSON.stringify(components);
  if (kept?.key !== key) kept = { key, caches: createEvaluationCaches() };
  return kept.caches;
}

function evaluateVariant(doc: SweepRequest['document']): RouteResult {
  const prepared = prepareRoute(parseRoute(doc));
  prepared.caches = cachesFor(prepared.doc.components);
  return evaluatePrepared(prepared, null);
}

let newest = 0;
let cancelled = 0;

function step(req: SweepRequest, points: SweepPoint[]) {
  if (req.id !== newest || req.id <= cancelled) return;
  const x = req.values[points.length];
  let y: number | null;
  try {
    y = measure(
      evaluateVariant(variant(req.document, req.stepId, req.sweep, x)),
      req.stepId,
      req.sweep,
    );
  } catch {
    y = null;
  }
  points.push({ x, y });
  if (points.length < req.values.length) setTimeout(() => step(req, points), 0);
  else
    (self as unknown as DedicatedWorkerGlobalScope).postMessage({
      id: req.id,
      points,
    } satisfies SweepReply);
}

self.onmessage = (event: MessageEvent<SweepRequest | SweepCancel>) => {
  const msg = event.data;
  if ('cancel' in msg) {
    cancelled = Math.max(cancelled, msg.cancel);
    return;
  }
  newest = Math.max(newest, msg.id);
  if (!msg.values.length)
    (self as unknown as DedicatedWorkerGlobalScope).postMessage({
      id: msg.id,
      points: [],
    } satisfies SweepReply);
  else step(msg, []);
};
