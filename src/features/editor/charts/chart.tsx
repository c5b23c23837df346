import { useEffect, useRef, useState } from 'react';
import type { EChartsCoreOption } from 'echarts/core';

type Echarts = (typeof import('./echarts'))['echarts'];
let loading: Promise<Echarts> | null = null;
const loadEcharts = () => (loading ??= import('./echarts').then((m) => m.echarts));

/** The product's colours for plots (docs/design-system.md); every series also has a label and a mark or dash. */
export const PLOT = {
  ink: '#23272D',
  muted: '#585E67',
  faint: '#858B94',
  rule: '#D9D5CB',
  accent: '#3B4C86',
  organic: '#B48424',
  aqueous: '#2C8797',
  solid: '#7B6450',
  vapour: '#8F86B3',
  hazard: '#A3303C',
  font: 'Lexend, system-ui, sans-serif',
} as const;

/** Axis and text defaults shared by every plot: small, calm, tabular. */
export const axisStyle = {
  axisLine: { lineStyle: { color: PLOT.faint } },
  axisTick: { lineStyle: { color: PLOT.faint } },
  axisLabel: { color: PLOT.muted, fontSize: 11, fontFamily: PLOT.font },
  nameTextStyle: { color: PLOT.muted, fontSize: 11, fontFamily: PLOT.font },
  splitLine: { lineStyle: { color: PLOT.rule, type: 'dashed' as const } },
};

export const baseOption = {
  animation: false,
  textStyle: { fontFamily: PLOT.font, color: PLOT.ink },
  tooltip: {
    trigger: 'axis' as const,
    textStyle: { fontSize: 12, fontFamily: PLOT.font },
    borderColor: PLOT.rule,
  },
};

/**
 * One plot: loads the charting library on first use, draws `option` as SVG and
 * follows the element's size. `label` names the plot for screen readers; the
 * numbers it shows are also in a table or the stream table.
 */
export function Chart({
  option,
  label,
  height = 200,
  testId,
}: {
  option: EChartsCoreOption;
  label: string;
  height?: number;
  testId?: string;
}) {
  const el = useRef<HTMLDivElement>(null);
  const chart = useRef<ReturnType<Echarts['init']> | null>(null);
  const [failed, setFailed] = useState(false);

  useEffect(() => {
    let disposed = false;
    let observer: ResizeObserver | null = null;
    loadEcharts()
      .then((echarts) => {
        if (disposed || !el.current) return;
        chart.current = echarts.init(el.current, null, { renderer: 'svg' });
        chart.current.setOption(optionRef.current);
        observer = new ResizeObserver(() => chart.current?.resize());
        observer.observe(el.current);
      })
      .catch(() => setFailed(true));
    return () => {
      disposed = true;
      observer?.disconnect();
      chart.current?.dispose();
      chart.current = null;
    };
  }, []);

  const optionRef = useRef(option);
  optionRef.current = option;
  useEffect(() => {
    chart.current?.setOption(option, { notMerge: true });
  }, [option]);

  if (failed)
    return (
      <p className="text-small text-caution-hazard-deep">
        The plot could not be loaded; reload the page to try again.
      </p>
    );
  return (
    <div
      ref={el}
      role="img"
      aria-label={label}
      data-testid={testId}
      style={{ height }}
      className="w-full"
    />
  );
}
