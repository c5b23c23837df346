import type { RevisionCompare } from '@shared/schemas/revisions';
import { formatSignificant } from '@/lib/format';

const TOTAL_LABELS: Record<string, string> = {
  yieldPct: 'Yield, %',
  purityWtPct: 'Assay, wt%',
  solventFreePurityPct: 'Purity, solvent-free %',
  pmi: 'PMI',
  eFactor: 'E-factor',
  eFactorExcludingWater: 'E-factor without water',
  solventUseLPerKg: 'Solvent use, L/kg',
  cycleTimeH: 'Cycle time, h',
  isolatedProductKg: 'Isolated product, kg',
  isolatedSolidKg: 'Isolated solid, kg',
  productInKg: 'Product in, kg',
  totalInputKg: 'Total input, kg',
};

const show = (value: unknown) => {
  if (value === null || value === undefined) return '—';
  if (typeof value === 'number') return formatSignificant(value, 4);
  if (typeof value === 'object') return JSON.stringify(value);
  return String(value);
};

function totalLabel(name: string, componentNames: Record<string, string>) {
  if (name.startsWith('purge.')) {
    const id = name.slice(6);
    return `Purge factor, ${componentNames[id] ?? id}`;
  }
  if (name.startsWith('peakVolumeL.')) return `Peak volume, L (${name.slice(12)})`;
  return TOTAL_LABELS[name] ?? name;
}

/** What changed between two revisions: steps, each field old → new, and the totals side by side. */
export function CompareView({
  compare,
  componentNames,
}: {
  compare: RevisionCompare;
  componentNames: Record<string, string>;
}) {
  const totals = Object.entries(compare.totals).filter(
    ([name]) => !name.startsWith('peakVolumeL.'),
  );
  const nothing =
    !compare.stepsAdded.length &&
    !compare.stepsRemoved.length &&
    !compare.stepsChanged.length &&
    !compare.documentChanges.length &&
    !compare.connectionsAdded.length &&
    !compare.connectionsRemoved.length;
  return (
    <div className="space-y-3 text-small" data-compare>
      <p className="text-ink-muted">
        Revision {compare.from} → revision {compare.to}. Changed steps are outlined on the canvas.
      </p>
      {nothing ? <p>The route documents are the same.</p> : null}
      {compare.stepsAdded.length ? (
        <p>
          <span className="font-medium">Steps added:</span>{' '}
          {compare.stepsAdded.map((s) => s.name).join(', ')}
        </p>
      ) : null}
      {compare.stepsRemoved.length ? (
        <p>
          <span className="font-medium">Steps removed:</span>{' '}
          {compare.stepsRemoved.map((s) => s.name).join(', ')}
        </p>
      ) : null}
      {compare.stepsChanged.map((step) => (
        <table key={step.stepId} className="w-full" aria-label={`Changes in ${step.name}`}>
          <caption className="text-left font-medium">{step.name}</caption>
          <thead>
            <tr className="text-caption text-ink-muted">
              <th className="text-left font-normal">Field</th>
              <th className="text-right font-normal">Rev. {compare.from}</th>
              <th className="text-right font-normal">Rev. {compare.to}</th>
            </tr>
          </thead>
          <tbody>
            {step.changes.map((c) => (
              <tr key={c.path} className="border-t border-rule">
                <td className="break-all pr-2">{c.path.replace(/^params\./, '')}</td>
                <td className="text-right tabular-nums">{show(c.from)}</td>
                <td className="text-right font-medium tabular-nums">{show(c.to)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      ))}
      {compare.documentChanges.length ? (
        <p>
          <span className="font-medium">Other changes:</span>{' '}
          {compare.documentChanges
            .map((c) => `${c.path}: ${show(c.from)} → ${show(c.to)}`)
            .join('; ')}
        </p>
      ) : null}
      <table className="w-full" aria-label="Totals">
        <caption className="text-left font-medium">Totals</caption>
        <thead>
          <tr className="text-caption text-ink-muted">
            <th className="text-left font-normal">Total</th>
            <th className="text-right font-normal">Rev. {compare.from}</th>
            <th className="text-right font-normal">Rev. {compare.to}</th>
          </tr>
        </thead>
        <tbody>
          {totals.map(([name, t]) => (
            <tr
              key={name}
              className={`border-t border-rule ${t.from !== t.to ? 'bg-accent-soft' : ''}`}
              data-changed={t.from !== t.to}
            >
              <td className="pr-2">{totalLabel(name, componentNames)}</td>
              <td className="text-right tabular-nums">{show(t.from)}</td>
              <td className="text-right font-medium tabular-nums">{show(t.to)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
