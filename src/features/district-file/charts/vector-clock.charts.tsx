import { profileLabel, sameToTwoDecimals } from '../district-file-format';
import type { DistrictFileResponse } from '../../../../shared/api/board.schema';
import { ChartFigure } from '../../../components/chart/chart-figure';
import { SeriesTable } from '../../../components/chart/series-table';
import { useUnits } from '../../../lib/units';
import { useLadderWords } from '../../ladder/ladder-format';
import { AXIS_LIMITS, convertRange, isBeyond, withinAxis } from './axis-limits';
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

/** Which generations get a name on the heat chart: 1, 2, 5, 10 … so that no more than `maxNames` are named. */
export function genStep(count: number, maxNames = 8): number {
  for (const step of [1, 2, 5, 10, 20, 50]) if (count / step <= maxNames) return step;
  return 100;
}

/** How many generation names fit side by side: about one per 80 px of chart, 3 to 8 (a phone gets 4). */
export const generationNamesFor = (width: number) => Math.max(3, Math.min(8, Math.floor(width / 80)));

/** Moves an earlier season's days onto this season's calendar, so the two lines share one time axis. */
const shiftToYear = (dates: readonly string[], year: number) => dates.map((d) => `${year}${d.slice(4)}`).filter((d) => !d.endsWith('-02-29'));

export function DegreeDaysChart({ vc, seasonYear, compared }: { vc: VectorClock; seasonYear: number; compared?: { year: number; vc: VectorClock } | null }) {
  const { t, f } = useLadderWords();
  const u = useUnits();
  /** Degree-days are a temperature difference × days: °C·d → °F·d without an offset. */
  const dd = (x: number | null | undefined) => (x === null || x === undefined ? null : u.toTemperatureDelta(x));
  const ddUnit = u.degreeDaySymbol;
  const gens = generationDays(vc);
  // The chart spans about the window's width less the page's margins; names beyond what fits are left out.
  const maxNames = generationNamesFor(typeof window === 'undefined' ? 1024 : Math.min(window.innerWidth, 1152) - 96);
  const step = gens.length <= maxNames ? 1 : genStep(gens.length, maxNames);
  const last = lastIndexWithValue(vc.cumulativeDegreeDays);
  const comparedSeries = compared
    ? (() => {
        const keep = compared.vc.dates.map((d, i) => (d.endsWith('-02-29') ? -1 : i)).filter((i) => i >= 0);
        const dates = shiftToYear(compared.vc.dates, seasonYear);
        return dates.map((d, j) => [d, round(dd(compared.vc.cumulativeDegreeDays[keep[j]]), 1)] as [string, number | null]);
      })()
    : null;
  const comparedLast = compared ? lastIndexWithValue(compared.vc.cumulativeDegreeDays) : -1;
  // No season can hold more heat than the warmest day on record every day (axis-limits.ts); beyond is not drawn.
  const ddRange = convertRange(AXIS_LIMITS.degreeDaysC, u.toTemperatureDelta);
  const drawn = withinAxis(vc.cumulativeDegreeDays.map((x) => round(dd(x), 1)), ddRange);
  const comparedDrawn = comparedSeries ? withinAxis(comparedSeries.map(([, v]) => v), ddRange) : null;
  const beyondAxis = drawn.beyond + (comparedDrawn?.beyond ?? 0);
  const summary =
    last < 0
      ? t('district-file:degreeDays.none')
      : [
          t('district-file:degreeDays.summary', { value: f.number(dd(vc.cumulativeDegreeDays[last]), 0), unit: ddUnit, day: f.date(vc.dates[last]) }),
          gens.length
            ? t('district-file:degreeDays.generationsLatest', { count: gens.length, day: f.date(gens[gens.length - 1].date) })
            : t('district-file:degreeDays.generations', { count: gens.length }),
          compared && comparedLast >= 0
            ? t('district-file:degreeDays.compared', { year: compared.year, value: f.number(dd(compared.vc.cumulativeDegreeDays[comparedLast]), 0), unit: ddUnit })
            : '',
        ]
          .filter(Boolean)
          .join(' ');
  return (
    <ChartFigure
      title={t('district-file:degreeDays.title', { profile: profileLabel({ t }, vc) })}
      summary={summary}
      emptyText={last < 0 ? t('district-file:degreeDays.empty') : null}
      height="16rem"
      beyondAxis={beyondAxis}
      option={{
        grid: baseGrid,
        legend,
        tooltip: axisTooltip,
        xAxis: timeAxis,
        yAxis: valueAxis(t('district-file:degreeDays.axis', { unit: ddUnit })),
        series: [
          {
            type: 'line',
            name: t('district-file:degreeDays.series', { year: seasonYear }),
            data: pairs(vc.dates, drawn.values),
            showSymbol: false,
            lineStyle: { color: INDIGO, width: 2 },
            itemStyle: { color: INDIGO },
            markLine: {
              symbol: 'none',
              silent: true,
              lineStyle: { color: PLUM, type: 'dotted', width: 1 },
              label: { ...FONT, color: PLUM, fontSize: 10, formatter: (p: any) => t('district-file:degreeDays.genMark', { generation: p.data?.generation ?? '' }) },
              // Every generation keeps its line; only every n-th is named, so the names never pile up (3–8 by width).
              data: gens.map((g) => ({ xAxis: g.date, generation: g.generation, label: { show: g.generation % step === 0 } }) as any),
            },
          },
          ...(comparedSeries
            ? [{ type: 'line' as const, name: t('district-file:degreeDays.series', { year: compared!.year }), data: comparedSeries.map(([d], j) => [d, comparedDrawn!.values[j]] as [string, number | null]), showSymbol: false, lineStyle: { color: GREY, width: 1.5, type: 'dashed' as const }, itemStyle: { color: GREY } }]
            : []),
        ],
      }}
      table={
        <SeriesTable
          caption={t('district-file:degreeDays.tableCaption', { profile: profileLabel({ t }, vc) })}
          header={[t('district-file:table.day'), t('district-file:degreeDays.column', { unit: ddUnit }), t('district-file:degreeDays.generationsColumn'), t('district-file:degreeDays.seasonOpenColumn')]}
          rows={weeklyIndexes(vc.dates.length).map((i) => [
            f.date(vc.dates[i]),
            f.number(dd(vc.cumulativeDegreeDays[i]), 0),
            f.number(vc.generations[i], 2),
            vc.seasonOpen[i] ? t('district-file:yes') : t('district-file:no'),
          ])}
          emptyText={t('district-file:table.empty')}
        />
      }
    />
  );
}

/**
 * True on a day whose EIP is not completed: the traits are known (survival through the EIP is) but the
 * model gives no EIP — no development at that temperature, or beyond the mosquito's life or a season
 * (shared/model/traits.ts eipCompletion) — or an EIP is given that is longer than a season (a stored
 * answer from before that bound, or any other path). Shown in words, never as a number.
 */
export const eipNotCompleted = (vc: Pick<VectorClock, 'eipDays' | 'survivalThroughEip'>, i: number): boolean => {
  const d = vc.eipDays[i];
  return d === null || d === undefined ? vc.survivalThroughEip[i] !== null && vc.survivalThroughEip[i] !== undefined : isBeyond(d, AXIS_LIMITS.eipDays);
};

export function EipChart({ vc }: { vc: VectorClock }) {
  const { t, f } = useLadderWords();
  const last = lastIndexWithValue(vc.eipDays.map((d, i) => (d === null && eipNotCompleted(vc, i) ? 0 : d)));
  const summary =
    last < 0
      ? t('district-file:eip.none')
      : eipNotCompleted(vc, last)
        ? t('district-file:eip.summaryNotCompleted', { day: f.date(vc.dates[last]) })
        : t('district-file:eip.summary', { day: f.date(vc.dates[last]), days: f.number(vc.eipDays[last], 1), survival: f.percent(vc.survivalThroughEip[last] ?? 0) });
  const names = { eip: t('district-file:eip.series.eip'), survival: t('district-file:eip.series.survival') };
  // The EIP axis ends at a season (a longer EIP is "not completed"), survival at 100 %; beyond is not drawn.
  const drawn = {
    eip: withinAxis(vc.eipDays, AXIS_LIMITS.eipDays),
    survival: withinAxis(vc.survivalThroughEip.map((s) => (s === null ? null : round(s * 100, 1))), AXIS_LIMITS.percent),
  };
  return (
    <ChartFigure
      title={t('district-file:eip.title', { profile: profileLabel({ t }, vc) })}
      summary={summary}
      emptyText={last < 0 ? t('district-file:eip.empty') : null}
      height="16rem"
      beyondAxis={drawn.eip.beyond + drawn.survival.beyond}
      option={{
        grid: baseGrid,
        legend,
        tooltip: axisTooltip,
        xAxis: timeAxis,
        yAxis: [valueAxis(t('district-file:eip.axisLeft')), valueAxis(t('district-file:eip.axisRight'), { min: 0, max: 100, splitLine: { show: false } })],
        series: [
          { type: 'line', name: names.eip, data: pairs(vc.dates, drawn.eip.values), showSymbol: false, lineStyle: { color: INK, width: 1.5 }, itemStyle: { color: INK } },
          {
            type: 'line',
            name: names.survival,
            yAxisIndex: 1,
            data: pairs(vc.dates, drawn.survival.values),
            showSymbol: false,
            lineStyle: { color: PLUM, width: 1.5, type: 'dashed' },
            itemStyle: { color: PLUM },
          },
        ],
      }}
      table={
        <SeriesTable
          caption={t('district-file:eip.tableCaption', { profile: profileLabel({ t }, vc) })}
          header={[t('district-file:table.day'), t('district-file:eip.column'), t('district-file:eip.survivalColumn'), t('district-file:eip.completeColumn')]}
          rows={weeklyIndexes(vc.dates.length).map((i) => [
            f.date(vc.dates[i]),
            eipNotCompleted(vc, i) ? t('district-file:eip.notCompleted') : f.number(vc.eipDays[i], 1),
            vc.survivalThroughEip[i] === null ? null : f.number(vc.survivalThroughEip[i]! * 100, 1),
            vc.complete[i] ? t('district-file:yes') : t('district-file:no'),
          ])}
          emptyText={t('district-file:table.empty')}
        />
      }
    />
  );
}

export function RvcChart({ vc }: { vc: VectorClock }) {
  const words = useLadderWords();
  const { t, f } = words;
  const last = lastIndexWithValue(vc.rvc);
  const band = vc.rvc.map((_, i) => (vc.rvcLow[i] === null || vc.rvcHigh[i] === null ? null : vc.rvcHigh[i]! - vc.rvcLow[i]!));
  const n2 = (x: number | null | undefined) => f.number(x, 2, true);
  const summary =
    last < 0
      ? t('district-file:rvc.none')
      : sameToTwoDecimals(words, vc.rvcLow[last], vc.rvc[last], vc.rvcHigh[last])
        ? t('district-file:rvc.summarySingle', { value: n2(vc.rvc[last]), day: f.date(vc.dates[last]) })
        : t('district-file:rvc.summary', { value: n2(vc.rvc[last]), day: f.date(vc.dates[last]), low: n2(vc.rvcLow[last]), high: n2(vc.rvcHigh[last]) });
  const names = { low: t('district-file:rvc.series.low'), band: t('district-file:rvc.series.band'), central: t('district-file:rvc.series.central') };
  return (
    <ChartFigure
      title={t('district-file:rvc.title', { profile: profileLabel({ t }, vc) })}
      summary={summary}
      emptyText={last < 0 ? t('district-file:rvc.empty') : null}
      height="16rem"
      option={{
        grid: baseGrid,
        legend: { ...legend, data: [names.central, names.band] },
        tooltip: {
          ...axisTooltip,
          formatter: (params: any) => {
            const i = Array.isArray(params) ? params[0]?.dataIndex : params?.dataIndex;
            if (i === undefined) return '';
            const one = sameToTwoDecimals(words, vc.rvcLow[i], vc.rvc[i], vc.rvcHigh[i]);
            return [f.date(vc.dates[i]), t('district-file:rvc.tooltipCentral', { value: n2(vc.rvc[i]) }), ...(one ? [] : [t('district-file:rvc.tooltipRange', { low: n2(vc.rvcLow[i]), high: n2(vc.rvcHigh[i]) })])].join('<br/>');
          },
        },
        xAxis: timeAxis,
        yAxis: valueAxis(t('district-file:rvc.axis'), { min: 0 }),
        series: [
          { type: 'line', name: names.low, stack: 'range', data: pairs(vc.dates, vc.rvcLow), showSymbol: false, lineStyle: { opacity: 0 }, silent: true, tooltip: { show: false } },
          { type: 'line', name: names.band, stack: 'range', data: pairs(vc.dates, band), showSymbol: false, lineStyle: { opacity: 0 }, areaStyle: { color: INDIGO_PALE }, itemStyle: { color: INDIGO_PALE }, silent: true },
          { type: 'line', name: names.central, data: pairs(vc.dates, vc.rvc), showSymbol: false, lineStyle: { color: INDIGO, width: 2 }, itemStyle: { color: INDIGO } },
        ],
      }}
      table={
        <SeriesTable
          caption={t('district-file:rvc.tableCaption', { profile: profileLabel({ t }, vc) })}
          header={[t('district-file:table.day'), t('district-file:rvc.lowColumn'), t('district-file:rvc.centralColumn'), t('district-file:rvc.highColumn')]}
          rows={weeklyIndexes(vc.dates.length).map((i) => [f.date(vc.dates[i]), n2(vc.rvcLow[i]), n2(vc.rvc[i]), n2(vc.rvcHigh[i])])}
          emptyText={t('district-file:table.empty')}
        />
      }
    />
  );
}

