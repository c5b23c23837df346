/**
 * The parts of the charting library the chromatogram plot uses: line series
 * with per-pixel thinning (LTTB), zoom and pan (dataZoom), shaded
 * integration windows (markArea) and the canvas renderer, which stays smooth
 * with 100,000 points where SVG would not. Loaded on demand.
 */
import * as echarts from 'echarts/core';
import { LineChart } from 'echarts/charts';
import {
  DataZoomInsideComponent,
  DataZoomSliderComponent,
  GridComponent,
  LegendComponent,
  MarkAreaComponent,
  MarkPointComponent,
  TooltipComponent,
} from 'echarts/components';
import { CanvasRenderer } from 'echarts/renderers';

echarts.use([
  LineChart,
  GridComponent,
  LegendComponent,
  TooltipComponent,
  DataZoomInsideComponent,
  DataZoomSliderComponent,
  MarkAreaComponent,
  MarkPointComponent,
  CanvasRenderer,
]);

export { echarts };
