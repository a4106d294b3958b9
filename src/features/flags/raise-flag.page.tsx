import { useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { useNavigate } from 'react-router-dom';
import { ACTION_IDS, type ActionId } from '../../../shared/api/flags.schema';
import { CheckboxGroup, FormMessage, SelectField } from '../../components/form';
import { PageHeading } from '../../components/page-heading';
import { useSession } from '../../app/session';
import { isApiError } from '../../lib/api-client';
import { useDistricts } from '../districts/api/districts.api';
import { useRaiseFlag } from './api/decide-flag.api';
import { useFlagFormat } from './flag-format';

/** The raise-flag body's messages (shared/api/flags.schema.ts) as sentences naming the field. */
const KNOWN: Record<string, string> = {
  'is required': 'required',
  'must be at least 10 characters': 'minMessage',
  'must be at most 2,000 characters': 'maxMessage',
  'must say why (3 characters or more)': 'why',
  'choose at least one action': 'oneAction',
};

/** Raise a flag by hand (health officer: any district; epidemiologist: assigned districts). */
export function RaiseFlagPage() {
  const f = useFlagFormat();
  const { t } = f;
  const me = useSession();
  const districts = useDistricts();
  const raise = useRaiseFlag();
  const navigate = useNavigate();
  const [search] = useSearchParams();
  // Opened from a District file or the Ladder (?district=…), the district is already chosen.
  const [districtId, setDistrictId] = useState(search.get('district') ?? '');
  const [note, setNote] = useState('');
  const [message, setMessage] = useState('');
  const [actions, setActions] = useState<string[]>([...ACTION_IDS]);
  const allowed = (districts.data ?? []).filter((d) => me.role !== 'epidemiologist' || me.districts.some((m) => m.id === d.id));
  const fieldError = (path: string, label: string) => {
    const message = isApiError(raise.error) ? raise.error.fieldMessage(path) : undefined;
    return message && KNOWN[message] ? t(`validation.${KNOWN[message]}`, { field: label }) : message;
  };

  return (
    <section aria-labelledby="page-title">
      <PageHeading lead={t('raise.lead')}>{t('raise.title')}</PageHeading>
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
        <SelectField label={t('raise.district')} value={districtId} onChange={(e) => setDistrictId(e.currentTarget.value)} error={fieldError('districtId', t('raise.district'))} required>
          <option value="">{t('raise.chooseDistrict')}</option>
          {allowed.map((d) => (
            <option key={d.id} value={d.id}>
              {d.name} ({d.code})
            </option>
          ))}
        </SelectField>
        <div className="field">
          <label htmlFor="flag-note" className="field-label">
            {t('raise.note')}
          </label>
          <textarea id="flag-note" className="input" value={note} onChange={(e) => setNote(e.currentTarget.value)} maxLength={1000} required />
        </div>
        <div className="field">
          <label htmlFor="flag-message" className="field-label">
            {t('raise.message')}
          </label>
          <textarea id="flag-message" className="input min-h-24" value={message} onChange={(e) => setMessage(e.currentTarget.value)} maxLength={2000} />
        </div>
        <CheckboxGroup
          legend={t('raise.actions')}
          options={ACTION_IDS.map((a) => ({ value: a, label: t(`action.${a}.title`) }))}
          value={actions}
          onChange={setActions}
          hint={f.caution()}
          error={fieldError('actions', t('raise.actions'))}
        />
        {(() => {
          // A disabled button says why: the first thing still missing.
          const missing = !districtId ? t('raise.needDistrict') : note.trim().length < 3 ? t('raise.needNote') : actions.length === 0 ? t('raise.needAction') : null;
          return (
            <>
              <button type="submit" className="btn btn-primary" disabled={raise.isPending || missing !== null} aria-describedby={missing ? 'raise-missing' : undefined}>
                {raise.isPending ? t('raise.raising') : t('raise.submit')}
              </button>
              {missing ? (
                <p id="raise-missing" className="text-sm text-ink-muted">
                  {missing}
                </p>
              ) : null}
            </>
          );
        })()}
      </form>
    </section>
  );
}
