import { useMemo } from 'react';
import { useEditorStore } from '@/stores/editor-store';
import { useEvaluation } from '../evaluation';
import { keyOf, type StepInput } from '../document';
import { useSweep } from '../sweep';
import { Chart, PLOT, axisStyle, baseOption } from '../charts/chart';
import { componentLabel } from './fields';
import { formatFactor, formatSignificant } from '@/lib/format';

type ProfilePoint = {
  distillateL: number;
  potTemperatureC: number;
  originalSolventWtPct: number;
  pressureMbar: number;
};

const fmt = (v: number, d = 1) => (Number.isFinite(v) ? v.toFixed(d) : '—');

function PlotFrame({
  title,
  note,
  children,
}: {
  title: string;
  note?: string;
  children: React.ReactNode;
}) {
  return (
    <figure className="mt-3 rounded-card border border-rule bg-paper-raised p-2">
      <figcaption className="text-small font-medium text-ink">{title}</figcaption>
      {children}
      {note ? <p className="text-caption text-ink-muted">{note}</p> : null}
    </figure>
  );
}

/** The plot that belongs to the selected step, if its kind has one. */
export function StepPlot({ step }: { step: StepInput }) {
  if (step.kind === 'distillation') return <DistillationProfile stepId={step.id} />;
  if (step.kind === 'crystallisation' || step.kind === 'wash' || step.kind === 'extraction')
    return <SweepPlot step={step} />;
  return null;
}

/** Pot temperature and residual original solvent against distillate volume. */
function DistillationProfile({ stepId }: { stepId: string }) {
  const profile = useEvaluation(
    (s) => s.result?.steps[stepId]?.details.profile as ProfilePoint[] | undefined,
  );
  const option = useMemo(() => {
    if (!profile?.length) return null;
    const swap = profile.some((p) => p.originalSolventWtPct < 99.999);
    // Axis titles beside their axes and the legend below the plot, so neither sits on the other;
    // each series has its own mark as well as its colour and dash.
    return {
      ...baseOption,
      grid: { left: 52, right: swap ? 52 : 16, top: 12, bottom: 62 },
      legend: {
        bottom: 0,
        left: 'center',
        itemWidth: 22,
        textStyle: { fontSize: 11, color: PLOT.muted },
      },
      xAxis: {
        type: 'value',
        name: 'Distillate (L)',
        nameLocation: 'middle',
        nameGap: 24,
        ...axisStyle,
        splitLine: { show: false },
      },
      yAxis: [
        {
          type: 'value',
          name: 'Pot temperature (°C)',
          nameLocation: 'middle',
          nameGap: 36,
          nameRotate: 90,
          scale: true,
          ...axisStyle,
        },
        ...(swap
          ? [
              {
                type: 'value',
                name: 'Original solvent left (wt %)',
                nameLocation: 'middle',
                nameGap: 34,
                nameRotate: -90,
                min: 0,
                max: 100,
                ...axisStyle,
                splitLine: { show: false },
              },
            ]
          : []),
      ],
      series: [
        {
          name: 'Pot temperature',
          type: 'line',
          symbol: 'circle',
          symbolSize: 5,
          showSymbol: true,
          lineStyle: { color: PLOT.accent, width: 2 },
          itemStyle: { color: PLOT.accent },
          data: profile.map((p) => [p.distillateL, p.potTemperatureC]),
        },
        ...(swap
          ? [
              {
                name: 'Original solvent left',
                type: 'line',
                yAxisIndex: 1,
                symbol: 'triangle',
                symbolSize: 6,
                showSymbol: true,
                lineStyle: { color: PLOT.organic, width: 2, type: 'dashed' },
                itemStyle: { color: PLOT.organic },
                data: profile.map((p) => [p.distillateL, p.originalSolventWtPct]),
              },
            ]
          : []),
      ],
    };
  }, [profile]);
  if (!option || !profile) return null;
  const last = profile[profile.length - 1];
  return (
    <PlotFrame
      title="Distillation profile"
      note={`End: ${fmt(last.distillateL, 2)} L distilled, pot ${fmt(last.potTemperatureC)} °C, original solvent ${fmt(last.originalSolventWtPct)} wt % of the solvents.`}
    >
      <Chart
        option={option}
        label="Pot temperature and original solvent left against distillate volume"
        testId="plot-distillation"
        height={260}
      />
    </PlotFrame>
  );
}

/** Crystallisation yield against end temperature, or product recovery against the number of stages. */
function SweepPlot({ step }: { step: StepInput }) {
  const { points, current, sweep, boiling } = useSweep(step);
  const stages = sweep === 'stages';
  const beyond = !stages && boiling !== null && current !== null && current > boiling.temperatureC;
  const option = useMemo(() => {
    if (!points) return null;
    const data = points.filter((p) => p.y !== null).map((p) => [p.x, p.y]);
    return {
      ...baseOption,
      grid: { left: 40, right: 12, top: 16, bottom: 34 },
      xAxis: stages
        ? {
            type: 'value',
            name: 'Stages',
            nameLocation: 'middle',
            nameGap: 22,
            minInterval: 1,
            ...axisStyle,
            splitLine: { show: false },
          }
        : {
            type: 'value',
            name: 'End temperature (°C)',
            nameLocation: 'middle',
            nameGap: 22,
            ...axisStyle,
            splitLine: { show: false },
          },
      yAxis: {
        type: 'value',
        name: stages ? 'Recovery %' : 'Yield %',
        scale: true,
        max: (v: { max: number }) => Math.min(100, Math.ceil(v.max + 1)),
        ...axisStyle,
      },
      series: [
        {
          name: stages ? 'Product recovery' : 'Crystallisation yield',
          type: 'line',
          symbol: stages ? 'circle' : 'emptyCircle',
          symbolSize: 6,
          lineStyle: { color: stages ? PLOT.aqueous : PLOT.solid, width: 2 },
          itemStyle: { color: stages ? PLOT.aqueous : PLOT.solid },
          data,
          markLine:
            current === null
              ? undefined
              : {
                  symbol: 'none',
                  silent: true,
                  label: { formatter: 'now', color: PLOT.muted, fontSize: 10 },
                  lineStyle: { color: PLOT.faint, type: 'dotted' },
                  data: [{ xAxis: current }],
                },
        },
      ],
    };
  }, [points, current, stages]);
  const title = stages
    ? 'Product recovery against number of stages'
    : 'Crystallisation yield against end temperature';
  return (
    <PlotFrame
      title={title}
      note={`Each point is the whole route evaluated again with only this setting changed.${
        !stages && boiling
          ? ` Limited to below the liquor's boiling point: ${boiling.solvent} boils at ${boiling.temperatureC.toFixed(0)} °C at 1 atm (the lowest-boiling solvent of the liquor).`
          : ''
      }`}
    >
      {beyond ? (
        <p className="text-caption font-medium text-caution-warning-deep" data-beyond-boiling>
          The set temperature is above the liquor&apos;s boiling point ({boiling!.solvent},{' '}
          {boiling!.temperatureC.toFixed(0)} °C at 1 atm): not reachable in an open vessel.
        </p>
      ) : null}
      {option ? (
        <Chart
          option={option}
          label={title}
          testId={stages ? 'plot-stages' : 'plot-end-temperature'}
        />
      ) : (
        <p className="py-8 text-center text-small text-ink-muted">Working out the curve…</p>
      )}
    </PlotFrame>
  );
}

/** Where the product goes: a Sankey of its mass over every connection to the isolated solid and the losses. */
export function ProductFlow() {
  const result = useEvaluation((s) => s.result);
  const doc = useEditorStore((s) => s.doc);
  const option = useMemo(() => {
    const pid = result?.totals.productId;
    if (!result || !pid) return null;
    const label = new Map<string, string>(doc.steps.map((s) => [s.id, s.name]));
    const links: Array<{ source: string; target: string; value: number }> = [];
    for (const c of doc.connections) {
      const kg = result.streams[c.id]?.kg[pid] ?? 0;
      if (kg > 1e-9 && label.has(c.from.stepId) && label.has(c.to.stepId))
        links.push({ source: c.from.stepId, target: c.to.stepId, value: kg });
    }
    for (const t of result.terminals) {
      const kg = t.stream.kg[pid] ?? 0;
      if (kg <= 1e-9) continue;
      const id = `${t.stepId}→${t.port}`;
      label.set(
        id,
        t.isolated ? 'Isolated product' : `Lost: ${label.get(t.stepId) ?? t.stepId} ${t.port}`,
      );
      links.push({ source: t.stepId, target: id, value: kg });
    }
    if (!links.length) return null;
    const used = new Set(links.flatMap((l) => [l.source, l.target]));
    const isolated = new Set(
      result.terminals.filter((t) => t.isolated).map((t) => `${t.stepId}→${t.port}`),
    );
    const lost = new Set(
      result.terminals.filter((t) => !t.isolated).map((t) => `${t.stepId}→${t.port}`),
    );
    return {
      ...baseOption,
      tooltip: {
        trigger: 'item',
        formatter: (p: {
          dataType: string;
          data: { source?: string; target?: string; value?: number; name?: string };
        }) =>
          p.dataType === 'edge'
            ? `${label.get(p.data.source!)} → ${label.get(p.data.target!)}: ${fmt(p.data.value ?? 0, 3)} kg product`
            : (label.get(p.data.name!) ?? ''),
      },
      series: [
        {
          type: 'sankey',
          left: 4,
          right: 110,
          top: 6,
          bottom: 6,
          nodeWidth: 8,
          nodeGap: 10,
          layoutIterations: 16,
          draggable: false,
          emphasis: { focus: 'adjacency' },
          label: {
            fontSize: 10,
            color: PLOT.ink,
            formatter: (p: { name: string }) => label.get(p.name) ?? p.name,
          },
          // Steps sit close together in a narrow panel: only where the product ends is labelled; steps are named on hover.
          lineStyle: { color: 'source', opacity: 0.35 },
          data: [...used].map((name) => ({
            name,
            label: { show: isolated.has(name) || lost.has(name) },
            itemStyle: {
              color: isolated.has(name) ? PLOT.solid : lost.has(name) ? PLOT.hazard : PLOT.accent,
            },
          })),
          links,
        },
      ],
    };
  }, [result, doc]);
  if (!result)
    return (
      <p className="text-small text-ink-muted">
        The product’s path appears once the route can be evaluated.
      </p>
    );
  if (!option)
    return (
      <p className="text-small text-ink-muted">
        No product moves through the route yet: give a component the role “product” and charge it.
      </p>
    );
  const lossKg = result.totals.productInKg - result.totals.isolatedProductKg;
  const pid = result.totals.productId;
  const names = new Map(doc.steps.map((s) => [s.id, s.name]));
  const exits = pid
    ? result.terminals
        .map((t) => ({
          key: `${t.stepId}:${t.port}`,
          where: t.isolated
            ? `Isolated (${names.get(t.stepId) ?? t.stepId})`
            : `${names.get(t.stepId) ?? t.stepId} · ${t.port}`,
          isolated: t.isolated,
          kg: t.stream.kg[pid] ?? 0,
        }))
        .filter((e) => e.kg >= 1e-4 * result.totals.productInKg)
        .sort((a, b) => b.kg - a.kg)
    : [];
  return (
    <figure>
      <Chart
        option={option}
        label="Where the product mass goes, step by step"
        height={180}
        testId="plot-product-flow"
      />
      <figcaption className="text-caption text-ink-muted">
        Band width is product mass (hover a band for its step). Isolated{' '}
        {fmt(result.totals.isolatedProductKg, 3)} kg of {fmt(result.totals.productInKg, 3)} kg
        charged; {fmt(lossKg, 3)} kg leaves in liquors and washes (marked “Lost”).
      </figcaption>
      <table
        className="mt-1 w-full text-caption tabular-nums"
        aria-label="Where the product leaves the route"
      >
        <tbody>
          {exits.map((e) => (
            <tr key={e.key} className="border-b border-rule">
              <th scope="row" className="py-0.5 pr-2 text-left font-normal">
                <span
                  aria-hidden="true"
                  className={`mr-1 inline-block size-2 ${e.isolated ? 'bg-phase-solid' : 'rotate-45 bg-caution-hazard'}`}
                />
                {e.where}
              </th>
              <td className="whitespace-nowrap py-0.5 text-right">
                {formatSignificant(e.kg, 3)} kg
              </td>
              <td className="w-14 py-0.5 text-right">
                {fmt((100 * e.kg) / (result.totals.productInKg || 1), 1)} %
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </figure>
  );
}

/** Purge factor (amount in ÷ amount in the isolated solid) of each impurity, on a log scale. */
export function PurgePlot() {
  const result = useEvaluation((s) => s.result);
  const components = useEditorStore((s) => s.doc.components);
  const rows = useMemo(() => {
    if (!result) return [];
    const byKey = new Map(components.map((c) => [keyOf(c), c]));
    return Object.entries(result.totals.purge).map(([id, p]) => ({
      id,
      name: byKey.has(id) ? componentLabel(byKey.get(id)!).replace(/ \(impurity\)$/, '') : id,
      factor: p.purgeFactor,
    }));
  }, [result, components]);
  const option = useMemo(() => {
    if (!rows.length) return null;
    const finite = rows.map((r) => r.factor).filter((f): f is number => f !== null);
    const cap = Math.max(10, ...finite.map((f) => f * 10));
    return {
      ...baseOption,
      tooltip: { trigger: 'axis', axisPointer: { type: 'shadow' } },
      grid: { left: 8, right: 44, top: 8, bottom: 24, containLabel: true },
      xAxis: { type: 'log', name: '×', min: 1, max: cap, ...axisStyle },
      yAxis: {
        type: 'category',
        data: rows.map((r) => r.name),
        inverse: true,
        ...axisStyle,
        axisLabel: { ...axisStyle.axisLabel, width: 120, overflow: 'truncate' },
      },
      series: [
        {
          name: 'Purge factor',
          type: 'bar',
          barMaxWidth: 14,
          data: rows.map((r) => ({
            value: r.factor ?? cap,
            itemStyle:
              r.factor === null
                ? {
                    color: PLOT.aqueous,
                    decal: {
                      symbol: 'rect',
                      dashArrayX: [1, 0],
                      dashArrayY: [2, 3],
                      rotation: -0.8,
                    },
                  }
                : { color: PLOT.accent },
          })),
          label: {
            show: true,
            position: 'right',
            fontSize: 10,
            color: PLOT.ink,
            formatter: (p: { dataIndex: number }) =>
              rows[p.dataIndex].factor === null
                ? 'all purged'
                : `${formatFactor(rows[p.dataIndex].factor)}×`,
          },
        },
      ],
    };
  }, [rows]);
  if (!result)
    return (
      <p className="text-small text-ink-muted">
        Purge factors appear once the route can be evaluated.
      </p>
    );
  if (!option)
    return (
      <p className="text-small text-ink-muted">
        No impurity is charged: add one in a Charge step to see how far the route purges it.
      </p>
    );
  return (
    <figure>
      <Chart
        option={option}
        label="Purge factor of each impurity, log scale"
        height={Math.max(120, 34 * rows.length + 40)}
        testId="plot-purge"
      />
      <figcaption className="text-caption text-ink-muted">
        Purge factor = impurity charged ÷ impurity in the isolated solid. “All purged”: none reaches
        the solid.
      </figcaption>
    </figure>
  );
}
