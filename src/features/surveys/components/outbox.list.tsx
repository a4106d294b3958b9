import type { OutboxItem } from '../offline-queue';

/** The surveys kept on this device and not yet accepted by the server. */
export function OutboxList({ items, onRetry, onDiscard }: { items: OutboxItem[]; onRetry: () => void; onDiscard: (id: string) => void }) {
  return (
    <section aria-labelledby="outbox-title" className="space-y-2" data-testid="survey-outbox">
      <h2 id="outbox-title" className="section-title">
        Waiting to be sent
      </h2>
      {items.length === 0 ? (
        <p className="text-sm text-ink-muted">Nothing waiting: every survey saved on this device has reached Broodcast.</p>
      ) : (
        <>
          <ul className="space-y-2">
            {items.map((item) => (
              <li key={item.survey.id} className="rounded-md border border-line bg-surface p-3 text-sm">
                <p className="font-bold">
                  {item.survey.locality} · {item.survey.date}
                </p>
                <p className="text-ink-muted">
                  {item.problem?.kind === 'refused'
                    ? `Not accepted: ${item.problem.message}`
                    : item.problem?.message ?? 'Kept on this device; sending…'}
                </p>
                {item.problem?.fields?.length ? (
                  <ul className="mt-1 list-disc pl-5">
                    {item.problem.fields.map((f) => (
                      <li key={f.path}>
                        <code className="font-mono">{f.path}</code>: {f.message}
                      </li>
                    ))}
                  </ul>
                ) : null}
                {item.problem?.kind === 'refused' ? (
                  <button type="button" className="btn btn-secondary btn-small mt-2" onClick={() => onDiscard(item.survey.id)}>
                    Discard this survey
                  </button>
                ) : null}
              </li>
            ))}
          </ul>
          <button type="button" className="btn btn-secondary btn-small" onClick={onRetry}>
            Send now
          </button>
        </>
      )}
    </section>
  );
}
