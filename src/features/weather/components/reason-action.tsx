import { useState, type FormEvent } from 'react';
import { useTranslation } from 'react-i18next';
import { VOID_REASON_MAX } from '../../../../shared/api/void.schema';
import { FormMessage, TextField } from '../../../components/form';
import { errorText } from '../../../lib/error-text';

/**
 * A button that opens an inline form asking why (required), then acts: confirming a held day, keeping a
 * hand correction or taking the incoming value. Inline, so it stays in the page's reading order.
 */
export function ReasonAction({ label, title, onAct, primary }: { label: string; title: string; onAct: (reason: string) => Promise<unknown>; primary?: boolean }) {
  const { t } = useTranslation('weather');
  const [open, setOpen] = useState(false);
  const [reason, setReason] = useState('');
  const [missing, setMissing] = useState(false);
  const [error, setError] = useState<unknown>(null);
  const [busy, setBusy] = useState(false);
  const submit = async (e: FormEvent) => {
    e.preventDefault();
    if (!reason.trim()) return setMissing(true);
    setBusy(true);
    setError(null);
    try {
      await onAct(reason.trim());
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
      <button type="button" className={`btn btn-small ${primary ? 'btn-primary' : 'btn-secondary'}`} onClick={() => setOpen(true)}>
        {label}
      </button>
    );
  return (
    <form onSubmit={submit} noValidate className="space-y-2" aria-label={title}>
      <TextField
        label={t('review.reason')}
        value={reason}
        maxLength={VOID_REASON_MAX}
        error={missing ? t('review.reasonRequired') : undefined}
        onChange={(e) => {
          setReason(e.currentTarget.value);
          setMissing(false);
        }}
      />
      {error ? <FormMessage kind="error">{errorText(error)}</FormMessage> : null}
      <div className="flex flex-wrap gap-2">
        <button type="submit" className="btn btn-primary btn-small" disabled={busy}>
          {label}
        </button>
        <button type="button" className="btn btn-secondary btn-small" disabled={busy} onClick={() => setOpen(false)}>
          {t('review.cancel')}
        </button>
      </div>
    </form>
  );
}
