import { useMemo } from 'react';
import { predictedLevels } from '@shared/chromatography/levels';
import { canInWorkspace, useSession } from '@/features/auth';
import { StepSamples } from '@/features/chromatograms';
import { useEditorStore } from '@/stores/editor-store';
import { useEvaluation } from '../evaluation';
import type { StepInput } from '../document';

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
        c.kind === 'compound' ? [{ id: c.id, name: c.name ?? c.id }] : [],
      ),
    [doc.components],
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
      canWrite={session ? canInWorkspace(session, workspaceId, 'chromatogram.upload') : false}
    />
  );
}
