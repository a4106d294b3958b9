/**
 * The one place ECharts is assembled: only the charts, components and renderer Broodcast uses are
 * registered (tree-shaken echarts/core), and only lazy-loaded screens import this module, so the sign-in
 * page never ships ECharts. The canvas renderer draws through the DOM and canvas APIs: no <style> tags,
 * nothing the Content-Security-Policy (style-src 'self') refuses.
 */
import * as echarts from 'echarts/core';
import { BarChart, LineChart, MapChart, type BarSeriesOption, type LineSeriesOption, type MapSeriesOption } from 'echarts/charts';
import {
  GridComponent,
  LegendComponent,
  MarkLineComponent,
  TooltipComponent,
  VisualMapPiecewiseComponent,
  type GridComponentOption,
  type LegendComponentOption,
  type MarkLineComponentOption,
  type TooltipComponentOption,
  type VisualMapComponentOption,
} from 'echarts/components';
import { CanvasRenderer } from 'echarts/renderers';

echarts.use([
  MapChart,
  LineChart,
  BarChart,
  TooltipComponent,
  VisualMapPiecewiseComponent,
  GridComponent,
  LegendComponent,
  MarkLineComponent,
  CanvasRenderer,
]);

export type ChartOption = echarts.ComposeOption<
  | LineSeriesOption
  | BarSeriesOption
  | MapSeriesOption
  | GridComponentOption
  | LegendComponentOption
  | MarkLineComponentOption
  | TooltipComponentOption
  | VisualMapComponentOption
>;

export { echarts };
