import { useState } from 'react';
import { useForm, type FieldError } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useTranslation } from 'react-i18next';
import { populationBody, type DistrictDto } from '../../../../shared/api/districts.schema';
import { applyServerFieldErrors, formErrorText } from '../../../lib/form-errors';
import { FormMessage, TextField } from '../../../components/form';
import { useSetPopulation } from '../api/set-population.api';
import { useFormat } from '../../../i18n/format';

/** An empty number box comes through as NaN; say so in words rather than with the schema's default. */
function numberError(error: FieldError | undefined, empty: string): string | undefined {
  if (!error) return undefined;
  if (error.type === 'invalid_type') return empty;
  return error.message;
}

export function PopulationForm({ district }: { district: DistrictDto }) {
  const { t } = useTranslation('districts');
  const f = useFormat();
  const setPopulation = useSetPopulation();
  const [message, setMessage] = useState<{ kind: 'error' | 'success'; text: string } | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm({
    resolver: zodResolver(populationBody),
    defaultValues: { year: new Date().getFullYear(), population: undefined },
  });
  const recorded = [...district.populations].sort((a, b) => b.year - a.year);

  const onSubmit = handleSubmit(async (values) => {
    setMessage(null);
    try {
      await setPopulation.mutateAsync({ id: district.id, population: values });
      setMessage({ kind: 'success', text: t('population.saved', { year: values.year, population: f.number(values.population) }) });
    } catch (error) {
      const unmatched = applyServerFieldErrors(error, setError, ['year', 'population']);
      setMessage({ kind: 'error', text: formErrorText(error, unmatched) });
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3" aria-labelledby={`population-${district.id}`}>
      <h4 id={`population-${district.id}`} className="font-bold">
        {t('population.title')}
      </h4>
      <p className="text-sm text-ink-muted">
        {recorded.length === 0
          ? t('population.none')
          : t('population.recorded', { list: recorded.map((p) => t('population.item', { year: p.year, population: f.number(p.population) })).join('; ') })}
      </p>
      {message ? <FormMessage kind={message.kind}>{message.text}</FormMessage> : null}
      <TextField
        label={t('population.year')}
        type="number"
        inputMode="numeric"
        min={1900}
        max={2100}
        step={1}
        error={numberError(errors.year, t('population.yearEmpty'))}
        {...register('year', { valueAsNumber: true })}
      />
      <TextField
        label={t('population.population')}
        type="number"
        inputMode="numeric"
        min={0}
        step={1}
        hint={t('population.hint')}
        error={numberError(errors.population, t('population.populationEmpty'))}
        {...register('population', { valueAsNumber: true })}
      />
      <button type="submit" className="btn btn-primary btn-small" disabled={isSubmitting}>
        {isSubmitting ? t('saving') : t('population.submit')}
      </button>
    </form>
  );
}
