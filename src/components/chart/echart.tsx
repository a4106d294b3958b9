/**
 * The ECharts drawing of every plot (ChartFigure and the screens' own charts): ./echart-base.tsx with the
 * line and bar parts of ECharts registered (./echarts-plots.ts). The Ladder's region map imports
 * ./echart-base.tsx directly, so it fetches only the map's parts.
 */
import './echarts-plots';

export * from './echart-base';
