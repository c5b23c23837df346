/// <reference lib="webworker" />
/**
 * What-if curves for one step: the route is evaluated again with one of the
 * step's parameters set to each value of a sweep (end temperature of a
 * crystallisation, number of stages of a wash or extraction). The document is
 * copied for every variant; the engine stays pure and nothing is written back.
 */
import { evaluateRoute } from '@shared/engine/route/evaluate';

export type SweepKind = 'crystallisation-end-temperature' | 'stages';
export type SweepRequest = { id: number; document: { steps: Array<{ id: string; kind: string; params: Record<string, unknown> }> }; stepId: string; sweep: SweepKind; values: number[] };
export type SweepPoint = { x: number; y: number | null };
export type SweepReply = { id: number; points: SweepPoint[] };

/** The document with the step's swept parameter set to `x`. */
export function variant(doc: SweepRequest['document'], stepId: string, sweep: SweepKind, x: number): SweepRequest['document'] {
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
function measure(result: ReturnType<typeof evaluateRoute>, stepId: string, sweep: SweepKind): number | null {
  const step = result.steps[stepId];
  if (!step) return null;
  if (sweep === 'stages') {
    const v = step.summary['product recovery %'];
    return typeof v === 'number' ? v : null;
  }
  const v = step.details.yieldPct;
  return typeof v === 'number' ? v : null;
}

self.onmessage = (event: MessageEvent<SweepRequest>) => {
  const { id, document, stepId, sweep, values } = event.data;
  const points = values.map((x) => {
    try {
      return { x, y: measure(evaluateRoute(variant(document, stepId, sweep, x)), stepId, sweep) };
    } catch {
      return { x, y: null };
    }
  });
  (self as unknown as DedicatedWorkerGlobalScope).postMessage({ id, points } satisfies SweepReply);
};
