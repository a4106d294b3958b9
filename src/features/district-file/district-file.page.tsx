import { useId, useMemo } from 'react';
import { Link, useParams, useSearchParams } from 'react-router-dom';
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
import { CurrentTier } from './components/current-tier';
import './district-file.css';

const seasonParam = (v: string | null) => (v && /^\d{4}$/.test(v) ? Number(v) : null);
const byWeek = (a: { epiYear: number; epiWeek: number }, b: { epiYear: number; epiWeek: number }) => a.epiYear - b.epiYear || a.epiWeek - b.epiWeek;

/**
 * Everything about one district for one season: its tier and drivers, what changed, notes on the inputs,
 * and the charts (weather, heat accumulation, the Vector clock, cases against the channel, larval indices,
 * tier history), each with a text summary and a table. Loaded lazily with ECharts.
 */
export function DistrictFilePage() {
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

  if (file.isPending) return <p className="text-ink-muted">Loading the District file…</p>;
  if (file.isError)
    return (
      <section aria-labelledby="page-title">
        <PageHeading>District file</PageHeading>
        <FormMessage kind="error">{file.error.message}</FormMessage>
        <p className="mt-4">
          <Link to="/" className="link">
            Back to the Ladder
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
      onChoose={choose}
    />
  );
}

function DistrictFileView({
  data,
  loadingSeason,
  compared,
  compare,
  onChoose,
}: {
  data: DistrictFileResponse;
  loadingSeason: boolean;
  compared: DistrictFileResponse | null;
  compare: number | null;
  onChoose: (key: 'season' | 'compare', value: string) => void;
}) {
  const id = useId();
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
          Ladder
        </Link>{' '}
        <span aria-hidden="true">›</span> District file
      </p>
      <PageHeading lead={`District file of ${district.code}, season ${seasonYear}.`}>{district.name}</PageHeading>
      <DemoDataLabel districts={[district]} />

      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_20rem]">
        <div className="min-w-0 space-y-6">
          <form className="flex flex-wrap items-end gap-4" onSubmit={(e) => e.preventDefault()} aria-label="Season">
            <div className="field w-40">
              <label htmlFor={`${id}-season`} className="field-label">
                Season
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
                Compare heat with
              </label>
              <select
                id={`${id}-compare`}
                className="input"
                value={compare !== null && compare < seasonYear ? compare : ''}
                onChange={(e) => onChoose('compare', e.currentTarget.value)}
                disabled={earlier.length === 0}
              >
                <option value="">No other season</option>
                {earlier.map((s) => (
                  <option key={s} value={s}>
                    {s}
                  </option>
                ))}
              </select>
            </div>
            {loadingSeason ? <p className="text-sm text-ink-muted">Loading the season…</p> : null}
          </form>

          {current ? (
            <CurrentTier current={current} previous={previous} />
          ) : (
            <FormMessage kind="info">No tier has been computed for {seasonYear} yet. A season run computes it.</FormMessage>
          )}

          <section aria-labelledby={`${id}-about`} className="card">
            <h2 id={`${id}-about`} className="section-title">
              About the data
            </h2>
            <ul className="mt-2 list-disc space-y-1 pl-5 text-sm">
              <li>Weather: {data.weather.source ?? 'no source recorded'}.</li>
              <li>
                {filledDays === 0
                  ? 'No day of weather was filled in.'
                  : `${filledDays} day${filledDays === 1 ? ' was' : 's were'} missing and filled in from neighbouring days.`}
              </li>
              <li>
                {data.vectorClock.length === 0
                  ? 'No vector–pathogen profile is assigned to this district.'
                  : `Profiles: ${data.vectorClock.map((v) => v.profileName).join(', ')}.`}
              </li>
              <li>{data.larval.length === 0 ? 'No larval surveys this season.' : `${data.larval.reduce((a, w) => a + w.surveys, 0)} larval surveys this season.`}</li>
            </ul>
            <DistrictLinks districtId={district.id} />
          </section>
        </div>
        <CautionsPanel className="self-start" />
      </div>

      <div className="mt-8 space-y-8">
        <section aria-labelledby={`${id}-weather`} className="card space-y-4">
          <h2 id={`${id}-weather`} className="text-xl font-bold">
            Weather and heat
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
              Vector clock
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
            Cases and larval surveys
          </h2>
          {data.cases.length === 0 ? <p className="text-ink-muted">No case counts for this season.</p> : null}
          {data.cases.map((c) => (
            <CasesChart key={c.diseaseId} cases={c} seasonYear={seasonYear} />
          ))}
          <LarvalChart larval={data.larval} />
        </section>

        <section aria-labelledby={`${id}-tiers`} className="card space-y-4">
          <h2 id={`${id}-tiers`} className="text-xl font-bold">
            Tier over the season
          </h2>
          <TierHistoryChart tiers={tiers} />
        </section>
      </div>
    </section>
  );
}

/** Other screens about this district that exist in this build. */
function DistrictLinks({ districtId }: { districtId: string }) {
  return (
    <p className="mt-3 text-sm">
      <Link to={`/districts/${districtId}/cases`} className="link">
        Weekly case counts for this district
      </Link>
    </p>
  );
}
