import { useMemo } from 'react';
import { predictedLevels } from '@shared/chromatography/levels';
import { canInWorkspace, useSession } from '@/features/auth';
import { StepSamples, WashCalibration } from '@/features/chromatograms';
import { useEditorStore } from '@/stores/editor-store';
import { useEvaluation } from '../evaluation';
import type { StepInput } from '../document';
import { saveMeasuredPartition, useWashContext } from './wash-calibration-panel';

/** The selected step's IPC samples, with the levels the live evaluation predicts there. */
export function StepSamplesPanel({
  workspaceId,
  routeId,
  step,
}: {
  workspaceId: string;
  routeId: string;
  step: StepInput;
}) {
  const doc = useEditorStore((s) => s.doc);
  const result = useEvaluation((s) => s.result);
  const { data: session } = useSession();
  const compounds = useMemo(
    () =>
      doc.components.flatMap((c) =>
        c.kind === 'compound' ? [{ id: c.id, name: c.name ?? c.id, role: c.role }] : [],
      ),
    [doc.components],
  );
  const wash = useWashContext(step);
  const canWrite = session ? canInWorkspace(session, workspaceId, 'chromatogram.upload') : false;
  const canEditRoute = useEditorStore((s) => !s.readOnly);
  // Samples before the wash: at the steps feeding it, and at the wash itself.
  const beforeStepIds = useMemo(
    () => [
      ...doc.connections.filter((c) => c.to.stepId === step.id).map((c) => c.from.stepId),
      step.id,
    ],
    [doc.connections, step.id],
  );
  const stepNames = useMemo(
    () => Object.fromEntries(doc.steps.map((s) => [s.id, s.name])),
    [doc.steps],
  );
  const predicted = useMemo(
    () =>
      result ? predictedLevels(doc as Parameters<typeof predictedLevels>[0], result, step.id) : [],
    [doc, result, step.id],
  );
  return (
    <StepSamples
      workspaceId={workspaceId}
      routeId={routeId}
      step={{ id: step.id, name: step.name }}
      compounds={compounds}
      predicted={predicted}
      evaluated={result !== null}
      canWrite={canWrite}
      calibration={
        step.kind === 'wash' || step.kind === 'extraction' ? (
          <WashCalibration
            workspaceId={workspaceId}
            routeId={routeId}
            step={{ id: step.id, name: step.name }}
            beforeStepIds={beforeStepIds}
            stepNames={stepNames}
            compounds={compounds}
            productId={doc.referenceInput.componentId}
            wash={wash}
            canWrite={canEditRoute}
            onSave={saveMeasuredPartition}
          />
        ) : undefined
      }
    />
  );
}
