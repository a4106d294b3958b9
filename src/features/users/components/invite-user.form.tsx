import { useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useTranslation } from 'react-i18next';
import { userInviteBody } from '../../../../shared/api/users.schema';
import { applyServerFieldErrors, formErrorText } from '../../../lib/form-errors';
import { errorText } from '../../../lib/error-text';
import { FormMessage, SelectField, TextField } from '../../../components/form';
import { SearchPicker } from '../../../components/search-picker';
import { useInviteUser } from '../api/invite-user.api';
import { RegionChoice } from './region-choice';
import { useDistrictOptions } from './district-options';
import { RoleOptions, useDistrictHint } from './role-options';
import { LANGUAGES, LANGUAGE_NAMES } from '../../../../shared/languages';

const FIELDS = ['email', 'displayName', 'role', 'language', 'districtIds', 'regionIds'] as const;

export function InviteUserForm() {
  const { t } = useTranslation('users');
  const invite = useInviteUser();
  const districts = useDistrictOptions();
  const [message, setMessage] = useState<{ kind: 'error' | 'success'; text: string } | null>(null);
  const {
    register,
    control,
    handleSubmit,
    setError,
    reset,
    watch,
    formState: { errors, isSubmitting },
  } = useForm({
    resolver: zodResolver(userInviteBody),
    defaultValues: { email: '', displayName: '', role: undefined, language: 'en' as const, districtIds: [], regionIds: [] },
  });
  const role = watch('role');
  const districtHint = useDistrictHint(role);

  const onSubmit = handleSubmit(async (values) => {
    setMessage(null);
    try {
      // Regions go in the body only when some are ticked (an installation without regions sends what it always sent).
      const { regionIds, ...rest } = values;
      const user = await invite.mutateAsync(regionIds.length ? values : rest);
      reset();
      setMessage({ kind: 'success', text: t('invite.sent', { email: user.email }) });
    } catch (error) {
      const unmatched = applyServerFieldErrors(error, setError, FIELDS);
      setMessage({ kind: 'error', text: formErrorText(error, unmatched) });
    }
  });

  const roleError = errors.role?.type === 'server' ? errors.role.message : errors.role ? t('invite.chooseRole') : undefined;

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-labelledby="invite-title">
      <h2 id="invite-title" className="section-title">
        {t('invite.title')}
      </h2>
      <p className="text-sm text-ink-muted">{t('invite.lead')}</p>
      {message ? <FormMessage kind={message.kind}>{message.text}</FormMessage> : null}
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField
          label={t('fields.email')}
          type="email"
          autoComplete="off"
          spellCheck={false}
          error={errors.email?.message}
          {...register('email')}
        />
        <TextField label={t('fields.name')} autoComplete="off" error={errors.displayName?.message} {...register('displayName')} />
        <SelectField label={t('fields.role')} error={roleError} {...register('role')}>
          <RoleOptions placeholder={t('invite.rolePlaceholder')} />
        </SelectField>
        {/* The invite mail is written in it, and it is the account's language until its owner changes it. */}
        <SelectField label={t('fields.language')} error={errors.language?.message} {...register('language')}>
          {LANGUAGES.map((lng) => (
            <option key={lng} value={lng} lang={lng}>
              {LANGUAGE_NAMES[lng]}
            </option>
          ))}
        </SelectField>
      </div>
      <Controller
        control={control}
        name="districtIds"
        render={({ field, fieldState }) => (
          <SearchPicker
            legend={t('fields.districts')}
            hint={districts.error ? t('districtsNotLoaded', { error: errorText(districts.error) }) : districtHint}
            options={districts.options}
            emptyText={districts.isPending ? t('loadingDistricts') : t('invite.noDistricts')}
            value={field.value ?? []}
            onChange={field.onChange}
            error={fieldState.error?.message}
          />
        )}
      />
      <Controller
        control={control}
        name="regionIds"
        render={({ field, fieldState }) => <RegionChoice value={field.value ?? []} onChange={field.onChange} error={fieldState.error?.message} />}
      />
      <button type="submit" className="btn btn-primary" disabled={isSubmitting}>
        {isSubmitting ? t('invite.submitting') : t('invite.submit')}
      </button>
    </form>
  );
}
