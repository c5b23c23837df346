import { useId, useMemo, useState } from 'react';
import { MONTE_CARLO_MAX_DRAWS } from '@shared/schemas/evaluate';
import type { Percentiles } from '@/features/routes';
import { Button } from '@/components/button';
import { useEditorStore } from '@/stores/editor-store';
import { keyOf } from '../document';
import { useJob, useStartMonteCarlo } from '../api/monte-carlo';
import { componentLabel } from './fields';
import { formatFactor } from '@/lib/format';

const inputCls =
  'w-full rounded-control border border-rule-strong bg-paper-raised px-2 py-1 text-body tabular-nums focus:outline-2 focus:outline-accent';

/** How many settings of the document carry a ± range. */
function countRanges(value: unknown): number {
  if (!value || typeof value !== 'object') return 0;
  if ('plusMinus' in value && 'value' in value) return 1;
  return Object.values(value).reduce<number>((n, v) => n + countRanges(v), 0);
}

/** "Run uncertainty": a seeded Monte Carlo on the server over every ± range; progress, then p5/p50/p95. */
export function UncertaintyPanel() {
  const [draws, setDraws] = useState('200');
  const [seed, setSeed] = useState('1');
  const [run, setRun] = useState<{ jobId: string; revision: number } | null>(null);
  const start = useStartMonteCarlo();
  const job = useJob(run?.jobId ?? null);
  const revision = useEditorStore((s) => s.modelRevision);
  const steps = useEditorStore((s) => s.doc.steps);
  const components = useEditorStore((s) => s.doc.components);
  const ranges = useMemo(() => countRanges(steps), [steps]);
  const drawsId = useId();
  const seedId = useId();

  const drawsN = Number(draws);
  const seedN = Number(seed);
  const drawsError =
    Number.isInteger(drawsN) && drawsN >= 1 && drawsN <= MONTE_CARLO_MAX_DRAWS
      ? null
      : `Draws: a whole number from 1 to ${MONTE_CARLO_MAX_DRAWS.toLocaleString('en')}.`;
  const seedError =
    Number.isInteger(seedN) && seedN >= 0 && seedN <= 4_294_967_295
      ? null
      : 'Seed: a whole number of zero or more.';
  const running =
    start.isPending ||
    job.data?.status === 'queued' ||
    job.data?.status === 'running' ||
    (run !== null && !job.data);

  const submit = (e: React.FormEvent) => {
    e.preventDefault();
    if (drawsError || seedError) return;
    const st = useEditorStore.getState();
    start.mutate(
      { doc: st.doc, draws: drawsN, seed: seedN },
      { onSuccess: ({ jobId }) => setRun({ jobId, revision: st.modelRevision }) },
    );
  };

  const names = new Map(
    components.map((c) => [keyOf(c), componentLabel(c).replace(/ \(impurity\)$/, '')]),
  );
  const data = job.data;
  const result = data?.status === 'done' ? data.result : undefined;
  const progress = data ? Math.round(100 * (data.status === 'done' ? 1 : data.progress)) : 0;

  return (
    <div className="space-y-2">
      <form aria-label="Uncertainty run" onSubmit={submit} className="flex items-end gap-2">
        <div className="w-24">
          <label htmlFor={drawsId} className="block text-caption text-ink-muted">
            Draws
          </label>
          <input
            id={drawsId}
            inputMode="numeric"
            value={draws}
            onChange={(e) => setDraws(e.target.value)}
            aria-invalid={drawsError ? true : undefined}
            className={inputCls}
          />
        </div>
        <div className="w-24">
          <label htmlFor={seedId} className="block text-caption text-ink-muted">
            Seed
          </label>
          <input
            id={seedId}
            inputMode="numeric"
            value={seed}
            onChange={(e) => setSeed(e.target.value)}
            aria-invalid={seedError ? true : undefined}
            className={inputCls}
          />
        </div>
        <Button
          type="submit"
          size="sm"
          busy={start.isPending}
          disabled={running || steps.length === 0}
        >
          Run uncertainty
        </Button>
      </form>
      {drawsError || seedError ? (
        <p className="text-caption text-caution-hazard-deep">{drawsError ?? seedError}</p>
      ) : null}
      <p className="text-caption text-ink-muted">
        {ranges
          ? `${ranges} setting${ranges === 1 ? '' : 's'} carry a ± range; each draw picks every one uniformly within its range.`
          : 'No setting carries a ± range yet, so every draw gives the same answer. Type a range in a step’s settings, for example “10 ± 1 vol”.'}
      </p>
      {start.isError ? (
        <p role="alert" className="text-small text-caution-hazard-deep">
          The run could not start: {start.error.message}
        </p>
      ) : null}
      {job.isError ? (
        <p role="alert" className="text-small text-caution-hazard-deep">
          The run’s progress could not be read: {job.error.message}
        </p>
      ) : null}
      {run ? (
        <div className="space-y-1">
          <div className="flex items-center justify-between text-caption text-ink-muted">
            <span>
              {data?.status === 'done'
                ? 'Done'
                : data?.status === 'failed'
                  ? 'Failed'
                  : data?.status === 'running'
                    ? 'Running'
                    : 'Queued'}
            </span>
            <span className="tabular-nums">{progress} %</span>
          </div>
          <div
            role="progressbar"
            aria-label="Uncertainty run progress"
            aria-valuemin={0}
            aria-valuemax={100}
            aria-valuenow={progress}
            aria-valuetext={data?.status === 'done' ? 'done' : `${progress} %`}
            data-status={data?.status ?? 'queued'}
            className="h-2 overflow-hidden rounded-full bg-paper-sunken"
          >
            <div
              className={`h-full ${data?.status === 'failed' ? 'bg-caution-hazard' : 'bg-accent'}`}
              style={{ width: `${progress}%` }}
            />
          </div>
        </div>
      ) : null}
      {data?.status === 'failed' ? (
        <p role="alert" className="text-small text-caution-hazard-deep">
          The run failed: {data.error?.message ?? 'no reason was given.'}
        </p>
      ) : null}
      {result ? (
        <>
          {run && run.revision !== revision ? (
            <p className="text-caption text-caution-advisory-deep">
              The route has changed since this run; run it again to see the bands for the route as
              it is now.
            </p>
          ) : null}
          <div className="overflow-x-auto">
            <table
              className="w-full border-collapse text-left text-caption tabular-nums"
              aria-label="Uncertainty bands"
            >
              <thead>
                <tr className="bg-paper-sunken text-ink-muted">
                  {['Quantity', 'p5', 'p50', 'p95', 'Band'].map((h) => (
                    <th key={h} scope="col" className="border-b border-rule px-2 py-1 font-medium">
                      {h}
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                <BandRow label="Yield %" p={result.yieldPct} scale="linear" />
                <BandRow label="Purity wt %" p={result.purityWtPct} scale="linear" />
                {Object.keys(result.purgeFactor).length ? (
                  <tr>
                    <th
                      scope="rowgroup"
                      colSpan={5}
                      className="border-b border-rule px-2 pb-0.5 pt-2 text-left font-medium text-ink-muted"
                    >
                      Purge factor of
                    </th>
                  </tr>
                ) : null}
                {Object.entries(result.purgeFactor).map(([id, p]) => (
                  <BandRow key={id} label={names.get(id) ?? id} p={p} scale="log" suffix="×" />
                ))}
              </tbody>
            </table>
          </div>
          <p className="text-caption text-ink-muted">
            {result.draws} draws, seed {result.seed}
            {result.failedDraws ? `; ${result.failedDraws} draws could not be evaluated` : ''}. A
            blank purge means that impurity is purged completely in most draws.{' '}
            {result.processSafetyNote}
          </p>
        </>
      ) : null}
    </div>
  );
}

/** One quantity's p5/p50/p95 with a band: the p5–p95 range as a bar, the median as a tick. */
function BandRow({
  label,
  p,
  scale,
  suffix = '',
}: {
  label: string;
  p: Percentiles;
  scale: 'linear' | 'log';
  suffix?: string;
}) {
  const f = (v: number | null) =>
    v === null
      ? '—'
      : scale === 'log'
        ? `${formatFactor(v)}${suffix}`
        : `${v >= 100 ? v.toFixed(0) : v.toFixed(1)}${suffix}`;
  const pos = (v: number) =>
    scale === 'linear'
      ? Math.min(100, Math.max(0, v))
      : Math.min(100, Math.max(0, (100 * Math.log10(Math.max(1, v))) / 4));
  const band = p.p5 !== null && p.p95 !== null && p.p50 !== null;
  return (
    <tr className="border-b border-rule">
      <th scope="row" className="max-w-36 px-2 py-1 font-normal" title={label}>
        {label}
      </th>
      <td className="whitespace-nowrap px-2 py-1">{f(p.p5)}</td>
      <td className="whitespace-nowrap px-2 py-1 font-medium">{f(p.p50)}</td>
      <td className="whitespace-nowrap px-2 py-1">{f(p.p95)}</td>
      <td className="w-24 px-2 py-1">
        {band ? (
          <span className="relative block h-2 rounded-full bg-paper-sunken" aria-hidden="true">
            <span
              className="absolute inset-y-0 rounded-full bg-accent-soft outline outline-1 outline-accent/50"
              style={{
                left: `${pos(p.p5!)}%`,
                width: `${Math.max(1.5, pos(p.p95!) - pos(p.p5!))}%`,
              }}
            />
            <span
              className="absolute -inset-y-0.5 w-0.5 bg-accent-deep"
              style={{ left: `${pos(p.p50!)}%` }}
            />
          </span>
        ) : null}
      </td>
    </tr>
  );
}
