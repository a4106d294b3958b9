import { useEffect, useState, type FormEvent } from 'react';
import { useTranslation } from 'react-i18next';
import { DRIVERS, TIERS, type TierSettings } from '../../../shared/tier/tier-settings';
import { FormMessage, TextField } from '../../components/form';
import { PageHeading } from '../../components/page-heading';
import { errorText } from '../../lib/error-text';
import { usePreviewTierSettings } from './api/preview-tier-settings.api';
import { useSaveTierSettings } from './api/save-tier-settings.api';
import { useTierSettings } from './api/tier-settings.api';
import { FieldApprovalForm } from '../field-week/components/field-approval.form';
import { FlagLapseForm } from './components/flag-lapse.form';

const CUTS = ['raised', 'high', 'critical'] as const;

/**
 * The tier's weights and cut points (admin): edit, preview how this week's Ladder would change (a dry run
 * that writes nothing), then save with a reason; every version stays in the history. Below them, how long
 * an open flag waits for sign-off before it lapses (FlagLapseForm).
 */
export function TierSettingsPage() {
  const { t } = useTranslation('tier-settings');
  const current = useTierSettings();
  const preview = usePreviewTierSettings();
  const save = useSaveTierSettings();
  const [draft, setDraft] = useState<TierSettings | null>(null);
  const [reason, setReason] = useState('');
  useEffect(() => {
    if (current.data && !draft) setDraft(current.data.settings);
  }, [current.data, draft]);

  const setNumber = (group: 'weights' | 'cuts', key: string, value: string) => {
    if (!draft) return;
    setDraft({ ...draft, [group]: { ...draft[group], [key]: Number(value) } });
    preview.reset();
    save.reset();
  };
  const onSave = (e: FormEvent) => {
    e.preventDefault();
    if (draft) save.mutate({ settings: draft, reason }, { onSuccess: () => setReason('') });
  };

  return (
    <section aria-labelledby="page-title">
      <PageHeading lead={t('lead')}>{t('title')}</PageHeading>
      {current.isPending || !draft ? (
        current.isError ? <FormMessage kind="error">{errorText(current.error)}</FormMessage> : <p className="text-ink-muted">{t('loading')}</p>
      ) : (
        <div className="space-y-8">
          <form className="card space-y-4" onSubmit={onSave}>
            <fieldset>
              <legend className="font-bold">{t('weights')}</legend>
              <div className="grid gap-3 sm:grid-cols-4">
                {DRIVERS.map((d) => (
                  <TextField key={d} label={t(`driver.${d}`)} type="number" step="any" min={0} max={10} value={draft.weights[d]}
                    onChange={(e) => setNumber('weights', d, e.target.value)} />
                ))}
              </div>
            </fieldset>
            <fieldset>
              <legend className="font-bold">{t('cuts')}</legend>
              <p className="field-hint">{t('cutsHint')}</p>
              <div className="grid gap-3 sm:grid-cols-3">
                {CUTS.map((c) => (
                  <TextField key={c} label={t(`tier.${c}`)} type="number" step="any" min={0.01} max={0.99} value={draft.cuts[c]}
                    onChange={(e) => setNumber('cuts', c, e.target.value)} />
                ))}
              </div>
            </fieldset>
            <div className="flex flex-wrap gap-3">
              <button type="button" className="btn btn-secondary" disabled={preview.isPending} onClick={() => preview.mutate({ settings: draft })}>
                {preview.isPending ? t('previewing') : t('preview')}
              </button>
            </div>
            {preview.isError && <FormMessage kind="error">{errorText(preview.error)}</FormMessage>}
            {preview.data && (
              <div aria-live="polite">
                <p>{t('previewWeek', { week: preview.data.epiWeek ?? '–', year: preview.data.epiYear ?? '–', count: preview.data.changes.length, total: preview.data.districts })}</p>
                {preview.data.changes.length > 0 && (
                  <table className="table">
                    <caption className="sr-only">{t('changesCaption')}</caption>
                    <thead>
                      <tr><th scope="col">{t('district')}</th><th scope="col">{t('from')}</th><th scope="col">{t('to')}</th></tr>
                    </thead>
                    <tbody>
                      {preview.data.changes.map((c) => (
                        <tr key={c.districtId}>
                          <th scope="row">{c.name} ({c.code})</th>
                          <td>{t(`tier.${c.from}`)} ({c.scoreFrom})</td>
                          <td>{t(`tier.${c.to}`)} ({c.scoreTo})</td>
                        </tr>
                      ))}
                    </tbody>
                  </table>
                )}
              </div>
            )}
            <TextField label={t('reason')} hint={t('reasonHint')} required minLength={3} maxLength={500} value={reason} onChange={(e) => setReason(e.target.value)} />
            {save.isError && <FormMessage kind="error">{errorText(save.error)}</FormMessage>}
            {save.isSuccess && <FormMessage kind="success">{t('saved', { version: save.data.version })}</FormMessage>}
            <button type="submit" className="btn btn-primary" disabled={save.isPending || reason.trim().length < 3}>
              {save.isPending ? t('saving') : t('save')}
            </button>
          </form>
          <FlagLapseForm />
          <FieldApprovalForm />
          <section aria-labelledby="history-title" className="card">
            <h2 id="history-title" className="text-lg font-bold">{t('history')}</h2>
            {current.data!.history.length === 0 ? (
              <p>{t('noHistory')}</p>
            ) : (
              <div className="overflow-x-auto">
                <table className="table">
                  <thead>
                    <tr>
                      <th scope="col">{t('version')}</th><th scope="col">{t('when')}</th><th scope="col">{t('who')}</th>
                      <th scope="col">{t('weights')}</th><th scope="col">{t('cuts')}</th><th scope="col">{t('reason')}</th>
                    </tr>
                  </thead>
                  <tbody>
                    {current.data!.history.map((v) => (
                      <tr key={v.version}>
                        <th scope="row">{v.version}</th>
                        <td>{new Date(v.createdAt).toLocaleString()}</td>
                        <td>{v.changedByName ?? ''}</td>
                        <td>{DRIVERS.map((d) => `${t(`driver.${d}`)} ${v.settings.weights[d]}`).join(', ')}</td>
                        <td>{TIERS.slice(1).map((c) => `${t(`tier.${c}`)} ${v.settings.cuts[c as (typeof CUTS)[number]]}`).join(', ')}</td>
                        <td>{v.reason}</td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
            )}
          </section>
        </div>
      )}
    </section>
  );
}
