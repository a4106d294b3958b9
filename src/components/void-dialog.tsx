import { useId, useState, type FormEvent } from 'react';
import { useTranslation } from 'react-i18next';
import { VOID_REASON_MAX } from '../../shared/api/void.schema';
import { errorText } from '../lib/error-text';
import { FieldError, FormMessage } from './form';

/**
 * "Void" with a required reason: for an entry made in error (a survey, a case count, a weather day).
 * Voiding never deletes: the entry stays readable in its history and the audit trail and stops counting.
 * A button that opens an inline dialog (no modal layer: it stays in the page's reading order).
 */
export function VoidAction({ what, onVoid }: { what: string; onVoid: (reason: string) => Promise<unknown> }) {
  const { t } = useTranslation('components');
  const id = useId();
  const [open, setOpen] = useState(false);
  const [reason, setReason] = useState('');
  const [missing, setMissing] = useState(false);
  const [error, setError] = useState<unknown>(null);
  const [busy, setBusy] = useState(false);

  const submit = async (e: FormEvent) => {
    e.preventDefault();
    if (!reason.trim()) {
      setMissing(true);
      return;
    }
    setBusy(true);
    setError(null);
    try {
      await onVoid(reason.trim());
      setOpen(false);
      setReason('');
    } catch (err) {
      setError(err);
    } finally {
      setBusy(false);
    }
  };

  if (!open)
    return (
      <button type="button" className="btn btn-secondary btn-small" onClick={() => setOpen(true)} aria-haspopup="dialog">
        {t('void.open')}
      </button>
    );
  return (
    <div role="dialog" aria-labelledby={`${id}-title`} className="card space-y-2">
      <h3 id={`${id}-title`} className="font-bold">{t('void.title', { what })}</h3>
      <p className="text-sm">{t('void.explain')}</p>
      <form onSubmit={submit} noValidate className="space-y-2">
        <div className="field">
          <label htmlFor={`${id}-reason`} className="field-label">{t('void.reason')}</label>
          <textarea
            id={`${id}-reason`}
            className="input"
            rows={2}
            maxLength={VOID_REASON_MAX}
            value={reason}
            aria-invalid={missing ? true : undefined}
            aria-describedby={missing ? `${id}-reason-error` : undefined}
            onChange={(e) => {
              setReason(e.currentTarget.value);
              setMissing(false);
            }}
          />
          <FieldError id={`${id}-reason-error`} label={t('void.reason')} message={missing ? 'is required' : undefined} />
        </div>
        <FormMessage kind="error">{error ? errorText(error) : null}</FormMessage>
        <div className="flex flex-wrap gap-2">
          <button type="submit" className="btn btn-primary" disabled={busy}>{busy ? t('void.voiding') : t('void.confirm')}</button>
          <button type="button" className="btn btn-secondary" onClick={() => setOpen(false)} disabled={busy}>{t('void.cancel')}</button>
        </div>
      </form>
    </div>
  );
}
