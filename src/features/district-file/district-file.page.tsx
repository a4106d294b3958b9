import { useId, useMemo } from 'react';
import { useSession } from '../../app/session';
import { Link, useParams, useSearchParams } from 'react-router-dom';
import { useTranslation } from 'react-i18next';
import type { DistrictFileResponse } from '../../../shared/api/board.schema';
import { FormMessage } from '../../components/form';
import { PageHeading } from '../../components/page-heading';
import { CautionsPanel } from '../cautions/cautions-panel';
import { DemoDataLabel } from '../districts/components/demo-data-label';
import { useComparedDistrictFile, useDistrictFile } from './api/district-file.api';
import { CasesChart } from './charts/cases.chart';
import { LarvalChart } from './charts/larval.chart';
import { TierHistoryChart } from './charts/tier-history.chart';
import { DegreeDaysChart, EipChart, RvcChart } from './charts/vector-clock.charts';
import { WeatherChart } from './charts/weather.chart';
import { CaseOutlookPanel } from './outlook/case-outlook.panel';
import { CurrentTier } from './components/current-tier';
import { KeyNumbers } from './components/key-numbers';
import { FieldWorkPanel } from './components/field-work.panel';
import { ProfileAssignment } from '../profiles/components/profile-assignment';
import { profileLabel, weatherSourceText } from './district-file-format';
import { useLadderWords } from '../ladder/ladder-format';
import './district-file.css';
import { errorText } from '../../lib/error-text';
import { may } from '../../../shared/permissions';

const seasonParam = (v: string | null) => (v && /^\d{4}$/.test(v) ? Number(v) : null);
const byWeek = (a: { epiYear: number; epiWeek: number }, b: { epiYear: number; epiWeek: number }) => a.epiYear - b.epiYear || a.epiWeek - b.epiWeek;

/**
 * Everything about one district for one season: its tier and drivers, what changed, notes on the inputs,
 * and the charts (weather, heat accumulation, the Vector clock, cases against the channel, larval indices,
 * tier history), each with a text summary and a table, and the Case outlook (fetched when it comes near
 * the viewport). Loaded lazily with ECharts.
 */
export function DistrictFilePage() {
  const { t } = useTranslation('district-file');
  const { id = '' } = useParams();
  const [search, setSearch] = useSearchParams();
  const season = seasonParam(search.get('season'));
  const compare = seasonParam(search.get('compare'));
  const file = useDistrictFile(id, season);
  const compared = useComparedDistrictFile(id, compare !== null && compare !== file.data?.seasonYear ? compare : null);

  const choose = (key: 'season' | 'compare', value: string) =>
    setSearch(
      (prev) => {
        const next = new URLSearchParams(prev);
        if (value) next.set(key, value);
        else next.delete(key);
        if (key === 'season' && next.get('compare') && Number(next.get('compare')) >= Number(value)) next.delete('compare');
        return next;
      },
      { replace: true },
    );

  if (file.isPending) return <p className="text-ink-muted">{t('loading')}</p>;
  if (file.isError)
    return (
      <section aria-labelledby="page-title">
        <PageHeading>{t('title')}</PageHeading>
        <FormMessage kind="error">{errorText(file.error)}</FormMessage>
        <p className="mt-4">
          <Link to="/" className="link">
            {t('backToLadder')}
          </Link>
        </p>
      </section>
    );
  return (
    <DistrictFileView
      data={file.data}
      loadingSeason={file.isPlaceholderData}
      compared={compared.data && compare !== null ? compared.data : null}
      compare={compare}
      compareFailed={compared.isError ? errorText(compared.error) : null}
      onChoose={choose}
    />
  );
}

function DistrictFileView({
  data,
  loadingSeason,
  compared,
  compare,
  compareFailed,
  onChoose,
}: {
  data: DistrictFileResponse;
  loadingSeason: boolean;
  compared: DistrictFileResponse | null;
  compare: number | null;
  compareFailed: string | null;
  onChoose: (key: 'season' | 'compare', value: string) => void;
}) {
  const id = useId();
  const w = useLadderWords();
  const { t } = useTranslation('district-file');
  const me = useSession();
  const { district, seasonYear } = data;
  const seasons = useMemo(() => [...new Set([...data.seasons, seasonYear])].sort((a, b) => b - a), [data.seasons, seasonYear]);
  const earlier = seasons.filter((s) => s < seasonYear);
  const tiers = useMemo(() => [...data.tiers].sort(byWeek), [data.tiers]);
  const current = tiers[tiers.length - 1] ?? null;
  const previous = tiers[tiers.length - 2] ?? null;
  const filledDays = data.weather.filled.filter(Boolean).length;

  return (
    <section aria-labelledby="page-title" aria-busy={loadingSeason || undefined}>
      <p className="mb-2 text-sm">
        <Link to="/" className="link">
          {t('ladder:title')}
        </Link>{' '}
        <span aria-hidden="true">›</span> {t('title')}
      </p>
      <div className="flex flex-wrap items-start justify-between gap-3">
        <PageHeading lead={t('lead', { code: district.code, season: seasonYear })}>{district.name}</PageHeading>
        <span className="flex flex-wrap gap-2">
          {may(me.role, 'flags.raise') ? (
            <Link to={`/flags/new?district=${district.id}`} className="btn btn-secondary btn-small">
              {t('flags:raise.raiseHere')}
            </Link>
          ) : null}
          <Link to={`/districts/${district.id}/print?season=${seasonYear}`} className="btn btn-secondary btn-small" data-testid="print-link">
            {t('printLink')}
          </Link>
        </span>
      </div>
      <DemoDataLabel districts={[district]} />

      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_20rem]">
        <div className="min-w-0 space-y-6">
          <form className="flex flex-wrap items-end gap-4" onSubmit={(e) => e.preventDefault()} aria-label={t('season')}>
            <div className="field w-40">
              <label htmlFor={`${id}-season`} className="field-label">
                {t('season')}
              </label>
              <select id={`${id}-season`} className="input" value={seasonYear} onChange={(e) => onChoose('season', e.currentTarget.value)}>
                {seasons.map((s) => (
                  <option key={s} value={s}>
                    {s}
                  </option>
                ))}
              </select>
            </div>
            <div className="field w-56">
              <label htmlFor={`${id}-compare`} className="field-label">
                {t('compareWith')}
              </label>
              <select
                id={`${id}-compare`}
                className="input"
                value={compare !== null && compare < seasonYear ? compare : ''}
                onChange={(e) => onChoose('compare', e.currentTarget.value)}
                disabled={earlier.length === 0}
              >
                <option value="">{t('noOtherSeason')}</option>
                {earlier.map((s) => (
                  <option key={s} value={s}>
                    {s}
                  </option>
                ))}
              </select>
            </div>
            {loadingSeason ? <p className="text-sm text-ink-muted">{t('loadingSeason')}</p> : null}
          </form>
          <CompareNote data={data} compare={compare} compared={compared} failed={compareFailed} />

          {current ? (
            <CurrentTier current={current} previous={previous} />
          ) : (
            <FormMessage kind="info">{t('noTier', { season: seasonYear })}</FormMessage>
          )}

          <KeyNumbers data={data} />

          <section aria-labelledby={`${id}-about`} className="card">
            <h2 id={`${id}-about`} className="section-title">
              {t('about.title')}
            </h2>
            <ul className="mt-2 list-disc space-y-1 pl-5 text-sm">
              <li>{t('about.weather', { source: weatherSourceText(w, data.weather.source) })}</li>
              <li>{filledDays === 0 ? t('about.noneFilled') : t('about.filled', { count: filledDays, days: w.count(filledDays) })}</li>
              <li>
                {/* The assignment says which profiles the district has; a season without weather has them but no heat line. */}
                {(data.profiles ?? []).length === 0 && data.vectorClock.length === 0
                  ? t('about.noProfile')
                  : t('about.profiles', {
                      profiles: ((data.profiles ?? []).length ? data.profiles.map((p) => profileLabel({ t }, p)) : data.vectorClock.map((v) => profileLabel({ t }, v))).join(t('listSeparator')),
                    })}
                {(data.profiles ?? []).length > 0 && data.vectorClock.length === 0 ? ` ${t('about.noClockThisSeason', { season: seasonYear })}` : null}
              </li>
              <li>
                {data.larval.length === 0
                  ? t('about.noSurveys')
                  : t('about.surveys', { count: data.larval.reduce((a, x) => a + x.surveys, 0), surveys: w.count(data.larval.reduce((a, x) => a + x.surveys, 0)) })}
              </li>
            </ul>
            <DistrictLinks districtId={district.id} />
          </section>
          <ProfileAssignment profiles={data.profiles ?? []} />
        </div>
        <CautionsPanel className="self-start" />
      </div>

      <div className="mt-8 space-y-8">
        <section aria-labelledby={`${id}-weather`} className="card space-y-4">
          <h2 id={`${id}-weather`} className="text-xl font-bold">
            {t('sections.weather')}
          </h2>
          <WeatherChart weather={data.weather} />
          {data.vectorClock.map((vc) => {
            const other = compared?.vectorClock.find((c) => c.profileId === vc.profileId);
            return (
              <DegreeDaysChart
                key={vc.profileId}
                vc={vc}
                seasonYear={seasonYear}
                compared={other && compared ? { year: compared.seasonYear, vc: other } : null}
              />
            );
          })}
        </section>

        {data.vectorClock.length ? (
          <section aria-labelledby={`${id}-clock`} className="card space-y-4">
            <h2 id={`${id}-clock`} className="text-xl font-bold">
              {t('sections.vectorClock')}
            </h2>
            {data.vectorClock.map((vc) => (
              <div key={vc.profileId} className="space-y-4">
                <EipChart vc={vc} />
                <RvcChart vc={vc} />
              </div>
            ))}
          </section>
        ) : null}

        <section aria-labelledby={`${id}-cases`} className="card space-y-4">
          <h2 id={`${id}-cases`} className="text-xl font-bold">
            {t('sections.cases')}
          </h2>
          {data.cases.length === 0 ? <p className="text-ink-muted">{t('noCases')}</p> : null}
          {data.cases.map((c) => (
            <CasesChart key={c.diseaseId} cases={c} seasonYear={seasonYear} />
          ))}
          <LarvalChart larval={data.larval} />
        </section>

        <CaseOutlookPanel districtId={district.id} />

        <section aria-labelledby={`${id}-tiers`} className="card space-y-4">
          <h2 id={`${id}-tiers`} className="text-xl font-bold">
            {t('sections.tiers')}
          </h2>
          <TierHistoryChart tiers={tiers} />
        </section>

        <FieldWorkPanel districtId={district.id} />
      </div>
    </section>
  );
}

/** Other screens about this district that exist in this build. */
function DistrictLinks({ districtId }: { districtId: string }) {
  const { t } = useTranslation('district-file');
  return (
    <p className="mt-3 text-sm">
      <Link to={`/districts/${districtId}/cases`} className="link">
        {t('links.cases')}
      </Link>
    </p>
  );
}

/**
 * What "Compare heat with" did: nothing to say while no season is chosen or while it loads; otherwise the
 * reason a dashed line is missing (no weather stored that season, or the season could not be read).
 */
function CompareNote({ data, compare, compared, failed }: { data: DistrictFileResponse; compare: number | null; compared: DistrictFileResponse | null; failed: string | null }) {
  const { t } = useTranslation('district-file');
  if (compare === null || compare >= data.seasonYear) return null;
  if (failed) return <FormMessage kind="error">{t('compare.failed', { year: compare, reason: failed })}</FormMessage>;
  if (!compared) return <p className="text-sm text-ink-muted">{t('compare.loading', { year: compare })}</p>;
  if (data.vectorClock.length === 0) return <p className="text-sm text-ink-muted" data-testid="compare-note">{t('compare.nothingThisSeason', { season: data.seasonYear })}</p>;
  const drawn = data.vectorClock.some((vc) => compared.vectorClock.some((c) => c.profileId === vc.profileId && c.cumulativeDegreeDays.some((x) => x !== null)));
  return drawn ? null : (
    <p className="text-sm text-ink-muted" data-testid="compare-note">
      {t('compare.noneThatSeason', { year: compare })}
    </p>
  );
}
