import { Link, useParams } from 'react-router-dom';
import { FormMessage } from '../../components/form';
import { PageHeading } from '../../components/page-heading';
import { useSession } from '../../app/session';
import { useFlag } from './api/flags.api';
import { DecisionForm } from './components/decision.form';
import { FlagSummary } from './components/flag-summary';
import { formatWhen, historyLabel } from './flag-format';

/** One flag with its whole history (who raised, approved or rejected it, when, and what changed). */
export function FlagPage() {
  const { id = '' } = useParams();
  const me = useSession();
  const detail = useFlag(id);
  return (
    <section aria-labelledby="page-title">
      <PageHeading>Flag</PageHeading>
      {detail.isPending ? (
        <p className="text-ink-muted">Loading the flag…</p>
      ) : detail.isError ? (
        <FormMessage kind="error">{detail.error.message}</FormMessage>
      ) : (
        <div className="space-y-6">
          <div className="card space-y-3">
            <FlagSummary flag={detail.data.flag} />
            {me.role === 'supervisor' ? <DecisionForm flag={detail.data.flag} /> : null}
            <p className="text-sm">
              <Link className="link" to={`/districts/${detail.data.flag.districtId}`}>
                Open the District file
              </Link>
            </p>
          </div>
          <div className="table-wrap">
            <table className="data-table">
              <caption className="table-caption">History</caption>
              <thead>
                <tr>
                  <th scope="col">When</th>
                  <th scope="col">What</th>
                  <th scope="col">Who</th>
                  <th scope="col">Reason or detail</th>
                </tr>
              </thead>
              <tbody>
                {detail.data.history.length === 0 ? (
                  <tr>
                    <td colSpan={4} className="text-ink-muted">
                      No recorded steps yet.
                    </td>
                  </tr>
                ) : (
                  detail.data.history.map((h, i) => (
                    <tr key={i}>
                      <td>{formatWhen(h.at)}</td>
                      <td>{historyLabel(h.action)}</td>
                      <td>{h.actor?.displayName ?? 'The season run'}</td>
                      <td>{h.reason ?? describe(h.after)}</td>
                    </tr>
                  ))
                )}
              </tbody>
            </table>
          </div>
        </div>
      )}
    </section>
  );
}

function describe(after: unknown): string {
  if (!after || typeof after !== 'object') return '—';
  const a = after as Record<string, unknown>;
  if (typeof a.recipients === 'number') return `${a.recipients} recipient${a.recipients === 1 ? '' : 's'}`;
  if (a.edited === true) return 'Message edited before approval';
  return '—';
}
