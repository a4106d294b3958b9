import type { DistrictFileResponse } from '../../../../shared/api/board.schema';
import { ChartFigure } from '../../../components/chart/chart-figure';
import { SeriesTable } from '../../../components/chart/series-table';
import { useLadderWords } from '../../ladder/ladder-format';
import { axisTooltip, baseGrid, categoryAxis, INDIGO, INK, legend, PLUM, round, valueAxis } from './chart-style';

type Larval = DistrictFileResponse['larval'];

export function LarvalChart({ larval }: { larval: Larval }) {
  const words = useLadderWords();
  const { t, f } = words;
  const weeks = [...larval].sort((a, b) => a.epiYear - b.epiYear || a.epiWeek - b.epiWeek);
  const labels = weeks.map((w) => t('epiWeekShort', { ns: 'common', week: w.epiWeek, year: w.epiYear }));
  const last = weeks[weeks.length - 1];
  const n1 = (x: number | null) => f.number(x, 1);
  // The pupa index pools only the surveys that counted pupae: say so when not all of the week's did.
  const pupaCell = (w: Larval[number]) =>
    w.pupa !== null && w.pupaSurveys < w.surveys
      ? t('district-file:larval.pupaPartial', { value: f.number(w.pupa, 2), counted: f.number(w.pupaSurveys), surveys: f.number(w.surveys) })
      : f.number(w.pupa, 2);
  const summary = last
    ? [
        t('district-file:larval.summary', { count: weeks.length }),
        t('district-file:larval.lastWeek', {
          week: words.week(last.epiYear, last.epiWeek),
          count: last.surveys,
          surveys: f.number(last.surveys),
          house: n1(last.house),
          container: n1(last.container),
          breteau: n1(last.breteau),
        }),
      ].join(' ')
    : t('district-file:larval.none');
  const names = { house: t('district-file:larval.series.house'), container: t('district-file:larval.series.container'), breteau: t('district-file:larval.series.breteau') };
  return (
    <ChartFigure
      title={t('district-file:larval.title')}
      summary={summary}
      emptyText={weeks.length === 0 ? t('district-file:larval.empty') : null}
      height="16rem"
      option={{
        grid: baseGrid,
        legend,
        tooltip: axisTooltip,
        xAxis: categoryAxis(labels),
        yAxis: valueAxis(t('district-file:larval.axis'), { min: 0 }),
        series: [
          { type: 'line', name: names.house, data: weeks.map((w) => round(w.house)), symbol: 'circle', symbolSize: 7, lineStyle: { color: INK, width: 1.5 }, itemStyle: { color: INK } },
          { type: 'line', name: names.container, data: weeks.map((w) => round(w.container)), symbol: 'rect', symbolSize: 7, lineStyle: { color: INDIGO, width: 1.5, type: 'dashed' }, itemStyle: { color: INDIGO } },
          { type: 'line', name: names.breteau, data: weeks.map((w) => round(w.breteau)), symbol: 'triangle', symbolSize: 8, lineStyle: { color: PLUM, width: 1.5, type: 'dotted' }, itemStyle: { color: PLUM } },
        ],
      }}
      table={
        <SeriesTable
          caption={t('district-file:larval.tableCaption')}
          header={[
            t('district-file:table.week'),
            t('district-file:larval.surveysColumn'),
            names.house,
            names.container,
            names.breteau,
            t('district-file:larval.pupaColumn'),
          ]}
          rows={weeks.map((w, i) => [labels[i], f.number(w.surveys), n1(w.house), n1(w.container), n1(w.breteau), pupaCell(w)])}
          emptyText={t('district-file:table.empty')}
        />
      }
    />
  );
}
