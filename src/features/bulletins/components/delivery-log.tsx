import { useTranslation } from 'react-i18next';
import { FormMessage } from '../../../components/form';
import { useFormat } from '../../../i18n/format';
import { errorText } from '../../../lib/error-text';
import { useOutbox } from '../api/bulletins.api';

/** Mail as the outbox sees it: sent, waiting (with its next try) and failed, with every attempt. */
export function DeliveryLog() {
  const { t } = useTranslation('bulletins');
  const f = useFormat();
  const outbox = useOutbox();
  if (outbox.isPending) return <p className="text-ink-muted">{t('log.loading')}</p>;
  if (outbox.isError) return <FormMessage kind="error">{errorText(outbox.error)}</FormMessage>;
  const { counts, messages } = outbox.data;
  return (
    <div className="space-y-2">
      <p className="text-sm">
        {t('log.counts', { sent: f.number(counts.sent), pending: f.number(counts.pending), failed: f.number(counts.failed) })}
      </p>
      <div className="table-wrap">
        <table className="data-table">
          <caption className="table-caption">{t('log.caption')}</caption>
          <thead>
            <tr>
              <th scope="col">{t('log.queued')}</th>
              <th scope="col">{t('log.kind')}</th>
              <th scope="col">{t('log.to')}</th>
              <th scope="col">{t('log.subject')}</th>
              <th scope="col">{t('log.status')}</th>
              <th scope="col">{t('log.attempts')}</th>
            </tr>
          </thead>
          <tbody>
            {messages.length === 0 ? (
              <tr>
                <td colSpan={6} className="text-ink-muted">
                  {t('log.empty')}
                </td>
              </tr>
            ) : (
              messages.map((m) => (
                <tr key={m.id}>
                  <td>{f.dateTime(m.createdAt)}</td>
                  <td>{t(`kinds.${m.kind}`)}</td>
                  <td>{m.to}</td>
                  <td>{m.subject}</td>
                  <td>
                    {t(`statuses.${m.status}`)}
                    {m.status === 'pending' && m.nextAttemptAt ? ` ${t('log.nextTry', { when: f.dateTime(m.nextAttemptAt) })}` : ''}
                    {m.sentAt ? ` ${f.dateTime(m.sentAt)}` : ''}
                  </td>
                  <td>
                    {f.number(m.attempts)}
                    {m.log.some((l) => l.error) ? (
                      <details>
                        <summary className="cursor-pointer text-sm">{t('log.errors')}</summary>
                        <ul className="text-sm">
                          {m.log.map((l, i) => (
                            <li key={i}>
                              {f.dateTime(l.at)}: {t(`outcomes.${l.outcome}`)}
                              {l.error ? ` — ${l.error}` : ''}
                            </li>
                          ))}
                        </ul>
                      </details>
                    ) : null}
                  </td>
                </tr>
              ))
            )}
          </tbody>
        </table>
      </div>
    </div>
  );
}
