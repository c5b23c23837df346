import { useId, useMemo, useState } from 'react';
import { backCalculateD } from '@shared/chromatography/calibration';
import type { ChromatogramSummary } from '@shared/schemas/chromatograms';
import { Button } from '@/components/button';
import { Loading } from '@/components/spinner';
import { useRouteChromatograms } from '../api/get-route-chromatograms';
import { fmt } from './format';
import type { RouteCompound } from './sample-viewer';
import { formatSignificant, significant } from '@/lib/format';

/** What the route's evaluation says about the wash, for the back-calculation. */
export interface WashContext {
  /** Organic and aqueous phase volumes [L]. */
  organicL: number;
  aqueousL: number;
  stages: number;
  mode: 'cross-current' | 'counter-current';
  /** Fraction of the product kept in the organic phase [-]. */
  productRecovery: number;
  /** Library id of the main organic solvent (the measured D is recorded for it). */
  organicSolventId: string | null;
  organicSolventName: string | null;
  pH: number | null;
  temperatureC: number | null;
}

/** A measured partition point, as the route's compound data keeps it. */
export interface MeasuredPartition {
  organicSolventId: string;
  pH?: number;
  temperatureC?: number;
  D: number;
  source: string;
}

const level = (sample: ChromatogramSummary, componentId: string) =>
  sample.peaks.reduce((sum, p) => sum + (p.componentId === componentId ? p.areaPct : 0), 0);
const has = (sample: ChromatogramSummary, componentId: string) =>
  sample.peaks.some((p) => p.componentId === componentId);

/**
 * The apparent distribution ratio of a compound from its levels before and
 * after this wash (shared/chromatography/calibration.ts), with the offer to
 * keep it as measured data of the route's compound.
 */
export function WashCalibration({
  workspaceId,
  routeId,
  step,
  beforeStepIds,
  stepNames,
  compounds,
  productId,
  wash,
  canWrite,
  onSave,
}: {
  workspaceId: string;
  routeId: string;
  step: { id: string; name: string };
  /** Steps whose samples count as "before": those feeding this one, and this one. */
  beforeStepIds: string[];
  stepNames: Record<string, string>;
  compounds: Array<RouteCompound & { role?: string }>;
  productId: string | null;
  wash: WashContext | null;
  canWrite: boolean;
  onSave: (componentId: string, point: MeasuredPartition) => void;
}) {
  const all = useRouteChromatograms(workspaceId, routeId);
  const baseId = useId();
  const traces = useMemo(
    () => (all.data ?? []).filter((s) => s.kind === 'trace' && s.peaks.some((p) => p.componentId)),
    [all.data],
  );
  const beforeChoices = traces.filter((s) => beforeStepIds.includes(s.stepId));
  const afterChoices = traces.filter((s) => s.stepId === step.id);
  const [beforeId, setBeforeId] = useState('');
  const [afterId, setAfterId] = useState('');
  const [componentId, setComponentId] = useState('');
  const [saved, setSaved] = useState<string | null>(null);
  const before = beforeChoices.find((s) => s.id === beforeId) ?? null;
  const after = afterChoices.find((s) => s.id === afterId) ?? null;
  const common = compounds.filter(
    (c) => c.id !== productId && before && after && has(before, c.id) && has(after, c.id),
  );
  const chosen = common.find((c) => c.id === componentId) ?? common[0] ?? null;

  if (all.isPending) return <Loading label="Loading the route’s samples…" />;
  if (all.isError)
    return <p className="text-small text-caution-hazard-deep">{all.error.message}</p>;
  if (!afterChoices.length || !beforeChoices.length)
    return (
      <p className="text-small text-ink-muted">
        To back-calculate a distribution ratio, assign peaks in a sample taken before this wash (at
        the step feeding it) and in one taken after it (here).
      </p>
    );

  const result =
    before && after && chosen && wash
      ? backCalculateD({
          beforePct: level(before, chosen.id),
          afterPct: level(after, chosen.id),
          productBeforePct: productId && has(before, productId) ? level(before, productId) : null,
          productAfterPct: productId && has(after, productId) ? level(after, productId) : null,
          productRecovery: wash.productRecovery,
          organicL: wash.organicL,
          aqueousL: wash.aqueousL,
          stages: wash.stages,
          mode: wash.mode,
        })
      : null;
  const label = (s: ChromatogramSummary) =>
    `${s.sampleName} (${stepNames[s.stepId] ?? s.stepId}, ${fmt.when(s.takenAt ?? s.createdAt)})`;

  return (
    <div className="space-y-2">
      <div className="grid grid-cols-2 gap-2">
        <div className="space-y-1">
          <label htmlFor={`${baseId}-before`} className="block text-small font-medium">
            Before the wash
          </label>
          <select
            id={`${baseId}-before`}
            value={beforeId}
            onChange={(e) => setBeforeId(e.target.value)}
            className="h-8 w-full rounded-control border border-rule-strong bg-paper-raised px-1 text-small"
          >
            <option value="">Choose a sample</option>
            {beforeChoices.map((s) => (
              <option key={s.id} value={s.id}>
                {label(s)}
              </option>
            ))}
          </select>
        </div>
        <div className="space-y-1">
          <label htmlFor={`${baseId}-after`} className="block text-small font-medium">
            After the wash
          </label>
          <select
            id={`${baseId}-after`}
            value={afterId}
            onChange={(e) => setAfterId(e.target.value)}
            className="h-8 w-full rounded-control border border-rule-strong bg-paper-raised px-1 text-small"
          >
            <option value="">Choose a sample</option>
            {afterChoices.map((s) => (
              <option key={s.id} value={s.id}>
                {label(s)}
              </option>
            ))}
          </select>
        </div>
      </div>
      {before && after ? (
        common.length ? (
          <div className="space-y-1">
            <label htmlFor={`${baseId}-compound`} className="block text-small font-medium">
              Compound
            </label>
            <select
              id={`${baseId}-compound`}
              value={chosen?.id ?? ''}
              onChange={(e) => setComponentId(e.target.value)}
              className="h-8 w-full rounded-control border border-rule-strong bg-paper-raised px-1 text-small"
            >
              {common.map((c) => (
                <option key={c.id} value={c.id}>
                  {c.name}
                </option>
              ))}
            </select>
          </div>
        ) : (
          <p className="text-small text-ink-muted">
            No compound other than the product is assigned in both samples.
          </p>
        )
      ) : null}
      {before && after && chosen && !wash ? (
        <p className="text-small text-ink-muted">
          The route has not been evaluated at this step yet, so the phase volumes are unknown.
        </p>
      ) : null}
      {result && chosen && wash ? (
        result.ok ? (
          <div
            className="space-y-1 rounded-control border border-rule bg-paper px-2 py-1.5 text-small"
            data-calibration
          >
            <p>
              Apparent D of {chosen.name}
              {wash.organicSolventName ? ` (${wash.organicSolventName}/water)` : ''}:{' '}
              <strong className="tabular-nums" data-d>
                {formatSignificant(result.D, 3)}
              </strong>
            </p>
            <p className="text-caption text-ink-muted">
              {(100 * result.fractionRemaining).toFixed(1)} % stayed in the organic phase (by{' '}
              {result.basis}); {result.formula}; V_org {wash.organicL.toFixed(2)} L, V_aq{' '}
              {wash.aqueousL.toFixed(2)} L.
            </p>
            {result.warnings.map((w) => (
              <p key={w} className="text-caption text-caution-warning-deep">
                {w}
              </p>
            ))}
            {canWrite && wash.organicSolventId ? (
              <Button
                size="sm"
                onClick={() => {
                  onSave(chosen.id, {
                    organicSolventId: wash.organicSolventId!,
                    ...(wash.pH !== null ? { pH: Math.round(wash.pH * 100) / 100 } : {}),
                    ...(wash.temperatureC !== null ? { temperatureC: wash.temperatureC } : {}),
                    D: significant(result.D, 4),
                    source:
                      `Measured: back-calculated from IPC samples “${before!.sampleName}” and “${after!.sampleName}” across ${step.name}`.slice(
                        0,
                        300,
                      ),
                  });
                  setSaved(chosen.name);
                }}
              >
                Save D = {formatSignificant(result.D, 3)} as measured for {chosen.name}
              </Button>
            ) : null}
            {saved ? (
              <p role="status" className="text-caption text-ink-muted">
                Saved in the route’s data for {saved}, marked as measured; the route is evaluated
                again with it, and a measured D wins over the estimates.
              </p>
            ) : null}
          </div>
        ) : (
          <p className="text-small text-ink-muted" data-calibration>
            {result.reason}
          </p>
        )
      ) : null}
    </div>
  );
}
