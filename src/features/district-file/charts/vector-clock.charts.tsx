import type { DistrictFileResponse } from '../../../../shared/api/board.schema';
import { ChartFigure } from '../../../components/chart/chart-figure';
import { SeriesTable } from '../../../components/chart/series-table';
import { formatDay } from '../../ladder/ladder-format';
import {
  axisTooltip,
  baseGrid,
  FONT,
  GREY,
  INDIGO,
  INDIGO_PALE,
  INK,
  lastIndexWithValue,
  legend,

  pairs,
  PLUM,
  round,
  timeAxis,
  valueAxis,
  weeklyIndexes,
} from './chart-style';

export type VectorClock = DistrictFileResponse['vectorClock'][number];

/** The days on which one more generation was completed (the whole number of generations went up). */
export function generationDays(vc: Pick<VectorClock, 'dates' | 'generations'>): { date: string; generation: number }[] {
  const out: { date: string; generation: number }[] = [];
  let before = 0;
  vc.generations.forEach((g, i) => {
    if (g === null) return;
    const whole = Math.floor(g);
    if (whole > before) out.push({ date: vc.dates[i], generation: whole });
    before = Math.max(before, whole);
  });
  return out;
}

/** Moves an earlier season's days onto this season's calendar, so the two lines share one time axis. */
const shiftToYear = (dates: readonly string[], year: number) => dates.map((d) => `${year}${d.slice(4)}`).filter((d) => !d.endsWith('-02-29'));

export function DegreeDaysChart({ vc, seasonYear, compared }: { vc: VectorClock; seasonYear: number; compared?: { year: number; vc: VectorClock } | null }) {
  const gens = generationDays(vc);
  const last = lastIndexWithValue(vc.cumulativeDegreeDays);
  const comparedSeries = compared
    ? (() => {
        const keep = compared.vc.dates.map((d, i) => (d.endsWith('-02-29') ? -1 : i)).filter((i) => i >= 0);
        const dates = shiftToYear(compared.vc.dates, seasonYear);
        return dates.map((d, j) => [d, compared.vc.cumulativeDegreeDays[keep[j]] ?? null] as [string, number | null]);
      })()
    : null;
  const comparedLast = compared ? lastIndexWithValue(compared.vc.cumulativeDegreeDays) : -1;
  const summary =
    last < 0
      ? 'No heat accumulation for this season yet.'
      : `Degree-days accumulated since the biofix reached ${round(vc.cumulativeDegreeDays[last], 0)} by ${formatDay(vc.dates[last])}, ` +
        `with ${gens.length} generation${gens.length === 1 ? '' : 's'} completed` +
        (gens.length ? ` (the latest on ${formatDay(gens[gens.length - 1].date)}).` : '.') +
        (compared && comparedLast >= 0 ? ` The dashed line is ${compared.year} on the same calendar, which reached ${round(compared.vc.cumulativeDegreeDays[comparedLast], 0)} by its end.` : '');
  return (
    <ChartFigure
      title={`Heat accumulation — ${vc.profileName}`}
      summary={summary}
      emptyText={last < 0 ? 'No heat accumulation yet for this season.' : null}
      height="16rem"
      option={{
        grid: baseGrid,
        legend,
        tooltip: axisTooltip,
        xAxis: timeAxis,
        yAxis: valueAxis('degree-days'),
        series: [
          {
            type: 'line',
            name: `${seasonYear} cumulative degree-days`,
            data: pairs(vc.dates, vc.cumulativeDegreeDays),
            showSymbol: false,
            lineStyle: { color: INDIGO, width: 2 },
            itemStyle: { color: INDIGO },
            markLine: {
              symbol: 'none',
              silent: true,
              lineStyle: { color: PLUM, type: 'dotted', width: 1 },
              label: { ...FONT, color: PLUM, fontSize: 10, formatter: (p: any) => `gen ${p.data?.generation ?? ''}` },
              data: gens.map((g) => ({ xAxis: g.date, generation: g.generation }) as any),
            },
          },
          ...(comparedSeries
            ? [{ type: 'line' as const, name: `${compared!.year} cumulative degree-days`, data: comparedSeries, showSymbol: false, lineStyle: { color: GREY, width: 1.5, type: 'dashed' as const }, itemStyle: { color: GREY } }]
            : []),
        ],
      }}
      table={
        <SeriesTable
          caption={`Heat accumulation, ${vc.profileName} (one row a week)`}
          header={['Day', 'Cumulative degree-days', 'Generations', 'Season open']}
          rows={weeklyIndexes(vc.dates.length).map((i) => [vc.dates[i], round(vc.cumulativeDegreeDays[i], 0), round(vc.generations[i], 2), vc.seasonOpen[i] ? 'yes' : 'no'])}
        />
      }
    />
  );
}

export function EipChart({ vc }: { vc: VectorClock }) {
  const last = lastIndexWithValue(vc.eipDays);
  const summary =
    last < 0
      ? 'No extrinsic incubation estimate for this season yet.'
      : `On ${formatDay(vc.dates[last])} the extrinsic incubation period was ${round(vc.eipDays[last])} days (left scale) and ` +
        `${round((vc.survivalThroughEip[last] ?? 0) * 100, 0)}% of infected mosquitoes would be expected to survive it (right scale).`;
  return (
    <ChartFigure
      title={`Vector clock — ${vc.profileName}`}
      summary={summary}
      emptyText={last < 0 ? 'No vector clock yet for this season.' : null}
      height="16rem"
      option={{
        grid: baseGrid,
        legend,
        tooltip: axisTooltip,
        xAxis: timeAxis,
        yAxis: [valueAxis('EIP days'), valueAxis('survival %', { min: 0, max: 100, splitLine: { show: false } })],
        series: [
          { type: 'line', name: 'EIP (days)', data: pairs(vc.dates, vc.eipDays), showSymbol: false, lineStyle: { color: INK, width: 1.5 }, itemStyle: { color: INK } },
          {
            type: 'line',
            name: 'Survival through the EIP (%)',
            yAxisIndex: 1,
            data: pairs(vc.dates, vc.survivalThroughEip.map((s) => (s === null ? null : round(s * 100, 1)))),
            showSymbol: false,
            lineStyle: { color: PLUM, width: 1.5, type: 'dashed' },
            itemStyle: { color: PLUM },
          },
        ],
      }}
      table={
        <SeriesTable
          caption={`Vector clock, ${vc.profileName} (one row a week)`}
          header={['Day', 'EIP days', 'Survival through the EIP %', 'Estimate complete']}
          rows={weeklyIndexes(vc.dates.length).map((i) => [
            vc.dates[i],
            round(vc.eipDays[i]),
            vc.survivalThroughEip[i] === null ? null : round(vc.survivalThroughEip[i]! * 100, 1),
            vc.complete[i] ? 'yes' : 'no',
          ])}
        />
      }
    />
  );
}

export function RvcChart({ vc }: { vc: VectorClock }) {
  const last = lastIndexWithValue(vc.rvc);
  const band = vc.rvc.map((_, i) => (vc.rvcLow[i] === null || vc.rvcHigh[i] === null ? null : vc.rvcHigh[i]! - vc.rvcLow[i]!));
  const summary =
    last < 0
      ? 'No relative vectorial capacity for this season yet.'
      : `Relative vectorial capacity (1 = the profile’s optimum) was ${round(vc.rvc[last], 2)} on ${formatDay(vc.dates[last])}, ` +
        `between a low estimate of ${round(vc.rvcLow[last], 2) ?? '—'} and a high of ${round(vc.rvcHigh[last], 2) ?? '—'}; the shaded band spans low to high.`;
  return (
    <ChartFigure
      title={`Relative vectorial capacity — ${vc.profileName}`}
      summary={summary}
      emptyText={last < 0 ? 'No relative vectorial capacity yet for this season.' : null}
      height="16rem"
      option={{
        grid: baseGrid,
        legend: { ...legend, data: ['Central estimate', 'Low–high range'] },
        tooltip: {
          ...axisTooltip,
          formatter: (params: any) => {
            const i = Array.isArray(params) ? params[0]?.dataIndex : params?.dataIndex;
            if (i === undefined) return '';
            return `${formatDay(vc.dates[i])}<br/>Central ${round(vc.rvc[i], 2) ?? '—'}<br/>Low ${round(vc.rvcLow[i], 2) ?? '—'} · high ${round(vc.rvcHigh[i], 2) ?? '—'}`;
          },
        },
        xAxis: timeAxis,
        yAxis: valueAxis('relative to optimum', { min: 0 }),
        series: [
          { type: 'line', name: 'Low', stack: 'range', data: pairs(vc.dates, vc.rvcLow), showSymbol: false, lineStyle: { opacity: 0 }, silent: true, tooltip: { show: false } },
          { type: 'line', name: 'Low–high range', stack: 'range', data: pairs(vc.dates, band), showSymbol: false, lineStyle: { opacity: 0 }, areaStyle: { color: INDIGO_PALE }, itemStyle: { color: INDIGO_PALE }, silent: true },
          { type: 'line', name: 'Central estimate', data: pairs(vc.dates, vc.rvc), showSymbol: false, lineStyle: { color: INDIGO, width: 2 }, itemStyle: { color: INDIGO } },
        ],
      }}
      table={
        <SeriesTable
          caption={`Relative vectorial capacity, ${vc.profileName} (one row a week)`}
          header={['Day', 'Low', 'Central', 'High']}
          rows={weeklyIndexes(vc.dates.length).map((i) => [vc.dates[i], round(vc.rvcLow[i], 2), round(vc.rvc[i], 2), round(vc.rvcHigh[i], 2)])}
        />
      }
    />
  );
}

