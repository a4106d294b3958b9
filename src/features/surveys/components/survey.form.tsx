import { useEffect, useMemo, useRef, useState } from 'react';
import { useTranslation } from 'react-i18next';
import { Controller, useForm, type FieldError } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { CONTAINER_TYPES, surveyFormSchema, type SurveyForm } from '../../../../shared/api/surveys.schema';
import type { DistrictRef } from '../../../../shared/api/auth.schema';
import { larvalSurveySchema } from '../../../../shared/signals/schemas';
import { larvalIndices } from '../../../../shared/signals/larval-indices';
import { CheckboxGroup, FormMessage, SelectField, TextField } from '../../../components/form';
import { useFormat } from '../../../i18n/format';
import { useSubmitSurvey } from '../api/submit-survey.api';
import { formatIndex, localToday, newSurveyId, surveyMessage } from '../survey-format';

const COUNT_FIELDS = ['housesInspected', 'housesPositive', 'containersInspected', 'containersPositive'] as const;

/**
 * The field form of a larval survey: one column, large touch targets, numeric keyboards, readable at
 * 360 px. Saving keeps the survey on the device first, then sends it (see offline-queue.ts).
 */
export function SurveyFormCard({ districts, onDistrictChange }: { districts: DistrictRef[]; onDistrictChange?: (districtId: string) => void }) {
  const { t } = useTranslation('surveys');
  const { number } = useFormat();
  const today = localToday();
  const schema = useMemo(() => surveyFormSchema(today), [today]);
  const submit = useSubmitSurvey();
  const fieldError = (label: string, error: FieldError | undefined) =>
    error ? (error.type === 'invalid_type' ? t('validation.wholeNumberOrZero') : surveyMessage(t, label, error.message)) : undefined;
  const textError = (label: string, error: FieldError | undefined) => surveyMessage(t, label, error?.message);
  const [message, setMessage] = useState<{ kind: 'success' | 'info' | 'error'; text: string } | null>(null);
  // The outcome is shown above the form; on a phone the save button is a long scroll below it, so the
  // message is brought into view (a worker who saw nothing happen would fill the survey in again).
  const messageRef = useRef<HTMLDivElement>(null);
  useEffect(() => {
    if (message) messageRef.current?.scrollIntoView?.({ block: 'nearest' });
  }, [message]);
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
  // The page beside the form shows the chosen district's recent surveys.
  useEffect(() => {
    if (values.districtId) onDistrictChange?.(values.districtId);
  }, [values.districtId, onDistrictChange]);
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
          ? { kind: 'success', text: t('form.sent', { locality: form.locality }) }
          : { kind: 'info', text: t('form.kept', { locality: form.locality }) },
      );
      // The counts go back to empty (null shows as an empty field; NaN was written into the inputs as "NaN").
      const empty = null as unknown as number;
      reset({ ...form, locality: '', housesInspected: empty, housesPositive: empty, containersInspected: empty, containersPositive: empty, pupae: null, containerTypes: [], notes: '' });
    } catch (error) {
      setMessage({
        kind: 'error',
        text: t('form.notKept', { problem: error instanceof Error ? error.message : t('form.unknownProblem') }),
      });
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-labelledby="survey-form-title">
      <h2 id="survey-form-title" className="section-title">
        {t('form.title')}
      </h2>
      {message ? (
        <div ref={messageRef}>
          <FormMessage kind={message.kind}>{message.text}</FormMessage>
        </div>
      ) : null}
      <SelectField label={t('form.district')} error={textError(t('form.district'), errors.districtId)} {...register('districtId')}>
        {districts.map((d) => (
          <option key={d.id} value={d.id}>
            {d.code} — {d.name}
          </option>
        ))}
      </SelectField>
      <TextField label={t('form.locality')} autoComplete="off" error={textError(t('form.locality'), errors.locality)} {...register('locality')} />
      <TextField label={t('form.date')} type="date" max={today} error={textError(t('form.date'), errors.date)} {...register('date')} />
      {COUNT_FIELDS.map((name) => (
        <TextField
          key={name}
          label={t(`form.${name}`)}
          type="number"
          inputMode="numeric"
          min={0}
          step={1}
          error={fieldError(t(`form.${name}`), errors[name])}
          {...register(name, { valueAsNumber: true })}
        />
      ))}
      <TextField
        label={t('form.pupae')}
        type="number"
        inputMode="numeric"
        min={0}
        step={1}
        hint={t('form.pupaeHint')}
        error={fieldError(t('form.pupae'), errors.pupae)}
        {...register('pupae', { setValueAs: (v) => (v === '' || v === null || v === undefined ? null : Number(v)) })}
      />
      <Controller
        control={control}
        name="containerTypes"
        render={({ field }) => (
          <CheckboxGroup
            legend={t('form.containerTypes')}
            options={CONTAINER_TYPES.map((c) => ({ value: c, label: t(`containerType.${c}`) }))}
            value={field.value}
            onChange={field.onChange}
            error={surveyMessage(t, t('form.containerTypes'), errors.containerTypes?.message)}
          />
        )}
      />
      <TextField label={t('form.notes')} autoComplete="off" error={textError(t('form.notes'), errors.notes)} {...register('notes')} />
      <div className="rounded-md border border-line bg-surface p-3 text-sm" aria-live="polite">
        <p className="font-bold">{t('form.indicesTitle')}</p>
        {indices ? (
          <dl className="mt-1 grid grid-cols-2 gap-x-4 gap-y-1">
            <dt>{t('index.house')}</dt>
            <dd className="tabular-nums">{formatIndex(number, indices.house, t)}</dd>
            <dt>{t('index.container')}</dt>
            <dd className="tabular-nums">{formatIndex(number, indices.container, t)}</dd>
            <dt>{t('index.breteau')}</dt>
            <dd className="tabular-nums">{formatIndex(number, indices.breteau)}</dd>
            <dt>{t('index.pupa')}</dt>
            <dd className="tabular-nums">{formatIndex(number, indices.pupa)}</dd>
          </dl>
        ) : (
          <p className="text-ink-muted">{t('form.indicesEmpty')}</p>
        )}
      </div>
      <button type="submit" className="btn btn-primary w-full sm:w-auto" disabled={isSubmitting}>
        {isSubmitting ? t('form.saving') : t('form.save')}
      </button>
    </form>
  );
}
