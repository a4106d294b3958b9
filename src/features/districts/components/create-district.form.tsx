import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { districtCreateBody } from '../../../../shared/api/districts.schema';
import { applyServerFieldErrors, formErrorText } from '../../../lib/form-errors';
import { FormMessage, TextField } from '../../../components/form';
import { useCreateDistrict } from '../api/create-district.api';

export const CODE_HINT = '2 to 16 capital letters, digits or hyphens, for example HV-07.';

export function CreateDistrictForm() {
  const create = useCreateDistrict();
  const [message, setMessage] = useState<{ kind: 'error' | 'success'; text: string } | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm({ resolver: zodResolver(districtCreateBody), defaultValues: { code: '', name: '' } });

  const onSubmit = handleSubmit(async (values) => {
    setMessage(null);
    try {
      const district = await create.mutateAsync(values);
      reset();
      setMessage({
        kind: 'success',
        text: `${district.code} — ${district.name} is created. Add its population and boundary from the table.`,
      });
    } catch (error) {
      const unmatched = applyServerFieldErrors(error, setError, ['code', 'name']);
      setMessage({ kind: 'error', text: formErrorText(error, unmatched) });
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-labelledby="create-district-title">
      <h2 id="create-district-title" className="section-title">
        Create a district
      </h2>
      {message ? <FormMessage kind={message.kind}>{message.text}</FormMessage> : null}
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField
          label="Code"
          hint={CODE_HINT}
          autoComplete="off"
          spellCheck={false}
          autoCapitalize="characters"
          error={errors.code?.message}
          {...register('code')}
        />
        <TextField label="Name" autoComplete="off" error={errors.name?.message} {...register('name')} />
      </div>
      <button type="submit" className="btn btn-primary" disabled={isSubmitting}>
        {isSubmitting ? 'Creating…' : 'Create the district'}
      </button>
    </form>
  );
}
