import { useEffect, useMemo, useRef, useState, type KeyboardEvent } from 'react';
import type { EChartsCoreOption } from 'echarts/core';
import { Button } from '@/components/button';
import { formatSignificant } from '@/lib/format';

type Echarts = (typeof import('./echarts-trace'))['echarts'];
let loading: Promise<Echarts> | null = null;
const loadEcharts = () => (loading ??= import('./echarts-trace').then((m) => m.echarts));

/** Colours of the traces, in order (the palette of docs/design-system.md); overlays are also dashed. */
const TRACE_COLOURS = ['#3B4C86', '#B48424', '#2C8797', '#7B6450', '#8F86B3', '#7F8A2B'];
const FONT = 'Lexend, system-ui, sans-serif';

export interface PlotTrace {
  id: string;
  label: string;
  timeMin: number[];
  signal: number[];
}

export interface PlotPeak {
  startMin: number;
  endMin: number;
  retentionMin: number;
  label: string;
}

/**
 * A chromatogram: the sample's trace, other injections overlaid, its
 * baseline and its integration windows shaded with the peak numbers. Wheel
 * or pinch zooms, dragging pans, the slider below picks a time range; the
 * buttons (and + − ← → 0 on the focused plot) do the same from the keyboard.
 */
export function TracePlot({
  traces,
  baseline,
  peaks,
  label,
  height = 320,
}: {
  traces: PlotTrace[];
  baseline?: { timeMin: number[]; signal: number[] } | null;
  peaks: PlotPeak[];
  label: string;
  height?: number;
}) {
  const el = useRef<HTMLDivElement>(null);
  const chart = useRef<ReturnType<Echarts['init']> | null>(null);
  const window = useRef({ start: 0, end: 100 });
  const [failed, setFailed] = useState(false);

  const option = useMemo<EChartsCoreOption>(
    () => ({
      animation: false,
      textStyle: { fontFamily: FONT, color: '#23272D' },
      grid: { left: 56, right: 16, top: 40, bottom: 64 },
      legend: {
        top: 0,
        right: 16,
        textStyle: { fontSize: 11, color: '#585E67' },
        data: traces.map((t) => t.label),
      },
      tooltip: {
        trigger: 'axis',
        textStyle: { fontSize: 12, fontFamily: FONT },
        valueFormatter: (v: unknown) =>
          typeof v === 'number' ? formatSignificant(v, 4) : String(v),
      },
      xAxis: {
        type: 'value',
        name: 'Time (min)',
        nameLocation: 'middle',
        nameGap: 24,
        scale: true,
        axisLabel: { color: '#585E67', fontSize: 11 },
        splitLine: { lineStyle: { color: '#D9D5CB', type: 'dashed' } },
      },
      yAxis: {
        type: 'value',
        name: 'Signal',
        scale: true,
        axisLabel: { color: '#585E67', fontSize: 11 },
        splitLine: { lineStyle: { color: '#D9D5CB', type: 'dashed' } },
      },
      dataZoom: [
        { type: 'inside', xAxisIndex: 0, filterMode: 'none', start: 0, end: 100 },
        { type: 'inside', yAxisIndex: 0, filterMode: 'none', zoomOnMouseWheel: 'shift' },
        {
          type: 'slider',
          xAxisIndex: 0,
          filterMode: 'none',
          height: 18,
          bottom: 8,
          showDataShadow: false,
        },
      ],
      series: [
        ...traces.map((t, i) => ({
          name: t.label,
          type: 'line',
          showSymbol: false,
          sampling: 'lttb',
          large: true,
          progressive: 0,
          lineStyle: {
            width: i === 0 ? 1.4 : 1,
            color: TRACE_COLOURS[i % TRACE_COLOURS.length],
            type: i === 0 ? 'solid' : 'dashed',
          },
          itemStyle: { color: TRACE_COLOURS[i % TRACE_COLOURS.length] },
          emphasis: { disabled: true },
          data: t.timeMin.map((x, k) => [x, t.signal[k]]),
          ...(i === 0
            ? {
                markArea: {
                  silent: true,
                  itemStyle: { color: 'rgba(59, 76, 134, 0.08)' },
                  data: peaks.map((p) => [{ xAxis: p.startMin }, { xAxis: p.endMin }]),
                },
                markPoint: {
                  symbol: 'pin',
                  symbolSize: 0,
                  label: { show: true, color: '#2C3A69', fontSize: 11, position: 'top' },
                  data: peaks.map((p) => {
                    let best = 0;
                    let bestDistance = Infinity;
                    t.timeMin.forEach((x, k) => {
                      const d = Math.abs(x - p.retentionMin);
                      if (d < bestDistance) {
                        bestDistance = d;
                        best = k;
                      }
                    });
                    return { coord: [p.retentionMin, t.signal[best] ?? 0], value: p.label };
                  }),
                },
              }
            : {}),
        })),
        ...(baseline
          ? [
              {
                name: 'Baseline',
                type: 'line',
                showSymbol: false,
                silent: true,
                lineStyle: { width: 1, color: '#858B94', type: 'dotted' },
                data: baseline.timeMin.map((x, k) => [x, baseline.signal[k]]),
              },
            ]
          : []),
      ],
    }),
    [traces, baseline, peaks],
  );

  const optionRef = useRef(option);
  optionRef.current = option;

  useEffect(() => {
    let disposed = false;
    let observer: ResizeObserver | null = null;
    loadEcharts()
      .then((echarts) => {
        if (disposed || !el.current) return;
        const instance = echarts.init(el.current, null, { renderer: 'canvas' });
        chart.current = instance;
        instance.setOption(optionRef.current);
        instance.on('datazoom', () => {
          const zoom = (
            instance.getOption() as { dataZoom?: Array<{ start: number; end: number }> }
          ).dataZoom?.[0];
          if (zoom) window.current = { start: zoom.start, end: zoom.end };
        });
        observer = new ResizeObserver(() => instance.resize());
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

  useEffect(() => {
    // Keep the chemist's zoom when the data change (a re-integration).
    chart.current?.setOption(option, { notMerge: true });
    chart.current?.dispatchAction({ type: 'dataZoom', dataZoomIndex: 0, ...window.current });
    chart.current?.dispatchAction({ type: 'dataZoom', dataZoomIndex: 2, ...window.current });
  }, [option]);

  const zoomTo = (start: number, end: number) => {
    const width = Math.max(0.5, Math.min(100, end - start));
    let s = Math.max(0, start);
    if (s + width > 100) s = 100 - width;
    window.current = { start: s, end: s + width };
    chart.current?.dispatchAction({ type: 'dataZoom', dataZoomIndex: 0, ...window.current });
    chart.current?.dispatchAction({ type: 'dataZoom', dataZoomIndex: 2, ...window.current });
  };
  const zoom = (factor: number) => {
    const { start, end } = window.current;
    const mid = (start + end) / 2;
    const half = ((end - start) * factor) / 2;
    zoomTo(mid - half, mid + half);
  };
  const pan = (fraction: number) => {
    const { start, end } = window.current;
    const shift = (end - start) * fraction;
    zoomTo(start + shift, end + shift);
  };
  const onKeyDown = (event: KeyboardEvent) => {
    const actions: Record<string, () => void> = {
      '+': () => zoom(0.5),
      '=': () => zoom(0.5),
      '-': () => zoom(2),
      ArrowLeft: () => pan(-0.2),
      ArrowRight: () => pan(0.2),
      '0': () => zoomTo(0, 100),
    };
    const action = actions[event.key];
    if (action) {
      event.preventDefault();
      action();
    }
  };

  if (failed)
    return (
      <p className="text-small text-caution-hazard-deep">
        The plot could not be loaded; reload the page to try again.
      </p>
    );
  return (
    <div>
      <div className="mb-1 flex flex-wrap items-center gap-1" aria-label="Plot controls">
        <Button size="sm" variant="secondary" onClick={() => zoom(0.5)} aria-label="Zoom in">
          +
        </Button>
        <Button size="sm" variant="secondary" onClick={() => zoom(2)} aria-label="Zoom out">
          −
        </Button>
        <Button size="sm" variant="secondary" onClick={() => pan(-0.2)} aria-label="Pan left">
          ←
        </Button>
        <Button size="sm" variant="secondary" onClick={() => pan(0.2)} aria-label="Pan right">
          →
        </Button>
        <Button size="sm" variant="quiet" onClick={() => zoomTo(0, 100)}>
          Whole run
        </Button>
        <span className="text-caption text-ink-faint">
          Wheel to zoom, drag to pan, Shift+wheel zooms the signal axis.
        </span>
      </div>
      <div
        ref={el}
        role="img"
        tabIndex={0}
        aria-label={label}
        onKeyDown={onKeyDown}
        data-testid="trace-plot"
        style={{ height }}
        className="w-full rounded-control focus-visible:outline-2 focus-visible:outline-accent"
      />
    </div>
  );
}
