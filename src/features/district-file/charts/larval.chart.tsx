import type { DistrictFileResponse } from '../../../../shared/api/board.schema';
import { ChartFigure } from '../../../components/chart/chart-figure';
import { SeriesTable } from '../../../components/chart/series-table';
import { axisTooltip, baseGrid, categoryAxis, INDIGO, INK, legend, PLUM, round, valueAxis } from './chart-style';

type Larval = DistrictFileResponse['larval'];

export function LarvalChart({ larval }: { larval: Larval }) {
  const weeks = [...larval].sort((a, b) => a.epiYear - b.epiYear || a.epiWeek - b.epiWeek);
  const labels = weeks.map((w) => `${w.epiYear} W${w.epiWeek}`);
  const last = weeks[weeks.length - 1];
  const summary = last
    ? `House, Container and Breteau indices from larval surveys, by week (${weeks.length} week${weeks.length === 1 ? '' : 's'} with surveys). ` +
      `In week ${last.epiWeek} of ${last.epiYear} (${last.surveys} survey${last.surveys === 1 ? '' : 's'}): House ${round(last.house) ?? '—'}%, Container ${round(last.container) ?? '—'}%, Breteau ${round(last.breteau) ?? '—'}.`
    : 'No larval surveys this season.';
  return (
    <ChartFigure
      title="Larval indices"
      summary={summary}
      emptyText={weeks.length === 0 ? 'No larval surveys yet this season.' : null}
      height="16rem"
      option={{
        grid: baseGrid,
        legend,
        tooltip: axisTooltip,
        xAxis: categoryAxis(labels),
        yAxis: valueAxis('index', { min: 0 }),
        series: [
          { type: 'line', name: 'House index (%)', data: weeks.map((w) => round(w.house)), symbol: 'circle', symbolSize: 7, lineStyle: { color: INK, width: 1.5 }, itemStyle: { color: INK } },
          { type: 'line', name: 'Container index (%)', data: weeks.map((w) => round(w.container)), symbol: 'rect', symbolSize: 7, lineStyle: { color: INDIGO, width: 1.5, type: 'dashed' }, itemStyle: { color: INDIGO } },
          { type: 'line', name: 'Breteau index', data: weeks.map((w) => round(w.breteau)), symbol: 'triangle', symbolSize: 8, lineStyle: { color: PLUM, width: 1.5, type: 'dotted' }, itemStyle: { color: PLUM } },
        ],
      }}
      table={
        <SeriesTable
          caption="Larval indices by week"
          header={['Week', 'Surveys', 'House index %', 'Container index %', 'Breteau index', 'Pupae per person']}
          rows={weeks.map((w, i) => [labels[i], w.surveys, round(w.house), round(w.container), round(w.breteau), round(w.pupa, 2)])}
        />
      }
    />
  );
}
