/**
 * Sweeps for the per-step plots, run in their own worker so the live
 * evaluation of edits never waits behind them. Only the newest request per
 * plot is answered on screen. A sweep starts well after an edit's own result
 * has landed (it evaluates the route once per swept value, and would compete
 * for the processor), and a newer edit cancels the sweep still running.
 */
import { useEffect, useState } from 'react';
import type {
  SweepCancel,
  SweepKind,
  SweepPoint,
  SweepReply,
  SweepRequest,
} from '@/workers/sweep.worker';
import { useEvaluation } from './evaluation';
import { useEditorStore } from '@/stores/editor-store';
import { SOLVENTS } from '@shared/engine/data';
import { keyOf, type StepInput } from './document';

type Doc = ReturnType<typeof useEditorStore.getState>['doc'];
type Result = NonNullable<ReturnType<typeof useEvaluation.getState>['result']>;

/** Share of the liquor's solvents from which a solvent bounds the reachable temperature. */
const LIQUOR_SOLVENT_SHARE = 0.05;

/**
 * The highest temperature the liquor can reach in an open vessel: the lowest
 * normal boiling point of the solvents making up at least 5 % of the solvents
 * at the step (its feed, plus the antisolvent). A conservative bound: the
 * mixture boils between its components' boiling points unless it forms a
 * minimum-boiling azeotrope, when it boils lower still.
 */
export function liquorBoiling(
  step: StepInput,
  doc: Pick<Doc, 'components' | 'connections'>,
  result: Pick<Result, 'streams'> | null,
): { temperatureC: number; solvent: string } | null {
  if (step.kind !== 'crystallisation' || !result) return null;
  const feed = doc.connections.find((c) => c.to.stepId === step.id && c.to.port === 'feed');
  const stream = feed ? result.streams[feed.id] : undefined;
  if (!stream) return null;
  const solventOf = new Map<string, string>();
  for (const c of doc.components) if (c.kind === 'solvent') solventOf.set(keyOf(c), c.solventId);
  const kg = new Map<string, number>();
  for (const [id, m] of Object.entries(stream.kg)) if (solventOf.has(id) && m > 0) kg.set(id, m);
  const mode = step.params.mode;
  if (mode.kind === 'antisolvent' && solventOf.has(mode.antisolventId))
    kg.set(mode.antisolventId, kg.get(mode.antisolventId) ?? 0);
  const total = [...kg.values()].reduce((a, b) => a + b, 0);
  let best: { temperatureC: number; solvent: string } | null = null;
  for (const [id, m] of kg) {
    const isAntisolvent = mode.kind === 'antisolvent' && id === mode.antisolventId;
    if (!isAntisolvent && !(m / total >= LIQUOR_SOLVENT_SHARE)) continue;
    const rec = SOLVENTS.find((x) => x.id === solventOf.get(id));
    const bp = rec?.boilingPointC.value;
    if (rec && typeof bp === 'number' && (!best || bp < best.temperatureC))
      best = { temperatureC: bp, solvent: rec.name };
  }
  return best;
}

let worker: Worker | null = null;
let nextId = 1;
const waiting = new Map<number, (points: SweepPoint[]) => void>();
/** Quiet time after the last change before a sweep starts, and the re-check while the edit's own evaluation runs. */
const SWEEP_DELAY_MS = 400;
const RECHECK_MS = 100;

function getWorker(): Worker {
  if (worker) return worker;
  worker = new Worker(new URL('../../workers/sweep.worker.ts', import.meta.url), {
    type: 'module',
    name: 'route-sweeps',
  });
  worker.onmessage = (event: MessageEvent<SweepReply>) => {
    waiting.get(event.data.id)?.(event.data.points);
    waiting.delete(event.data.id);
  };
  return worker;
}

const plain = (v: unknown): number | null =>
  typeof v === 'number'
    ? v
    : v && typeof v === 'object' && 'value' in v && typeof v.value === 'number'
      ? v.value
      : null;

/** Which sweep a step has, and over what values (around its current setting, in the usual plant range). */
export function sweepFor(
  step: StepInput,
  boilingC: number | null = null,
): { sweep: SweepKind; values: number[]; current: number } | null {
  if (step.kind === 'wash' || step.kind === 'extraction') {
    const current = step.params.stages;
    return { sweep: 'stages', values: [1, 2, 3, 4, 5, 6, 8], current };
  }
  if (step.kind === 'crystallisation') {
    const mode = step.params.mode;
    if (mode.kind === 'evaporative') return null;
    const current = plain(mode.kind === 'cooling' ? mode.endC : mode.temperatureC);
    if (current === null) return null;
    let hi =
      mode.kind === 'cooling' ? (plain(mode.startC) ?? current + 40) : Math.max(current + 30, 40);
    // Only the reachable range: below the liquor's boiling point (the set value itself stays, to be flagged).
    if (boilingC !== null) hi = Math.max(Math.min(hi, boilingC - 2), current);
    const lo = Math.min(current - 10, -10);
    const values = Array.from(
      { length: 11 },
      (_, k) => Math.round((lo + ((hi - lo) * k) / 10) * 10) / 10,
    );
    return { sweep: 'crystallisation-end-temperature', values, current };
  }
  return null;
}

/** The sweep's points for the selected step; recomputed (debounced) when the route's model changes. */
export function useSweep(step: StepInput): {
  points: SweepPoint[] | null;
  current: number | null;
  sweep: SweepKind | null;
  boiling: { temperatureC: number; solvent: string } | null;
} {
  const revision = useEditorStore((s) => s.modelRevision);
  const components = useEditorStore((s) => s.doc.components);
  const connections = useEditorStore((s) => s.doc.connections);
  const streams = useEvaluation((s) => s.result?.streams ?? null);
  const boiling = liquorBoiling(step, { components, connections }, streams ? { streams } : null);
  const spec = sweepFor(step, boiling?.temperatureC ?? null);
  const key = spec ? `${spec.sweep}:${spec.values.join(',')}` : '';
  const [points, setPoints] = useState<SweepPoint[] | null>(null);
  useEffect(() => {
    if (!spec) return;
    let live = true;
    let sent = 0;
    const start = () => {
      // The edit's own result first: the sweep waits while the live evaluation runs.
      if (useEvaluation.getState().status === 'running') {
        timer = setTimeout(start, RECHECK_MS);
        return;
      }
      const doc = useEditorStore.getState().doc;
      const id = nextId++;
      sent = id;
      waiting.set(id, (p) => live && setPoints(p));
      const document = {
        ...doc,
        steps: doc.steps.map(({ position: _p, ...s }) => s),
      } as unknown as SweepRequest['document'];
      getWorker().postMessage({
        id,
        document,
        stepId: step.id,
        sweep: spec.sweep,
        values: spec.values,
      } satisfies SweepRequest);
    };
    let timer = setTimeout(start, SWEEP_DELAY_MS);
    return () => {
      live = false;
      clearTimeout(timer);
      if (sent && waiting.has(sent)) {
        waiting.delete(sent);
        getWorker().postMessage({ cancel: sent } satisfies SweepCancel);
      }
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps -- the key stands for spec
  }, [step.id, key, revision]);
  return {
    points: spec ? points : null,
    current: spec?.current ?? null,
    sweep: spec?.sweep ?? null,
    boiling,
  };
}
