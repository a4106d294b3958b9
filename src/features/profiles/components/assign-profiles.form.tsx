import { useMemo, useState } from 'react';
import { useTranslation } from 'react-i18next';
import { assignProfilesBody } from '../../../../shared/api/profiles.schema';
import type { DistrictDto } from '../../../../shared/api/districts.schema';
import { SearchPicker } from '../../../components/search-picker';
import { CheckboxGroup, FormMessage, TextField } from '../../../components/form';
import { formErrorText } from '../../../lib/form-errors';
import { isApiError } from '../../../lib/api-client';
import { useAssignProfiles, useProfiles } from '../api/profiles.api';

type Errors = Record<string, string>;

/**
 * Assign vector profiles (each with an optional biofix MM-DD) to the chosen districts, with a reason.
 * The assignment replaces what the districts had; the next season run recomputes them.
 */
export function AssignProfilesForm({ districts }: { districts: DistrictDto[] }) {
  const { t } = useTranslation('profiles');
  const profiles = useProfiles();
  const assign = useAssignProfiles();
  const [districtIds, setDistrictIds] = useState<string[]>([]);
  const [profileIds, setProfileIds] = useState<string[]>([]);
  const [biofix, setBiofix] = useState<Record<string, string>>({});
  const [reason, setReason] = useState('');
  const [errors, setErrors] = useState<Errors>({});
  const [message, setMessage] = useState<{ kind: 'error' | 'success'; text: string } | null>(null);
  // Only published profiles are assignable: the season run computes from the shipped library.
  const districtOptions = useMemo(() => districts.map((d) => ({ value: d.id, label: `${d.code} – ${d.name}` })), [districts]);
  const assignable = (profiles.data ?? []).filter((p) => p.kind === 'published');

  const fieldOf = (path: string) => {
    if (path.startsWith('districtIds')) return 'districtIds';
    const m = /^profiles\.(\d+)\.biofix$/.exec(path);
    if (m) return `biofix.${profileIds[Number(m[1])]}`;
    if (path.startsWith('profiles')) return 'profiles';
    if (path.startsWith('reason')) return 'reason';
    return null;
  };

  const onSubmit = async (e: React.FormEvent) => {
    e.preventDefault();
    setMessage(null);
    const body = {
      districtIds,
      profiles: profileIds.map((profileId) => ({ profileId, biofix: biofix[profileId]?.trim() ? biofix[profileId].trim() : null })),
      reason,
    };
    const parsed = assignProfilesBody.safeParse(body);
    const next: Errors = {};
    if (districtIds.length === 0) next.districtIds = t('assign.pickDistricts');
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const f = fieldOf(issue.path.join('.'));
        if (f && !next[f]) next[f] = f.startsWith('biofix.') ? t('assign.biofixInvalid') : f === 'reason' ? t('assign.reasonMissing') : issue.message;
      }
    }
    setErrors(next);
    if (Object.keys(next).length > 0 || !parsed.success) return;
    try {
      const res = await assign.mutateAsync(parsed.data);
      setMessage({ kind: 'success', text: t('assign.saved', { count: res.updated }) });
    } catch (error) {
      const server: Errors = {};
      if (isApiError(error)) for (const p of error.fields) { const f = fieldOf(p.path); if (f) server[f] = p.message; }
      setErrors(server);
      setMessage({ kind: 'error', text: formErrorText(error) });
    }
  };

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3" aria-labelledby="assign-profiles-title">
      <h3 id="assign-profiles-title" className="font-bold">{t('assign.title')}</h3>
      <p className="text-sm text-ink-muted">{t('assign.lead')}</p>
      {message ? <FormMessage kind={message.kind}>{message.text}</FormMessage> : null}
      <SearchPicker
        legend={t('assign.districts')}
        options={districtOptions}
        value={districtIds}
        onChange={setDistrictIds}
        error={errors.districtIds}
      />
      <CheckboxGroup
        legend={t('assign.profiles')}
        options={assignable.map((p) => ({ value: p.id, label: p.name }))}
        value={profileIds}
        onChange={setProfileIds}
        error={errors.profiles}
        hint={t('assign.profilesHint')}
      />
      {profileIds.map((id) => {
        const p = assignable.find((x) => x.id === id);
        return (
          <TextField
            key={id}
            label={t('assign.biofix', { profile: p?.name ?? id })}
            hint={t('assign.biofixHint', { default: p?.defaultBiofix ?? '' })}
            placeholder="MM-DD"
            value={biofix[id] ?? ''}
            onChange={(e) => setBiofix({ ...biofix, [id]: e.currentTarget.value })}
            error={errors[`biofix.${id}`]}
          />
        );
      })}
      <TextField label={t('assign.reason')} value={reason} onChange={(e) => setReason(e.currentTarget.value)} error={errors.reason} />
      <button type="submit" className="btn btn-primary btn-small" disabled={assign.isPending}>
        {assign.isPending ? t('assign.saving') : t('assign.submit')}
      </button>
    </form>
  );
}
