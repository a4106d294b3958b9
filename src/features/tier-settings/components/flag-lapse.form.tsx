import { useEffect, useState, type FormEvent } from 'react';
import { useTranslation } from 'react-i18next';
import { FormMessage, TextField } from '../../../components/form';
import { useFormat } from '../../../i18n/format';
import { errorText } from '../../../lib/error-text';
import { useFlagSettings } from '../api/flag-settings.api';
import { useSaveFlagSettings } from '../api/save-flag-settings.api';

/**
 * How many weeks an open flag waits for sign-off before it lapses (GET/PUT /api/flag-settings, admin):
 * the value in force with who changed it last, and a change with its reason (audited by the server).
 */
export function FlagLapseForm() {
  const { t } = useTranslation('tier-settings');
  const f = useFormat();
  const current = useFlagSettings();
  const save = useSaveFlagSettings();
  const [weeks, setWeeks] = useState('');
  const [reason, setReason] = useState('');
  useEffect(() => {
    if (current.data && weeks === '') setWeeks(String(current.data.lapseWeeks));
  }, [current.data, weeks]);

  const n = Number(weeks);
  const valid = Number.isInteger(n) && n >= 1 && n <= 26;
  const onSave = (e: FormEvent) => {
    e.preventDefault();
    if (valid) save.mutate({ lapseWeeks: n, reason: reason.trim() }, { onSuccess: () => setReason('') });
  };

  return (
    <section aria-labelledby="flag-lapse-title" className="card space-y-4">
      <h2 id="flag-lapse-title" className="text-lg font-bold">
        {t('flagLapse.title')}
      </h2>
      <p className="text-sm text-ink-muted">{t('flagLapse.lead')}</p>
      {current.isError ? (
        <FormMessage kind="error">{errorText(current.error)}</FormMessage>
      ) : !current.data ? (
        <p className="text-ink-muted">{t('flagLapse.loading')}</p>
      ) : (
        <form className="space-y-4" onSubmit={onSave}>
          <p data-lapse-weeks={current.data.lapseWeeks}>
            {t('flagLapse.current', { count: current.data.lapseWeeks })}{' '}
            {current.data.updatedAt
              ? t('flagLapse.changed', { who: current.data.updatedBy?.displayName ?? '—', when: f.dateTime(current.data.updatedAt) })
              : t('flagLapse.neverChanged')}
          </p>
          <TextField
            label={t('flagLapse.weeks')}
            hint={t('flagLapse.weeksHint')}
            type="number"
            inputMode="numeric"
            min={1}
            max={26}
            step={1}
            required
            value={weeks}
            onChange={(e) => {
              setWeeks(e.target.value);
              save.reset();
            }}
          />
          <TextField
            label={t('flagLapse.reason')}
            hint={t('flagLapse.reasonHint')}
            required
            minLength={3}
            maxLength={500}
            value={reason}
            onChange={(e) => setReason(e.target.value)}
          />
          {save.isError && <FormMessage kind="error">{errorText(save.error)}</FormMessage>}
          {save.isSuccess && <FormMessage kind="success">{t('flagLapse.saved', { count: save.data.lapseWeeks })}</FormMessage>}
          <button type="submit" className="btn btn-primary" disabled={save.isPending || !valid || reason.trim().length < 3}>
            {save.isPending ? t('flagLapse.saving') : t('flagLapse.save')}
          </button>
        </form>
      )}
    </section>
  );
}
