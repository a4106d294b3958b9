import { useMemo } from 'react';
import { Link } from 'react-router-dom';
import { createColumnHelper, useTable } from '@tanstack/react-table';
import type { StationDto } from '../../../shared/api/weather.schema';
import { DataTable, plainTableFeatures, type PlainTableFeatures } from '../../components/data-table';
import { FormMessage } from '../../components/form';
import { PageHeading } from '../../components/page-heading';
import { useStations } from './api/stations.api';

const column = createColumnHelper<PlainTableFeatures, StationDto>();
const columns = column.columns([
  column.accessor('code', { header: 'Code', cell: (c) => <span className="font-mono text-sm">{c.getValue()}</span> }),
  column.accessor('name', { header: 'Name' }),
  column.accessor((s) => `${s.latitude.toFixed(3)}, ${s.longitude.toFixed(3)}`, { id: 'position', header: 'Latitude, longitude' }),
  column.accessor((s) => (s.elevation === null ? '—' : `${s.elevation} m`), { id: 'elevation', header: 'Elevation' }),
  column.accessor('district', {
    header: 'District',
    cell: (c) => {
      const d = c.getValue();
      return d ? <Link className="link" to={`/weather/districts/${d.id}`}>{d.code} {d.name}</Link> : <span className="text-ink-muted">outside every boundary</span>;
    },
  }),
  column.accessor((s) => `${s.days.toLocaleString('en')} days${s.lastDate ? `, last ${s.lastDate}` : ''}`, { id: 'data', header: 'Data' }),
]);

export function StationsPage() {
  const stations = useStations();
  const data = useMemo(() => stations.data ?? [], [stations.data]);
  const table = useTable({ features: plainTableFeatures, columns, data, getRowId: (s) => s.id });
  return (
    <section aria-labelledby="page-title">
      <PageHeading lead="Each station belongs to the district whose boundary contains it. A district without a station takes a distance-weighted series from the nearest ones.">
        Stations
      </PageHeading>
      {stations.data?.some((s) => s.isDemo) ? <p className="demo-label">Demo data — the Halvern Region is invented</p> : null}
      {stations.isError ? <FormMessage kind="error">{stations.error.message}</FormMessage> : <DataTable table={table} caption="Weather stations" emptyText="No stations yet." />}
    </section>
  );
}
