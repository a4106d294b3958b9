import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useTranslation } from 'react-i18next';
import { districtCreateBody } from '../../../../shared/api/districts.schema';
import { applyServerFieldErrors, formErrorText } from '../../../lib/form-errors';
import { FormMessage, TextField } from '../../../components/form';
import { useCreateDistrict } from '../api/create-district.api';

export function CreateDistrictForm() {
  const { t } = useTranslation('districts');
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
        text: t('create.done', { code: district.code, name: district.name }),
      });
    } catch (error) {
      const unmatched = applyServerFieldErrors(error, setError, ['code', 'name']);
      setMessage({ kind: 'error', text: formErrorText(error, unmatched) });
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-labelledby="create-district-title">
      <h2 id="create-district-title" className="section-title">
        {t('create.title')}
      </h2>
      {message ? <FormMessage kind={message.kind}>{message.text}</FormMessage> : null}
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField
          label={t('fields.code')}
          hint={t('fields.codeHint')}
          autoComplete="off"
          spellCheck={false}
          autoCapitalize="characters"
          error={errors.code?.message}
          {...register('code')}
        />
        <TextField label={t('fields.name')} autoComplete="off" error={errors.name?.message} {...register('name')} />
      </div>
      <button type="submit" className="btn btn-primary" disabled={isSubmitting}>
        {isSubmitting ? t('create.submitting') : t('create.submit')}
      </button>
    </form>
  );
}
