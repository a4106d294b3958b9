import type { DistrictFileResponse } from '../../../../shared/api/board.schema';
import { ChartFigure } from '../../../components/chart/chart-figure';
import { SeriesTable } from '../../../components/chart/series-table';
import { formatDay } from '../../ladder/ladder-format';
import { axisTooltip, baseGrid, GREY, INDIGO, INDIGO_LIGHT, INK, legend, maxOf, pairs, round, timeAxis, valueAxis } from './chart-style';

type Weather = DistrictFileResponse['weather'];

export function WeatherChart({ weather }: { weather: Weather }) {
  const { dates, tmin, tmax, rh, rain, filled } = weather;
  const warmest = maxOf(tmax);
  const filledDays = filled.filter(Boolean).length;
  const summary =
    dates.length === 0
      ? 'No daily weather for this season yet.'
      : `Daily minimum and maximum temperature (°C, left scale) and relative humidity (%, right scale) from ${formatDay(dates[0])} to ${formatDay(dates[dates.length - 1])}.` +
        (warmest ? ` The warmest day reached ${round(warmest.value)} °C on ${formatDay(dates[warmest.index])}.` : '') +
        (filledDays ? ` ${filledDays} day${filledDays === 1 ? ' was' : 's were'} filled in from neighbouring days.` : '');
  return (
    <ChartFigure
      title="Daily temperature and humidity"
      summary={summary}
      emptyText={dates.length === 0 ? 'No weather yet for this season.' : null}
      height="18rem"
      option={{
        grid: baseGrid,
        legend,
        tooltip: axisTooltip,
        xAxis: timeAxis,
        yAxis: [valueAxis('°C'), valueAxis('RH %', { min: 0, max: 100, splitLine: { show: false } })],
        series: [
          { type: 'line', name: 'Maximum °C', data: pairs(dates, tmax), showSymbol: false, lineStyle: { color: INK, width: 1.5 }, itemStyle: { color: INK } },
          { type: 'line', name: 'Minimum °C', data: pairs(dates, tmin), showSymbol: false, lineStyle: { color: INDIGO, width: 1.5, type: 'dashed' }, itemStyle: { color: INDIGO } },
          { type: 'line', name: 'Relative humidity %', yAxisIndex: 1, data: pairs(dates, rh), showSymbol: false, lineStyle: { color: INDIGO_LIGHT, width: 1, type: 'dotted' }, itemStyle: { color: INDIGO_LIGHT } },
          { type: 'bar', name: 'Rain mm', yAxisIndex: 1, data: pairs(dates, rain), itemStyle: { color: GREY }, barMaxWidth: 3 },
        ],
      }}
      table={
        <SeriesTable
          caption="Daily weather"
          header={['Day', 'Minimum °C', 'Maximum °C', 'Relative humidity %', 'Rain mm', 'Filled in']}
          rows={dates.map((d, i) => [d, round(tmin[i]), round(tmax[i]), round(rh[i], 0), round(rain[i]), filled[i] ? 'yes' : ''])}
        />
      }
    />
  );
}
