import { useTranslation } from 'react-i18next';
import type { TFunction } from 'i18next';
import { useFormat } from '../../../i18n/format';
import type { OutboxItem } from '../offline-queue';
import { FIELD_LABEL_KEYS, surveyMessage } from '../survey-format';

/**
 * How an outbox's items are worded: the namespace holding its `outbox.*` texts (title, empty, sending,
 * offline, signIn, serverProblem, refused, discard, sendNow), the label key of each field the server may
 * name, and how a field's problem reads as a sentence. Surveys are the default.
 */
export type OutboxWords = {
  namespace: 'surveys' | 'field-log';
  labelKeys: Record<string, string>;
  message: (t: TFunction, label: string, message: string | undefined) => string | undefined;
  testId: string;
};

const SURVEY_WORDS: OutboxWords = {
  namespace: 'surveys',
  labelKeys: FIELD_LABEL_KEYS,
  message: (t, label, message) => surveyMessage(t as TFunction<'surveys'>, label, message),
  testId: 'survey-outbox',
};

/** Why a kept item has not reached the server yet, in the interface language. */
function problemText(t: TFunction, problem: OutboxItem['problem']): string {
  if (!problem) return t('outbox.sending');
  if (problem.kind === 'refused') return t('outbox.refused', { message: problem.message });
  if (problem.code === 'no-connection') return t('outbox.offline');
  if (problem.code === 'sign-in') return t('outbox.signIn');
  if (problem.code === 'server') return t('outbox.serverProblem', { message: problem.message });
  return problem.message; // kept by an earlier version of the outbox
}

/** What is kept on this device and not yet accepted by the server (surveys, or field records with `words`). */
export function OutboxList<B extends { id: string; locality: string; date: string }>({
  items,
  onRetry,
  onDiscard,
  words = SURVEY_WORDS,
}: {
  items: OutboxItem<B>[];
  onRetry: () => void;
  onDiscard: (id: string) => void;
  words?: OutboxWords;
}) {
  const { t } = useTranslation(words.namespace) as unknown as { t: TFunction };
  const { date } = useFormat();
  return (
    <section aria-labelledby={`${words.testId}-title`} className="space-y-2" data-testid={words.testId}>
      <h2 id={`${words.testId}-title`} className="section-title">
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
                      const labelKey = words.labelKeys[field];
                      return (
                        <li key={f.path}>
                          {labelKey ? (
                            words.message(t, t(labelKey), f.message)
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
