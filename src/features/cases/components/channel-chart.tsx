import ReactEChartsCore from 'echarts-for-react/esm/core';
import { BarChart, LineChart } from 'echarts/charts';
import { GridComponent, LegendComponent, TooltipComponent } from 'echarts/components';
import * as echarts from 'echarts/core';
import { CanvasRenderer } from 'echarts/renderers';
import { useTranslation } from 'react-i18next';
import type { SignalsResponse } from '../../../../shared/api/cases.schema';
import { useFormat } from '../../../i18n/format';
import { localizeOption } from '../../../components/chart/echart';
import { echartsLocale } from '../../../components/chart/echarts-core';

// Only the charts and components this chart uses (STACK.md: tree-shaken ECharts).
echarts.use([BarChart, LineChart, GridComponent, LegendComponent, TooltipComponent, CanvasRenderer]);

/** Broodcast's accent scale (sequential, readable in grayscale); no traffic-light colours. */
const INK = '#1d2026';
const BAND = '#b5bde2';
const CENTRE = '#3a4890';
const SEASON = '#26305e';
const PRIOR = '#8c98cf';
const OPEN = '#dfe3f3';

/**
 * This season's weekly cases (bars) against the endemic channel (shaded band from the lower to the upper
 * bound, centre line dashed) and the prior seasons (thin lines, hidden until chosen in the legend).
 */
export function ChannelChart({ data }: { data: SignalsResponse }) {
  const { t, i18n } = useTranslation('cases');
  const { number, date } = useFormat();
  const weeksInYear = Math.max(data.weeks.length, ...data.priorSeasons.map((s) => s.weeks.length));
  const categories = Array.from({ length: weeksInYear }, (_, i) => t('chart.weekShort', { week: i + 1 }));
  const byWeek = new Map(data.weeks.map((w) => [w.week, w]));
  const at = (i: number) => byWeek.get(i + 1);
  const lower = categories.map((_, i) => at(i)?.channel?.lower ?? null);
  const width = categories.map((_, i) => {
    const c = at(i)?.channel;
    return c ? c.upper - c.lower : null;
  });
  const centre = categories.map((_, i) => at(i)?.channel?.centre ?? null);
  // An open week's bar (reporting not over, a partial count) is drawn pale and hatched, and its tooltip says so.
  const season = categories.map((_, i) => {
    const w = at(i);
    const value = w?.cases ?? null;
    return w?.open && value !== null ? { value, itemStyle: { color: OPEN, borderColor: SEASON, borderType: 'dashed', decal: { symbol: 'rect', dashArrayX: [1, 0], dashArrayY: [2, 3], rotation: -Math.PI / 4, color: SEASON } } } : value;
  });
  const seasonValue = (i: number) => at(i)?.cases ?? null;
  const priorNames = data.priorSeasons.map((s) => (data.excludedYears.includes(s.year) ? t('chart.leftOut', { year: s.year }) : String(s.year)));
  const names = { channel: t('chart.channel'), lower: t('chart.lower'), centre: t('chart.centre'), season: t('chart.season', { year: data.year }) };

  const option = {
    aria: { enabled: true },
    animation: false,
    textStyle: { fontFamily: 'Lato, system-ui, sans-serif', color: INK },
    grid: { left: 48, right: 16, top: 64, bottom: 36 },
    color: [BAND, BAND, CENTRE, SEASON, PRIOR],
    legend: {
      top: 0,
      type: 'scroll',
      data: [names.channel, names.centre, names.season, ...priorNames],
      selected: Object.fromEntries(priorNames.map((n) => [n, false])),
    },
    tooltip: {
      trigger: 'axis',
      // Text only (no HTML from data): the band is shown as its bounds, not as the stacked width.
      formatter: (params: { dataIndex: number; seriesName: string; value: unknown }[]) => {
        const i = params[0]?.dataIndex ?? 0;
        const w = at(i);
        const fmt = (v: number | null | undefined) => (v === null || v === undefined ? '—' : number(v, v % 1 ? 1 : 0, true));
        const lines = [
          t('chart.week', { week: i + 1 }),
          t('chart.seasonLine', { year: data.year, cases: fmt(seasonValue(i)) }),
          ...(w?.open ? [t('chart.openWeek', { date: date(w.deadline) })] : []),
          w?.channel ? t('chart.channelLine', { lower: fmt(w.channel.lower), upper: fmt(w.channel.upper), centre: fmt(w.channel.centre) }) : t('chart.noChannel'),
          ...params.filter((p) => priorNames.includes(p.seriesName)).map((p) => `${p.seriesName}: ${fmt(p.value as number | null)}`),
        ];
        return lines.join('<br>');
      },
    },
    xAxis: { type: 'category', data: categories, axisLabel: { interval: 3 } },
    yAxis: { type: 'value', name: t('chart.axis'), nameGap: 12, nameTextStyle: { align: 'left' }, minInterval: 1 },
    series: [
      { name: names.lower, type: 'line', data: lower, stack: 'channel', symbol: 'none', lineStyle: { width: 0 }, itemStyle: { color: BAND } },
      {
        name: names.channel,
        type: 'line',
        data: width,
        stack: 'channel',
        symbol: 'none',
        lineStyle: { width: 0 },
        areaStyle: { color: BAND, opacity: 0.7 },
        itemStyle: { color: BAND },
      },
      { name: names.centre, type: 'line', data: centre, symbol: 'none', lineStyle: { color: CENTRE, type: 'dashed', width: 1.5 }, itemStyle: { color: CENTRE } },
      { name: names.season, type: 'bar', data: season, itemStyle: { color: SEASON }, barMaxWidth: 12 },
      ...data.priorSeasons.map((s, i) => ({
        name: priorNames[i],
        type: 'line',
        data: s.weeks,
        symbol: 'none',
        lineStyle: { width: 1, color: PRIOR, type: data.excludedYears.includes(s.year) ? 'dotted' : 'solid' },
        itemStyle: { color: PRIOR },
      })),
    ],
  };
  return (
    <ReactEChartsCore
      echarts={echarts}
      option={localizeOption(option as never, i18n.language)}
      notMerge
      style={{ height: 340, width: '100%' }}
      opts={{ renderer: 'canvas', locale: echartsLocale(i18n.language) }}
    />
  );
}
