import type { DistrictFileResponse } from '../../../../shared/api/board.schema';
import { ChartFigure } from '../../../components/chart/chart-figure';
import { SeriesTable } from '../../../components/chart/series-table';
import { useUnits } from '../../../lib/units';
import { useLadderWords } from '../../ladder/ladder-format';
import { AXIS_LIMITS, convertRange, withinAxis } from './axis-limits';
import { axisTooltip, baseGrid, GREY, INDIGO, INDIGO_LIGHT, INK, legend, maxOf, pairs, round, timeAxis, valueAxis } from './chart-style';

type Weather = DistrictFileResponse['weather'];

/** Daily minimum and maximum temperature, humidity and rain, in the user's units (stored values stay °C and mm). */
export function WeatherChart({ weather }: { weather: Weather }) {
  const w = useLadderWords();
  const { t, f } = w;
  const u = useUnits();
  const { dates, rh, filled } = weather;
  const temp = (x: number | null) => (x === null ? null : round(u.toTemperature(x)));
  const tmin = weather.tmin.map(temp);
  const tmax = weather.tmax.map(temp);
  const rain = weather.rain.map((x) => (x === null ? null : round(u.toRain(x), u.rainDigits)));
  // What the axes may show: temperatures within the records ever measured, humidity and rain within the
  // right axis (0–100, % or the rain unit). Values beyond are not drawn and are counted under the chart;
  // the table keeps them as stored.
  const tempRange = convertRange(AXIS_LIMITS.temperatureC, u.toTemperature);
  const drawn = {
    tmin: withinAxis(tmin, tempRange),
    tmax: withinAxis(tmax, tempRange),
    rh: withinAxis(rh, AXIS_LIMITS.percent),
    rain: withinAxis(rain, AXIS_LIMITS.percent),
  };
  const beyondAxis = drawn.tmin.beyond + drawn.tmax.beyond + drawn.rh.beyond + drawn.rain.beyond;
  // The warmest day the summary names is a plausible one; a value beyond the records is said in the note.
  const warmest = maxOf(drawn.tmax.values);
  const filledDays = filled.filter(Boolean).length;
  const unit = { temp: u.temperatureSymbol, rain: u.rainSymbol };
  const summary =
    dates.length === 0
      ? t('district-file:weather.none')
      : [
          t('district-file:weather.summary', { ...unit, from: f.date(dates[0]), to: f.date(dates[dates.length - 1]) }),
          warmest ? t('district-file:weather.warmest', { value: f.number(warmest.value, 1), temp: unit.temp, day: f.date(dates[warmest.index]) }) : '',
          filledDays ? t('district-file:weather.filled', { count: filledDays, days: f.number(filledDays) }) : '',
        ]
          .filter(Boolean)
          .join(' ');
  const names = {
    max: t('district-file:weather.series.max', unit),
    min: t('district-file:weather.series.min', unit),
    rh: t('district-file:weather.series.rh'),
    rain: t('district-file:weather.series.rain', unit),
  };
  return (
    <ChartFigure
      title={t('district-file:weather.title')}
      summary={summary}
      emptyText={dates.length === 0 ? t('district-file:weather.empty') : null}
      height="18rem"
      beyondAxis={beyondAxis}
      option={{
        grid: baseGrid,
        legend,
        tooltip: axisTooltip,
        xAxis: timeAxis,
        yAxis: [valueAxis(unit.temp), valueAxis(t('district-file:weather.axisRight', unit), { min: 0, max: 100, splitLine: { show: false } })],
        series: [
          { type: 'line', name: names.max, data: pairs(dates, drawn.tmax.values), showSymbol: false, lineStyle: { color: INK, width: 1.5 }, itemStyle: { color: INK } },
          { type: 'line', name: names.min, data: pairs(dates, drawn.tmin.values), showSymbol: false, lineStyle: { color: INDIGO, width: 1.5, type: 'dashed' }, itemStyle: { color: INDIGO } },
          { type: 'line', name: names.rh, yAxisIndex: 1, data: pairs(dates, drawn.rh.values), showSymbol: false, lineStyle: { color: INDIGO_LIGHT, width: 1, type: 'dotted' }, itemStyle: { color: INDIGO_LIGHT } },
          { type: 'bar', name: names.rain, yAxisIndex: 1, data: pairs(dates, drawn.rain.values), itemStyle: { color: GREY }, barMaxWidth: 3 },
        ],
      }}
      table={
        <SeriesTable
          caption={t('district-file:weather.tableCaption')}
          header={[t('district-file:table.day'), names.min, names.max, names.rh, names.rain, t('district-file:weather.filledColumn')]}
          rows={dates.map((d, i) => [
            f.date(d),
            f.number(tmin[i], 1),
            f.number(tmax[i], 1),
            f.number(round(rh[i], 0)),
            f.number(rain[i], u.rainDigits),
            filled[i] ? t('district-file:yes') : '',
          ])}
          emptyText={t('district-file:table.empty')}
        />
      }
    />
  );
}
