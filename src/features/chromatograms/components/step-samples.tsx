import { useMemo, useState, type ReactNode } from 'react';
import type { PredictedLevel } from '@shared/chromatography/levels';
import { Button } from '@/components/button';
import { ErrorState } from '@/components/error-state';
import { Loading } from '@/components/spinner';
import { useStepChromatograms } from '../api/get-chromatograms';
import { fmt } from './format';
import { levelRows, MeasuredLevels } from './measured-levels';
import { SampleViewer, type RouteCompound } from './sample-viewer';
import { UploadForm } from './upload-form';

/**
 * The IPC samples taken at a step: upload, the list, and the latest sample's
 * measured levels beside the route's prediction. A sample opens large with
 * its plot, peak table, limits and assignments.
 */
export function StepSamples({
  workspaceId,
  routeId,
  step,
  compounds,
  predicted,
  evaluated,
  canWrite,
  calibration,
}: {
  workspaceId: string;
  routeId: string;
  step: { id: string; name: string };
  compounds: RouteCompound[];
  predicted: PredictedLevel[];
  evaluated: boolean;
  canWrite: boolean;
  /** The wash calibration, on steps that have one. */
  calibration?: ReactNode;
}) {
  const list = useStepChromatograms(workspaceId, routeId, step.id);
  const [openId, setOpenId] = useState<string | null>(null);
  const [showUpload, setShowUpload] = useState(false);
  const samples = useMemo(() => list.data?.pages.flatMap((p) => p.items) ?? [], [list.data]);
  const names = useMemo(
    () => Object.fromEntries(compounds.map((c) => [c.id, c.name])),
    [compounds],
  );
  const latest = [...samples].reverse().find((s) => s.kind === 'trace' && s.peaks.length);

  return (
    <section aria-labelledby={`samples-${step.id}`} className="mt-4 border-t border-rule pt-3">
      <div className="mb-2 flex items-center justify-between gap-2">
        <h3 id={`samples-${step.id}`} className="text-small font-medium">
          IPC samples{samples.length ? ` (${samples.length})` : ''}
        </h3>
        {canWrite && samples.length ? (
          <Button
            size="sm"
            variant="secondary"
            aria-expanded={showUpload}
            onClick={() => setShowUpload((v) => !v)}
          >
            {showUpload ? 'Hide upload' : 'Add sample'}
          </Button>
        ) : null}
      </div>
      {list.isPending ? (
        <Loading label="Loading samples…" />
      ) : list.isError ? (
        <ErrorState
          error={list.error}
          title="The samples could not be loaded"
          onRetry={() => list.refetch()}
        />
      ) : (
        <>
          {!samples.length ? (
            <p className="mb-2 text-small text-ink-muted">
              No samples at this step yet.{' '}
              {canWrite
                ? 'Upload the chromatogram of a sample taken here to check the prediction.'
                : 'A chemist can upload the chromatogram of a sample taken here.'}
            </p>
          ) : (
            <ul className="mb-3 divide-y divide-rule rounded-control border border-rule">
              {samples.map((s) => (
                <li key={s.id} className="flex items-center justify-between gap-2 px-2 py-1.5">
                  <div className="min-w-0">
                    <p className="truncate text-small font-medium">{s.sampleName}</p>
                    <p className="text-caption text-ink-muted">
                      {s.kind === 'trace'
                        ? `${s.peaks.length} peak${s.peaks.length === 1 ? '' : 's'}`
                        : s.format.toUpperCase()}
                      {' · '}
                      {fmt.when(s.takenAt ?? s.createdAt)}
                    </p>
                  </div>
                  <Button
                    size="sm"
                    variant="secondary"
                    onClick={() => setOpenId(s.id)}
                    aria-label={`Open ${s.sampleName}`}
                  >
                    Open
                  </Button>
                </li>
              ))}
            </ul>
          )}
          {list.hasNextPage ? (
            <Button
              size="sm"
              variant="quiet"
              busy={list.isFetchingNextPage}
              onClick={() => list.fetchNextPage()}
            >
              Show more samples
            </Button>
          ) : null}
          {latest ? (
            <div className="mb-3">
              <h4 className="mb-1 text-caption font-medium uppercase tracking-wide text-ink-muted">
                Latest: {latest.sampleName}
              </h4>
              <MeasuredLevels
                rows={levelRows(latest, predicted, names)}
                evaluated={evaluated}
                caption={`Measured and predicted levels at ${step.name}`}
              />
            </div>
          ) : null}
          {calibration && samples.some((s) => s.kind === 'trace') ? (
            <details className="mb-3 rounded-control border border-rule px-2 py-1.5">
              <summary className="cursor-pointer text-small font-medium">
                Distribution ratio from this wash
              </summary>
              <div className="mt-2">{calibration}</div>
            </details>
          ) : null}
          {canWrite && (showUpload || !samples.length) ? (
            <UploadForm
              workspaceId={workspaceId}
              routeId={routeId}
              stepId={step.id}
              onUploaded={(id) => {
                setShowUpload(false);
                setOpenId(id);
              }}
            />
          ) : null}
        </>
      )}
      {openId ? (
        <SampleViewer
          key={openId}
          workspaceId={workspaceId}
          routeId={routeId}
          sampleId={openId}
          stepName={step.name}
          samples={samples}
          compounds={compounds}
          predicted={predicted}
          evaluated={evaluated}
          canWrite={canWrite}
          onClose={() => setOpenId(null)}
        />
      ) : null}
    </section>
  );
}
