import { Fragment, useState } from 'react';
import type { SignalsResponse } from '../../../../shared/api/cases.schema';
import { FormMessage } from '../../../components/form';
import { formErrorText } from '../../../lib/form-errors';
import { useCloseWeek } from '../api/close-week.api';
import { useCaseFormat } from '../case-format';
import { RevisionHistory } from './revision-history';

/** The season week by week: count, incidence, channel, zone, C1–C3, CUSUM, growth; history and closing on demand. */
export function SignalsTable({ data, today }: { data: SignalsResponse; today: string }) {
  const { t, formatNumber, formatDate } = useCaseFormat();
  const flag = (s: { statistic: number | null; alarm: boolean | null }) =>
    s.statistic === null ? '—' : `${formatNumber(s.statistic, 2)}${s.alarm ? ` · ${t('signals.alarm')}` : ''}`;
  const [open, setOpen] = useState<string | null>(null);
  const close = useCloseWeek();
  const [message, setMessage] = useState<string | null>(null);
  const rows = [...data.weeks].reverse();
  // Open weeks (reporting not over) show their partial count and no statistic (the server sends none).
  const columns = 11;
  return (
    <div className="space-y-2">
      {message ? <FormMessage kind="error">{message}</FormMessage> : null}
      <div className="table-wrap" tabIndex={0} role="region" aria-label={t('signals.caption', { disease: data.disease.name, district: data.district.name, year: data.year })}>
        <table className="data-table" data-testid="signals-table">
          <caption className="table-caption">
            {t('signals.caption', { disease: data.disease.name, district: data.district.name, year: data.year })}
          </caption>
          <thead>
            <tr>
              <th scope="col">{t('signals.week')}</th>
              <th scope="col">{t('signals.cases')}</th>
              <th scope="col">{t('signals.per100k')}</th>
              <th scope="col">{t('signals.channel')}</th>
              <th scope="col">{t('signals.zone')}</th>
              <th scope="col">C1</th>
              <th scope="col">C2</th>
              <th scope="col">C3</th>
              <th scope="col">{t('signals.cusum')}</th>
              <th scope="col">{t('signals.growth')}</th>
              <th scope="col">{t('signals.record')}</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((w) => {
              const end = new Date(`${w.start}T00:00:00Z`);
              end.setUTCDate(end.getUTCDate() + 6);
              const over = end.toISOString().slice(0, 10) < today;
              return (
                <Fragment key={w.week}>
                  <tr>
                    <th scope="row" className="whitespace-nowrap text-left font-normal">
                      {t('chart.weekShort', { week: w.week })} <span className="text-xs text-ink-muted">{formatDate(w.start)}</span>
                    </th>
                    <td className="tabular-nums">
                      {w.cases ?? '—'}
                      {w.open ? <span className="block text-xs text-ink-muted">{t('signals.partial')}</span> : null}
                    </td>
                    <td className="tabular-nums">{formatNumber(w.incidence, 2)}</td>
                    <td className="tabular-nums whitespace-nowrap">
                      {w.channel ? `${formatNumber(w.channel.lower, 1)} – ${formatNumber(w.channel.centre, 1)} – ${formatNumber(w.channel.upper, 1)}` : '—'}
                    </td>
                    <td>{w.open ? t('signals.notYet') : w.zone ? t(`zone.${w.zone}`) : '—'}</td>
                    <td className="tabular-nums">{flag(w.c1)}</td>
                    <td className="tabular-nums">{flag(w.c2)}</td>
                    <td className="tabular-nums">{flag(w.c3)}</td>
                    <td className="tabular-nums">{flag(w.cusum)}</td>
                    <td className="tabular-nums whitespace-nowrap">
                      {w.growth.percent === null ? '—' : `${w.growth.percent > 0 ? '+' : ''}${formatNumber(w.growth.percent, 0)} %`}
                      {w.growth.doublingWeeks !== null ? (
                        <span className="block text-xs text-ink-muted">{t('signals.doubles', { weeks: formatNumber(w.growth.doublingWeeks, 1) })}</span>
                      ) : null}
                    </td>
                    <td className="whitespace-nowrap text-sm">
                      {[w.closed ? t('signals.closed') : w.open ? t('signals.reportingOpen', { date: formatDate(w.deadline) }) : t('signals.open'), w.late ? t('signals.late') : null, w.voided ? t('signals.voided') : null].filter(Boolean).join(', ')}
                      <span className="mt-1 flex gap-1">
                        {w.countId && data.canReadHistory ? (
                          <button
                            type="button"
                            className="btn btn-secondary btn-small"
                            aria-expanded={open === w.countId}
                            onClick={() => setOpen(open === w.countId ? null : w.countId)}
                          >
                            {t('signals.history')}
                          </button>
                        ) : null}
                        {data.canClose && !w.closed && over ? (
                          <button
                            type="button"
                            className="btn btn-secondary btn-small"
                            disabled={close.isPending}
                            onClick={() => {
                              setMessage(null);
                              close.mutate(
                                { districtId: data.district.id, week: { year: data.year, week: w.week } },
                                { onError: (e) => setMessage(formErrorText(e)) },
                              );
                            }}
                          >
                            {t('signals.closeWeek')}
                          </button>
                        ) : null}
                      </span>
                    </td>
                  </tr>
                  {open && open === w.countId ? (
                    <tr className="row-detail">
                      <td colSpan={columns}>
                        <RevisionHistory countId={open} />
                      </td>
                    </tr>
                  ) : null}
                </Fragment>
              );
            })}
          </tbody>
        </table>
      </div>
    </div>
  );
}
