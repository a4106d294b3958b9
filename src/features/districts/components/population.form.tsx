import { useState } from 'react';
import { useForm, type FieldError } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { populationBody, type DistrictDto } from '../../../../shared/api/districts.schema';
import { applyServerFieldErrors, formErrorText } from '../../../lib/form-errors';
import { FormMessage, TextField } from '../../../components/form';
import { useSetPopulation } from '../api/set-population.api';

const numberFormat = new Intl.NumberFormat('en');

/** An empty number box comes through as NaN; say so in words rather than with the schema's default. */
function numberError(error: FieldError | undefined, empty: string): string | undefined {
  if (!error) return undefined;
  if (error.type === 'invalid_type') return empty;
  return error.message;
}

export function PopulationForm({ district }: { district: DistrictDto }) {
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
      setMessage({ kind: 'success', text: `Population for ${values.year} saved: ${numberFormat.format(values.population)}.` });
    } catch (error) {
      const unmatched = applyServerFieldErrors(error, setError, ['year', 'population']);
      setMessage({ kind: 'error', text: formErrorText(error, unmatched) });
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3" aria-labelledby={`population-${district.id}`}>
      <h4 id={`population-${district.id}`} className="font-bold">
        Population for a year
      </h4>
      <p className="text-sm text-ink-muted">
        {recorded.length === 0
          ? 'No population recorded yet. Incidence per 100,000 needs one.'
          : `Recorded: ${recorded.map((p) => `${p.year}: ${numberFormat.format(p.population)}`).join('; ')}.`}
      </p>
      {message ? <FormMessage kind={message.kind}>{message.text}</FormMessage> : null}
      <TextField
        label="Year"
        type="number"
        inputMode="numeric"
        min={1900}
        max={2100}
        step={1}
        error={numberError(errors.year, 'Enter the year, for example 2024.')}
        {...register('year', { valueAsNumber: true })}
      />
      <TextField
        label="Population"
        type="number"
        inputMode="numeric"
        min={0}
        step={1}
        hint="Saving a year that is already recorded replaces its number."
        error={numberError(errors.population, 'Enter the population as a whole number.')}
        {...register('population', { valueAsNumber: true })}
      />
      <button type="submit" className="btn btn-primary btn-small" disabled={isSubmitting}>
        {isSubmitting ? 'Saving…' : 'Save the population'}
      </button>
    </form>
  );
}
