import { lazy, Suspense } from 'react';
import { useParams, useSearchParams } from 'react-router-dom';
import { useTranslation } from 'react-i18next';
import { PageHeading } from '../../components/page-heading';
import { FormMessage, SelectField } from '../../components/form';
import { isForbidden } from '../../lib/api-client';
import { errorText } from '../../lib/error-text';
import { NotAllowedPage } from '../../app/not-allowed.page';
import { useSession } from '../../app/session';
import { CautionsPanel } from '../cautions/cautions-panel';
import { useDistricts } from '../districts/api/districts.api';
import { DemoDataLabel } from '../districts/components/demo-data-label';
import { DistrictSurveys } from '../surveys/components/district-surveys';
import { useCasesSettings } from './api/cases-settings.api';
import { useDiseases } from './api/diseases.api';
import { useDistrictSignals } from './api/district-signals.api';
import { useCaseFormat } from './case-format';
import { EpidemicYearsForm } from './components/epidemic-years.form';
import { SignalsTable } from './components/signals.table';
import { mayIn } from '../../../shared/permissions';

const ChannelChart = lazy(() => import('./components/channel-chart').then((m) => ({ default: m.ChannelChart })));

/** The cases part of the District file: this season against the district's endemic channel, its signals and larval surveys. */
export function DistrictCasesPage() {
  const { t } = useTranslation('cases');
  const caseFormat = useCaseFormat();
  const { formatNumber, formatShare, formatDate } = caseFormat;
  const me = useSession();
  const { id = '' } = useParams();
  const [search, setSearch] = useSearchParams();
  const diseases = useDiseases();
  const settings = useCasesSettings();
  const districts = useDistricts();
  const code = search.get('disease');
  const district = districts.data?.find((d) => d.id === id);
  // Without a disease in the address, the page opens on the district's own diseases (those of its profiles) first.
  const ownDiseases = (diseases.data ?? []).filter((d) => district?.profileIds.some((p) => d.profileIds.includes(p)));
  const disease = diseases.data?.find((d) => d.code === code) ?? ownDiseases[0] ?? (districts.isPending ? undefined : diseases.data?.[0]);
  const orderedDiseases = [...ownDiseases, ...(diseases.data ?? []).filter((d) => !ownDiseases.includes(d))];
  const yearParam = Number(search.get('year')) || undefined;
  const signals = useDistrictSignals(id, disease?.id, yearParam);

  if (isForbidden(signals.error)) return <NotAllowedPage />;
  const data = signals.data;
  // The headline reads the newest complete week: an open week (reporting not over) holds a partial count.
  const latest = data?.lastCompleteWeek ? data.weeks.find((w) => w.week === data.lastCompleteWeek) : undefined;
  const openWeeks = data?.weeks.filter((w) => w.open) ?? [];
  const currentYear = settings.data?.currentWeek.year ?? new Date().getFullYear();
  const years = Array.from({ length: 7 }, (_, i) => currentYear - i);
  const set = (key: string, value: string) => {
    const next = new URLSearchParams(search);
    next.set(key, value);
    setSearch(next, { replace: true });
  };

  return (
    <section aria-labelledby="page-title">
      <PageHeading lead={t('district.lead')}>{t('district.title', { district: data?.district.name ?? district?.name ?? t('district.districtFallback') })}</PageHeading>
      <DemoDataLabel districts={district ? [district] : undefined} />
      <div className="mb-4 flex flex-wrap items-end gap-4">
        <SelectField label={t('district.disease')} className="field min-w-0 sm:min-w-56" value={disease?.code ?? ''} onChange={(e) => set('disease', e.currentTarget.value)}>
          {orderedDiseases.map((d) => (
            <option key={d.id} value={d.code}>
              {d.name}
            </option>
          ))}
        </SelectField>
        <SelectField label={t('district.season')} className="field min-w-32" value={String(yearParam ?? currentYear)} onChange={(e) => set('year', e.currentTarget.value)}>
          {years.map((y) => (
            <option key={y} value={y}>
              {y}
            </option>
          ))}
        </SelectField>
      </div>
      <div className="grid gap-6 2xl:grid-cols-[minmax(0,1fr)_20rem]">
        <div className="min-w-0 space-y-6">
          {signals.isError ? (
            <FormMessage kind="error">{errorText(signals.error)}</FormMessage>
          ) : !data || !settings.data ? (
            <p className="text-ink-muted">{t('district.loading')}</p>
          ) : (
            <>
              <dl className="grid grid-cols-2 gap-3 sm:grid-cols-4" data-testid="season-summary">
                <div className="card">
                  <dt className="text-sm text-ink-muted">{latest ? t('district.completeWeek', { week: latest.week }) : t('district.noCompleteWeek')}</dt>
                  <dd className="text-2xl font-bold tabular-nums">
                    {latest?.cases === null || latest?.cases === undefined ? t('district.noCases') : t('district.cases', { count: latest.cases })}
                  </dd>
                  <dd className="text-sm">{latest?.zone ? t(`zone.${latest.zone}`) : t('district.noChannel')}</dd>
                </div>
                <div className="card">
                  <dt className="text-sm text-ink-muted">{t('district.incidence')}</dt>
                  <dd className="text-2xl font-bold tabular-nums">{formatNumber(latest?.incidence, 2)}</dd>
                  <dd className="text-sm">{t('district.population', { population: formatNumber(data.population) })}</dd>
                </div>
                <div className="card">
                  <dt className="text-sm text-ink-muted">{t('district.doubling', { weeks: data.fittedGrowth?.weeks ?? 4 })}</dt>
                  <dd className="text-2xl font-bold tabular-nums">
                    {data.fittedGrowth?.doublingWeeks ? t('district.doublingValue', { weeks: formatNumber(data.fittedGrowth.doublingWeeks, 1) }) : t('district.notGrowing')}
                  </dd>
                </div>
                <div className="card">
                  <dt className="text-sm text-ink-muted">{t('district.onTime')}</dt>
                  <dd className="text-2xl font-bold tabular-nums">{formatShare(data.completeness.share)}</dd>
                  <dd className="text-sm">
                    {t('district.onTimeDetail', { onTime: data.completeness.onTime, expected: data.completeness.expected })}
                  </dd>
                </div>
              </dl>
              {openWeeks.length ? (
                <p className="notice notice-info text-sm" data-testid="open-weeks">
                  {t('district.openWeeks', {
                    count: openWeeks.length,
                    weeks: openWeeks.map((w) => w.week).join(', '),
                    date: formatDate(openWeeks.at(-1)!.deadline),
                    days: data.deadlineDays,
                  })}
                </p>
              ) : null}
              <p className="text-sm text-ink-muted">
                {t('district.channel', {
                  method: t(`district.method.${data.channelMethod}`),
                  count: data.seasonsUsed.length,
                  years: [...data.seasonsUsed].sort().join(', ') || t('district.none'),
                })}
              </p>
              {data.notes.length ? (
                <ul className="notice notice-info list-disc pl-8 text-sm">
                  {data.notes.map((n) => (
                    <li key={n.code} data-note={n.code}>
                      {caseFormat.signalNote(n)}
                    </li>
                  ))}
                </ul>
              ) : null}
              <div className="card">
                <Suspense fallback={<p className="text-ink-muted">{t('district.drawing')}</p>}>
                  <ChannelChart data={data} />
                </Suspense>
              </div>
              <SignalsTable data={data} today={settings.data.today} />
            </>
          )}
          <section aria-labelledby="surveys-title" className="space-y-2">
            <h2 id="surveys-title" className="section-title">
              {t('district.surveys')}
            </h2>
            {id ? <DistrictSurveys districtId={id} /> : null}
          </section>
        </div>
        <div className="space-y-6 self-start">
          <CautionsPanel />
          {/* Keyed by district and disease only: a key holding the saved years remounted the form when its
              own save came back, and the "Left out: …" confirmation vanished before it could be read. */}
          {data && mayIn(me.role, 'cases.channelSettings', data.canEnter) ? <EpidemicYearsForm key={`${data.district.id}-${data.disease.id}`} data={data} /> : null}
        </div>
      </div>
    </section>
  );
}
