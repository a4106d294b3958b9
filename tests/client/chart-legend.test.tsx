import { describe, expect, it } from 'vitest';
import { fitLegend, legendRows } from '../../src/components/chart/echart';
import { baseGrid, legend } from '../../src/features/district-file/charts/chart-style';

/** Issue 21: chart legends ran into the axis titles when they wrapped (a phone, or many series). */
const option = (names: string[]) => ({ grid: baseGrid, legend, series: names.map((name) => ({ type: 'line', name, data: [] })) }) as never;

describe('legends that wrap', () => {
  it('when the legend fits one row, then the grid keeps its place', () => {
    expect(legendRows(['Tmax', 'Tmin'], 1100)).toBe(1);
    const fitted = fitLegend(option(['Degree-days 2026', 'Degree-days 2025']), 1100);
    expect(fitted.extra).toBe(0);
    expect((fitted.option as { grid: { top: number } }).grid.top).toBe(baseGrid.top);
  });

  it('when the legend wraps onto three rows on a phone, then the grid moves down and the chart grows by as much', () => {
    const names = ['Weekly cases 2026', 'Endemic channel', 'Channel centre', '2021', '2022', '2023', '2024', '2025'];
    expect(legendRows(names, 300, legend.itemGap)).toBeGreaterThanOrEqual(3);
    const fitted = fitLegend(option(names), 300);
    const top = (fitted.option as { grid: { top: number } }).grid.top;
    expect(fitted.extra).toBeGreaterThan(0);
    expect(top).toBe(baseGrid.top + fitted.extra);
    // Room for every legend row (14 px items, 14 px between rows, 5 px padding) and the axis name under it.
    const rows = legendRows(names, 300, legend.itemGap);
    expect(top).toBeGreaterThanOrEqual(10 + rows * 14 + (rows - 1) * 14 + 24);
  });

  it('when the legend scrolls (one row by design) or the chart has none, then nothing changes', () => {
    const scroll = { grid: { top: 64 }, legend: { type: 'scroll', data: Array.from({ length: 20 }, (_, i) => `Season ${i}`) } } as never;
    expect(fitLegend(scroll, 300).extra).toBe(0);
    expect(fitLegend({ series: [] } as never, 300).extra).toBe(0);
  });
});
