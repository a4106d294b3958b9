import { useMemo } from 'react';
import { useNavigate, useParams } from 'react-router-dom';
import { useTranslation } from 'react-i18next';
import { createColumnHelper, useTable } from '@tanstack/react-table';
import type { SeriesDayDto } from '../../../shared/api/weather.schema';
import { DataTable, plainTableFeatures, type PlainTableFeatures } from '../../components/data-table';
import { FormMessage, SelectField } from '../../components/form';
import { PageHeading } from '../../components/page-heading';
import { useFormat } from '../../i18n/format';
import { downloadCsv, toCsv } from '../../lib/csv';
import { useUnits } from '../../lib/units';
import { useDistricts } from '../districts/api/districts.api';
import { useDistrictSeries } from './api/district-series.api';
import { errorText } from '../../lib/error-text';

const column = createColumnHelper<PlainTableFeatures, SeriesDayDto>();

/** A district's daily weather series and where it comes from (its stations, or interpolated from the nearest). */
export function DistrictWeatherPage() {
  const { t } = useTranslation('weather');
  const { number, date } = useFormat();
  const units = useUnits();
  const { id = null } = useParams();
  const navigate = useNavigate();
  const districts = useDistricts();
  const series = useDistrictSeries(id);
  const days = useMemo(() => [...(series.data?.days ?? [])].reverse(), [series.data]);
  const columns = useMemo(() => {
    const v = (x: number | null, digits: number, unit: string) => (x === null ? '—' : `${number(x, digits, true)} ${unit}`);
    return column.columns([
      column.accessor('date', { header: t('district.date'), cell: (c) => <span className="whitespace-nowrap">{date(c.getValue())}</span> }),
      column.accessor((d) => v(d.tmin === null ? null : units.toTemperature(d.tmin), 1, units.temperatureSymbol), { id: 'tmin', header: t('district.tmin') }),
      column.accessor((d) => v(d.tmax === null ? null : units.toTemperature(d.tmax), 1, units.temperatureSymbol), { id: 'tmax', header: t('district.tmax') }),
      column.accessor((d) => v(d.rh, 1, '%'), { id: 'rh', header: t('district.rh') }),
      column.accessor((d) => v(d.rain === null ? null : units.toRain(d.rain), units.rainDigits, units.rainSymbol), { id: 'rain', header: t('district.rain') }),
      column.accessor(
        (d) => (d.missing ? t('district.missing') : d.filled ? t('district.filled') : t('district.stationCount', { count: d.stationCount })),
        { id: 'quality', header: t('district.day') },
      ),
    ]);
  }, [t, number, date, units]);
  const table = useTable({ features: plainTableFeatures, columns, data: days, getRowId: (d) => d.date });
  const s = series.data;

  /** The series as a spreadsheet file, in the user's display units (the column headers name them). */
  const download = () => {
    if (!s) return;
    const round = (x: number | null, digits: number) => (x === null ? null : Number(x.toFixed(digits)));
    const header = ['date', `tmin_${units.temperature}`, `tmax_${units.temperature}`, 'rh_percent', `rain_${units.rain}`, 'filled', 'missing', 'stations'];
    const rows = s.days.map((d) => [
      d.date,
      round(d.tmin === null ? null : units.toTemperature(d.tmin), 2),
      round(d.tmax === null ? null : units.toTemperature(d.tmax), 2),
      d.rh,
      round(d.rain === null ? null : units.toRain(d.rain), units.rain === 'in' ? 3 : 1),
      d.filled,
      d.missing,
      d.stationCount,
    ]);
    downloadCsv(`broodcast-weather-${s.district.code}.csv`, toCsv(header, rows));
  };

  return (
    <section aria-labelledby="page-title" className="min-w-0 space-y-6">
      <PageHeading lead={t('district.lead')}>{t('district.title')}</PageHeading>
      <SelectField label={t('district.district')} value={id ?? ''} onChange={(e) => navigate(`/weather/districts/${e.currentTarget.value}`)}>
        <option value="" disabled>
          {t('chooseDistrict')}
        </option>
        {districts.data?.map((d) => (
          <option key={d.id} value={d.id}>
            {d.code} {d.name}
          </option>
        ))}
      </SelectField>
      {series.isError ? <FormMessage kind="error">{errorText(series.error)}</FormMessage> : null}
      {s ? (
        <>
          {s.district.isDemo ? <p className="demo-label">{t('demo')}</p> : null}
          <div className="card min-w-0 space-y-2 break-words">
            <h2 className="section-title">{t('district.sourceTitle')}</h2>
            {s.source.kind === 'none' ? (
              <p>{t('district.noStation')}</p>
            ) : (
              <>
                <p>
                  {s.source.kind === 'stations'
                    ? s.source.stations.length === 1
                      ? t('district.fromStation')
                      : t('district.fromStations', { count: s.source.stations.length })
                    : t('district.interpolated')}
                </p>
                <ul className="list-disc pl-5 text-sm">
                  {s.source.stations.map((st) => (
                    <li key={st.id}>
                      <span className="font-mono">{st.code}</span> {st.name} —{' '}
                      {t('district.stationLine', { distance: number(st.distanceKm, 1, true), weight: number(st.weight, 3, true) })}
                    </li>
                  ))}
                </ul>
              </>
            )}
            <p className="text-sm text-ink-muted">
              {s.summary.first
                ? t('district.summaryRange', {
                    days: number(s.summary.days),
                    first: date(s.summary.first),
                    last: date(s.summary.last),
                    filled: number(s.summary.filled),
                    missing: number(s.summary.missing),
                  })
                : t('district.summary', { days: number(s.summary.days), filled: number(s.summary.filled), missing: number(s.summary.missing) })}
            </p>
            {s.days.length ? (
              <button type="button" className="btn btn-secondary btn-small" onClick={download}>
                {t('district.download', { temperature: units.temperatureSymbol, rain: units.rainSymbol })}
              </button>
            ) : null}
          </div>
          <DataTable table={table} caption={t('district.caption', { district: s.district.name })} emptyText={t('district.empty')} />
        </>
      ) : null}
    </section>
  );
}
