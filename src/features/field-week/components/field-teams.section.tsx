import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { WORK_KINDS, type WorkKind } from '../../../../shared/field/work-kinds';
import { CheckboxGroup, FormMessage, SelectField, TextField } from '../../../components/form';
import { isApiError } from '../../../lib/api-client';
import { errorText } from '../../../lib/error-text';
import { useDistricts } from '../../districts/api/districts.api';
import { useCreateFieldTeam } from '../api/create-field-team.api';
import { useFieldTeamCandidates } from '../api/field-team-candidates.api';
import { useFieldTeams } from '../api/field-teams.api';

/** The field teams the officer keeps, and a form to add one. */
export function FieldTeamsSection() {
  const { t } = useTranslation('field-week');
  const teams = useFieldTeams();
  const districts = useDistricts();
  const people = useFieldTeamCandidates();
  const create = useCreateFieldTeam();
  const [name, setName] = useState('');
  const [base, setBase] = useState('');
  const [kinds, setKinds] = useState<string[]>([]);
  const [days, setDays] = useState('4');
  const [members, setMembers] = useState<string[]>([]);
  const [done, setDone] = useState<string | null>(null);
  const fieldError = (path: string) => (isApiError(create.error) ? create.error.fieldMessage(path) : undefined);

  const onSubmit = (e: React.FormEvent) => {
    e.preventDefault();
    setDone(null);
    create.mutate(
      { name, baseDistrictId: base, kinds: kinds as WorkKind[], daysPerWeek: Number(days), memberIds: members },
      {
        onSuccess: (team) => {
          setDone(t('teams.added', { name: team.name }));
          setName('');
          setKinds([]);
          setMembers([]);
        },
      },
    );
  };

  return (
    <div className="card mb-6 space-y-4">
      <h2 className="section-title">{t('teams.title')}</h2>
      {teams.data?.length ? (
        <ul className="space-y-1">
          {teams.data.map((team) => (
            <li key={team.id}>
              <strong>{team.name}</strong>
              {' · '}
              {t('teamLine', { base: team.baseDistrict.name, days: team.daysPerWeek })}
              {' · '}
              {team.kinds.map((k) => t(`kinds.${k}`)).join(', ')}
              {' · '}
              {t('teams.members', { count: team.members.length })}
            </li>
          ))}
        </ul>
      ) : teams.isSuccess ? <p>{t('noTeams')}</p> : null}

      <form onSubmit={onSubmit} className="space-y-3" noValidate>
        <h3 className="font-bold">{t('teams.add')}</h3>
        <TextField label={t('teams.name')} value={name} onChange={(e) => setName(e.currentTarget.value)} error={fieldError('name')} required />
        <SelectField label={t('teams.base')} value={base} onChange={(e) => setBase(e.currentTarget.value)} error={fieldError('baseDistrictId')} required>
          <option value="">{t('teams.pickBase')}</option>
          {(districts.data ?? []).map((d) => <option key={d.id} value={d.id}>{d.name}</option>)}
        </SelectField>
        <CheckboxGroup legend={t('teams.kinds')} options={WORK_KINDS.map((k) => ({ value: k, label: t(`kinds.${k}`) }))} value={kinds} onChange={setKinds} error={fieldError('kinds')} />
        <TextField label={t('teams.days')} type="number" min={1} max={7} inputMode="numeric" value={days} onChange={(e) => setDays(e.currentTarget.value)} error={fieldError('daysPerWeek')} />
        <CheckboxGroup legend={t('teams.people')} options={(people.data ?? []).map((p) => ({ value: p.id, label: p.displayName }))} value={members} onChange={setMembers} />
        <FormMessage kind="error">{create.error ? errorText(create.error) : null}</FormMessage>
        <FormMessage kind="success">{done}</FormMessage>
        <button type="submit" className="btn btn-primary" disabled={create.isPending}>{create.isPending ? t('saving') : t('teams.submit')}</button>
      </form>
    </div>
  );
}
