import { useId, useState } from 'react';
import { useTranslation } from 'react-i18next';
import { FormMessage, TextField } from '../../../components/form';
import { errorText } from '../../../lib/error-text';
import { useDemoSummary } from '../api/demo-summary.api';
import { useRemoveDemo } from '../api/remove-demo.api';

/**
 * Removing the invented demo region (issue 17): shown only while demo data is left. The admin first sees what
 * goes (districts and all their data, stations and their weather; the demo's people are deactivated), gives a
 * reason for the audit trail and confirms; nothing happens before that.
 */
export function RemoveDemoPanel() {
  const { t } = useTranslation('districts');
  const id = useId();
  const summary = useDemoSummary();
  const remove = useRemoveDemo();
  const [asking, setAsking] = useState(false);
  const [reason, setReason] = useState('');
  const [done, setDone] = useState<string | null>(null);
  const s = summary.data;
  if (done) return <FormMessage kind="success">{done}</FormMessage>;
  if (!s || (s.districts === 0 && s.stations === 0)) return null;

  const confirm = async () => {
    const out = await remove.mutateAsync({ confirm: true, reason }).catch(() => null);
    if (out) setDone(t('removeDemo.done', { districts: out.districts, stations: out.stations, users: out.usersDeactivated }));
  };

  return (
    <section aria-labelledby={`${id}-title`} className="space-y-3" data-testid="remove-demo">
      <h2 id={`${id}-title`} className="section-title">
        {t('removeDemo.title')}
      </h2>
      <p className="text-sm text-ink-muted">{t('removeDemo.lead')}</p>
      {!asking ? (
        <button type="button" className="btn btn-secondary" onClick={() => setAsking(true)}>
          {t('removeDemo.start')}
        </button>
      ) : (
        <div role="alertdialog" aria-labelledby={`${id}-ask`} className="space-y-3">
          <p id={`${id}-ask`} className="font-bold">
            {t('removeDemo.ask', { districts: s.districts, stations: s.stations, users: s.users })}
          </p>
          <TextField label={t('removeDemo.reason')} value={reason} onChange={(e) => setReason(e.currentTarget.value)} autoComplete="off" />
          {remove.isError ? <FormMessage kind="error">{errorText(remove.error)}</FormMessage> : null}
          <div className="flex flex-wrap gap-2">
            <button type="button" className="btn btn-primary" disabled={!reason.trim() || remove.isPending} onClick={() => void confirm()}>
              {remove.isPending ? t('removeDemo.removing') : t('removeDemo.confirm')}
            </button>
            <button type="button" className="btn btn-secondary" onClick={() => setAsking(false)}>
              {t('removeDemo.keep')}
            </button>
          </div>
        </div>
      )}
    </section>
  );
}
