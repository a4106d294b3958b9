import ReactEChartsCore from 'echarts-for-react/esm/core';
import { useMemo } from 'react';
import { useTranslation } from 'react-i18next';
import { formattersFor } from '../../../shared/locale-format';
import { echarts, echartsLocale, type ChartOption } from './echarts-core';

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
  const { i18n } = useTranslation();
  const language = i18n.language;
  const localized = useMemo(() => localizeOption(option, language), [option, language]);
  const opts = useMemo(() => ({ renderer: 'canvas' as const, locale: echartsLocale(language) }), [language]);
  return (
    <ReactEChartsCore
      echarts={echarts}
      option={reducedMotion() ? { ...localized, animation: false } : localized}
      notMerge
      lazyUpdate
      opts={opts}
      style={{ height, width: '100%' }}
      onEvents={onEvents}
    />
  );
}

type AxisLike = { type?: string; axisLabel?: { formatter?: unknown; [k: string]: unknown }; [k: string]: unknown };

/**
 * The chart in the interface language: month names come from the ECharts locale given at start-up
 * (`opts.locale`), and the numbers on every value axis and in the tooltip are formatted with Intl for the
 * language ("5 000" and "0,4" in French, not "5,000" and "0.4"), unless a chart formats them itself.
 */
export function localizeOption(option: ChartOption, language: string): ChartOption {
  const f = formattersFor(language);
  const num = (v: unknown) => (typeof v === 'number' ? f.number(v, Math.abs(v) < 10 && !Number.isInteger(v) ? 2 : 1) : String(v ?? ''));
  const axis = (a: AxisLike, defaultType: string): AxisLike => {
    if ((a.type ?? defaultType) !== 'value' || a.axisLabel?.formatter) return a;
    return { ...a, axisLabel: { ...(a.axisLabel ?? {}), formatter: (v: number) => num(v) } };
  };
  const axes = (x: unknown, defaultType: string) =>
    x === undefined ? undefined : Array.isArray(x) ? x.map((a) => axis(a as AxisLike, defaultType)) : axis(x as AxisLike, defaultType);
  const o = option as Record<string, unknown>;
  const tooltip = o.tooltip as Record<string, unknown> | undefined;
  return {
    ...option,
    ...(o.xAxis !== undefined ? { xAxis: axes(o.xAxis, 'category') } : {}),
    ...(o.yAxis !== undefined ? { yAxis: axes(o.yAxis, 'value') } : {}),
    ...(tooltip && !Array.isArray(tooltip) && !tooltip.formatter && !tooltip.valueFormatter ? { tooltip: { ...tooltip, valueFormatter: num } } : {}),
  } as ChartOption;
}
