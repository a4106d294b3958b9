import { useEffect, useState, type FormEvent } from 'react';
import { useTranslation } from 'react-i18next';
import { FormMessage, TextField } from '../../../components/form';
import { errorText } from '../../../lib/error-text';
import { useFieldSettings, useSaveFieldSettings } from '../api/field-settings.api';

/** The admin's switch: a supervisor must approve the Field week before the teams are mailed (changed with a reason). */
export function FieldApprovalForm() {
  const { t } = useTranslation('field-week');
  const current = useFieldSettings();
  const save = useSaveFieldSettings();
  const [on, setOn] = useState<boolean | null>(null);
  const [reason, setReason] = useState('');
  useEffect(() => {
    if (current.data && on === null) setOn(current.data.approvalRequired);
  }, [current.data, on]);
  const onSave = (e: FormEvent) => {
    e.preventDefault();
    save.mutate({ approvalRequired: on ?? false, reason: reason.trim() }, { onSuccess: () => setReason('') });
  };
  return (
    <section aria-labelledby="field-approval-title" className="card space-y-4">
      <h2 id="field-approval-title" className="text-lg font-bold">{t('approval.title')}</h2>
      {current.isError ? <FormMessage kind="error">{errorText(current.error)}</FormMessage> : !current.data ? null : (
        <form className="space-y-4" onSubmit={onSave}>
          <label className="flex items-center gap-2">
            <input type="checkbox" className="checkbox" checked={on ?? false} onChange={(e) => setOn(e.currentTarget.checked)} />
            <span>{t('approval.required')}</span>
          </label>
          <TextField label={t('approval.reason')} required minLength={3} maxLength={500} value={reason} onChange={(e) => setReason(e.currentTarget.value)} />
          {save.isError && <FormMessage kind="error">{errorText(save.error)}</FormMessage>}
          {save.isSuccess && <FormMessage kind="success">{t('approval.saved')}</FormMessage>}
          <button type="submit" className="btn btn-primary" disabled={save.isPending || reason.trim().length < 3}>{t('approval.save')}</button>
        </form>
      )}
    </section>
  );
}
