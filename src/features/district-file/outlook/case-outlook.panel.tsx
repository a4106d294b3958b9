import { useId, useRef, useState } from 'react';
import type { DistrictOutlookResponse, OutlookHorizonSkillDto } from '../../../../shared/api/outlook.schema';
import { FormMessage } from '../../../components/form';
import { errorText } from '../../../lib/error-text';
import { useNearViewport } from '../../../lib/use-near-viewport';
import { useLadderWords, type LadderWords } from '../../ladder/ladder-format';
import { useDistrictOutlook } from '../api/district-outlook.api';
import { OutlookFanChart } from './outlook-fan.chart';

/**
 * The Case outlook on the District file (docs/outlook.md § On the District file). Fetched only once the
 * panel comes near the viewport (the first answer per district takes seconds), so the rest of the file
 * never waits for it. A fan is drawn only for the weeks ahead that beat the seasonal null; the skill of
 * every week ahead is shown beside it, and every other case is said in words with no fan.
 */
export function CaseOutlookPanel({ districtId }: { districtId: string }) {
  const id = useId();
  const w = useLadderWords();
  const { t } = w;
  const place = useRef<HTMLElement>(null);
  const near = useNearViewport(place, true);
  const [disease, setDisease] = useState<string | null>(null);
  const outlook = useDistrictOutlook(districtId, disease, near);
  const data = outlook.data;

  return (
    <section ref={place} aria-labelledby={`${id}-title`} aria-busy={outlook.isFetching || undefined} className="card space-y-4" data-testid="case-outlook">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <h2 id={`${id}-title`} className="text-xl font-bold">
          {t('district-file:outlook.title')}
        </h2>
        {data && data.diseases.length > 1 ? (
          <div className="field w-80 max-w-full">
            <label htmlFor={`${id}-disease`} className="field-label">
              {t('district-file:outlook.disease')}
            </label>
            <select id={`${id}-disease`} className="input" value={data.disease?.id ?? ''} onChange={(e) => setDisease(e.currentTarget.value || null)}>
              {data.diseases.map((d) => (
                <option key={d.id} value={d.id}>
                  {d.name}
                </option>
              ))}
            </select>
          </div>
        ) : null}
      </div>
      <p className="text-sm">{t('district-file:outlook.lead')}</p>

      {outlook.isError ? (
        <FormMessage kind="error">{t('district-file:outlook.failedToLoad', { reason: errorText(outlook.error) })}</FormMessage>
      ) : !data || (outlook.isFetching && outlook.isPlaceholderData) ? (
        <p className="text-ink-muted" role="status" data-testid="outlook-loading">
          {t('district-file:outlook.loading')}
        </p>
      ) : (
        <OutlookBody w={w} data={data} />
      )}

      <ul className="cautions list-disc space-y-1 pl-5 text-sm" data-testid="outlook-cautions">
        <li>{t('district-file:outlook.cautions.estimate')}</li>
        <li>{t('district-file:outlook.cautions.authority')}</li>
      </ul>
    </section>
  );
}

function OutlookBody({ w, data }: { w: LadderWords; data: DistrictOutlookResponse }) {
  const { t, f } = w;
  const disease = data.disease?.name ?? '';
  if (data.status !== 'ok') {
    return (
      <p data-testid="outlook-why" data-status={data.status}>
        {t(`district-file:outlook.status.${data.status}`, { disease })}
      </p>
    );
  }
  // The server already sends forecasts only for weeks ahead 1…fanHorizons; kept to those here too, so no
  // answer can ever put a fan on screen for a week ahead without skill.
  const shown = { ...data, forecast: data.forecast.filter((x) => x.horizon <= data.fanHorizons) };
  const fan = data.fanHorizons > 0 && shown.forecast.length > 0;
  const firstWithout = data.skill?.horizons.find((h) => h.horizon === data.fanHorizons + 1);
  return (
    <div className="space-y-4">
      <p data-testid="outlook-why" data-status={fan ? 'fan' : 'no_skill'}>
        {fan
          ? [
              t('district-file:outlook.fanFor', { count: data.fanHorizons, weeks: f.number(data.fanHorizons) }),
              firstWithout ? t('district-file:outlook.fanStops', { count: firstWithout.horizon }) : '',
            ]
              .filter(Boolean)
              .join(' ')
          : t('district-file:outlook.noSkill', { disease })}
      </p>
      <div className="space-y-6">
        {fan ? (
          <div className="min-w-0" data-testid="outlook-fan">
            <OutlookFanChart outlook={shown} />
          </div>
        ) : null}
        {data.skill ? <SkillTable w={w} data={data} horizons={data.skill.horizons} /> : null}
      </div>
      {data.skill?.firstOrigin && data.skill.lastOrigin ? (
        <p className="text-sm text-ink-muted">
          {t('district-file:outlook.scoredOn', {
            count: data.skill.origins,
            origins: f.number(data.skill.origins),
            from: w.week(data.skill.firstOrigin.year, data.skill.firstOrigin.week),
            to: w.week(data.skill.lastOrigin.year, data.skill.lastOrigin.week),
          })}
        </p>
      ) : null}
    </div>
  );
}

/**
 * A signed number for a gain over the null ("+12 %", "-3 %"); a value that rounds to 0 at the shown
 * precision is shown as a plain 0 (never "-0 %").
 */
function signed(format: (x: number) => string, x: number | null, digits: number, none: string): string {
  if (x === null) return none;
  if (Math.round(Math.abs(x) * 10 ** digits) === 0) return format(0);
  return x > 0 ? `+${format(x)}` : format(x);
}

function SkillTable({ w, data, horizons }: { w: LadderWords; data: DistrictOutlookResponse; horizons: OutlookHorizonSkillDto[] }) {
  const { t, f } = w;
  const verdict = (h: OutlookHorizonSkillDto) => {
    if (h.horizon <= data.fanHorizons) return t('district-file:outlook.skill.shown');
    if (h.scored < 26) return t('district-file:outlook.skill.tooFew');
    if (!h.beatsNull) return t('district-file:outlook.skill.notBetter');
    return t('district-file:outlook.skill.afterGap');
  };
  const columns = ['ahead', 'crps', 'closer', 'logScore', 'gain', 'coverage80', 'scored', 'fan'] as const;
  // On a phone each row becomes a small card and each cell names its column (district-file.css).
  const label = (c: (typeof columns)[number]) => t(`district-file:outlook.skill.${c}`);
  return (
    <div className="min-w-0 space-y-2">
      <h3 className="section-title">{t('district-file:outlook.skill.title')}</h3>
      <p className="text-sm text-ink-muted">{t('district-file:outlook.skill.help')}</p>
      <p className="text-sm text-ink-muted">{t('district-file:outlook.skill.rule')}</p>
      <div className="table-wrap">
        <table className="data-table outlook-skill" data-testid="outlook-skill">
          <caption className="sr-only">{t('district-file:outlook.skill.caption')}</caption>
          <thead>
            <tr>
              {columns.map((c) => (
                <th key={c} scope="col">
                  {label(c)}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {horizons.map((h) => (
              <tr key={h.horizon} data-horizon={h.horizon} data-fan={h.horizon <= data.fanHorizons ? 'yes' : 'no'}>
                <th scope="row">{t('district-file:outlook.skill.weeksAhead', { count: h.horizon })}</th>
                <td data-label={label('crps')}><span className="whitespace-nowrap">{t('district-file:outlook.skill.versus', { ours: f.number(h.crps, 2, true), usual: f.number(h.nullCrps, 2, true) })}</span></td>
                <td data-label={label('closer')}><span className="whitespace-nowrap">{signed((x) => f.percent(x), h.crpsSkill, 2, f.percent(null))}</span></td>
                <td data-label={label('logScore')}><span className="whitespace-nowrap">{t('district-file:outlook.skill.versus', { ours: f.number(h.logScore, 2, true), usual: f.number(h.nullLogScore, 2, true) })}</span></td>
                <td data-label={label('gain')}><span className="whitespace-nowrap">{signed((x) => f.number(x, 2, true), h.logScoreGain, 2, f.number(null))}</span></td>
                <td data-label={label('coverage80')}><span className="whitespace-nowrap">{f.percent(h.coverage80)}</span></td>
                <td data-label={label('scored')}><span className="whitespace-nowrap">{f.number(h.scored)}</span></td>
                <td className="outlook-verdict" data-label={label('fan')}>{verdict(h)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
