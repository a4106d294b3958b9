import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { profileDto, type ProfileDto, type ProfileVariantBody } from '../../../../shared/api/profiles.schema';
import { FormMessage, SelectField, TextField } from '../../../components/form';
import { api, isApiError } from '../../../lib/api-client';
import { formErrorText } from '../../../lib/form-errors';
import { useFormat } from '../../../i18n/format';
import { profileLabel } from '../../district-file/district-file-format';
import { parameterOption } from '../parameter-words';

/** POST /api/profiles/:id/variants (admin) — a local copy of a published profile with one sourced change. */
export function VariantForm({ profiles }: { profiles: ProfileDto[] }) {
  const { t } = useTranslation(['profiles', 'district-file']);
  const f = useFormat();
  const queryClient = useQueryClient();
  const published = profiles.filter((p) => p.kind === 'published');
  const [baseId, setBaseId] = useState(published[0]?.id ?? '');
  const base = published.find((p) => p.id === baseId);
  const numeric = (base?.parameters ?? []).filter((p) => typeof p.value === 'number');
  const [path, setPath] = useState('');
  const [form, setForm] = useState({ id: '', name: '', value: '', source: '', reason: '' });
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<{ kind: 'error' | 'success'; text: string } | null>(null);
  const create = useMutation({
    mutationFn: (body: ProfileVariantBody) => api.post(`/api/profiles/${encodeURIComponent(baseId)}/variants`, body, profileDto),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['profiles'] }),
  });
  const chosenPath = path || numeric[0]?.path || '';
  const set = (k: keyof typeof form) => (e: React.ChangeEvent<HTMLInputElement>) => setForm({ ...form, [k]: e.currentTarget.value });

  const onSubmit = async (e: React.FormEvent) => {
    e.preventDefault();
    setMessage(null);
    setErrors({});
    try {
      const saved = await create.mutateAsync({
        id: form.id.trim(), name: form.name, reason: form.reason,
        changes: [{ path: chosenPath, value: form.value.trim() === '' ? undefined : Number(form.value), source: form.source }],
      });
      setMessage({ kind: 'success', text: t('variant.saved', { name: saved.name }) });
    } catch (error) {
      const next: Record<string, string> = {};
      if (isApiError(error)) {
        for (const f of error.fields) {
          const key = f.path.startsWith('changes.0.') ? f.path.slice('changes.0.'.length) : f.path;
          next[key] = f.message;
        }
      }
      setErrors(next);
      setMessage({ kind: 'error', text: formErrorText(error) });
    }
  };

  return (
    <form onSubmit={onSubmit} noValidate className="card space-y-3" aria-labelledby="variant-title">
      <h2 id="variant-title" className="text-lg font-bold">{t('variant.title')}</h2>
      <p className="text-sm text-ink-muted">{t('variant.lead')}</p>
      {message ? <FormMessage kind={message.kind}>{message.text}</FormMessage> : null}
      <SelectField label={t('variant.base')} value={baseId} onChange={(e) => { setBaseId(e.currentTarget.value); setPath(''); }}>
        {published.map((p) => <option key={p.id} value={p.id}>{profileLabel({ t }, { profileId: p.id, profileName: p.name })}</option>)}
      </SelectField>
      <TextField label={t('variant.id')} hint={t('variant.idHint')} value={form.id} onChange={set('id')} error={errors.id} />
      <TextField label={t('variant.name')} value={form.name} onChange={set('name')} error={errors.name} />
      <SelectField label={t('variant.parameter')} value={chosenPath} onChange={(e) => setPath(e.currentTarget.value)} error={errors.path}>
        {numeric.map((p) => <option key={p.path} value={p.path}>{parameterOption(t, f, p)}</option>)}
      </SelectField>
      <TextField label={t('variant.value')} type="number" step="any" value={form.value} onChange={set('value')} error={errors.value} />
      <TextField label={t('variant.source')} hint={t('variant.sourceHint')} value={form.source} onChange={set('source')} error={errors.source} />
      <TextField label={t('variant.reason')} value={form.reason} onChange={set('reason')} error={errors.reason} />
      <button type="submit" className="btn btn-primary btn-small" disabled={create.isPending}>{t('variant.submit')}</button>
    </form>
  );
}
