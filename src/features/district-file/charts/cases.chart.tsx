import type { DistrictFileResponse } from '../../../../shared/api/board.schema';
import { ChartFigure } from '../../../components/chart/chart-figure';
import { SeriesTable } from '../../../components/chart/series-table';
import { useLadderWords } from '../../ladder/ladder-format';
import { channelMethodText, isOpenWeekAt, lastCompleteIndex, lastOpenIndex } from '../district-file-format';
import { axisTooltip, baseGrid, categoryAxis, GREY, INDIGO, INDIGO_PALE, INK, lastIndexWithValue, legend, valueAxis } from './chart-style';

type Cases = DistrictFileResponse['cases'][number];

/** Prior seasons drawn as thin lines: the most recent few, so the chart stays readable. */
const PRIOR_SHOWN = 3;

export function CasesChart({ cases, seasonYear }: { cases: Cases; seasonYear: number }) {
  const words = useLadderWords();
  const { t, f } = words;
  const { weeks, counts, channel, priorSeasons } = cases;
  const labels = weeks.map((w) => t('district-file:weekShort', { week: w }));
  // The summary reads the newest complete week; a week still open for reporting is drawn pale and named as partial.
  const last = lastCompleteIndex(cases);
  const openAt = lastOpenIndex(cases);
  const anyCount = lastIndexWithValue(counts);
  const band = weeks.map((_, i) => (channel.lower[i] === null || channel.upper[i] === null ? null : channel.upper[i]! - channel.lower[i]!));
  const priors = [...priorSeasons].sort((a, b) => b.year - a.year).slice(0, PRIOR_SHOWN);
  let zone: 'above' | 'below' | 'within' | null = null;
  if (last >= 0 && channel.upper[last] !== null && channel.lower[last] !== null) {
    const c = counts[last]!;
    zone = c > channel.upper[last]! ? 'above' : c < channel.lower[last]! ? 'below' : 'within';
  }
  const names = {
    cases: t('district-file:cases.series.cases', { year: seasonYear }),
    lower: t('district-file:cases.series.lower'),
    band: t('district-file:cases.series.band'),
    centre: t('district-file:cases.series.centre'),
    upper: t('district-file:cases.series.upper'),
  };
  const summary =
    anyCount < 0
      ? t('district-file:cases.none', { disease: cases.diseaseName, year: seasonYear })
      : [
          t('district-file:cases.summary', { disease: cases.diseaseName, year: seasonYear, method: channelMethodText(words, channel.method) }),
          last >= 0 ? t(zone ? `district-file:cases.lastWeek.${zone}` : 'district-file:cases.lastWeek.plain', { week: weeks[last], count: counts[last]!, cases: f.number(counts[last]) }) : '',
          openAt >= 0 ? t('district-file:cases.openWeek', { week: weeks[openAt], count: counts[openAt]!, cases: f.number(counts[openAt]) }) : '',
          priors.length ? t('district-file:cases.priors', { years: priors.map((p) => p.year).join(t('district-file:listSeparator')) }) : '',
        ]
          .filter(Boolean)
          .join(' ');
  return (
    <ChartFigure
      title={t('district-file:cases.title', { disease: cases.diseaseName })}
      summary={summary}
      height="18rem"
      option={{
        grid: baseGrid,
        legend: { ...legend, data: [names.cases, names.band, names.centre, ...priors.map((p) => String(p.year))] },
        tooltip: {
          ...axisTooltip,
          formatter: (params: any) => {
            const i = Array.isArray(params) ? params[0]?.dataIndex : params?.dataIndex;
            if (i === undefined) return '';
            const lines = [
              t('district-file:cases.week', { week: weeks[i] }),
              t('district-file:cases.tooltipCases', { year: seasonYear, cases: f.number(counts[i]) }),
              ...(isOpenWeekAt(cases, i) ? [t('district-file:cases.partial')] : []),
              t('district-file:cases.tooltipChannel', { lower: f.number(channel.lower[i], 1), upper: f.number(channel.upper[i], 1), centre: f.number(channel.centre[i], 1) }),
              ...priors.map((p) => `${p.year}: ${f.number(p.counts[i])}`),
            ];
            return lines.join('<br/>');
          },
        },
        xAxis: categoryAxis(labels),
        yAxis: valueAxis(t('district-file:cases.axis'), { min: 0 }),
        series: [
          { type: 'line', name: names.lower, stack: 'channel', data: channel.lower, showSymbol: false, lineStyle: { color: GREY, width: 1 }, silent: true },
          { type: 'line', name: names.band, stack: 'channel', data: band, showSymbol: false, lineStyle: { color: GREY, width: 1 }, areaStyle: { color: INDIGO_PALE }, itemStyle: { color: INDIGO_PALE }, silent: true },
          { type: 'line', name: names.centre, data: channel.centre, showSymbol: false, lineStyle: { color: INDIGO, width: 1.5, type: 'dashed' }, itemStyle: { color: INDIGO } },
          ...priors.map((p) => ({ type: 'line' as const, name: String(p.year), data: p.counts, showSymbol: false, lineStyle: { color: GREY, width: 1, type: 'dotted' as const }, itemStyle: { color: GREY } })),
          {
            type: 'bar', name: names.cases, itemStyle: { color: INK }, barMaxWidth: 10,
            data: counts.map((c, i) => (c !== null && isOpenWeekAt(cases, i) ? { value: c, itemStyle: { color: INDIGO_PALE, borderColor: INK, borderType: 'dashed' as const, borderWidth: 1 } } : c)),
          },
        ],
      }}
      table={
        <SeriesTable
          caption={t('district-file:cases.tableCaption', { disease: cases.diseaseName })}
          header={[t('district-file:table.week'), names.cases, names.lower, names.centre, names.upper, ...priors.map((p) => String(p.year))]}
          rows={weeks.map((w, i) => [
            t('district-file:cases.week', { week: w }),
            isOpenWeekAt(cases, i) && counts[i] !== null ? t('district-file:cases.partialValue', { cases: f.number(counts[i]) }) : f.number(counts[i]),
            f.number(channel.lower[i], 1),
            f.number(channel.centre[i], 1),
            f.number(channel.upper[i], 1),
            ...priors.map((p) => f.number(p.counts[i])),
          ])}
          emptyText={t('district-file:table.empty')}
        />
      }
    />
  );
}
