import { useEffect, useMemo, useRef, useState } from 'react';
import { createPortal } from 'react-dom';
import { purgeCascades, type PurgeCascade } from '@shared/engine/route/purge';
import { csvText } from '@shared/csv';
import { useEditorStore } from '@/stores/editor-store';
import { Button } from '@/components/button';
import { formatFactor, formatSignificant, significant } from '@/lib/format';
import { useEvaluation } from '../evaluation';
import { keyOf } from '../document';
import { Chart, PLOT, axisStyle, baseOption } from '../charts/chart';
import { PurgePlot } from './plots';

type Result = NonNullable<ReturnType<typeof useEvaluation.getState>['result']>;
type Impurity = Result['totals']['impurities'][number];

/** A level in the isolated solid as an HPLC report gives it: two decimals, "< 0.01" below that. */
export function formatLevel(pct: number | null | undefined): string {
  if (pct === null || pct === undefined || !Number.isFinite(pct)) return '—';
  return pct < 0.005 ? '< 0.01' : pct.toFixed(2);
}

/** "99.97", never "100.00" unless nothing else is in the solid. */
export function formatPurity(pct: number | null | undefined): string {
  if (pct === null || pct === undefined || !Number.isFinite(pct)) return '—';
  const s = pct.toFixed(2);
  return s === '100.00' && pct < 100 ? '> 99.99' : s;
}

const SUPERSCRIPT: Record<string, string> = {
  '-': '⁻',
  '0': '⁰',
  '1': '¹',
  '2': '²',
  '3': '³',
  '4': '⁴',
  '5': '⁵',
  '6': '⁶',
  '7': '⁷',
  '8': '⁸',
  '9': '⁹',
};
/** 1e-9 → "10⁻⁹" for a log axis. */
const powerOfTen = (v: number) =>
  `10${String(Math.round(Math.log10(v))).replace(/./g, (c) => SUPERSCRIPT[c] ?? c)}`;

const kg = (v: number) =>
  v === 0 ? '0' : v >= 0.01 && v < 1e5 ? v.toFixed(4) : formatSignificant(v, 3);

/** Pass / fail / no limit, in words and a mark (never colour alone). */
export function LimitMark({ impurity }: { impurity: Impurity }) {
  if (impurity.pass === null)
    return (
      <span className="whitespace-nowrap text-caption text-ink-muted" data-limit="none">
        no limit set
      </span>
    );
  return impurity.pass ? (
    <span
      className="inline-flex items-center gap-1 whitespace-nowrap rounded-control bg-phase-aqueous-soft px-1.5 py-px text-caption font-medium text-phase-aqueous-deep"
      data-limit="pass"
    >
      <span aria-hidden="true">✓</span> within {impurity.limitPct} %
    </span>
  ) : (
    <span
      className="inline-flex items-center gap-1 whitespace-nowrap rounded-control bg-caution-hazard-soft px-1.5 py-px text-caption font-medium text-caution-hazard-deep"
      data-limit="fail"
    >
      <span aria-hidden="true">✗</span> above {impurity.limitPct} %
    </span>
  );
}

function useNames() {
  const doc = useEditorStore((s) => s.doc);
  return useMemo(() => {
    const comp = new Map<string, string>();
    for (const c of doc.components) comp.set(keyOf(c), c.kind === 'compound' ? c.name : keyOf(c));
    const step = new Map(doc.steps.map((s) => [s.id, s.name]));
    return {
      component: (id: string) => comp.get(id) ?? id,
      step: (id: string | null) => (id ? (step.get(id) ?? id) : '—'),
      routeName: doc.name ?? 'route',
    };
  }, [doc]);
}

/** The Purge tab: each impurity against its limit, the step that removes it, the route's purge factors. */
export function PurgePanel() {
  const result = useEvaluation((s) => s.result);
  const names = useNames();
  const [open, setOpen] = useState(false);
  const cascades = useMemo(() => (result ? purgeCascades(result) : []), [result]);
  if (!result)
    return (
      <p className="text-small text-ink-muted">
        The purge appears once the route can be evaluated.
      </p>
    );
  const main = new Map(cascades.map((c) => [c.componentId, c.mainStepId]));
  const { totals } = result;
  return (
    <div className="space-y-3">
      {totals.impurities.length ? (
        <>
          <p className="text-small">
            Solvent-free purity{' '}
            <strong className="tabular-nums" data-purge-purity>
              {formatPurity(totals.solventFreePurityPct)} %
            </strong>{' '}
            <span className="text-caption text-ink-muted">
              (area-% basis; assay {formatPurity(totals.purityWtPct)} wt % with solvents and water)
            </span>
          </p>
          <table className="w-full text-small" aria-label="Impurities in the isolated solid">
            <thead>
              <tr className="text-left text-caption text-ink-muted">
                <th className="py-0.5 font-normal">Impurity</th>
                <th className="py-0.5 text-right font-normal">In solid, %</th>
                <th className="py-0.5 pl-2 font-normal">Limit</th>
                <th className="py-0.5 pl-2 font-normal">Removed mainly at</th>
              </tr>
            </thead>
            <tbody>
              {totals.impurities.map((i) => (
                <tr
                  key={i.componentId}
                  className="border-t border-rule"
                  data-impurity={i.componentId}
                >
                  <td className="py-1 pr-1">{names.component(i.componentId)}</td>
                  <td className="py-1 text-right tabular-nums">{formatLevel(i.levelPct)}</td>
                  <td className="py-1 pl-2">
                    <LimitMark impurity={i} />
                  </td>
                  <td className="py-1 pl-2" data-main-step={main.get(i.componentId) ?? ''}>
                    {names.step(main.get(i.componentId) ?? null)}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          <Button size="sm" variant="secondary" onClick={() => setOpen(true)}>
            Open purge view
          </Button>
        </>
      ) : null}
      <PurgePlot />
      {open ? <PurgeView onClose={() => setOpen(false)} /> : null}
    </div>
  );
}

/** Amount of one impurity travelling with the product after each step (log scale), as a cascade. */
function CascadeChart({
  cascade,
  stepName,
}: {
  cascade: PurgeCascade;
  stepName: (id: string) => string;
}) {
  const option = useMemo(() => {
    const rows = cascade.rows;
    const floor = Math.min(
      ...rows.flatMap((r) => [r.inKg, r.outKg]).filter((v) => v > 0),
      Infinity,
    );
    const min = Number.isFinite(floor) ? 10 ** Math.floor(Math.log10(floor) - 1) : 1e-12;
    return {
      ...baseOption,
      grid: { left: 8, right: 16, top: 28, bottom: 24, containLabel: true },
      tooltip: {
        ...baseOption.tooltip,
        formatter: (p: Array<{ dataIndex: number }>) => {
          const r = rows[p[0]?.dataIndex ?? 0];
          return r ? `${stepName(r.stepId)}: ${kg(r.outKg)} kg with the product` : '';
        },
      },
      xAxis: {
        type: 'category',
        name: 'Step',
        nameLocation: 'middle',
        nameGap: 22,
        // Numbered as in the table below; the names are there.
        data: rows.map((_, k) => String(k + 1)),
        ...axisStyle,
        axisLabel: { ...axisStyle.axisLabel, interval: 0 },
      },
      yAxis: {
        type: 'log',
        name: 'kg with the product',
        min,
        ...axisStyle,
        nameTextStyle: { ...axisStyle.nameTextStyle, align: 'left' },
        splitNumber: 4,
        axisLabel: { ...axisStyle.axisLabel, formatter: (v: number) => powerOfTen(v) },
      },
      series: [
        {
          name: 'With the product after the step',
          type: 'line',
          step: 'end',
          symbol: 'circle',
          symbolSize: 6,
          lineStyle: { color: PLOT.accent, width: 2 },
          itemStyle: { color: PLOT.accent },
          data: rows.map((r) => Math.max(r.outKg, min)),
          label: {
            show: true,
            position: 'top',
            fontSize: 10,
            color: PLOT.ink,
            formatter: (p: { dataIndex: number }) => {
              const f = rows[p.dataIndex].stepFactor;
              return f === null ? 'all' : f > 1.05 ? `÷${formatFactor(f)}` : '';
            },
          },
        },
      ],
    };
  }, [cascade, stepName]);
  return (
    <Chart
      option={option}
      label={`Amount of the impurity with the product after each step, log scale`}
      height={170}
      testId={`purge-cascade-${cascade.componentId}`}
    />
  );
}

/**
 * The purge argument, full screen: per impurity a cascade picture and a table
 * of each step's amount in, amount leaving with the product, and the step and
 * cumulative purge factors. Printable (only this view prints) and exportable as CSV.
 */
export function PurgeView({ onClose }: { onClose: () => void }) {
  const result = useEvaluation((s) => s.result);
  const names = useNames();
  const dialog = useRef<HTMLDivElement>(null);
  const cascades = useMemo(() => (result ? purgeCascades(result) : []), [result]);
  useEffect(() => {
    const before = document.activeElement as HTMLElement | null;
    document.body.classList.add('pw-purge-view-open');
    dialog.current?.focus();
    const onKey = (e: KeyboardEvent) => {
      if (e.key === 'Escape') onClose();
    };
    window.addEventListener('keydown', onKey);
    return () => {
      window.removeEventListener('keydown', onKey);
      document.body.classList.remove('pw-purge-view-open');
      before?.focus();
    };
  }, [onClose]);
  if (!result) return null;
  const levels = new Map(result.totals.impurities.map((i) => [i.componentId, i]));
  const download = () => {
    const rows = cascades.flatMap((c) =>
      c.rows.map((r) => [
        names.component(c.componentId),
        names.step(r.stepId),
        significant(r.inKg, 6),
        significant(r.outKg, 6),
        r.stepFactor === null ? 'complete' : significant(r.stepFactor, 4),
        r.cumulativeFactor === null ? 'complete' : significant(r.cumulativeFactor, 4),
      ]),
    );
    const text = csvText(
      [
        'impurity',
        'step',
        'in_kg',
        'with_product_kg',
        'step_purge_factor',
        'cumulative_purge_factor',
      ],
      rows,
    );
    const url = URL.createObjectURL(new Blob([text], { type: 'text/csv' }));
    const a = document.createElement('a');
    a.href = url;
    a.download = `${names.routeName.replace(/[^\w-]+/g, '-')}-purge.csv`;
    a.click();
    URL.revokeObjectURL(url);
  };
  return createPortal(
    <div
      ref={dialog}
      role="dialog"
      aria-modal="true"
      aria-label="Purge view"
      tabIndex={-1}
      data-purge-view
      className="fixed inset-0 z-50 overflow-y-auto bg-paper p-6 text-ink outline-none"
    >
      <header className="mb-4 flex flex-wrap items-center gap-3">
        <div className="min-w-0 flex-1">
          <h1 className="text-title font-medium">Purge of each impurity, step by step</h1>
          <p className="text-small text-ink-muted">
            {names.routeName} · solvent-free purity{' '}
            {formatPurity(result.totals.solventFreePurityPct)} % (area-% basis) · engine{' '}
            {result.engineVersion}
          </p>
        </div>
        <div className="flex gap-2 print:hidden">
          <Button size="sm" variant="secondary" onClick={download}>
            Download CSV
          </Button>
          <Button size="sm" variant="secondary" onClick={() => window.print()}>
            Print
          </Button>
          <Button size="sm" onClick={onClose}>
            Close
          </Button>
        </div>
      </header>
      <p className="mb-4 max-w-3xl text-small text-ink-muted">
        For each step: the amount of the impurity entering it, the amount leaving with the product
        (in the output that carries the most product), the step&apos;s purge factor (in ÷ out) and
        the cumulative factor (the product of the step factors so far). “Complete”: none leaves with
        the product. Levels are in the isolated solid, solvent-free.
      </p>
      <div className="grid gap-6 lg:grid-cols-2">
        {cascades.map((c) => {
          const level = levels.get(c.componentId);
          return (
            <section
              key={c.componentId}
              aria-label={names.component(c.componentId)}
              data-purge-impurity={c.componentId}
              className="break-inside-avoid rounded-card border border-rule bg-paper-raised p-3"
            >
              <h2 className="text-small font-medium">{names.component(c.componentId)}</h2>
              <p className="text-caption text-ink-muted">
                {level ? (
                  <>
                    {formatLevel(level.levelPct)} % in the solid · <LimitMark impurity={level} />{' '}
                    ·{' '}
                  </>
                ) : null}
                removed mainly at{' '}
                <strong className="text-ink" data-main-step={c.mainStepId ?? ''}>
                  {names.step(c.mainStepId)}
                </strong>
              </p>
              <CascadeChart cascade={c} stepName={names.step} />
              <table className="mt-2 w-full text-caption tabular-nums">
                <thead>
                  <tr className="text-left text-ink-muted">
                    <th className="w-5 py-0.5 font-normal">#</th>
                    <th className="py-0.5 font-normal">Step</th>
                    <th className="py-0.5 text-right font-normal">In, kg</th>
                    <th className="py-0.5 text-right font-normal">With product, kg</th>
                    <th className="py-0.5 text-right font-normal">Step factor</th>
                    <th className="py-0.5 text-right font-normal">Cumulative</th>
                  </tr>
                </thead>
                <tbody>
                  {c.rows.map((r, k) => (
                    <tr
                      key={r.stepId}
                      className={`border-t border-rule ${r.stepId === c.mainStepId ? 'font-medium' : ''}`}
                    >
                      <td className="py-0.5 text-ink-muted">{k + 1}</td>
                      <td className="py-0.5 pr-1">{names.step(r.stepId)}</td>
                      <td className="py-0.5 text-right">{kg(r.inKg)}</td>
                      <td className="py-0.5 text-right">{kg(r.outKg)}</td>
                      <td className="py-0.5 text-right">
                        {r.stepFactor === null ? 'complete' : `${formatFactor(r.stepFactor)}×`}
                      </td>
                      <td className="py-0.5 text-right">
                        {r.cumulativeFactor === null
                          ? 'complete'
                          : `${formatFactor(r.cumulativeFactor)}×`}
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </section>
          );
        })}
      </div>
      {!cascades.length ? (
        <p className="text-small text-ink-muted">No impurity is charged in this route.</p>
      ) : null}
    </div>,
    document.body,
  );
}
