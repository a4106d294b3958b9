import type { DistrictOutlookResponse } from '../../../../shared/api/outlook.schema';
import { ChartFigure } from '../../../components/chart/chart-figure';
import { SeriesTable } from '../../../components/chart/series-table';
import { useLadderWords } from '../../ladder/ladder-format';
import { axisTooltip, baseGrid, categoryAxis, INDIGO, INDIGO_LIGHT, INDIGO_PALE, INK, legend, valueAxis } from '../charts/chart-style';

/** The 25–75 % band: the same indigo as the 10–90 % band, stronger, so the two read apart in grayscale too. */
const INDIGO_MID = 'rgba(140, 152, 207, 0.75)';

/** "1 Dec" / "1 déc." — the first day of a week, in the interface language (calendar dates in UTC). */
export function weekDayLabel(locale: string, iso: string): string {
  return new Intl.DateTimeFormat(locale, { day: 'numeric', month: 'short', timeZone: 'UTC' }).format(new Date(`${iso}T00:00:00Z`));
}

/**
 * The Case outlook's fan: observed cases of the recent weeks (bars) and, for the weeks ahead with skill
 * only (the server sends no others), the median (line) inside the 25–75 % and 10–90 % bands. The bands
 * are one stack (10 % base, then 10–25, 25–75 and 75–90 % slices), started at the origin week's count so
 * the fan opens from what was last seen. Only call it with a forecast: the panel says in words why there
 * is no fan otherwise.
 */
export function OutlookFanChart({ outlook }: { outlook: DistrictOutlookResponse }) {
  const { t, f } = useLadderWords();
  const { recent, forecast, origin } = outlook;
  const disease = outlook.disease?.name ?? '';
  const past = recent.map((w) => ({ ...w, cases: w.cases }));
  if (origin && !past.some((w) => w.year === origin.year && w.week === origin.week)) past.push({ ...origin });
  const n = past.length;
  const labels = [...past, ...forecast].map((w) => weekDayLabel(f.locale, w.weekStart));
  const pad = (k: number) => Array.from({ length: k }, () => null as number | null);
  const at = origin ? origin.cases : null;
  // Before the origin: nothing; at the origin: the count seen (a band of width 0); then the forecast.
  const lead = (values: number[]) => [...pad(Math.max(0, n - 1)), at, ...values];
  const q10 = lead(forecast.map((x) => x.q10));
  const low = lead(forecast.map((x) => x.q25 - x.q10)).map((v, i) => (i === n - 1 ? 0 : v));
  const mid = lead(forecast.map((x) => x.q75 - x.q25)).map((v, i) => (i === n - 1 ? 0 : v));
  const high = lead(forecast.map((x) => x.q90 - x.q75)).map((v, i) => (i === n - 1 ? 0 : v));
  const median = lead(forecast.map((x) => x.q50));
  const observed = [...past.map((w) => w.cases), ...pad(forecast.length)];
  const names = {
    observed: t('district-file:outlook.series.observed'),
    median: t('district-file:outlook.series.median'),
    band80: t('district-file:outlook.series.band80'),
    band50: t('district-file:outlook.series.band50'),
  };
  const first = forecast[0]!;
  const lastAhead = forecast[forecast.length - 1]!;
  const summary = [
    t('district-file:outlook.chartSummary', {
      disease,
      count: forecast.length,
      weeks: f.number(forecast.length),
      origin: f.date(origin?.weekEnd ?? null),
    }),
    // All of the 10–90 % range on one count (an off-season week of nothing): said as that count, not "between 0 and 0".
    first.q10 === first.q90
      ? t('district-file:outlook.nextWeekExact', { day: f.date(first.weekStart), median: f.number(first.q50) })
      : t('district-file:outlook.nextWeek', { day: f.date(first.weekStart), median: f.number(first.q50), low: f.number(first.q10), high: f.number(first.q90) }),
    forecast.length > 1 && lastAhead.q10 !== lastAhead.q90
      ? t('district-file:outlook.lastWeekAhead', { count: lastAhead.horizon, day: f.date(lastAhead.weekStart), median: f.number(lastAhead.q50), low: f.number(lastAhead.q10), high: f.number(lastAhead.q90) })
      : '',
  ]
    .filter(Boolean)
    .join(' ');
  const top = Math.max(...forecast.map((x) => x.q90), ...past.map((w) => w.cases ?? 0), 1);
  return (
    <ChartFigure
      title={t('district-file:outlook.chartTitle', { disease })}
      summary={summary}
      height="18rem"
      option={{
        grid: baseGrid,
        legend: {
          ...legend,
          // The bands' own lines are hidden; their legend marks are filled squares of the band colours.
          data: [names.observed, names.median, { name: names.band50, icon: 'rect' }, { name: names.band80, icon: 'rect' }],
        },
        tooltip: {
          ...axisTooltip,
          formatter: (params: any) => {
            const i = Array.isArray(params) ? params[0]?.dataIndex : params?.dataIndex;
            if (i === undefined) return '';
            if (i < n) {
              const w = past[i]!;
              return [t('district-file:outlook.tooltipWeek', { day: f.date(w.weekStart) }), t('district-file:outlook.tooltipObserved', { cases: f.number(w.cases) })].join('<br/>');
            }
            const x = forecast[i - n]!;
            return [
              t('district-file:outlook.tooltipAhead', { count: x.horizon, day: f.date(x.weekStart) }),
              t('district-file:outlook.tooltipMedian', { cases: f.number(x.q50) }),
              t('district-file:outlook.tooltipBand50', { low: f.number(x.q25), high: f.number(x.q75) }),
              t('district-file:outlook.tooltipBand80', { low: f.number(x.q10), high: f.number(x.q90) }),
            ].join('<br/>');
          },
        },
        xAxis: categoryAxis(labels),
        yAxis: valueAxis(t('district-file:outlook.axis'), { min: 0, max: top <= 5 ? 5 : undefined, minInterval: 1 }),
        series: [
          { type: 'line', name: 'q10', stack: 'fan', data: q10, showSymbol: false, lineStyle: { opacity: 0 }, silent: true, tooltip: { show: false } },
          { type: 'line', name: names.band80, stack: 'fan', data: low, showSymbol: false, lineStyle: { opacity: 0 }, areaStyle: { color: INDIGO_PALE }, itemStyle: { color: INDIGO_PALE }, silent: true },
          { type: 'line', name: names.band50, stack: 'fan', data: mid, showSymbol: false, lineStyle: { opacity: 0 }, areaStyle: { color: INDIGO_MID }, itemStyle: { color: INDIGO_MID }, silent: true },
          { type: 'line', name: names.band80, stack: 'fan', data: high, showSymbol: false, lineStyle: { opacity: 0 }, areaStyle: { color: INDIGO_PALE }, itemStyle: { color: INDIGO_PALE }, silent: true },
          { type: 'line', name: names.median, data: median, symbol: 'circle', symbolSize: 6, lineStyle: { color: INDIGO, width: 2, type: 'dashed' }, itemStyle: { color: INDIGO, borderColor: INDIGO_LIGHT } },
          { type: 'bar', name: names.observed, data: observed, itemStyle: { color: INK }, barMaxWidth: 10 },
        ],
      }}
      table={
        <SeriesTable
          caption={t('district-file:outlook.tableCaption', { disease })}
          header={[
            t('district-file:outlook.table.week'),
            names.observed,
            names.median,
            names.band50,
            names.band80,
          ]}
          rows={[
            ...past.map((w) => [t('district-file:outlook.table.weekOf', { day: f.date(w.weekStart) }), f.number(w.cases), '', '', '']),
            ...forecast.map((x) => [
              t('district-file:outlook.table.aheadOf', { count: x.horizon, day: f.date(x.weekStart) }),
              '',
              f.number(x.q50),
              t('district-file:outlook.range', { low: f.number(x.q25), high: f.number(x.q75) }),
              t('district-file:outlook.range', { low: f.number(x.q10), high: f.number(x.q90) }),
            ]),
          ]}
          emptyText={t('district-file:table.empty')}
        />
      }
    />
  );
}
