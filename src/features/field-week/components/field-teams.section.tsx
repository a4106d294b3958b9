import { useMemo, useState } from 'react';
import { useTranslation } from 'react-i18next';
import type { FieldTeamDto } from '../../../../shared/api/field.schema';
import { WORK_KINDS, type WorkKind } from '../../../../shared/field/work-kinds';
import { CheckboxGroup, FormMessage, TextField } from '../../../components/form';
import { isApiError } from '../../../lib/api-client';
import { errorText } from '../../../lib/error-text';
import { useDistricts } from '../../districts/api/districts.api';
import { useCreateFieldTeam } from '../api/create-field-team.api';
import { useFieldTeamCandidates } from '../api/field-team-candidates.api';
import { useFieldTeams } from '../api/field-teams.api';
import { useRetireFieldTeam } from '../api/retire-field-team.api';
import { useUpdateFieldTeam } from '../api/update-field-team.api';
import { SearchPicker } from '../../../components/search-picker';

interface Draft {
  name: string;
  base: string[];
  kinds: string[];
  days: string;
  members: string[];
}
const EMPTY: Draft = { name: '', base: [], kinds: [], days: '4', members: [] };
const draftOf = (team: FieldTeamDto): Draft => ({
  name: team.name, base: [team.baseDistrict.id], kinds: team.kinds, days: String(team.daysPerWeek), members: team.members.map((m) => m.id),
});

/**
 * The field teams the officer keeps: the list (retired teams last), and one form to add a team or change
 * the one being edited. Base district and members are searchable pickers (a region may have thousands of
 * districts). The server checks everything again and names the field it refuses.
 */
export function FieldTeamsSection() {
  const { t } = useTranslation('field-week');
  const { t: tApp } = useTranslation('app');
  const teams = useFieldTeams();
  const districts = useDistricts();
  const people = useFieldTeamCandidates();
  const create = useCreateFieldTeam();
  const update = useUpdateFieldTeam();
  const retire = useRetireFieldTeam();
  const [editing, setEditing] = useState<string | null>(null);
  const [draft, setDraft] = useState<Draft>(EMPTY);
  const [done, setDone] = useState<string | null>(null);
  const [confirmRetire, setConfirmRetire] = useState<string | null>(null);
  const saving = editing ? update : create;
  const fieldError = (path: string) => (isApiError(saving.error) ? saving.error.fieldMessage(path) : undefined);
  const set = (patch: Partial<Draft>) => setDraft((d) => ({ ...d, ...patch }));

  const districtItems = useMemo(() => (districts.data ?? []).map((d) => ({ value: d.id, label: `${d.name} · ${d.code}` })), [districts.data]);
  const peopleItems = useMemo(() => {
    const list = (people.data ?? []).map((p) => ({ value: p.id, label: `${p.displayName} · ${tApp(`roles.${p.role}`)}` }));
    // Members already on the team being edited stay listed even if the candidates list no longer has them.
    const team = teams.data?.find((x) => x.id === editing);
    for (const m of team?.members ?? []) if (!list.some((p) => p.value === m.id)) list.push({ value: m.id, label: `${m.displayName} · ${tApp(`roles.${m.role}`)}` });
    return list;
  }, [people.data, teams.data, editing, tApp]);

  const startEdit = (team: FieldTeamDto) => {
    create.reset();
    update.reset();
    setDone(null);
    setEditing(team.id);
    setDraft(draftOf(team));
  };
  const stopEdit = () => {
    update.reset();
    setEditing(null);
    setDraft(EMPTY);
  };

  const onSubmit = (e: React.FormEvent) => {
    e.preventDefault();
    setDone(null);
    // Sent as typed: the server's schema refuses what is wrong and names the field (no days, no kind, no base).
    const body = { name: draft.name, baseDistrictId: draft.base[0] ?? '', kinds: draft.kinds as WorkKind[], daysPerWeek: draft.days.trim() === '' ? Number.NaN : Number(draft.days), memberIds: draft.members };
    const onSuccess = (team: FieldTeamDto) => {
      setDone(t(editing ? 'teams.saved' : 'teams.added', { name: team.name }));
      setEditing(null);
      setDraft(EMPTY);
    };
    if (editing) update.mutate({ id: editing, body }, { onSuccess });
    else create.mutate(body, { onSuccess });
  };

  return (
    <div className="card mb-6 space-y-4" id="teams">
      <h2 className="section-title">{t('teams.title')}</h2>
      {teams.data?.length ? (
        <ul className="divide-y divide-line" aria-label={t('teams.title')}>
          {teams.data.map((team) => (
            <li key={team.id} className="flex flex-wrap items-center gap-x-3 gap-y-1 py-2" data-team={team.name}>
              <div className="min-w-0 flex-1">
                <strong>{team.name}</strong>
                {team.retiredAt ? <span className="ml-2 text-sm text-ink-muted">({t('teams.retired')})</span> : null}
                <br />
                <small>
                  {t('teamLine', { base: team.baseDistrict.name, days: team.daysPerWeek })}
                  {' · '}
                  {team.kinds.map((k) => t(`kinds.${k}`)).join(', ')}
                  {' · '}
                  {team.members.length ? team.members.map((m) => m.displayName).join(', ') : t('teams.noMembers')}
                </small>
              </div>
              {team.retiredAt ? null : (
                <div className="flex gap-2">
                  <button type="button" className="btn btn-secondary" onClick={() => startEdit(team)} aria-label={t('teams.editOne', { name: team.name })}>{t('teams.edit')}</button>
                  {confirmRetire === team.id ? (
                    <>
                      <button type="button" className="btn btn-primary" onClick={() => retire.mutate(team.id, { onSuccess: () => { setConfirmRetire(null); setDone(t('teams.retiredDone', { name: team.name })); if (editing === team.id) stopEdit(); } })} disabled={retire.isPending}>
                        {t('teams.retireConfirm')}
                      </button>
                      <button type="button" className="btn btn-secondary" onClick={() => setConfirmRetire(null)}>{t('teams.cancel')}</button>
                    </>
                  ) : (
                    <button type="button" className="btn btn-secondary" onClick={() => setConfirmRetire(team.id)} aria-label={t('teams.retireOne', { name: team.name })}>{t('teams.retire')}</button>
                  )}
                </div>
              )}
            </li>
          ))}
        </ul>
      ) : teams.isSuccess ? <p>{t('noTeams')}</p> : null}
      {confirmRetire ? <p className="text-sm">{t('teams.retireHint')}</p> : null}
      <FormMessage kind="error">{retire.error ? errorText(retire.error) : null}</FormMessage>

      <form onSubmit={onSubmit} className="space-y-3" noValidate aria-labelledby="team-form-title">
        <h3 className="font-bold" id="team-form-title">{editing ? t('teams.editTitle', { name: teams.data?.find((x) => x.id === editing)?.name ?? '' }) : t('teams.add')}</h3>
        <TextField label={t('teams.name')} value={draft.name} onChange={(e) => set({ name: e.currentTarget.value })} error={fieldError('name')} required maxLength={80} />
        <SearchPicker legend={t('teams.base')} hint={t('teams.baseHint')} options={districtItems} value={draft.base} onChange={(base) => set({ base: base.slice(-1) })} error={fieldError('baseDistrictId')} />
        <CheckboxGroup legend={t('teams.kinds')} options={WORK_KINDS.map((k) => ({ value: k, label: t(`kinds.${k}`) }))} value={draft.kinds} onChange={(kinds) => set({ kinds })} error={fieldError('kinds')} />
        <TextField label={t('teams.days')} hint={t('teams.daysHint')} type="number" min={1} max={7} step={1} inputMode="numeric" value={draft.days} onChange={(e) => set({ days: e.currentTarget.value })} error={fieldError('daysPerWeek')} />
        <SearchPicker legend={t('teams.people')} hint={t('teams.peopleHint')} options={peopleItems} value={draft.members} onChange={(members) => set({ members })} error={fieldError('memberIds')} />
        <FormMessage kind="error">{saving.error ? errorText(saving.error) : null}</FormMessage>
        <FormMessage kind="success">{done}</FormMessage>
        <div className="flex flex-wrap gap-3">
          <button type="submit" className="btn btn-primary" disabled={saving.isPending}>{saving.isPending ? t('saving') : editing ? t('teams.save') : t('teams.submit')}</button>
          {editing ? <button type="button" className="btn btn-secondary" onClick={stopEdit}>{t('teams.cancel')}</button> : null}
        </div>
      </form>
    </div>
  );
}
