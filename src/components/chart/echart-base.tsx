import ReactEChartsCore from 'echarts-for-react/esm/core';
import { useLayoutEffect, useMemo, useRef, useState, type RefObject } from 'react';
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
  const box = useRef<HTMLDivElement>(null);
  const width = useWidth(box);
  const localized = useMemo(() => localizeOption(option, language), [option, language]);
  const fitted = useMemo(() => fitLegend(localized, width), [localized, width]);
  const opts = useMemo(() => ({ renderer: 'canvas' as const, locale: echartsLocale(language) }), [language]);
  return (
    <div ref={box}>
      <ReactEChartsCore
        echarts={echarts}
        option={reducedMotion() ? { ...fitted.option, animation: false } : fitted.option}
        notMerge
        lazyUpdate
        opts={opts}
        style={{ height: fitted.extra > 0 ? `calc(${height} + ${fitted.extra}px)` : height, width: '100%' }}
        onEvents={onEvents}
      />
    </div>
  );
}

/** The width of an element in CSS px, kept current as it resizes (0 until it is laid out). */
function useWidth(ref: RefObject<HTMLDivElement | null>): number {
  const [width, setWidth] = useState(0);
  useLayoutEffect(() => {
    const el = ref.current;
    if (!el) return;
    setWidth(el.clientWidth);
    if (typeof ResizeObserver === 'undefined') return;
    const observer = new ResizeObserver(() => setWidth(el.clientWidth));
    observer.observe(el);
    return () => observer.disconnect();
  }, [ref]);
  return width;
}

/** ECharts' legend metrics at its defaults: 25 px symbols, 5 px from symbol to text, 5 px padding; text 12 px. */
const LEGEND = { symbol: 25, symbolGap: 5, padding: 5, itemHeight: 14, charWidth: 6.6 };
/** The axis name above the plot (12 px text, `nameGap` 12) and a little air. */
const AXIS_NAME_ROOM = 30;

/** How many rows a plain (wrapping) legend takes at this width: entries are packed left to right. */
export function legendRows(names: readonly string[], width: number, itemGap = 14): number {
  if (names.length === 0 || width <= 0) return names.length ? 1 : 0;
  const room = width - 2 * LEGEND.padding;
  let rows = 1;
  let used = 0;
  for (const name of names) {
    const w = LEGEND.symbol + LEGEND.symbolGap + Math.ceil(name.length * LEGEND.charWidth);
    if (used > 0 && used + itemGap + w > room) {
      rows++;
      used = w;
    } else used += (used > 0 ? itemGap : 0) + w;
  }
  return rows;
}

/**
 * A legend at the top that wraps onto more rows than the grid leaves room for would run into the axis
 * names and the plot (a phone, or a chart with many series). ECharts does not lay the grid out around a
 * wrapped legend by itself, so this moves the grid down by the rows the legend takes at the chart's width
 * and makes the chart taller by as much (`extra`), so the plot keeps its height. A scrolling legend
 * (`type: 'scroll'`) keeps one row and is left alone.
 */
export function fitLegend(option: ChartOption, width: number): { option: ChartOption; extra: number } {
  const o = option as Record<string, any>;
  const legend = o.legend;
  const grid = o.grid;
  if (!legend || Array.isArray(legend) || legend.show === false || legend.type === 'scroll' || !grid || Array.isArray(grid) || typeof grid.top !== 'number' || width <= 0)
    return { option, extra: 0 };
  const names: string[] = Array.isArray(legend.data)
    ? legend.data.map((d: unknown) => (typeof d === 'string' ? d : String((d as { name?: unknown })?.name ?? '')))
    : (Array.isArray(o.series) ? o.series : [o.series]).map((s: { name?: unknown } | undefined) => (typeof s?.name === 'string' ? s.name : '')).filter(Boolean);
  const itemGap = typeof legend.itemGap === 'number' ? legend.itemGap : 10;
  const rows = legendRows(names, width - (legend.left ?? 0) - (legend.right ?? 0), itemGap);
  const needed = LEGEND.padding * 2 + rows * LEGEND.itemHeight + (rows - 1) * itemGap + AXIS_NAME_ROOM;
  const extra = Math.max(0, Math.ceil(needed - grid.top));
  if (extra === 0) return { option, extra: 0 };
  return { option: { ...option, grid: { ...grid, top: grid.top + extra } } as ChartOption, extra };
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
