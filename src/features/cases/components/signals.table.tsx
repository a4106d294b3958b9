import { Fragment, useState } from 'react';
import { CHANNEL_ZONE_LABELS } from '../../../../shared/signals/endemic-channel';
import type { SignalsResponse } from '../../../../shared/api/cases.schema';
import { FormMessage } from '../../../components/form';
import { formErrorText } from '../../../lib/form-errors';
import { useCloseWeek } from '../api/close-week.api';
import { formatNumber } from '../case-format';
import { RevisionHistory } from './revision-history';

const flag = (s: { statistic: number | null; alarm: boolean | null }) =>
  s.statistic === null ? '—' : `${s.statistic.toFixed(2)}${s.alarm ? ' · alarm' : ''}`;

/** The season week by week: count, incidence, channel, zone, C1–C3, CUSUM, growth; history and closing on demand. */
export function SignalsTable({ data, today }: { data: SignalsResponse; today: string }) {
  const [open, setOpen] = useState<string | null>(null);
  const close = useCloseWeek();
  const [message, setMessage] = useState<string | null>(null);
  const rows = [...data.weeks].reverse();
  const columns = 11;
  return (
    <div className="space-y-2">
      {message ? <FormMessage kind="error">{message}</FormMessage> : null}
      <div className="table-wrap">
        <table className="data-table" data-testid="signals-table">
          <caption className="table-caption">
            {data.disease.name} in {data.district.name}, {data.year}, most recent week first
          </caption>
          <thead>
            <tr>
              <th scope="col">Week</th>
              <th scope="col">Cases</th>
              <th scope="col">Per 100,000</th>
              <th scope="col">Channel (lower – centre – upper)</th>
              <th scope="col">Zone</th>
              <th scope="col">C1</th>
              <th scope="col">C2</th>
              <th scope="col">C3</th>
              <th scope="col">CUSUM</th>
              <th scope="col">Week on week</th>
              <th scope="col">Record</th>
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
                      W{w.week} <span className="text-xs text-ink-muted">{w.start}</span>
                    </th>
                    <td className="tabular-nums">{w.cases ?? '—'}</td>
                    <td className="tabular-nums">{formatNumber(w.incidence, 2)}</td>
                    <td className="tabular-nums whitespace-nowrap">
                      {w.channel ? `${formatNumber(w.channel.lower, 1)} – ${formatNumber(w.channel.centre, 1)} – ${formatNumber(w.channel.upper, 1)}` : '—'}
                    </td>
                    <td>{w.zone ? CHANNEL_ZONE_LABELS[w.zone] : '—'}</td>
                    <td className="tabular-nums whitespace-nowrap">{flag(w.c1)}</td>
                    <td className="tabular-nums whitespace-nowrap">{flag(w.c2)}</td>
                    <td className="tabular-nums whitespace-nowrap">{flag(w.c3)}</td>
                    <td className="tabular-nums whitespace-nowrap">{flag(w.cusum)}</td>
                    <td className="tabular-nums whitespace-nowrap">
                      {w.growth.percent === null ? '—' : `${w.growth.percent > 0 ? '+' : ''}${w.growth.percent.toFixed(0)} %`}
                      {w.growth.doublingWeeks !== null ? <span className="block text-xs text-ink-muted">doubles in {w.growth.doublingWeeks.toFixed(1)} wk</span> : null}
                    </td>
                    <td className="whitespace-nowrap text-sm">
                      {[w.closed ? 'closed' : 'open', w.late ? 'late' : null].filter(Boolean).join(', ')}
                      <span className="mt-1 flex gap-1">
                        {w.countId && data.canReadHistory ? (
                          <button
                            type="button"
                            className="btn btn-secondary btn-small"
                            aria-expanded={open === w.countId}
                            onClick={() => setOpen(open === w.countId ? null : w.countId)}
                          >
                            History
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
                            Close week
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
