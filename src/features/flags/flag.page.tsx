import { Link, useParams } from 'react-router-dom';
import { FormMessage } from '../../components/form';
import { PageHeading } from '../../components/page-heading';
import { useSession } from '../../app/session';
import { useFlag } from './api/flags.api';
import { DecisionForm } from './components/decision.form';
import { FlagSummary } from './components/flag-summary';
import { useFlagFormat } from './flag-format';
import { errorText } from '../../lib/error-text';
import { may } from '../../../shared/permissions';

/** One flag with its whole history (who raised, approved or rejected it, when, and what changed). */
export function FlagPage() {
  const { id = '' } = useParams();
  const f = useFlagFormat();
  const { t } = f;
  const me = useSession();
  const detail = useFlag(id);
  return (
    <section aria-labelledby="page-title">
      <PageHeading>{t('flag.title')}</PageHeading>
      {detail.isPending ? (
        <p className="text-ink-muted">{t('flag.loading')}</p>
      ) : detail.isError ? (
        <FormMessage kind="error">{errorText(detail.error)}</FormMessage>
      ) : (
        <div className="space-y-6">
          <div className="card space-y-3">
            <FlagSummary flag={detail.data.flag} />
            {may(me.role, 'flags.signOff') ? <DecisionForm flag={detail.data.flag} /> : null}
            <p className="text-sm">
              <Link className="link" to={`/districts/${detail.data.flag.districtId}`}>
                {t('flag.openFile')}
              </Link>
            </p>
          </div>
          <div className="table-wrap">
            <table className="data-table">
              <caption className="table-caption">{t('flag.historyCaption')}</caption>
              <thead>
                <tr>
                  <th scope="col">{t('flag.when')}</th>
                  <th scope="col">{t('flag.what')}</th>
                  <th scope="col">{t('flag.who')}</th>
                  <th scope="col">{t('flag.detail')}</th>
                </tr>
              </thead>
              <tbody>
                {detail.data.history.length === 0 ? (
                  <tr>
                    <td colSpan={4} className="text-ink-muted">
                      {t('flag.noSteps')}
                    </td>
                  </tr>
                ) : (
                  detail.data.history.map((h, i) => (
                    <tr key={i}>
                      <td>{f.formatWhen(h.at)}</td>
                      <td>{f.historyLabel(h.action)}</td>
                      <td>{h.actor?.displayName ?? t('seasonRun')}</td>
                      <td>{h.reason ?? describe(t, h.after)}</td>
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

function describe(t: ReturnType<typeof useFlagFormat>['t'], after: unknown): string {
  if (!after || typeof after !== 'object') return '—';
  const a = after as Record<string, unknown>;
  if (typeof a.recipients === 'number') return t('history.recipients', { count: a.recipients });
  if (a.edited === true) return t('history.edited');
  return '—';
}
