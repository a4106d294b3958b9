import { lazy, Suspense } from 'react';
import { useParams, useSearchParams } from 'react-router-dom';
import { CHANNEL_ZONE_LABELS } from '../../../shared/signals/endemic-channel';
import { PageHeading } from '../../components/page-heading';
import { FormMessage, SelectField } from '../../components/form';
import { isForbidden } from '../../lib/api-client';
import { NotAllowedPage } from '../../app/not-allowed.page';
import { useSession } from '../../app/session';
import { CautionsPanel } from '../cautions/cautions-panel';
import { useDistricts } from '../districts/api/districts.api';
import { DemoDataLabel } from '../districts/components/demo-data-label';
import { DistrictSurveys } from '../surveys/components/district-surveys';
import { useCasesSettings } from './api/cases-settings.api';
import { useDiseases } from './api/diseases.api';
import { useDistrictSignals } from './api/district-signals.api';
import { formatNumber, formatShare } from './case-format';
import { EpidemicYearsForm } from './components/epidemic-years.form';
import { SignalsTable } from './components/signals.table';

const ChannelChart = lazy(() => import('./components/channel-chart').then((m) => ({ default: m.ChannelChart })));

const METHOD_LABELS = {
  geometric: 'geometric mean with its 95 % band (Bortman 1999)',
  quartile: 'quartiles: first quartile, median, third quartile',
  'mean-2sd': 'mean ± 2 standard deviations',
} as const;

/** The cases part of the District file: this season against the district's endemic channel, its signals and larval surveys. */
export function DistrictCasesPage() {
  const me = useSession();
  const { id = '' } = useParams();
  const [search, setSearch] = useSearchParams();
  const diseases = useDiseases();
  const settings = useCasesSettings();
  const districts = useDistricts();
  const code = search.get('disease');
  const disease = diseases.data?.find((d) => d.code === code) ?? diseases.data?.[0];
  const yearParam = Number(search.get('year')) || undefined;
  const signals = useDistrictSignals(id, disease?.id, yearParam);
  const district = districts.data?.find((d) => d.id === id);

  if (isForbidden(signals.error)) return <NotAllowedPage />;
  const data = signals.data;
  const latest = data?.weeks.at(-1);
  const currentYear = settings.data?.currentWeek.year ?? new Date().getFullYear();
  const years = Array.from({ length: 7 }, (_, i) => currentYear - i);
  const set = (key: string, value: string) => {
    const next = new URLSearchParams(search);
    next.set(key, value);
    setSearch(next, { replace: true });
  };

  return (
    <section aria-labelledby="page-title">
      <PageHeading lead="Part of the District file: this season’s weekly cases against the district’s own endemic channel, the aberration tests and the larval surveys.">
        {data?.district.name ?? district?.name ?? 'District'}: cases
      </PageHeading>
      <DemoDataLabel districts={district ? [district] : undefined} />
      <div className="mb-4 flex flex-wrap items-end gap-4">
        <SelectField label="Disease" className="field min-w-56" value={disease?.code ?? ''} onChange={(e) => set('disease', e.currentTarget.value)}>
          {(diseases.data ?? []).map((d) => (
            <option key={d.id} value={d.code}>
              {d.name}
            </option>
          ))}
        </SelectField>
        <SelectField label="Season" className="field min-w-32" value={String(yearParam ?? currentYear)} onChange={(e) => set('year', e.currentTarget.value)}>
          {years.map((y) => (
            <option key={y} value={y}>
              {y}
            </option>
          ))}
        </SelectField>
      </div>
      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_20rem]">
        <div className="min-w-0 space-y-6">
          {signals.isError ? (
            <FormMessage kind="error">{signals.error.message}</FormMessage>
          ) : !data || !settings.data ? (
            <p className="text-ink-muted">Loading the season…</p>
          ) : (
            <>
              <dl className="grid grid-cols-2 gap-3 sm:grid-cols-4" data-testid="season-summary">
                <div className="card">
                  <dt className="text-sm text-ink-muted">Week {latest?.week ?? '—'}</dt>
                  <dd className="text-2xl font-bold tabular-nums">{latest?.cases ?? '—'} cases</dd>
                  <dd className="text-sm">{latest?.zone ? CHANNEL_ZONE_LABELS[latest.zone] : 'No channel'}</dd>
                </div>
                <div className="card">
                  <dt className="text-sm text-ink-muted">Incidence per 100,000</dt>
                  <dd className="text-2xl font-bold tabular-nums">{formatNumber(latest?.incidence, 2)}</dd>
                  <dd className="text-sm">population {formatNumber(data.population)}</dd>
                </div>
                <div className="card">
                  <dt className="text-sm text-ink-muted">Doubling time (fit of the last {data.fittedGrowth?.weeks ?? 4} weeks)</dt>
                  <dd className="text-2xl font-bold tabular-nums">
                    {data.fittedGrowth?.doublingWeeks ? `${data.fittedGrowth.doublingWeeks.toFixed(1)} wk` : 'not growing'}
                  </dd>
                </div>
                <div className="card">
                  <dt className="text-sm text-ink-muted">Reports on time</dt>
                  <dd className="text-2xl font-bold tabular-nums">{formatShare(data.completeness.share)}</dd>
                  <dd className="text-sm">
                    {data.completeness.onTime} of {data.completeness.expected} due weeks
                  </dd>
                </div>
              </dl>
              <p className="text-sm text-ink-muted">
                Channel: {METHOD_LABELS[data.channelMethod]}, from {data.seasonsUsed.length} prior seasons ({[...data.seasonsUsed].sort().join(', ') || 'none'}).
              </p>
              {data.notes.length ? (
                <ul className="notice notice-info list-disc pl-8 text-sm">
                  {data.notes.map((n) => (
                    <li key={n}>{n}</li>
                  ))}
                </ul>
              ) : null}
              <div className="card">
                <Suspense fallback={<p className="text-ink-muted">Drawing the chart…</p>}>
                  <ChannelChart data={data} />
                </Suspense>
              </div>
              <SignalsTable data={data} today={settings.data.today} />
            </>
          )}
          <section aria-labelledby="surveys-title" className="space-y-2">
            <h2 id="surveys-title" className="section-title">
              Larval surveys
            </h2>
            {id ? <DistrictSurveys districtId={id} /> : null}
          </section>
        </div>
        <div className="space-y-6 self-start">
          <CautionsPanel />
          {data && (data.canEnter || me.role === 'admin') ? <EpidemicYearsForm key={`${data.disease.id}-${data.excludedYears.join()}`} data={data} /> : null}
        </div>
      </div>
    </section>
  );
}
