import type { DistrictFileResponse } from '../../../../shared/api/board.schema';
import { ChartFigure } from '../../../components/chart/chart-figure';
import { SeriesTable } from '../../../components/chart/series-table';
import { axisTooltip, baseGrid, categoryAxis, GREY, INDIGO, INDIGO_PALE, INK, lastIndexWithValue, legend, valueAxis } from './chart-style';

type Cases = DistrictFileResponse['cases'][number];

/** Prior seasons drawn as thin lines: the most recent few, so the chart stays readable. */
const PRIOR_SHOWN = 3;

export function CasesChart({ cases, seasonYear }: { cases: Cases; seasonYear: number }) {
  const { weeks, counts, channel, priorSeasons } = cases;
  const labels = weeks.map((w) => `W${w}`);
  const last = lastIndexWithValue(counts);
  const band = weeks.map((_, i) => (channel.lower[i] === null || channel.upper[i] === null ? null : channel.upper[i]! - channel.lower[i]!));
  const priors = [...priorSeasons].sort((a, b) => b.year - a.year).slice(0, PRIOR_SHOWN);
  let zone = '';
  if (last >= 0 && channel.upper[last] !== null && channel.lower[last] !== null) {
    const c = counts[last]!;
    zone = c > channel.upper[last]! ? ' above the channel' : c < channel.lower[last]! ? ' below the channel' : ' within the channel';
  }
  const summary =
    last < 0
      ? `No ${cases.diseaseName} counts for ${seasonYear} yet.`
      : `Weekly ${cases.diseaseName} cases in ${seasonYear} (bars) against the endemic channel from prior seasons (${channel.method}): ` +
        `the shaded band runs from its lower to its upper line, the dashed line is its centre. ` +
        `Week ${weeks[last]} had ${counts[last]} case${counts[last] === 1 ? '' : 's'}${zone}.` +
        (priors.length ? ` Thin grey lines: ${priors.map((p) => p.year).join(', ')}.` : '');
  return (
    <ChartFigure
      title={`Weekly cases against the endemic channel — ${cases.diseaseName}`}
      summary={summary}
      height="18rem"
      option={{
        grid: baseGrid,
        legend: { ...legend, data: [`${seasonYear} cases`, 'Channel (lower–upper)', 'Channel centre', ...priors.map((p) => String(p.year))] },
        tooltip: {
          ...axisTooltip,
          formatter: (params: any) => {
            const i = Array.isArray(params) ? params[0]?.dataIndex : params?.dataIndex;
            if (i === undefined) return '';
            const lines = [
              `Week ${weeks[i]}`,
              `${seasonYear}: ${counts[i] ?? '—'} cases`,
              `Channel ${channel.lower[i] ?? '—'}–${channel.upper[i] ?? '—'} (centre ${channel.centre[i] ?? '—'})`,
              ...priors.map((p) => `${p.year}: ${p.counts[i] ?? '—'}`),
            ];
            return lines.join('<br/>');
          },
        },
        xAxis: categoryAxis(labels),
        yAxis: valueAxis('cases', { min: 0 }),
        series: [
          { type: 'line', name: 'Channel lower', stack: 'channel', data: channel.lower, showSymbol: false, lineStyle: { color: GREY, width: 1 }, silent: true },
          { type: 'line', name: 'Channel (lower–upper)', stack: 'channel', data: band, showSymbol: false, lineStyle: { color: GREY, width: 1 }, areaStyle: { color: INDIGO_PALE }, itemStyle: { color: INDIGO_PALE }, silent: true },
          { type: 'line', name: 'Channel centre', data: channel.centre, showSymbol: false, lineStyle: { color: INDIGO, width: 1.5, type: 'dashed' }, itemStyle: { color: INDIGO } },
          ...priors.map((p) => ({ type: 'line' as const, name: String(p.year), data: p.counts, showSymbol: false, lineStyle: { color: GREY, width: 1, type: 'dotted' as const }, itemStyle: { color: GREY } })),
          { type: 'bar', name: `${seasonYear} cases`, data: counts, itemStyle: { color: INK }, barMaxWidth: 10 },
        ],
      }}
      table={
        <SeriesTable
          caption={`Weekly ${cases.diseaseName} cases and the endemic channel`}
          header={['Week', `${seasonYear} cases`, 'Channel lower', 'Channel centre', 'Channel upper', ...priors.map((p) => String(p.year))]}
          rows={weeks.map((w, i) => [`Week ${w}`, counts[i], channel.lower[i], channel.centre[i], channel.upper[i], ...priors.map((p) => p.counts[i])])}
        />
      }
    />
  );
}
