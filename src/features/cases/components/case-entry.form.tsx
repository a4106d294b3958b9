import { useMemo, useState } from 'react';
import { useForm, type FieldError } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { caseEntryFormSchema, type CaseEntryForm, type CasesSettings, type DiseaseDto } from '../../../../shared/api/cases.schema';
import type { DistrictRef } from '../../../../shared/api/auth.schema';
import { FormMessage, SelectField, TextField } from '../../../components/form';
import { applyServerFieldErrors, formErrorText } from '../../../lib/form-errors';
import { usePutCount } from '../api/put-count.api';

const numberError = (error: FieldError | undefined, empty: string) =>
  error ? (error.type === 'invalid_type' ? empty : error.message) : undefined;
const optionalNumber = (v: unknown) => (v === '' || v === null || v === undefined ? null : Number(v));

/** One district's count for one week, with the optional confirmed / probable split. */
export function CaseEntryForm({ districts, diseases, settings }: { districts: DistrictRef[]; diseases: DiseaseDto[]; settings: CasesSettings }) {
  const schema = useMemo(() => caseEntryFormSchema(settings.epiWeekSystem, settings.today), [settings]);
  const put = usePutCount();
  const [message, setMessage] = useState<{ kind: 'error' | 'success'; text: string } | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<CaseEntryForm>({
    resolver: zodResolver(schema),
    defaultValues: {
      districtId: districts[0]?.id ?? '',
      diseaseId: diseases[0]?.id ?? '',
      year: settings.currentWeek.year,
      week: settings.currentWeek.week,
      confirmed: null,
      probable: null,
      reason: '',
    },
  });

  const onSubmit = handleSubmit(async (values) => {
    setMessage(null);
    const { districtId, reason, ...rest } = values;
    try {
      const result = await put.mutateAsync({ districtId, body: { ...rest, ...(reason?.trim() ? { reason: reason.trim() } : {}), source: 'form' } });
      const district = districts.find((d) => d.id === districtId);
      const what = { created: 'Saved', corrected: 'Corrected', unchanged: 'Nothing changed for' }[result.outcome];
      setMessage({
        kind: 'success',
        text: `${what} ${district?.code ?? ''} week ${values.week} of ${values.year}: ${result.count.cases} cases${result.count.late ? ' (received late)' : ''}.`,
      });
    } catch (error) {
      const unmatched = applyServerFieldErrors(error, setError, ['districtId', 'diseaseId', 'year', 'week', 'cases', 'confirmed', 'probable', 'reason']);
      setMessage({ kind: 'error', text: formErrorText(error, unmatched) });
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3" aria-labelledby="entry-title">
      <h2 id="entry-title" className="section-title">
        Enter a week’s count
      </h2>
      {message ? <FormMessage kind={message.kind}>{message.text}</FormMessage> : null}
      <div className="grid gap-3 sm:grid-cols-2">
        <SelectField label="District" error={errors.districtId?.message} {...register('districtId')}>
          {districts.map((d) => (
            <option key={d.id} value={d.id}>
              {d.code} — {d.name}
            </option>
          ))}
        </SelectField>
        <SelectField label="Disease" error={errors.diseaseId?.message} {...register('diseaseId')}>
          {diseases.map((d) => (
            <option key={d.id} value={d.id}>
              {d.name}
            </option>
          ))}
        </SelectField>
        <TextField label="Year" type="number" inputMode="numeric" error={numberError(errors.year, 'Enter the epidemiological year.')} {...register('year', { valueAsNumber: true })} />
        <TextField
          label="Week"
          type="number"
          inputMode="numeric"
          min={1}
          max={53}
          hint={settings.epiWeekSystem === 'iso' ? 'ISO weeks, Monday to Sunday.' : 'Epidemiological weeks, Sunday to Saturday.'}
          error={numberError(errors.week, 'Enter the week number.')}
          {...register('week', { valueAsNumber: true })}
        />
        <TextField label="Cases" type="number" inputMode="numeric" min={0} step={1} error={numberError(errors.cases, 'Enter the cases as a whole number (0 if none).')} {...register('cases', { valueAsNumber: true })} />
        <TextField label="Confirmed (optional)" type="number" inputMode="numeric" min={0} step={1} error={numberError(errors.confirmed, 'Enter a whole number or leave it empty.')} {...register('confirmed', { setValueAs: optionalNumber })} />
        <TextField label="Probable (optional)" type="number" inputMode="numeric" min={0} step={1} error={numberError(errors.probable, 'Enter a whole number or leave it empty.')} {...register('probable', { setValueAs: optionalNumber })} />
        <TextField
          label="Reason (for a correction)"
          hint="Needed when the week already has a count, or is closed."
          error={errors.reason?.message}
          {...register('reason')}
        />
      </div>
      <button type="submit" className="btn btn-primary" disabled={isSubmitting}>
        {isSubmitting ? 'Saving…' : 'Save the count'}
      </button>
    </form>
  );
}
