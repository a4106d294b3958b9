import { useTranslation } from 'react-i18next';
import type { LeadSkillDto } from '../../../../shared/api/look-back.schema';
import { ChartFigure } from '../../../components/chart/chart-figure';
import { SeriesTable } from '../../../components/chart/series-table';
import { useFormat } from '../../../i18n/format';
import { axisTooltip, baseGrid, categoryAxis, GREY, INDIGO, INK, legend, PLUM, valueAxis } from '../../district-file/charts/chart-style';

/** The models drawn, the tier first; the null models in quieter strokes. */
const MODELS = ['tier', 'climatology', 'persistence', 'channel'] as const;
type Model = (typeof MODELS)[number];
const STYLE: Record<Model, { color: string; type: 'solid' | 'dashed' | 'dotted'; width: number }> = {
  tier: { color: INDIGO, type: 'solid', width: 3 },
  climatology: { color: PLUM, type: 'dashed', width: 1.5 },
  persistence: { color: GREY, type: 'dotted', width: 1.5 },
  channel: { color: INK, type: 'dashed', width: 1 },
};

type Measure = 'hitRate' | 'falseAlarmRatio';

/**
 * One measure (hit rate or false-alarm ratio) by lead time, for the replayed tier beside the three null
 * models scored on the same weeks; the table gives the same values with the tier's bootstrap interval.
 */
export function SkillByLeadChart({ leads, measure }: { leads: readonly LeadSkillDto[]; measure: Measure }) {
  const { t } = useTranslation('look-back');
  const f = useFormat();
  const names = Object.fromEntries(MODELS.map((m) => [m, t(`models.${m}`)])) as Record<Model, string>;
  const value = (l: LeadSkillDto, m: Model) => l[m][measure];
  const interval = (l: LeadSkillDto) => (measure === 'hitRate' ? l.tier.hitRateInterval : l.tier.falseAlarmRatioInterval);
  const labels = leads.map((l) => t('chart.leadShort', { count: l.lead, n: f.number(l.lead) }));
  const known = leads.filter((l) => value(l, 'tier') !== null);
  const summary =
    known.length === 0
      ? t(`chart.${measure}.none`)
      : t(`chart.${measure}.summary`, {
          lead: f.number(known[0]!.lead),
          tier: f.percent(value(known[0]!, 'tier')),
          climatology: f.percent(value(known[0]!, 'climatology')),
          persistence: f.percent(value(known[0]!, 'persistence')),
        });
  return (
    <ChartFigure
      title={t(`chart.${measure}.title`)}
      summary={summary}
      height="18rem"
      emptyText={leads.every((l) => MODELS.every((m) => value(l, m) === null)) ? t(`chart.${measure}.none`) : null}
      option={{
        grid: baseGrid,
        legend: { ...legend, data: MODELS.map((m) => names[m]) },
        tooltip: { ...axisTooltip, valueFormatter: (v: unknown) => (typeof v === 'number' ? f.percent(v) : '—') },
        xAxis: { ...categoryAxis(labels), name: t('chart.leadAxis'), nameLocation: 'middle', nameGap: 26 },
        yAxis: valueAxis(t(`chart.${measure}.axis`), { min: 0, max: 1, axisLabel: { formatter: (v: number) => f.percent(v) } }),
        series: MODELS.map((m) => ({
          type: 'line' as const,
          name: names[m],
          data: leads.map((l) => value(l, m)),
          connectNulls: false,
          showSymbol: true,
          symbolSize: m === 'tier' ? 7 : 4,
          lineStyle: { color: STYLE[m].color, width: STYLE[m].width, type: STYLE[m].type },
          itemStyle: { color: STYLE[m].color },
        })),
      }}
      table={
        <SeriesTable
          caption={t(`chart.${measure}.title`)}
          header={[t('table.lead'), names.tier, t('table.interval'), names.climatology, names.persistence, names.channel, t('table.pairs')]}
          rows={leads.map((l) => {
            const i = interval(l);
            return [
              t('chart.leadShort', { count: l.lead, n: f.number(l.lead) }),
              f.percent(value(l, 'tier')),
              i.lower === null || i.upper === null ? null : t('table.range', { lower: f.percent(i.lower), upper: f.percent(i.upper) }),
              f.percent(value(l, 'climatology')),
              f.percent(value(l, 'persistence')),
              f.percent(value(l, 'channel')),
              f.number(l.pairs),
            ];
          })}
        />
      }
    />
  );
}
