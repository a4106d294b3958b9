import { useMemo } from 'react';
import { Link } from 'react-router-dom';
import { useTranslation } from 'react-i18next';
import { createColumnHelper, useTable } from '@tanstack/react-table';
import type { StationDto } from '../../../shared/api/weather.schema';
import { DataTable, plainTableFeatures, type PlainTableFeatures } from '../../components/data-table';
import { FormMessage } from '../../components/form';
import { PageHeading } from '../../components/page-heading';
import { useFormat } from '../../i18n/format';
import { useStations } from './api/stations.api';
import { errorText } from '../../lib/error-text';

const column = createColumnHelper<PlainTableFeatures, StationDto>();

export function StationsPage() {
  const { t } = useTranslation('weather');
  const { number, date } = useFormat();
  const stations = useStations();
  const data = useMemo(() => stations.data ?? [], [stations.data]);
  const columns = useMemo(
    () =>
      column.columns([
        column.accessor('code', { header: t('stations.code'), cell: (c) => <span className="font-mono text-sm">{c.getValue()}</span> }),
        column.accessor('name', { header: t('stations.name') }),
        column.accessor((s) => `${number(s.latitude, 3, true)}, ${number(s.longitude, 3, true)}`, { id: 'position', header: t('stations.position') }),
        column.accessor((s) => (s.elevation === null ? '—' : t('stations.elevationValue', { value: number(s.elevation) })), {
          id: 'elevation',
          header: t('stations.elevation'),
        }),
        column.accessor('district', {
          header: t('stations.district'),
          cell: (c) => {
            const d = c.getValue();
            return d ? (
              <Link className="link" to={`/weather/districts/${d.id}`}>
                {d.code} {d.name}
              </Link>
            ) : (
              <span className="text-ink-muted">{t('stations.outside')}</span>
            );
          },
        }),
        column.accessor(
          (s) => (s.lastDate
            ? t('stations.daysLast', { count: s.days, days: number(s.days), last: date(s.lastDate) })
            : t('stations.days', { count: s.days, days: number(s.days) })),
          { id: 'data', header: t('stations.data') },
        ),
      ]),
    [t, number, date],
  );
  const table = useTable({ features: plainTableFeatures, columns, data, getRowId: (s) => s.id });
  return (
    <section aria-labelledby="page-title">
      <PageHeading lead={t('stations.lead')}>{t('stations.title')}</PageHeading>
      {stations.data?.some((s) => s.isDemo) ? <p className="demo-label">{t('demo')}</p> : null}
      {stations.isError ? (
        <FormMessage kind="error">{errorText(stations.error)}</FormMessage>
      ) : (
        <DataTable table={table} caption={t('stations.caption')} emptyText={t('stations.empty')} />
      )}
    </section>
  );
}
