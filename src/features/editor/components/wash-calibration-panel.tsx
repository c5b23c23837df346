import { useMemo } from 'react';
import { sampledPort } from '@shared/chromatography/levels';
import type { MeasuredPartition, WashContext } from '@/features/chromatograms';
import { useEditorStore } from '@/stores/editor-store';
import { useEvaluation } from '../evaluation';
import type { EditorDoc, StepInput } from '../document';

const numberOf = (v: unknown): number | null =>
  typeof v === 'number'
    ? v
    : v && typeof v === 'object' && typeof (v as { value?: unknown }).value === 'number'
      ? (v as { value: number }).value
      : null;

/**
 * What the live evaluation says about a wash or extraction, for the
 * back-calculation of a distribution ratio: phase volumes, stages, the
 * product's recovery, the main organic solvent, pH and temperature.
 */
export function useWashContext(step: StepInput): WashContext | null {
  const doc = useEditorStore((s) => s.doc);
  const result = useEvaluation((s) => s.result);
  return useMemo(() => {
    if (step.kind !== 'wash' && step.kind !== 'extraction') return null;
    const r = result?.steps[step.id];
    if (!r) return null;
    const details = r.details as {
      mode?: 'cross-current' | 'counter-current';
      stages?: number;
      aqueousPH?: number | null;
      phaseVolumesL?: { organic: number; aqueous: number };
      components?: Record<string, { toOrganicPct: number }>;
    };
    const volumes = details.phaseVolumesL;
    if (!volumes || !(volumes.organic > 0) || !(volumes.aqueous > 0)) return null;
    const stages = details.stages ?? 1;
    // Cross-current: the aqueous volume of one stage; counter-current: the whole.
    const aqueousL =
      details.mode === 'counter-current' ? volumes.aqueous : volumes.aqueous / stages;
    const productId = doc.referenceInput.componentId;
    const kept = sampledPort(step as never) === 'aqueous' ? 'aqueous' : 'organic';
    const toOrganic = details.components?.[productId]?.toOrganicPct;
    const productRecovery =
      toOrganic === undefined ? 1 : (kept === 'organic' ? toOrganic : 100 - toOrganic) / 100;
    const organic = mainOrganicSolvent(doc, result, step.id);
    const params = (step.params ?? {}) as { temperatureC?: unknown };
    return {
      organicL: volumes.organic,
      aqueousL,
      stages,
      mode: details.mode ?? 'cross-current',
      productRecovery,
      organicSolventId: organic?.solventId ?? null,
      organicSolventName: organic?.solventId ?? null,
      pH: details.aqueousPH ?? null,
      temperatureC: numberOf(params.temperatureC),
    };
  }, [doc, result, step]);
}

/** The solvent (not water) with the most mass in the organic layer leaving the step. */
function mainOrganicSolvent(
  doc: EditorDoc,
  result: ReturnType<typeof useEvaluation.getState>['result'],
  stepId: string,
): { solventId: string } | null {
  if (!result) return null;
  const connection = doc.connections.find(
    (c) => c.from.stepId === stepId && c.from.port === 'organic',
  );
  const stream = connection
    ? result.streams[connection.id]
    : result.terminals.find((t) => t.stepId === stepId && t.port === 'organic')?.stream;
  if (!stream) return null;
  let best: { solventId: string; kg: number } | null = null;
  for (const c of doc.components) {
    if (c.kind !== 'solvent' || c.solventId === 'water') continue;
    const key = c.id ?? c.solventId;
    const kg = stream.kg[key] ?? 0;
    if (kg > (best?.kg ?? 0)) best = { solventId: c.solventId, kg };
  }
  return best;
}

/** Adds a measured partition point to a compound of the route (an undoable edit, saved with the draft). */
export function saveMeasuredPartition(componentId: string, point: MeasuredPartition) {
  const { doc, replaceDocument } = useEditorStore.getState();
  replaceDocument({
    ...doc,
    components: doc.components.map((c) =>
      c.kind === 'compound' && c.id === componentId
        ? { ...c, partition: [...(c.partition ?? []), point] }
        : c,
    ),
  });
}
