import { useMemo } from 'react';
import type { OptimiseResult } from '@shared/schemas/jobs';
import { axisStyle, baseOption, Chart, PLOT } from '@/features/editor';

export type TradeOffAxis = 'solventFreePurityPct' | 'yieldPct';

export const OBJECTIVE_AXIS: Record<OptimiseResult['objective'], { name: string; unit: string }> = {
  pmi: { name: 'PMI', unit: 'kg/kg' },
  solventLPerKg: { name: 'Solvent use', unit: 'L/kg' },
  cycleTimeH: { name: 'Cycle time', unit: 'h' },
};

export const TRADE_OFF_AXES: Record<TradeOffAxis, string> = {
  solventFreePurityPct: 'Solvent-free purity (%)',
  yieldPct: 'Yield (%)',
};

type Totals = OptimiseResult['candidates'][number]['totals'];
const objectiveOf = (t: Totals, o: OptimiseResult['objective']) =>
  o === 'pmi' ? t.pmi : o === 'solventLPerKg' ? t.solventLPerKg : t.cycleTimeH;

const point = (t: Totals, o: OptimiseResult['objective'], y: TradeOffAxis) => {
  const x = objectiveOf(t, o);
  const v = t[y];
  return x === null || v === null || !Number.isFinite(x) || !Number.isFinite(v) ? null : [x, v];
};

/**
 * The trade-off picture: every evaluated candidate with the objective across
 * and purity (or yield) up; routes that meet every constraint filled, those
 * that miss one hollow, the route as it stands and the chosen candidate marked
 * with their own shapes. The same numbers are listed beside the plot.
 */
export function TradeOffChart({ result, y }: { result: OptimiseResult; y: TradeOffAxis }) {
  const option = useMemo(() => {
    const o = result.objective;
    const pts = (feasible: boolean) =>
      result.candidates
        .filter((c) => c.feasible === feasible)
        .map((c) => point(c.totals, o, y))
        .filter((p): p is number[] => p !== null);
    const current = result.current ? point(result.current.totals, o, y) : null;
    const best = point(result.best.totals, o, y);
    const axis = OBJECTIVE_AXIS[o];
    return {
      ...baseOption,
      tooltip: { ...baseOption.tooltip, trigger: 'item' as const },
      legend: {
        top: 0,
        textStyle: { color: PLOT.muted, fontSize: 11, fontFamily: PLOT.font },
      },
      grid: { left: 64, right: 16, top: 36, bottom: 44 },
      xAxis: {
        type: 'value',
        name: `${axis.name} (${axis.unit}) — lower is better`,
        nameLocation: 'middle',
        nameGap: 26,
        scale: true,
        ...axisStyle,
      },
      yAxis: {
        type: 'value',
        name: TRADE_OFF_AXES[y],
        nameLocation: 'middle',
        nameGap: 48,
        scale: true,
        ...axisStyle,
      },
      series: [
        {
          name: 'Meets every constraint',
          type: 'scatter',
          symbol: 'circle',
          symbolSize: 7,
          itemStyle: { color: PLOT.aqueous, opacity: 0.8 },
          data: pts(true),
        },
        {
          name: 'Misses a constraint',
          type: 'scatter',
          symbol: 'emptyTriangle',
          symbolSize: 8,
          itemStyle: { color: PLOT.hazard, opacity: 0.75 },
          data: pts(false),
        },
        {
          name: 'Route as it stands',
          type: 'scatter',
          symbol: 'diamond',
          symbolSize: 15,
          itemStyle: { color: PLOT.organic, borderColor: PLOT.ink, borderWidth: 1 },
          data: current ? [current] : [],
          z: 5,
        },
        {
          name: 'Chosen candidate',
          type: 'scatter',
          symbol: 'rect',
          symbolSize: 13,
          itemStyle: { color: PLOT.accent, borderColor: PLOT.ink, borderWidth: 1 },
          data: best ? [best] : [],
          z: 6,
        },
      ],
    };
  }, [result, y]);
  const axis = OBJECTIVE_AXIS[result.objective];
  return (
    <Chart
      option={option}
      height={320}
      testId="trade-off-chart"
      label={`Trade-off of ${axis.name} against ${TRADE_OFF_AXES[y].toLowerCase()}: ${result.candidates.length} candidates, ${result.candidates.filter((c) => c.feasible).length} meeting every constraint`}
    />
  );
}
