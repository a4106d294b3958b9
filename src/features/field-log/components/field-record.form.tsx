import { useEffect, useMemo, useRef, useState } from 'react';
import { useTranslation } from 'react-i18next';
import type { TFunction } from 'i18next';
import { useForm, type FieldError, type Resolver } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { fieldRecordBody, type FieldRecordBody } from '../../../../shared/api/field-records.schema';
import type { DistrictRef } from '../../../../shared/api/auth.schema';
import { WORK_KINDS } from '../../../../shared/field/work-kinds';
import { AMOUNT_UNITS } from '../../../../shared/field/field-records';
import { FormMessage, SelectField, TextField } from '../../../components/form';
import { localToday, newSurveyId } from '../../surveys/survey-format';
import { useSubmitFieldRecord } from '../api/submit-field-record.api';
import { recordMessage } from '../field-log-format';

type RecordForm = {
  id: string;
  districtId: string;
  locality: string;
  date: string;
  kind: FieldRecordBody['kind'];
  housesVisited: number | null;
  containers: number | null;
  areaM2: number | null;
  product: string;
  amount: number | null;
  amountUnit: FieldRecordBody['amountUnit'];
  notes: string;
};

/** An empty number field is "not given" (null), never 0; anything else is read as a number (NaN is refused by the schema). */
const optionalNumber = (v: unknown) => (v === '' || v === null || v === undefined ? null : Number(v));
const optionalChoice = (v: unknown) => (v === '' || v === null || v === undefined ? null : v);
const textOrNull = (v: string | null | undefined) => (v && v.trim() ? v.trim() : null);

/**
 * The Field log's form: one piece of vector-control work, one column, large touch targets, numeric
 * keyboards, readable at 360 px. Checked with the shared schema of POST /api/field-records (plus "not in
 * the future"); saved to the device first, then sent (see field-record-outbox.ts).
 */
export function FieldRecordForm({ districts }: { districts: DistrictRef[] }) {
  const { t } = useTranslation(['field-log', 'field-week']);
  const today = localToday();
  const schema = useMemo(
    () =>
      fieldRecordBody.superRefine((r, ctx) => {
        if (r.date > today) ctx.addIssue({ code: 'custom', path: ['date'], message: 'cannot be in the future' });
      }),
    [today],
  );
  const submit = useSubmitFieldRecord();
  const [message, setMessage] = useState<{ kind: 'success' | 'info' | 'error'; text: string } | null>(null);
  // On a phone the save button is a long scroll below the message: bring the outcome into view.
  const messageRef = useRef<HTMLDivElement>(null);
  useEffect(() => {
    if (message) messageRef.current?.scrollIntoView?.({ block: 'nearest' });
  }, [message]);
  const blank = (districtId: string, date: string, kind: RecordForm['kind']): RecordForm => ({
    id: newSurveyId(),
    districtId,
    locality: '',
    date,
    kind,
    housesVisited: null,
    containers: null,
    areaM2: null,
    product: '',
    amount: null,
    amountUnit: null,
    notes: '',
  });
  const {
    register,
    handleSubmit,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<RecordForm>({
    resolver: zodResolver(schema) as unknown as Resolver<RecordForm>,
    defaultValues: blank(districts[0]?.id ?? '', today, 'source-reduction'),
  });
  const err = (name: keyof RecordForm, error: FieldError | undefined) => recordMessage(t as unknown as TFunction, t(`form.${name}`), error?.message);

  const onSubmit = handleSubmit(async (form) => {
    setMessage(null);
    // Optional fields left empty are sent as null (not given), never as 0 or "".
    const record: FieldRecordBody = {
      id: form.id,
      districtId: form.districtId,
      locality: form.locality.trim(),
      date: form.date,
      kind: form.kind,
      housesVisited: form.housesVisited ?? null,
      containers: form.containers ?? null,
      areaM2: form.areaM2 ?? null,
      product: textOrNull(form.product),
      amount: form.amount ?? null,
      amountUnit: form.amountUnit ?? null,
      notes: textOrNull(form.notes),
    };
    try {
      const { sent } = await submit.mutateAsync(record);
      setMessage(
        sent
          ? { kind: 'success', text: t('form.sent', { locality: record.locality }) }
          : { kind: 'info', text: t('form.kept', { locality: record.locality }) },
      );
      // A new record gets a new id; district, date and kind stay (a worker often records several in a row).
      reset(blank(form.districtId, form.date, form.kind));
    } catch (error) {
      setMessage({ kind: 'error', text: t('form.notKept', { problem: error instanceof Error ? error.message : t('form.unknownProblem') }) });
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-labelledby="record-form-title">
      <h2 id="record-form-title" className="section-title">
        {t('form.title')}
      </h2>
      {message ? (
        <div ref={messageRef}>
          <FormMessage kind={message.kind}>{message.text}</FormMessage>
        </div>
      ) : null}
      <SelectField label={t('form.districtId')} error={err('districtId', errors.districtId)} {...register('districtId')}>
        {districts.map((d) => (
          <option key={d.id} value={d.id}>
            {d.code} — {d.name}
          </option>
        ))}
      </SelectField>
      <TextField label={t('form.locality')} autoComplete="off" error={err('locality', errors.locality)} {...register('locality')} />
      <TextField label={t('form.date')} type="date" max={today} error={err('date', errors.date)} {...register('date')} />
      <SelectField label={t('form.kind')} error={err('kind', errors.kind)} {...register('kind')}>
        {WORK_KINDS.map((k) => (
          <option key={k} value={k}>
            {t(`field-week:kinds.${k}`)}
          </option>
        ))}
      </SelectField>
      <fieldset className="space-y-4">
        <legend className="field-label">{t('form.coverage')}</legend>
        <p className="field-hint">{t('form.coverageHint')}</p>
        {(['housesVisited', 'containers'] as const).map((name) => (
          <TextField
            key={name}
            label={t(`form.${name}`)}
            type="number"
            inputMode="numeric"
            min={0}
            step={1}
            error={err(name, errors[name])}
            {...register(name, { setValueAs: optionalNumber })}
          />
        ))}
        <TextField
          label={t('form.areaM2')}
          type="number"
          inputMode="decimal"
          min={0}
          step="any"
          error={err('areaM2', errors.areaM2)}
          {...register('areaM2', { setValueAs: optionalNumber })}
        />
      </fieldset>
      <fieldset className="space-y-4">
        <legend className="field-label">{t('form.productTitle')}</legend>
        <p className="field-hint" data-testid="product-caution">
          {t('form.productCaution')}
        </p>
        <TextField label={t('form.product')} autoComplete="off" error={err('product', errors.product)} {...register('product')} />
        <div className="grid grid-cols-[minmax(0,1fr)_7rem] gap-3">
          <TextField
            label={t('form.amount')}
            type="number"
            inputMode="decimal"
            min={0}
            step="any"
            error={err('amount', errors.amount)}
            {...register('amount', { setValueAs: optionalNumber })}
          />
          <SelectField label={t('form.amountUnit')} error={err('amountUnit', errors.amountUnit)} {...register('amountUnit', { setValueAs: optionalChoice })}>
            <option value="">{t('form.noUnit')}</option>
            {AMOUNT_UNITS.map((u) => (
              <option key={u} value={u}>
                {t(`units.${u}`)}
              </option>
            ))}
          </SelectField>
        </div>
      </fieldset>
      <TextField label={t('form.notes')} autoComplete="off" error={err('notes', errors.notes)} {...register('notes')} />
      <button type="submit" className="btn btn-primary w-full sm:w-auto" disabled={isSubmitting}>
        {isSubmitting ? t('form.saving') : t('form.save')}
      </button>
    </form>
  );
}
