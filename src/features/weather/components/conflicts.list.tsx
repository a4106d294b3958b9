import { useTranslation } from 'react-i18next';
import type { ConflictDto } from '../../../../shared/api/weather.schema';
import { useFormat } from '../../../i18n/format';
import { useUnits } from '../../../lib/units';
import { useConflicts } from '../api/conflicts.api';
import { useResolveConflict } from '../api/resolve-conflict.api';
import { ReasonAction } from './reason-action';

type DayValues = ConflictDto['incoming'];

/**
 * Hand corrections win: values a feed or an upload brought for a day a person corrected wait here beside
 * the correction, which stands until someone keeps it or takes the new values (docs/weather-intake.md).
 */
export function ConflictsList() {
  const { t } = useTranslation('weather');
  const f = useFormat();
  const units = useUnits();
  const conflicts = useConflicts();
  const resolve = useResolveConflict();
  const values = (v: DayValues | null) =>
    v
      ? t('conflicts.values', {
          tmin: `${f.number(units.toTemperature(v.tmin), 1)} ${units.temperatureSymbol}`,
          tmax: `${f.number(units.toTemperature(v.tmax), 1)} ${units.temperatureSymbol}`,
          rh: v.rh === null ? '—' : `${f.number(v.rh, 0)} %`,
          rain: v.rain === null ? '—' : `${f.number(units.toRain(v.rain), units.rainDigits)} ${units.rainSymbol}`,
        })
      : '—';
  const list = conflicts.data ?? [];
  return (
    <section aria-labelledby="conflicts-title" className="card space-y-3">
      <h2 id="conflicts-title" className="section-title">
        {t('conflicts.title')}
      </h2>
      <p className="text-sm text-ink-muted">{t('conflicts.lead')}</p>
      {list.length === 0 ? (
        <p className="text-ink-muted">{conflicts.isPending ? t('intake.loading') : t('conflicts.empty')}</p>
      ) : (
        <ul className="divide-y divide-line rounded-md border border-line">
          {list.map((c) => (
            <li key={c.id} className="space-y-2 px-3 py-2 text-sm">
              <p className="font-bold">
                <span className="font-mono">{c.station}</span> · {f.date(c.date)}
              </p>
              <dl className="grid gap-1 sm:grid-cols-2">
                <div>
                  <dt className="text-ink-muted">{t('conflicts.current')}</dt>
                  <dd>{values(c.current)}</dd>
                </div>
                <div>
                  <dt className="text-ink-muted">{t('conflicts.incoming', { source: t(`intake.source.${c.source}`) })}</dt>
                  <dd>{values(c.incoming)}</dd>
                </div>
              </dl>
              <div className="flex flex-wrap gap-2">
                <ReasonAction
                  primary
                  label={t('conflicts.keep')}
                  title={t('conflicts.keepTitle', { station: c.station, date: c.date })}
                  onAct={(reason) => resolve.mutateAsync({ id: c.id, choice: 'keep', reason })}
                />
                <ReasonAction
                  label={t('conflicts.take')}
                  title={t('conflicts.takeTitle', { station: c.station, date: c.date })}
                  onAct={(reason) => resolve.mutateAsync({ id: c.id, choice: 'take', reason })}
                />
              </div>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
