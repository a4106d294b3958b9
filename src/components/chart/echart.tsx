import ReactEChartsCore from 'echarts-for-react/esm/core';
import { echarts, type ChartOption } from './echarts-core';

export type EChartProps = {
  option: ChartOption;
  /** CSS height of the drawing (the width follows the container). */
  height: string;
  onEvents?: Record<string, (params: any) => void>;
};

/** Whether the system asks for less motion (WCAG 2.3.3); charts then draw without animation. */
const reducedMotion = () => typeof window !== 'undefined' && window.matchMedia?.('(prefers-reduced-motion: reduce)').matches === true;

/** An ECharts drawing, tree-shaken. Wrapped by ChartFigure, which gives it a heading, a summary and a table. */
export function EChart({ option, height, onEvents }: EChartProps) {
  return (
    <ReactEChartsCore
      echarts={echarts}
      option={reducedMotion() ? { ...option, animation: false } : option}
      notMerge
      lazyUpdate
      opts={{ renderer: 'canvas' }}
      style={{ height, width: '100%' }}
      onEvents={onEvents}
    />
  );
}
