import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useTranslation } from 'react-i18next';
import { districtCreateBody, type DistrictDto } from '../../../../shared/api/districts.schema';
import { applyServerFieldErrors, formErrorText } from '../../../lib/form-errors';
import { FormMessage, TextField } from '../../../components/form';
import { useUpdateDistrict, type DistrictUpdateBody } from '../api/update-district.api';

export function RenameDistrictForm({ district }: { district: DistrictDto }) {
  const { t } = useTranslation('districts');
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
      setMessage({ kind: 'error', text: t('rename.nothingChanged') });
      return;
    }
    try {
      const saved = await update.mutateAsync({ id: district.id, changes });
      setMessage({ kind: 'success', text: t('rename.saved', { code: saved.code, name: saved.name }) });
    } catch (error) {
      const unmatched = applyServerFieldErrors(error, setError, ['code', 'name']);
      setMessage({ kind: 'error', text: formErrorText(error, unmatched) });
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3" aria-labelledby={`rename-${district.id}`}>
      <h4 id={`rename-${district.id}`} className="font-bold">
        {t('rename.title')}
      </h4>
      {message ? <FormMessage kind={message.kind}>{message.text}</FormMessage> : null}
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
      <button type="submit" className="btn btn-primary btn-small" disabled={isSubmitting}>
        {isSubmitting ? t('saving') : t('rename.submit')}
      </button>
    </form>
  );
}
