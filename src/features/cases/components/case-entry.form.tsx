import { useEffect, useMemo, useState } from 'react';
import { useTranslation } from 'react-i18next';
import { useForm, type FieldError } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { caseEntryFormSchema, type CaseEntryForm, type CasesSettings, type DiseaseDto } from '../../../../shared/api/cases.schema';
import type { DistrictRef } from '../../../../shared/api/auth.schema';
import { FormMessage, SelectField, TextField } from '../../../components/form';
import { applyServerFieldErrors, formErrorText } from '../../../lib/form-errors';
import { usePutCount } from '../api/put-count.api';
import { useStoredCount } from '../api/stored-count.api';
import { caseMessage } from '../case-format';

const optionalNumber = (v: unknown) => (v === '' || v === null || v === undefined ? null : Number(v));

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const SPLIT_FIELDS = ['cases', 'confirmed', 'probable'] as const;

/**
 * One district's count for one week, with the optional confirmed / probable split. Once district,
 * disease, year and week name a week that already holds a count, the form loads it (total, confirmed,
 * probable) into every field the person has not touched, so a correction changes only what the person
 * changes; the age bands, which this form does not show, are left out of the body and so kept as stored.
 */
export function CaseEntryForm({ districts, diseases, settings }: { districts: DistrictRef[]; diseases: DiseaseDto[]; settings: CasesSettings }) {
  const { t } = useTranslation('cases');
  const numberError = (label: string, error: FieldError | undefined, empty: string) =>
    error ? (error.type === 'invalid_type' ? empty : caseMessage(t, label, error.message)) : undefined;
  const textError = (label: string, error: FieldError | undefined) => caseMessage(t, label, error?.message);
  const schema = useMemo(() => caseEntryFormSchema(settings.epiWeekSystem, settings.today), [settings]);
  const put = usePutCount();
  const [message, setMessage] = useState<{ kind: 'error' | 'success'; text: string } | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    watch,
    getFieldState,
    resetField,
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

  const [districtId, diseaseId, year, week] = watch(['districtId', 'diseaseId', 'year', 'week']);
  const keyValid =
    UUID.test(districtId ?? '') && UUID.test(diseaseId ?? '') && Number.isInteger(year) && year >= 1990 && year <= 2100 &&
    Number.isInteger(week) && week >= 1 && week <= 53;
  const stored = useStoredCount({ districtId, diseaseId, year, week }, keyValid);
  const record = keyValid && stored.data?.count && !stored.data.count.voided ? stored.data.count : null;
  const recordKey = keyValid && stored.data ? `${districtId}:${diseaseId}:${year}:${week}:${record?.version ?? 0}` : null;
  useEffect(() => {
    if (!recordKey) return;
    // A field the person typed in keeps what they typed; every other field shows the stored value (or empties).
    const values = { cases: record?.cases, confirmed: record?.confirmed ?? null, probable: record?.probable ?? null };
    for (const f of SPLIT_FIELDS) if (!getFieldState(f).isDirty) resetField(f, { defaultValue: values[f] as never });
    // Runs once per stored version (recordKey), not on every render of `record`.
  }, [recordKey]);

  const onSubmit = handleSubmit(async (values) => {
    setMessage(null);
    const { districtId, reason, ...rest } = values;
    try {
      const result = await put.mutateAsync({ districtId, body: { ...rest, ...(reason?.trim() ? { reason: reason.trim() } : {}), source: 'form' } });
      const district = districts.find((d) => d.id === districtId);
      const text = t(`entry.${result.outcome}`, { district: district?.code ?? '', week: values.week, year: values.year, cases: result.count.cases });
      setMessage({ kind: 'success', text: result.count.late ? t('entry.late', { text: text.replace(/\.$/, '') }) + '.' : text });
      // A reason belongs to one correction: the next one asks for its own.
      resetField('reason', { defaultValue: '' });
    } catch (error) {
      const unmatched = applyServerFieldErrors(error, setError, ['districtId', 'diseaseId', 'year', 'week', 'cases', 'confirmed', 'probable', 'reason']);
      setMessage({ kind: 'error', text: formErrorText(error, unmatched) });
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3" aria-labelledby="entry-title">
      <h2 id="entry-title" className="section-title">
        {t('entry.title')}
      </h2>
      {message ? <FormMessage kind={message.kind}>{message.text}</FormMessage> : null}
      {record ? (
        <p className="notice notice-info text-sm" data-testid="stored-count">
          {record.confirmed === null && record.probable === null
            ? t('entry.storedNoSplit', { week: record.week, year: record.year, cases: record.cases })
            : t('entry.stored', { week: record.week, year: record.year, cases: record.cases, confirmed: record.confirmed ?? '—', probable: record.probable ?? '—' })}
        </p>
      ) : null}
      <div className="grid gap-3 sm:grid-cols-2">
        <SelectField label={t('entry.district')} error={textError(t('entry.district'), errors.districtId)} {...register('districtId')}>
          {districts.map((d) => (
            <option key={d.id} value={d.id}>
              {d.code} — {d.name}
            </option>
          ))}
        </SelectField>
        <SelectField label={t('entry.disease')} error={textError(t('entry.disease'), errors.diseaseId)} {...register('diseaseId')}>
          {diseases.map((d) => (
            <option key={d.id} value={d.id}>
              {d.name}
            </option>
          ))}
        </SelectField>
        <TextField
          label={t('entry.year')}
          type="number"
          inputMode="numeric"
          error={numberError(t('entry.year'), errors.year, t('entry.yearEmpty'))}
          {...register('year', { valueAsNumber: true })}
        />
        <TextField
          label={t('entry.week')}
          type="number"
          inputMode="numeric"
          min={1}
          max={53}
          hint={settings.epiWeekSystem === 'iso' ? t('entry.isoHint') : t('entry.epiHint')}
          error={numberError(t('entry.week'), errors.week, t('entry.weekEmpty'))}
          {...register('week', { valueAsNumber: true })}
        />
        <TextField
          label={t('entry.cases')}
          type="number"
          inputMode="numeric"
          min={0}
          step={1}
          error={numberError(t('entry.cases'), errors.cases, t('entry.casesEmpty'))}
          {...register('cases', { valueAsNumber: true })}
        />
        <TextField
          label={t('entry.confirmed')}
          type="number"
          inputMode="numeric"
          min={0}
          step={1}
          error={numberError(t('entry.confirmed'), errors.confirmed, t('entry.optionalEmpty'))}
          {...register('confirmed', { setValueAs: optionalNumber })}
        />
        <TextField
          label={t('entry.probable')}
          type="number"
          inputMode="numeric"
          min={0}
          step={1}
          error={numberError(t('entry.probable'), errors.probable, t('entry.optionalEmpty'))}
          {...register('probable', { setValueAs: optionalNumber })}
        />
        <TextField
          label={t('entry.reason')}
          hint={t('entry.reasonHint')}
          error={textError(t('entry.reason'), errors.reason)}
          {...register('reason')}
        />
      </div>
      <button type="submit" className="btn btn-primary" disabled={isSubmitting}>
        {isSubmitting ? t('entry.saving') : t('entry.save')}
      </button>
    </form>
  );
}
