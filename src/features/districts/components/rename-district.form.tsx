import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { districtCreateBody, type DistrictDto } from '../../../../shared/api/districts.schema';
import { applyServerFieldErrors, formErrorText } from '../../../lib/form-errors';
import { FormMessage, TextField } from '../../../components/form';
import { useUpdateDistrict, type DistrictUpdateBody } from '../api/update-district.api';
import { CODE_HINT } from './create-district.form';

export function RenameDistrictForm({ district }: { district: DistrictDto }) {
  const update = useUpdateDistrict();
  const [message, setMessage] = useState<{ kind: 'error' | 'success'; text: string } | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm({
    resolver: zodResolver(districtCreateBody),
    defaultValues: { code: district.code, name: district.name },
  });

  const onSubmit = handleSubmit(async (values) => {
    setMessage(null);
    const changes: DistrictUpdateBody = {};
    if (values.code !== district.code) changes.code = values.code;
    if (values.name !== district.name) changes.name = values.name;
    if (Object.keys(changes).length === 0) {
      setMessage({ kind: 'error', text: 'Nothing has changed yet.' });
      return;
    }
    try {
      const saved = await update.mutateAsync({ id: district.id, changes });
      setMessage({ kind: 'success', text: `Saved: ${saved.code} — ${saved.name}.` });
    } catch (error) {
      const unmatched = applyServerFieldErrors(error, setError, ['code', 'name']);
      setMessage({ kind: 'error', text: formErrorText(error, unmatched) });
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3" aria-labelledby={`rename-${district.id}`}>
      <h4 id={`rename-${district.id}`} className="font-bold">
        Code and name
      </h4>
      {message ? <FormMessage kind={message.kind}>{message.text}</FormMessage> : null}
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
      <button type="submit" className="btn btn-primary btn-small" disabled={isSubmitting}>
        {isSubmitting ? 'Saving…' : 'Save code and name'}
      </button>
    </form>
  );
}
