import { useState } from 'react';
import type { RouteDocument } from '@shared/schemas/route';
import type { OptimiseResult, Percentiles } from '@shared/schemas/jobs';
import type { OptimiseRequestInput } from '@shared/schemas/optimise';
import { freeParamChoices } from '@shared/engine/optimise';
import { Button } from '@/components/button';
import { Select } from '@/components/select';
import { formatPurity } from '@/features/editor';
import {
  OBJECTIVE_AXIS,
  TRADE_OFF_AXES,
  TradeOffChart,
  type TradeOffAxis,
} from './trade-off-chart';

const fmt = (v: number | null | undefined, digits = 1) =>
  v === null || v === undefined || !Number.isFinite(v) ? '—' : v.toFixed(digits);
const band = (p: Percentiles | undefined, digits = 1) =>
  p ? `${fmt(p.p5, digits)} – ${fmt(p.p95, digits)}` : '—';

/**
 * The answer of a finished run: the trade-off picture, the chosen
 * candidate's parameters beside the route's, its figures with their Monte
 * Carlo spread, and "Open as a copy". When nothing met every constraint it
 * says so and shows the closest candidate with what it misses.
 */
export function OptimiseResultView({
  result,
  request,
  original,
  onOpenCopy,
  opening,
}: {
  result: OptimiseResult;
  request: OptimiseRequestInput;
  original: RouteDocument;
  onOpenCopy: () => void;
  opening: boolean;
}) {
  const [y, setY] = useState<TradeOffAxis>('solventFreePurityPct');
  const axis = OBJECTIVE_AXIS[result.objective];
  const choices = freeParamChoices(original);
  const objectiveOf = (t: OptimiseResult['best']['totals']) =>
    result.objective === 'pmi'
      ? t.pmi
      : result.objective === 'solventLPerKg'
        ? t.solventLPerKg
        : t.cycleTimeH;
  const best = result.best;
  const current = result.current;
  const u = best.uncertainty;
  const feasibleCount = result.candidates.filter((c) => c.feasible).length;
  const impurityNames = new Map(
    original.components.flatMap((c) => (c.kind === 'compound' ? [[c.id, c.name] as const] : [])),
  );

  return (
    <div className="space-y-4" data-testid="optimiser-result">
      {result.feasible ? (
        <div className="rounded-card border border-rule bg-paper-raised px-4 py-3">
          <p className="font-medium">
            Best route found: {axis.name} {fmt(objectiveOf(best.totals))} {axis.unit}
            {current ? ` (now ${fmt(objectiveOf(current.totals))} ${axis.unit})` : ''}
          </p>
          <p className="text-small text-ink-muted">{result.message}</p>
        </div>
      ) : (
        <div
          role="alert"
          className="rounded-card border border-caution-warning/50 bg-caution-warning-soft px-4 py-3"
        >
          <p className="font-medium text-caution-warning-deep">No feasible route</p>
          <p className="text-body">
            None of the {result.evaluations} routes tried meets every constraint. The closest one is
            shown below; it misses:
          </p>
          <ul className="mt-1 list-disc pl-5 text-body">
            {best.unmet.map((m) => (
              <li key={m}>{m}</li>
            ))}
          </ul>
          <p className="mt-1 text-small text-ink-muted">
            Widen the ranges, free another parameter or relax a constraint, then run again.
          </p>
        </div>
      )}

      <div className="rounded-card border border-rule bg-paper-raised p-3">
        <div className="flex flex-wrap items-end justify-between gap-2">
          <p className="text-small text-ink-muted">
            {result.candidates.length} routes evaluated, {feasibleCount} meet every constraint
            {result.failedEvaluations
              ? `; ${result.failedEvaluations} could not be evaluated and are not shown`
              : ''}
            .
          </p>
          <Select
            label="Plot against"
            value={y}
            onValueChange={(v) => setY(v as TradeOffAxis)}
            options={(Object.keys(TRADE_OFF_AXES) as TradeOffAxis[]).map((k) => ({
              value: k,
              label: TRADE_OFF_AXES[k],
            }))}
          />
        </div>
        <TradeOffChart result={result} y={y} />
      </div>

      <div className="grid gap-4 lg:grid-cols-2">
        <section aria-labelledby="chosen-heading" className="space-y-2">
          <h3 id="chosen-heading" className="text-body font-medium">
            {result.feasible ? 'Chosen candidate' : 'Closest candidate'}
          </h3>
          <table
            className="w-full border-collapse text-left text-small tabular-nums"
            aria-label="Chosen parameters"
          >
            <thead>
              <tr className="border-b border-rule text-caption text-ink-muted">
                <th className="py-1 pr-2 font-medium">Parameter</th>
                <th className="py-1 pr-2 font-medium">Now</th>
                <th className="py-1 font-medium">Chosen</th>
              </tr>
            </thead>
            <tbody>
              {request.free.map((f) => {
                const c = choices.find((x) => x.stepId === f.stepId && x.param === f.param);
                const unit = c?.unit ? ` ${c.unit}` : '';
                const digits = c?.integer ? 0 : 2;
                return (
                  <tr key={`${f.stepId}.${f.param}`} className="border-b border-rule">
                    <td className="py-1 pr-2">
                      {c ? `${c.label} of ${c.stepName}` : `${f.param} of ${f.stepId}`}
                    </td>
                    <td className="py-1 pr-2 whitespace-nowrap">
                      {fmt(c?.value, digits)}
                      {unit}
                    </td>
                    <td className="py-1 font-medium whitespace-nowrap">
                      {fmt(best.params[`${f.stepId}.${f.param}`], digits)}
                      {unit}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </section>

        <section aria-labelledby="figures-heading" className="space-y-2">
          <h3 id="figures-heading" className="text-body font-medium">
            Figures and their spread
          </h3>
          <table
            className="w-full border-collapse text-left text-small tabular-nums"
            aria-label="Figures of the chosen candidate"
          >
            <thead>
              <tr className="border-b border-rule text-caption text-ink-muted">
                <th className="py-1 pr-2 font-medium">Figure</th>
                <th className="py-1 pr-2 font-medium">Now</th>
                <th className="py-1 pr-2 font-medium">Chosen</th>
                <th className="py-1 font-medium">Spread p5 – p95</th>
              </tr>
            </thead>
            <tbody>
              <FigureRow
                name={`${axis.name} (${axis.unit})`}
                now={current ? objectiveOf(current.totals) : null}
                chosen={objectiveOf(best.totals)}
                spread={band(u.objective)}
              />
              <FigureRow
                name="Yield (%)"
                now={current?.totals.yieldPct}
                chosen={best.totals.yieldPct}
                spread={band(u.yieldPct)}
              />
              <FigureRow
                name="Solvent-free purity (%)"
                now={current?.totals.solventFreePurityPct}
                chosen={best.totals.solventFreePurityPct}
                spread={
                  u.solventFreePurityPct
                    ? `${formatPurity(u.solventFreePurityPct.p5)} – ${formatPurity(u.solventFreePurityPct.p95)}`
                    : '—'
                }
                format={formatPurity}
              />
              <FigureRow
                name="Largest volume (L)"
                now={current?.totals.peakVolumeL}
                chosen={best.totals.peakVolumeL}
                spread={band(u.peakVolumeL)}
              />
              {Object.entries(u.impurityPct).map(([id, p]) => (
                <FigureRow
                  key={id}
                  name={`${impurityNames.get(id) ?? id} (%)`}
                  now={current?.totals.impurityPct[id]}
                  chosen={best.totals.impurityPct[id]}
                  spread={band(p, 3)}
                  digits={3}
                />
              ))}
            </tbody>
          </table>
          <p className="text-caption text-ink-muted" data-testid="optimiser-uncertainty">
            Spread over {u.draws} seeded draws of the route’s ± ranges at the chosen point
            {u.failedDraws ? ` (${u.failedDraws} could not be evaluated)` : ''}; it does not include
            the error of the models or of the component data.
          </p>
        </section>
      </div>

      <div className="rounded-card border border-caution-advisory/40 bg-caution-advisory-soft px-4 py-3 text-small">
        <p className="font-medium text-caution-advisory-deep">A model result</p>
        <p>
          Confirm it at the bench and through the site’s process-safety review before it is used;
          volumes, cycles and temperatures change heat loads, boil-up and vessel fill.{' '}
          {result.processSafetyNote}
        </p>
      </div>

      <div className="flex flex-wrap items-center gap-2">
        <Button onClick={onOpenCopy} disabled={opening} busy={opening}>
          Open as a copy
        </Button>
        <p className="text-caption text-ink-muted">
          Saves the {result.feasible ? 'chosen' : 'closest'} candidate as a new route (a draft);
          this route stays as it is. The chosen values are taken to two decimals of their unit.
        </p>
      </div>
    </div>
  );
}

function FigureRow({
  name,
  now,
  chosen,
  spread,
  digits = 1,
  format = (v) => fmt(v, digits),
}: {
  name: string;
  now: number | null | undefined;
  chosen: number | null | undefined;
  spread: string;
  digits?: number;
  /** How a value is written (purity: as the totals card writes it). */
  format?: (v: number | null | undefined) => string;
}) {
  return (
    <tr className="border-b border-rule">
      <td className="py-1 pr-2">{name}</td>
      <td className="py-1 pr-2">{format(now)}</td>
      <td className="py-1 pr-2 font-medium">{format(chosen)}</td>
      <td className="py-1">{spread}</td>
    </tr>
  );
}
