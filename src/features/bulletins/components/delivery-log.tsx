import { FormMessage } from '../../../components/form';
import { formatWhen } from '../../flags/flag-format';
import { useOutbox } from '../api/bulletins.api';

const STATUS_WORDS = { pending: 'Waiting to send', sent: 'Sent', failed: 'Failed' } as const;

/** Mail as the outbox sees it: sent, waiting (with its next try) and failed, with every attempt. */
export function DeliveryLog() {
  const outbox = useOutbox();
  if (outbox.isPending) return <p className="text-ink-muted">Loading the delivery log…</p>;
  if (outbox.isError) return <FormMessage kind="error">{outbox.error.message}</FormMessage>;
  const { counts, messages } = outbox.data;
  return (
    <div className="space-y-2">
      <p className="text-sm">
        {counts.sent} sent · {counts.pending} waiting · {counts.failed} failed
      </p>
      <div className="table-wrap">
        <table className="data-table">
          <caption className="table-caption">Delivery log (newest 100; failed and waiting first)</caption>
          <thead>
            <tr>
              <th scope="col">Queued</th>
              <th scope="col">Kind</th>
              <th scope="col">To</th>
              <th scope="col">Subject</th>
              <th scope="col">Status</th>
              <th scope="col">Attempts</th>
            </tr>
          </thead>
          <tbody>
            {messages.length === 0 ? (
              <tr>
                <td colSpan={6} className="text-ink-muted">
                  No mail yet.
                </td>
              </tr>
            ) : (
              messages.map((m) => (
                <tr key={m.id}>
                  <td>{formatWhen(m.createdAt)}</td>
                  <td>{m.kind}</td>
                  <td>{m.to}</td>
                  <td>{m.subject}</td>
                  <td>
                    {STATUS_WORDS[m.status]}
                    {m.status === 'pending' && m.nextAttemptAt ? ` (next try ${formatWhen(m.nextAttemptAt)})` : ''}
                    {m.sentAt ? ` ${formatWhen(m.sentAt)}` : ''}
                  </td>
                  <td>
                    {m.attempts}
                    {m.log.some((l) => l.error) ? (
                      <details>
                        <summary className="cursor-pointer text-sm">Errors</summary>
                        <ul className="text-sm">
                          {m.log.map((l, i) => (
                            <li key={i}>
                              {formatWhen(l.at)}: {l.outcome}
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
