import { useMemo } from 'react';
import { useNavigate, useParams } from 'react-router-dom';
import { createColumnHelper, useTable } from '@tanstack/react-table';
import type { SeriesDayDto } from '../../../shared/api/weather.schema';
import { DataTable, plainTableFeatures, type PlainTableFeatures } from '../../components/data-table';
import { FormMessage, SelectField } from '../../components/form';
import { PageHeading } from '../../components/page-heading';
import { useDistricts } from '../districts/api/districts.api';
import { useDistrictSeries } from './api/district-series.api';

const column = createColumnHelper<PlainTableFeatures, SeriesDayDto>();
const v = (x: number | null, unit: string) => (x === null ? '—' : `${x.toFixed(1)} ${unit}`);
const columns = column.columns([
  column.accessor('date', { header: 'Date' }),
  column.accessor((d) => v(d.tmin, '°C'), { id: 'tmin', header: 'Tmin' }),
  column.accessor((d) => v(d.tmax, '°C'), { id: 'tmax', header: 'Tmax' }),
  column.accessor((d) => v(d.rh, '%'), { id: 'rh', header: 'RH' }),
  column.accessor((d) => v(d.rain, 'mm'), { id: 'rain', header: 'Rain' }),
  column.accessor((d) => (d.missing ? 'Missing (gap too long to fill)' : d.filled ? 'Filled (interpolated)' : `${d.stationCount} station${d.stationCount === 1 ? '' : 's'}`), {
    id: 'quality', header: 'Day',
  }),
]);

/** A district's daily weather series and where it comes from (its stations, or interpolated from the nearest). */
export function DistrictWeatherPage() {
  const { id = null } = useParams();
  const navigate = useNavigate();
  const districts = useDistricts();
  const series = useDistrictSeries(id);
  const days = useMemo(() => [...(series.data?.days ?? [])].reverse(), [series.data]);
  const table = useTable({ features: plainTableFeatures, columns, data: days, getRowId: (d) => d.date });
  const s = series.data;
  return (
    <section aria-labelledby="page-title" className="space-y-6">
      <PageHeading lead="The daily series the season model reads. Missing days are gaps, never zeros.">District weather</PageHeading>
      <SelectField label="District" value={id ?? ''} onChange={(e) => navigate(`/weather/districts/${e.currentTarget.value}`)}>
        <option value="" disabled>Choose a district</option>
        {districts.data?.map((d) => <option key={d.id} value={d.id}>{d.code} {d.name}</option>)}
      </SelectField>
      {series.isError ? <FormMessage kind="error">{series.error.message}</FormMessage> : null}
      {s ? (
        <>
          {s.district.isDemo ? <p className="demo-label">Demo data — the Halvern Region is invented</p> : null}
          <div className="card space-y-2">
            <h2 className="section-title">Weather source</h2>
            {s.source.kind === 'none' ? (
              <p>No station yet: this district has no weather series.</p>
            ) : (
              <>
                <p>
                  {s.source.kind === 'stations'
                    ? `From ${s.source.stations.length === 1 ? 'its station' : `its ${s.source.stations.length} stations (equal weights)`}:`
                    : 'No station inside this district: interpolated from the nearest stations (inverse-distance weights):'}
                </p>
                <ul className="list-disc pl-5 text-sm">
                  {s.source.stations.map((st) => (
                    <li key={st.id}>
                      <span className="font-mono">{st.code}</span> {st.name} — {st.distanceKm.toFixed(1)} km from the district centre, weight {st.weight.toFixed(3)}
                    </li>
                  ))}
                </ul>
              </>
            )}
            <p className="text-sm text-ink-muted">
              {s.summary.days} days{s.summary.first ? ` from ${s.summary.first} to ${s.summary.last}` : ''}; {s.summary.filled} filled, {s.summary.missing} missing.
            </p>
          </div>
          <DataTable table={table} caption={`Daily weather of ${s.district.name}, latest first`} emptyText="No weather yet." />
        </>
      ) : null}
    </section>
  );
}
