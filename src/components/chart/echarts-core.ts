/**
 * The one place ECharts is assembled: only the charts, components and renderer Broodcast uses are
 * registered (tree-shaken echarts/core), and only lazy-loaded screens import this module, so the sign-in
 * page never ships ECharts. Here is what the region map needs (the Ladder's map: map series, tooltip,
 * piecewise visual map, canvas); the line and bar plots' parts are registered by ./echarts-plots.ts, which
 * only the plotting screens import, so the Ladder does not fetch them (about 38 kB gzipped less).
 * The canvas renderer draws through the DOM and canvas APIs: no <style> tags, nothing the
 * Content-Security-Policy (style-src 'self') refuses.
 */
import * as echarts from 'echarts/core';
import { MapChart, type BarSeriesOption, type LineSeriesOption, type MapSeriesOption } from 'echarts/charts';
import {
  TooltipComponent,
  VisualMapPiecewiseComponent,
  type GridComponentOption,
  type LegendComponentOption,
  type MarkLineComponentOption,
  type TooltipComponentOption,
  type VisualMapComponentOption,
} from 'echarts/components';
import { CanvasRenderer } from 'echarts/renderers';
// ECharts' own translations of its month and weekday names (the time axis labels), one per interface language.
import langFR from 'echarts/lib/i18n/langFR.js';
import langES from 'echarts/lib/i18n/langES.js';
import langPT from 'echarts/lib/i18n/langPT-br.js';

echarts.use([MapChart, TooltipComponent, VisualMapPiecewiseComponent, CanvasRenderer]);

echarts.registerLocale('FR', langFR);
echarts.registerLocale('ES', langES);
echarts.registerLocale('PT', langPT);

/** The ECharts locale of an interface language (English is ECharts' default). */
export const echartsLocale = (language: string) => ({ fr: 'FR', es: 'ES', pt: 'PT' })[language.slice(0, 2)] ?? 'EN';

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
