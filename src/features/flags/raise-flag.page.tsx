import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { ACTION_CAUTION, ACTION_IDS, ACTIONS, type ActionId } from '../../../shared/api/flags.schema';
import { CheckboxGroup, FormMessage, SelectField } from '../../components/form';
import { PageHeading } from '../../components/page-heading';
import { useSession } from '../../app/session';
import { isApiError } from '../../lib/api-client';
import { useDistricts } from '../districts/api/districts.api';
import { useRaiseFlag } from './api/decide-flag.api';

/** Raise a flag by hand (health officer: any district; epidemiologist: assigned districts). */
export function RaiseFlagPage() {
  const me = useSession();
  const districts = useDistricts();
  const raise = useRaiseFlag();
  const navigate = useNavigate();
  const [districtId, setDistrictId] = useState('');
  const [note, setNote] = useState('');
  const [message, setMessage] = useState('');
  const [actions, setActions] = useState<string[]>([...ACTION_IDS]);
  const allowed = (districts.data ?? []).filter((d) => me.role !== 'epidemiologist' || me.districts.some((m) => m.id === d.id));
  const fieldError = (path: string) => (isApiError(raise.error) ? raise.error.fieldMessage(path) : undefined);

  return (
    <section aria-labelledby="page-title">
      <PageHeading lead="Saw something the season run cannot: a cluster of fevers, a flooded neighbourhood? Raise a flag; a supervisor signs it off before anything is sent.">
        Raise a flag
      </PageHeading>
      <form
        className="card max-w-2xl space-y-4"
        onSubmit={(e) => {
          e.preventDefault();
          raise.mutate(
            { districtId, note: note.trim(), actions: actions as ActionId[], ...(message.trim() ? { message: message.trim() } : {}) },
            { onSuccess: (flag) => navigate(`/flags/${flag.id}`) },
          );
        }}
      >
        <FormMessage kind="error">{raise.error?.message}</FormMessage>
        <SelectField label="District" value={districtId} onChange={(e) => setDistrictId(e.currentTarget.value)} error={fieldError('districtId')} required>
          <option value="">Choose a district</option>
          {allowed.map((d) => (
            <option key={d.id} value={d.id}>
              {d.name} ({d.code})
            </option>
          ))}
        </SelectField>
        <div className="field">
          <label htmlFor="flag-note" className="field-label">
            What did you see?
          </label>
          <textarea id="flag-note" className="input" value={note} onChange={(e) => setNote(e.currentTarget.value)} maxLength={1000} required />
        </div>
        <div className="field">
          <label htmlFor="flag-message" className="field-label">
            Proposed advisory message (optional: Broodcast writes one from the tier and drivers)
          </label>
          <textarea id="flag-message" className="input min-h-24" value={message} onChange={(e) => setMessage(e.currentTarget.value)} maxLength={2000} />
        </div>
        <CheckboxGroup
          legend="Suggested actions"
          options={ACTION_IDS.map((a) => ({ value: a, label: ACTIONS[a].title }))}
          value={actions}
          onChange={setActions}
          hint={ACTION_CAUTION}
          error={fieldError('actions')}
        />
        <button type="submit" className="btn btn-primary" disabled={raise.isPending || !districtId || note.trim().length < 3 || actions.length === 0}>
          {raise.isPending ? 'Raising…' : 'Raise the flag'}
        </button>
      </form>
    </section>
  );
}
