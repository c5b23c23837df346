import { useEffect, useMemo, useRef, useState } from 'react';
import type {
  ChromatogramDetail,
  ChromatogramSummary,
  IntegrationWindowPayload,
} from '@shared/schemas/chromatograms';
import type { PredictedLevel } from '@shared/chromatography/levels';
import { isApiError } from '@/api/client';
import { Button, buttonClass } from '@/components/button';
import { ConfirmDialog } from '@/components/confirm-dialog';
import { ErrorState } from '@/components/error-state';
import { Loading } from '@/components/spinner';
import { Table, Td, Th } from '@/components/table';
import { useChromatogram, useChromatograms } from '../api/get-chromatogram';
import { useDeleteChromatogram } from '../api/delete-chromatogram';
import { useUpdateChromatogram } from '../api/update-chromatogram';
import { api } from '@/paths';
import { fmt } from './format';
import { levelRows, MeasuredLevels } from './measured-levels';
import { TracePlot, type PlotTrace } from './trace-plot';

export interface RouteCompound {
  id: string;
  name: string;
}

/** One sample, large: the plot with overlays, the peak table, limits and assignments, the levels. */
export function SampleViewer({
  workspaceId,
  routeId,
  sampleId,
  stepName,
  samples,
  compounds,
  predicted,
  evaluated,
  canWrite,
  onClose,
}: {
  workspaceId: string;
  routeId: string;
  sampleId: string;
  stepName: string;
  samples: ChromatogramSummary[];
  compounds: RouteCompound[];
  predicted: PredictedLevel[];
  evaluated: boolean;
  canWrite: boolean;
  onClose: () => void;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  useEffect(() => {
    const dialog = ref.current;
    if (dialog && !dialog.open) dialog.showModal();
  }, []);
  const summary = samples.find((s) => s.id === sampleId);
  // Every point of the opened trace: the plot thins it per pixel and stays smooth at 100,000.
  const detail = useChromatogram(workspaceId, routeId, sampleId, summary?.kind === 'trace');
  return (
    <dialog
      ref={ref}
      aria-labelledby="sample-title"
      onCancel={(e) => {
        e.preventDefault();
        onClose();
      }}
      className="m-auto max-h-[94vh] w-[min(72rem,96vw)] overflow-y-auto rounded-card border border-rule bg-paper-raised p-0 text-ink shadow-overlay backdrop:bg-ink/30"
    >
      <div className="p-4">
        <div className="flex items-start justify-between gap-3">
          <div>
            <h2 id="sample-title" className="text-title font-medium">
              {summary?.sampleName ?? 'Sample'}
            </h2>
            <p className="text-small text-ink-muted">
              {stepName}
              {summary?.takenAt ? ` · taken ${fmt.when(summary.takenAt)}` : ''}
              {summary ? ` · ${summary.fileName} (${fmt.bytes(summary.sizeBytes)})` : ''}
              {summary?.revision ? ` · revision ${summary.revision}` : ''}
            </p>
            {summary?.methodNote ? (
              <p className="text-small text-ink-muted">Method: {summary.methodNote}</p>
            ) : null}
          </div>
          <Button variant="secondary" size="sm" onClick={onClose}>
            Close
          </Button>
        </div>
        <div className="mt-3">
          {detail.isPending ? (
            <Loading label="Loading the sample…" />
          ) : detail.isError ? (
            <ErrorState
              error={detail.error}
              title="The sample could not be loaded"
              onRetry={() => detail.refetch()}
            />
          ) : (
            <SampleBody
              workspaceId={workspaceId}
              routeId={routeId}
              detail={detail.data}
              samples={samples}
              compounds={compounds}
              predicted={predicted}
              evaluated={evaluated}
              canWrite={canWrite}
              onDeleted={onClose}
            />
          )}
        </div>
      </div>
    </dialog>
  );
}

function SampleBody({
  workspaceId,
  routeId,
  detail,
  samples,
  compounds,
  predicted,
  evaluated,
  canWrite,
  onDeleted,
}: {
  workspaceId: string;
  routeId: string;
  detail: ChromatogramDetail;
  samples: ChromatogramSummary[];
  compounds: RouteCompound[];
  predicted: PredictedLevel[];
  evaluated: boolean;
  canWrite: boolean;
  onDeleted: () => void;
}) {
  const update = useUpdateChromatogram(workspaceId, routeId);
  const remove = useDeleteChromatogram(workspaceId, routeId);
  const [confirmDelete, setConfirmDelete] = useState(false);
  const [overlayIds, setOverlayIds] = useState<string[]>([]);
  const overlays = useChromatograms(workspaceId, routeId, overlayIds);
  const names = useMemo(
    () => Object.fromEntries(compounds.map((c) => [c.id, c.name])),
    [compounds],
  );

  const traces = useMemo<PlotTrace[]>(() => {
    if (!detail.trace) return [];
    const out: PlotTrace[] = [{ id: detail.id, label: detail.sampleName, ...detail.trace }];
    overlays.forEach((q) => {
      if (q.data?.trace) out.push({ id: q.data.id, label: q.data.sampleName, ...q.data.trace });
    });
    return out;
  }, [detail, overlays]);
  const plotPeaks = useMemo(
    () =>
      detail.peaks.map((p, i) => ({
        ...detail.limits[i],
        retentionMin: p.retentionMin,
        label: String(i + 1),
      })),
    [detail],
  );

  const mutationError = update.error ?? remove.error;
  const fileUrl = api.chromatograms.file(workspaceId, routeId, detail.id);

  const assign = (index: number, componentId: string) => {
    const next: Record<string, string> = {};
    detail.peaks.forEach((p, i) => {
      if (i !== index && p.componentId && p.componentId !== componentId)
        next[String(i)] = p.componentId;
    });
    if (componentId) next[String(index)] = componentId;
    update.mutate({ id: detail.id, change: { assignments: next } });
  };

  if (detail.kind === 'document')
    return (
      <div className="space-y-3">
        {detail.contentType.startsWith('image/') ? (
          <img
            src={fileUrl}
            alt={`${detail.sampleName}, as uploaded`}
            className="max-h-[60vh] rounded-control border border-rule"
          />
        ) : (
          <p className="text-body text-ink-muted">
            A PDF is kept as it was uploaded; it has no trace to integrate.
          </p>
        )}
        <div className="flex gap-2">
          <a className={buttonClass('secondary', 'sm')} href={fileUrl} download={detail.fileName}>
            Download {detail.fileName}
          </a>
          {canWrite ? (
            <Button variant="danger" size="sm" onClick={() => setConfirmDelete(true)}>
              Delete sample
            </Button>
          ) : null}
        </div>
        <DeleteConfirm
          open={confirmDelete}
          busy={remove.isPending}
          name={detail.sampleName}
          onCancel={() => setConfirmDelete(false)}
          onConfirm={() => remove.mutate(detail.id, { onSuccess: onDeleted })}
        />
      </div>
    );

  const overlayCandidates = samples.filter((s) => s.kind === 'trace' && s.id !== detail.id);
  const rows = levelRows(detail, predicted, names);
  return (
    <div className="space-y-4">
      {overlayCandidates.length ? (
        <fieldset className="flex flex-wrap items-center gap-x-3 gap-y-1 text-small">
          <legend className="mb-1 font-medium">Overlay other injections</legend>
          {overlayCandidates.map((s) => (
            <label key={s.id} className="flex items-center gap-1">
              <input
                type="checkbox"
                checked={overlayIds.includes(s.id)}
                onChange={(e) =>
                  setOverlayIds((ids) =>
                    e.target.checked ? [...ids, s.id] : ids.filter((id) => id !== s.id),
                  )
                }
              />
              {s.sampleName}
            </label>
          ))}
        </fieldset>
      ) : null}
      <TracePlot
        traces={traces}
        baseline={detail.baseline}
        peaks={plotPeaks}
        label={`Chromatogram of ${detail.sampleName}: ${detail.points.toLocaleString('en')} points, ${detail.peaks.length} peaks integrated`}
      />
      {detail.warnings.length ? (
        <ul className="space-y-0.5 rounded-control border border-caution-info/40 bg-caution-info-soft px-2 py-1.5 text-small text-caution-info-deep">
          {detail.warnings.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      ) : null}
      {mutationError ? (
        <p
          role="alert"
          className="rounded-control border border-caution-hazard/40 bg-caution-hazard-soft px-2 py-1.5 text-small text-caution-hazard-deep"
        >
          {isApiError(mutationError) && mutationError.details.length
            ? mutationError.details.map((d) => d.message).join(' ')
            : mutationError.message}
        </p>
      ) : null}
      <PeakTable
        detail={detail}
        compounds={compounds}
        canWrite={canWrite}
        busy={update.isPending}
        onAssign={assign}
      />
      <div className="grid gap-4 md:grid-cols-2">
        <LimitsEditor
          key={`${detail.id}-${detail.updatedAt}`}
          detail={detail}
          canWrite={canWrite}
          busy={update.isPending}
          onApply={(windows) => update.mutate({ id: detail.id, change: { integration: windows } })}
        />
        <section aria-labelledby="levels-title">
          <h3 id="levels-title" className="mb-1 text-small font-medium">
            Measured and predicted at this step
          </h3>
          <MeasuredLevels
            rows={rows}
            evaluated={evaluated}
            caption={`Measured and predicted levels of ${detail.sampleName}`}
          />
        </section>
      </div>
      <div className="flex flex-wrap gap-2 border-t border-rule pt-3">
        <a className={buttonClass('secondary', 'sm')} href={fileUrl} download={detail.fileName}>
          Download the original file
        </a>
        {canWrite ? (
          <Button variant="danger" size="sm" onClick={() => setConfirmDelete(true)}>
            Delete sample
          </Button>
        ) : null}
      </div>
      <DeleteConfirm
        open={confirmDelete}
        busy={remove.isPending}
        name={detail.sampleName}
        onCancel={() => setConfirmDelete(false)}
        onConfirm={() => remove.mutate(detail.id, { onSuccess: onDeleted })}
      />
    </div>
  );
}

function DeleteConfirm({
  open,
  busy,
  name,
  onCancel,
  onConfirm,
}: {
  open: boolean;
  busy: boolean;
  name: string;
  onCancel: () => void;
  onConfirm: () => void;
}) {
  return (
    <ConfirmDialog
      open={open}
      title="Delete this sample?"
      confirmLabel="Delete sample"
      busy={busy}
      onCancel={onCancel}
      onConfirm={onConfirm}
    >
      “{name}” and its file will be deleted, with its integration and assignments. The audit trail
      keeps a record that it existed.
    </ConfirmDialog>
  );
}

function PeakTable({
  detail,
  compounds,
  canWrite,
  busy,
  onAssign,
}: {
  detail: ChromatogramDetail;
  compounds: RouteCompound[];
  canWrite: boolean;
  busy: boolean;
  onAssign: (index: number, componentId: string) => void;
}) {
  if (!detail.peaks.length)
    return (
      <p className="text-body text-ink-muted">
        No peaks were integrated. Set integration limits by hand below.
      </p>
    );
  const names = Object.fromEntries(compounds.map((c) => [c.id, c.name]));
  return (
    <Table caption={`Peak table of ${detail.sampleName}`}>
      <thead>
        <tr>
          <Th>Peak</Th>
          <Th className="text-right">RT (min)</Th>
          <Th className="text-right">Height</Th>
          <Th className="text-right">Area</Th>
          <Th className="text-right">Area %</Th>
          <Th className="text-right">w½ (min)</Th>
          <Th className="text-right" title="Plate number N = 5.54 (tR/w½)²">
            N
          </Th>
          <Th className="text-right" title="Symmetry factor As = w0.05/2d">
            As
          </Th>
          <Th className="text-right" title="Resolution from the previous peak">
            Rs
          </Th>
          <Th>Compound</Th>
        </tr>
      </thead>
      <tbody>
        {detail.peaks.map((p, i) => (
          <tr key={i} data-peak={i + 1}>
            <Td className="tabular-nums">{i + 1}</Td>
            <Td className="text-right tabular-nums">{fmt.min(p.retentionMin)}</Td>
            <Td className="text-right tabular-nums">{fmt.sig(p.height)}</Td>
            <Td className="text-right tabular-nums">{fmt.sig(p.area)}</Td>
            <Td className="text-right tabular-nums" data-area-pct>
              {fmt.pct(p.areaPct)}
            </Td>
            <Td className="text-right tabular-nums">
              {p.widthHalfMin === null ? '—' : fmt.min(p.widthHalfMin)}
            </Td>
            <Td className="text-right tabular-nums">
              {p.plates === undefined ? '—' : fmt.int(p.plates)}
            </Td>
            <Td className="text-right tabular-nums">
              {p.symmetry === undefined ? '—' : fmt.twoDp(p.symmetry)}
            </Td>
            <Td className="text-right tabular-nums">
              {p.resolution === undefined ? '—' : fmt.twoDp(p.resolution)}
            </Td>
            <Td className="py-1">
              {canWrite ? (
                <select
                  aria-label={`Compound of peak ${i + 1} at ${fmt.min(p.retentionMin)} min`}
                  value={p.componentId ?? ''}
                  disabled={busy}
                  onChange={(e) => onAssign(i, e.target.value)}
                  className="h-7 w-full min-w-36 rounded-control border border-rule-strong bg-paper-raised px-1 text-small"
                >
                  <option value="">Not assigned</option>
                  {compounds.map((c) => (
                    <option key={c.id} value={c.id}>
                      {c.name}
                    </option>
                  ))}
                </select>
              ) : p.componentId ? (
                (names[p.componentId] ?? p.componentId)
              ) : (
                <span className="text-ink-faint">—</span>
              )}
            </Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}

/** The integration limits, one window per peak, editable as numbers (keyboard first). */
function LimitsEditor({
  detail,
  canWrite,
  busy,
  onApply,
}: {
  detail: ChromatogramDetail;
  canWrite: boolean;
  busy: boolean;
  onApply: (windows: IntegrationWindowPayload[] | null) => void;
}) {
  const [windows, setWindows] = useState(() =>
    detail.limits.map((l) => ({ start: l.startMin.toFixed(3), end: l.endMin.toFixed(3) })),
  );
  const [problem, setProblem] = useState<string | null>(null);
  const apply = () => {
    const parsed: IntegrationWindowPayload[] = [];
    for (const [i, w] of windows.entries()) {
      const startMin = Number(w.start.replace(',', '.'));
      const endMin = Number(w.end.replace(',', '.'));
      if (!Number.isFinite(startMin) || !Number.isFinite(endMin) || w.start === '' || w.end === '')
        return setProblem(`Window ${i + 1}: enter both limits in minutes.`);
      if (!(endMin > startMin))
        return setProblem(`Window ${i + 1}: the end must come after the start.`);
      parsed.push({ startMin, endMin });
    }
    if (!parsed.length) return setProblem('Add at least one window, or go back to automatic.');
    setProblem(null);
    onApply(parsed);
  };
  return (
    <section aria-labelledby="limits-title">
      <h3 id="limits-title" className="mb-1 text-small font-medium">
        Integration limits{' '}
        <span className="font-normal text-ink-muted">
          ({detail.integrationMode === 'manual' ? 'set by hand' : 'automatic'})
        </span>
      </h3>
      <ol className="space-y-1">
        {windows.map((w, i) => (
          <li key={i} className="flex items-center gap-1 text-small">
            <span className="w-14 text-ink-muted">Peak {i + 1}</span>
            <input
              aria-label={`Start of window ${i + 1} (min)`}
              inputMode="decimal"
              value={w.start}
              disabled={!canWrite || busy}
              onChange={(e) =>
                setWindows((all) =>
                  all.map((x, k) => (k === i ? { ...x, start: e.target.value } : x)),
                )
              }
              className="h-7 w-20 rounded-control border border-rule-strong bg-paper-raised px-1 text-right tabular-nums"
            />
            <span aria-hidden="true">–</span>
            <input
              aria-label={`End of window ${i + 1} (min)`}
              inputMode="decimal"
              value={w.end}
              disabled={!canWrite || busy}
              onChange={(e) =>
                setWindows((all) =>
                  all.map((x, k) => (k === i ? { ...x, end: e.target.value } : x)),
                )
              }
              className="h-7 w-20 rounded-control border border-rule-strong bg-paper-raised px-1 text-right tabular-nums"
            />
            <span className="text-ink-muted">min</span>
            {canWrite ? (
              <Button
                size="sm"
                variant="quiet"
                aria-label={`Remove window ${i + 1}`}
                onClick={() => setWindows((all) => all.filter((_, k) => k !== i))}
                disabled={busy}
              >
                Remove
              </Button>
            ) : null}
          </li>
        ))}
      </ol>
      {problem ? (
        <p role="alert" className="mt-1 text-caption text-caution-hazard-deep">
          {problem}
        </p>
      ) : null}
      {canWrite ? (
        <div className="mt-2 flex flex-wrap gap-2">
          <Button
            size="sm"
            variant="secondary"
            onClick={() => setWindows((all) => [...all, { start: '', end: '' }])}
            disabled={busy}
          >
            Add window
          </Button>
          <Button size="sm" onClick={apply} busy={busy}>
            Integrate with these limits
          </Button>
          {detail.integrationMode === 'manual' ? (
            <Button size="sm" variant="quiet" onClick={() => onApply(null)} disabled={busy}>
              Back to automatic
            </Button>
          ) : null}
        </div>
      ) : null}
    </section>
  );
}
