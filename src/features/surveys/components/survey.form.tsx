import { useMemo, useState } from 'react';
import { Controller, useForm, type FieldError } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { CONTAINER_TYPES, surveyFormSchema, type SurveyForm } from '../../../../shared/api/surveys.schema';
import type { DistrictRef } from '../../../../shared/api/auth.schema';
import { larvalSurveySchema } from '../../../../shared/signals/schemas';
import { larvalIndices } from '../../../../shared/signals/larval-indices';
import { CheckboxGroup, FormMessage, SelectField, TextField } from '../../../components/form';
import { useSubmitSurvey } from '../api/submit-survey.api';
import { formatIndex, localToday, newSurveyId } from '../survey-format';

const numberError = (error: FieldError | undefined) =>
  error ? (error.type === 'invalid_type' ? 'Enter a whole number (0 if none).' : error.message) : undefined;

const COUNT_FIELDS = [
  ['housesInspected', 'Houses inspected'],
  ['housesPositive', 'Houses with larvae or pupae'],
  ['containersInspected', 'Water-holding containers inspected'],
  ['containersPositive', 'Containers with larvae or pupae'],
] as const;

/**
 * The field form of a larval survey: one column, large touch targets, numeric keyboards, readable at
 * 360 px. Saving keeps the survey on the device first, then sends it (see offline-queue.ts).
 */
export function SurveyFormCard({ districts }: { districts: DistrictRef[] }) {
  const today = localToday();
  const schema = useMemo(() => surveyFormSchema(today), [today]);
  const submit = useSubmitSurvey();
  const [message, setMessage] = useState<{ kind: 'success' | 'info' | 'error'; text: string } | null>(null);
  const {
    register,
    handleSubmit,
    control,
    reset,
    watch,
    formState: { errors, isSubmitting },
  } = useForm<SurveyForm>({
    resolver: zodResolver(schema),
    defaultValues: { districtId: districts[0]?.id ?? '', locality: '', date: today, containerTypes: [], pupae: null, notes: '' },
  });

  const values = watch();
  const preview = larvalSurveySchema.safeParse({
    housesInspected: values.housesInspected,
    housesPositive: values.housesPositive,
    containersInspected: values.containersInspected,
    containersPositive: values.containersPositive,
    ...(typeof values.pupae === 'number' && !Number.isNaN(values.pupae) ? { pupae: values.pupae } : {}),
  });
  const indices = preview.success ? larvalIndices(preview.data) : null;

  const onSubmit = handleSubmit(async (form) => {
    setMessage(null);
    const survey = { ...form, id: newSurveyId(), notes: form.notes?.trim() ? form.notes.trim() : null, pupae: form.pupae ?? null };
    try {
      const { sent } = await submit.mutateAsync(survey);
      setMessage(
        sent
          ? { kind: 'success', text: `Survey of ${form.locality} sent.` }
          : { kind: 'info', text: `Survey of ${form.locality} saved on this device. It will be sent when the connection is back.` },
      );
      reset({ ...form, locality: '', housesInspected: NaN, housesPositive: NaN, containersInspected: NaN, containersPositive: NaN, pupae: null, containerTypes: [], notes: '' });
    } catch (error) {
      setMessage({
        kind: 'error',
        text: `The survey could not be kept on this device (${error instanceof Error ? error.message : 'unknown problem'}). Check that the browser allows site storage.`,
      });
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-labelledby="survey-form-title">
      <h2 id="survey-form-title" className="section-title">
        New larval survey
      </h2>
      {message ? <FormMessage kind={message.kind}>{message.text}</FormMessage> : null}
      <SelectField label="District" error={errors.districtId?.message} {...register('districtId')}>
        {districts.map((d) => (
          <option key={d.id} value={d.id}>
            {d.code} — {d.name}
          </option>
        ))}
      </SelectField>
      <TextField label="Locality" autoComplete="off" error={errors.locality?.message} {...register('locality')} />
      <TextField label="Date" type="date" max={today} error={errors.date?.message} {...register('date')} />
      {COUNT_FIELDS.map(([name, label]) => (
        <TextField
          key={name}
          label={label}
          type="number"
          inputMode="numeric"
          min={0}
          step={1}
          error={numberError(errors[name])}
          {...register(name, { valueAsNumber: true })}
        />
      ))}
      <TextField
        label="Pupae counted"
        type="number"
        inputMode="numeric"
        min={0}
        step={1}
        hint="Leave empty if pupae were not counted."
        error={numberError(errors.pupae)}
        {...register('pupae', { setValueAs: (v) => (v === '' || v === null || v === undefined ? null : Number(v)) })}
      />
      <Controller
        control={control}
        name="containerTypes"
        render={({ field }) => (
          <CheckboxGroup
            legend="Container types found"
            options={CONTAINER_TYPES.map((c) => ({ value: c, label: c }))}
            value={field.value}
            onChange={field.onChange}
            error={errors.containerTypes?.message}
          />
        )}
      />
      <TextField label="Notes" autoComplete="off" error={errors.notes?.message} {...register('notes')} />
      <div className="rounded-md border border-line bg-surface p-3 text-sm" aria-live="polite">
        <p className="font-bold">Indices of this survey</p>
        {indices ? (
          <dl className="mt-1 grid grid-cols-2 gap-x-4 gap-y-1">
            <dt>House index</dt>
            <dd className="tabular-nums">{formatIndex(indices.house, '%')}</dd>
            <dt>Container index</dt>
            <dd className="tabular-nums">{formatIndex(indices.container, '%')}</dd>
            <dt>Breteau index</dt>
            <dd className="tabular-nums">{formatIndex(indices.breteau)}</dd>
            <dt>Pupa index</dt>
            <dd className="tabular-nums">{formatIndex(indices.pupa)}</dd>
          </dl>
        ) : (
          <p className="text-ink-muted">Shown when the four counts above are filled in and consistent.</p>
        )}
      </div>
      <button type="submit" className="btn btn-primary w-full sm:w-auto" disabled={isSubmitting}>
        {isSubmitting ? 'Saving…' : 'Save the survey'}
      </button>
    </form>
  );
}
