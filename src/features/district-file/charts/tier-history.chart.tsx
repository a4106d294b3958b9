import type { DistrictFileResponse } from '../../../../shared/api/board.schema';
import { DRIVER_LABELS, DRIVERS, TIER_LABELS, type DriverId } from '../../../../shared/tier';
import { ChartFigure } from '../../../components/chart/chart-figure';
import { SeriesTable } from '../../../components/chart/series-table';
import { axisTooltip, baseGrid, categoryAxis, GREY, INDIGO, INDIGO_LIGHT, INK, legend, PLUM, valueAxis } from './chart-style';

type TierWeek = DistrictFileResponse['tiers'][number];

/** One colour per driver, from dark to light, so the stack also reads in grayscale. */
const DRIVER_COLOURS: Record<DriverId, string> = { cases: INK, climate: INDIGO, vectorClock: PLUM, larval: INDIGO_LIGHT };

export function TierHistoryChart({ tiers }: { tiers: readonly TierWeek[] }) {
  const labels = tiers.map((t) => `W${t.epiWeek}`);
  const contribution = (t: TierWeek, d: DriverId) => t.drivers.find((x) => x.id === d)?.contribution ?? 0;
  const last = tiers[tiers.length - 1];
  const changes = tiers.filter((t, i) => i > 0 && t.tier !== tiers[i - 1].tier).length;
  const summary = last
    ? `The tier score each week (${tiers.length} weeks), stacked by the contribution of each driver. ` +
      `Week ${last.epiWeek} stands at ${TIER_LABELS[last.tier]} (score ${last.score.toFixed(2)}); the tier changed ${changes} time${changes === 1 ? '' : 's'} this season.`
    : 'No tier has been computed for this season yet.';
  return (
    <ChartFigure
      title="Tier history and its drivers"
      summary={summary}
      emptyText={tiers.length === 0 ? 'No tier history yet for this season.' : null}
      height="18rem"
      option={{
        grid: baseGrid,
        legend,
        tooltip: {
          ...axisTooltip,
          formatter: (params: any) => {
            const i = Array.isArray(params) ? params[0]?.dataIndex : params?.dataIndex;
            const t = i === undefined ? undefined : tiers[i];
            if (!t) return '';
            return [
              `Week ${t.epiWeek} of ${t.epiYear}: <strong>${TIER_LABELS[t.tier]}</strong> (score ${t.score.toFixed(2)})`,
              ...DRIVERS.map((d) => `${DRIVER_LABELS[d]}: ${contribution(t, d).toFixed(2)}`),
            ].join('<br/>');
          },
        },
        xAxis: categoryAxis(labels),
        yAxis: valueAxis('score', { min: 0, max: 1 }),
        series: [
          ...DRIVERS.map((d) => ({
            type: 'bar' as const,
            name: DRIVER_LABELS[d],
            stack: 'score',
            data: tiers.map((t) => contribution(t, d)),
            itemStyle: { color: DRIVER_COLOURS[d], borderColor: '#ffffff', borderWidth: 0.5 },
            barMaxWidth: 14,
          })),
          {
            type: 'line' as const,
            name: 'Score',
            data: tiers.map((t) => t.score),
            step: 'middle' as const,
            symbol: 'none',
            lineStyle: { color: GREY, width: 1.5, type: 'dashed' as const },
            itemStyle: { color: GREY },
          },
        ],
      }}
      table={
        <SeriesTable
          caption="Tier history by week"
          header={['Week', 'Tier', 'Range', 'Score', ...DRIVERS.map((d) => DRIVER_LABELS[d])]}
          rows={tiers.map((t) => [
            `Week ${t.epiWeek} of ${t.epiYear}`,
            TIER_LABELS[t.tier],
            t.tierLow === t.tierHigh ? '' : `${TIER_LABELS[t.tierLow]}–${TIER_LABELS[t.tierHigh]}`,
            t.score.toFixed(2),
            ...DRIVERS.map((d) => contribution(t, d).toFixed(2)),
          ])}
        />
      }
    />
  );
}
