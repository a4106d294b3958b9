import type { DistrictFileResponse } from '../../../../shared/api/board.schema';
import { DRIVERS, type DriverId } from '../../../../shared/tier';
import { ChartFigure } from '../../../components/chart/chart-figure';
import { SeriesTable } from '../../../components/chart/series-table';
import { useLadderWords } from '../../ladder/ladder-format';
import { axisTooltip, baseGrid, categoryAxis, GREY, INDIGO, INDIGO_LIGHT, INK, legend, PLUM, valueAxis } from './chart-style';

type TierWeek = DistrictFileResponse['tiers'][number];

/** One colour per driver, from dark to light, so the stack also reads in grayscale. */
const DRIVER_COLOURS: Record<DriverId, string> = { cases: INK, climate: INDIGO, vectorClock: PLUM, larval: INDIGO_LIGHT };

export function TierHistoryChart({ tiers }: { tiers: readonly TierWeek[] }) {
  const w = useLadderWords();
  const { t, f } = w;
  const n2 = (x: number) => f.number(x, 2, true);
  const labels = tiers.map((x) => t('district-file:weekShort', { week: x.epiWeek }));
  const contribution = (t: TierWeek, d: DriverId) => t.drivers.find((x) => x.id === d)?.contribution ?? 0;
  const last = tiers[tiers.length - 1];
  const changes = tiers.filter((x, i) => i > 0 && x.tier !== tiers[i - 1].tier).length;
  const summary = last
    ? [
        t('district-file:tierHistory.summary', { count: tiers.length }),
        t('district-file:tierHistory.lastWeek', { week: last.epiWeek, tier: w.tier(last.tier), score: n2(last.score) }),
        t('district-file:tierHistory.changes', { count: changes }),
      ].join(' ')
    : t('district-file:tierHistory.none');
  return (
    <ChartFigure
      title={t('district-file:tierHistory.title')}
      summary={summary}
      emptyText={tiers.length === 0 ? t('district-file:tierHistory.empty') : null}
      height="18rem"
      option={{
        grid: baseGrid,
        legend,
        tooltip: {
          ...axisTooltip,
          formatter: (params: any) => {
            const i = Array.isArray(params) ? params[0]?.dataIndex : params?.dataIndex;
            const x = i === undefined ? undefined : tiers[i];
            if (!x) return '';
            return [
              t('district-file:tierHistory.tooltip', { week: t('common:epiWeek', { week: x.epiWeek, year: x.epiYear }), tier: `<strong>${w.tier(x.tier)}</strong>`, score: n2(x.score) }),
              ...DRIVERS.map((d) => `${w.driver(d)}: ${n2(contribution(x, d))}`),
            ].join('<br/>');
          },
        },
        xAxis: categoryAxis(labels),
        yAxis: valueAxis(t('district-file:tierHistory.axis'), { min: 0, max: 1 }),
        series: [
          ...DRIVERS.map((d) => ({
            type: 'bar' as const,
            name: w.driver(d),
            stack: 'score',
            data: tiers.map((x) => contribution(x, d)),
            itemStyle: { color: DRIVER_COLOURS[d], borderColor: '#ffffff', borderWidth: 0.5 },
            barMaxWidth: 14,
          })),
          {
            type: 'line' as const,
            name: t('district-file:tierHistory.scoreSeries'),
            data: tiers.map((x) => x.score),
            step: 'middle' as const,
            symbol: 'none',
            lineStyle: { color: GREY, width: 1.5, type: 'dashed' as const },
            itemStyle: { color: GREY },
          },
        ],
      }}
      table={
        <SeriesTable
          caption={t('district-file:tierHistory.tableCaption')}
          header={[
            t('district-file:table.week'),
            t('ladder:table.columns.tier'),
            t('district-file:tierHistory.rangeColumn'),
            t('ladder:table.columns.score'),
            ...DRIVERS.map((d) => w.driver(d)),
          ]}
          rows={tiers.map((x) => [
            t('common:epiWeek', { week: x.epiWeek, year: x.epiYear }),
            w.tier(x.tier),
            w.range(x) ?? '',
            n2(x.score),
            ...DRIVERS.map((d) => n2(contribution(x, d))),
          ])}
          emptyText={t('district-file:table.empty')}
        />
      }
    />
  );
}
