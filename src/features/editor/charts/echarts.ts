/**
 * The parts of the charting library the result plots use, and nothing else:
 * line, bar, scatter and Sankey charts, the SVG renderer. Loaded on demand (the first
 * time a plot shows), never with the first page.
 */
import * as echarts from 'echarts/core';
import { BarChart, LineChart, SankeyChart, ScatterChart } from 'echarts/charts';
import {
  GridComponent,
  LegendComponent,
  MarkLineComponent,
  TooltipComponent,
} from 'echarts/components';
import { SVGRenderer } from 'echarts/renderers';

echarts.use([
  LineChart,
  BarChart,
  SankeyChart,
  ScatterChart,
  GridComponent,
  LegendComponent,
  TooltipComponent,
  MarkLineComponent,
  SVGRenderer,
]);

export { echarts };
