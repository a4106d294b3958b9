import { Fragment, useState } from 'react';
import type { SignalsResponse } from '../../../../shared/api/cases.schema';
import { FormMessage } from '../../../components/form';
import { isApiError } from '../../../lib/api-client';
import { formErrorText } from '../../../lib/form-errors';
import { useCloseWeek } from '../api/close-week.api';
import { useReopenWeek } from '../api/reopen-week.api';
import { useCaseFormat } from '../case-format';
import { RevisionHistory } from './revision-history';

/** The season week by week: count, incidence, channel, zone, C1–C3, CUSUM, growth; history and closing on demand. */
export function SignalsTable({ data, today }: { data: SignalsResponse; today: string }) {
  const { t, formatNumber, formatDate, weekLabel } = useCaseFormat();
  const flag = (s: { statistic: number | null; alarm: boolean | null }) =>
    s.statistic === null ? '—' : `${formatNumber(s.statistic, 2)}${s.alarm ? ` · ${t('signals.alarm')}` : ''}`;
  const [open, setOpen] = useState<string | null>(null);
  const close = useCloseWeek();
  const reopen = useReopenWeek();
  const [message, setMessage] = useState<{ kind: 'error' | 'success'; text: string } | null>(null);
  /** Closing a week asks first; reopening asks for a reason (the same steps as on the Case ledger grid). */
  const [confirming, setConfirming] = useState<{ week: number; kind: 'close' | 'reopen' } | null>(null);
  const [reopenReason, setReopenReason] = useState('');
  const label = (week: number) => weekLabel({ year: data.year, week });
  const closeWeek = (week: number) => {
    setMessage(null);
    close.mutate(
      { districtId: data.district.id, week: { year: data.year, week } },
      {
        onSuccess: () => {
          setConfirming(null);
          setMessage({ kind: 'success', text: t('grid.isClosed', { week: label(week), district: data.district.name }) });
        },
        onError: (e) => setMessage({ kind: 'error', text: formErrorText(e) }),
      },
    );
  };
  const reopenWeek = (week: number) => {
    setMessage(null);
    reopen.mutate(
      { districtId: data.district.id, week: { year: data.year, week, reason: reopenReason } },
      {
        onSuccess: (r) => {
          setConfirming(null);
          setReopenReason('');
          setMessage({ kind: 'success', text: r.reopened ? t('grid.isReopened', { week: label(week), district: data.district.name }) : t('grid.wasOpen') });
        },
        onError: (e) =>
          setMessage({ kind: 'error', text: isApiError(e) && e.fields.some((f) => f.path.endsWith('reason')) ? t('grid.giveReopenReason') : formErrorText(e) }),
      },
    );
  };
  const rows = [...data.weeks].reverse();
  // Open weeks (reporting not over) show their partial count and no statistic (the server sends none).
  const columns = 11;
  return (
    <div className="space-y-2">
      {message ? <FormMessage kind={message.kind}>{message.text}</FormMessage> : null}
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
                            aria-expanded={confirming?.week === w.week && confirming.kind === 'close'}
                            onClick={() => {
                              setMessage(null);
                              setConfirming({ week: w.week, kind: 'close' });
                            }}
                          >
                            {t('signals.closeWeek')}
                          </button>
                        ) : null}
                        {data.canClose && w.closed ? (
                          <button
                            type="button"
                            className="btn btn-secondary btn-small"
                            aria-expanded={confirming?.week === w.week && confirming.kind === 'reopen'}
                            onClick={() => {
                              setMessage(null);
                              setConfirming({ week: w.week, kind: 'reopen' });
                            }}
                          >
                            {t('signals.reopenWeek')}
                          </button>
                        ) : null}
                      </span>
                    </td>
                  </tr>
                  {confirming?.week === w.week && confirming.kind === 'close' ? (
                    <tr className="row-detail">
                      <td colSpan={columns}>
                        <div role="group" aria-labelledby={`close-confirm-${w.week}`} className="notice notice-info space-y-2">
                          <p id={`close-confirm-${w.week}`} className="text-sm">
                            {t('grid.confirmClose', { week: label(w.week), district: data.district.name })}
                          </p>
                          <div className="flex flex-wrap gap-2">
                            <button type="button" className="btn btn-primary btn-small" disabled={close.isPending} onClick={() => closeWeek(w.week)}>
                              {t('grid.confirmCloseButton')}
                            </button>
                            <button type="button" className="btn btn-secondary btn-small" onClick={() => setConfirming(null)}>
                              {t('grid.cancel')}
                            </button>
                          </div>
                        </div>
                      </td>
                    </tr>
                  ) : null}
                  {confirming?.week === w.week && confirming.kind === 'reopen' ? (
                    <tr className="row-detail">
                      <td colSpan={columns}>
                        <form
                          className="notice notice-info space-y-2"
                          aria-labelledby={`reopen-title-${w.week}`}
                          onSubmit={(e) => {
                            e.preventDefault();
                            reopenWeek(w.week);
                          }}
                        >
                          <p id={`reopen-title-${w.week}`} className="text-sm">
                            {t('grid.reopenExplain', { week: label(w.week), district: data.district.name })}
                          </p>
                          <div className="field">
                            <label htmlFor={`reopen-reason-${w.week}`} className="field-label">
                              {t('grid.reopenReason')}
                            </label>
                            <input id={`reopen-reason-${w.week}`} className="input" value={reopenReason} onChange={(e) => setReopenReason(e.currentTarget.value)} required minLength={3} />
                          </div>
                          <div className="flex flex-wrap gap-2">
                            <button type="submit" className="btn btn-primary btn-small" disabled={reopen.isPending}>
                              {t('grid.confirmReopenButton')}
                            </button>
                            <button type="button" className="btn btn-secondary btn-small" onClick={() => setConfirming(null)}>
                              {t('grid.cancel')}
                            </button>
                          </div>
                        </form>
                      </td>
                    </tr>
                  ) : null}
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
