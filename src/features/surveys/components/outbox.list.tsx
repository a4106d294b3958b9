import { useTranslation } from 'react-i18next';
import { useFormat } from '../../../i18n/format';
import type { OutboxItem } from '../offline-queue';
import { FIELD_LABEL_KEYS, surveyMessage } from '../survey-format';

/** Why a kept survey has not reached the server yet, in the interface language. */
function problemText(t: ReturnType<typeof useTranslation<'surveys'>>['t'], problem: OutboxItem['problem']): string {
  if (!problem) return t('outbox.sending');
  if (problem.kind === 'refused') return t('outbox.refused', { message: problem.message });
  if (problem.code === 'no-connection') return t('outbox.offline');
  if (problem.code === 'sign-in') return t('outbox.signIn');
  if (problem.code === 'server') return t('outbox.serverProblem', { message: problem.message });
  return problem.message; // kept by an earlier version of the outbox
}

/** The surveys kept on this device and not yet accepted by the server. */
export function OutboxList({ items, onRetry, onDiscard }: { items: OutboxItem[]; onRetry: () => void; onDiscard: (id: string) => void }) {
  const { t } = useTranslation('surveys');
  const { date } = useFormat();
  return (
    <section aria-labelledby="outbox-title" className="space-y-2" data-testid="survey-outbox">
      <h2 id="outbox-title" className="section-title">
        {t('outbox.title')}
      </h2>
      {items.length === 0 ? (
        <p className="text-sm text-ink-muted">{t('outbox.empty')}</p>
      ) : (
        <>
          <ul className="space-y-2">
            {items.map((item) => (
              <li key={item.survey.id} className="min-w-0 break-words rounded-md border border-line bg-surface p-3 text-sm">
                <p className="font-bold">
                  {item.survey.locality} · {date(item.survey.date)}
                </p>
                <p className="text-ink-muted">{problemText(t, item.problem)}</p>
                {item.problem?.fields?.length ? (
                  <ul className="mt-1 list-disc pl-5">
                    {item.problem.fields.map((f) => {
                      const field = f.path.replace(/^body\./, '').split('.')[0];
                      const labelKey = FIELD_LABEL_KEYS[field];
                      return (
                        <li key={f.path}>
                          {labelKey ? (
                            surveyMessage(t, t(labelKey), f.message)
                          ) : (
                            <>
                              <code className="font-mono">{f.path}</code>: {f.message}
                            </>
                          )}
                        </li>
                      );
                    })}
                  </ul>
                ) : null}
                {item.problem?.kind === 'refused' ? (
                  <button type="button" className="btn btn-secondary btn-small mt-2" onClick={() => onDiscard(item.survey.id)}>
                    {t('outbox.discard')}
                  </button>
                ) : null}
              </li>
            ))}
          </ul>
          <button type="button" className="btn btn-secondary btn-small" onClick={onRetry}>
            {t('outbox.sendNow')}
          </button>
        </>
      )}
    </section>
  );
}
