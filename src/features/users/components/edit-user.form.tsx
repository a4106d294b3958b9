import { useEffect, useRef, useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Trans, useTranslation } from 'react-i18next';
import { userInviteBody, type UserDto, type UserUpdateBody } from '../../../../shared/api/users.schema';
import { applyServerFieldErrors, formErrorText } from '../../../lib/form-errors';
import { FormMessage, SelectField, TextField } from '../../../components/form';
import { SearchPicker } from '../../../components/search-picker';
import { useUpdateUser } from '../api/update-user.api';
import { RegionChoice } from './region-choice';
import { useDistrictOptions } from './district-options';
import { RoleOptions, useDistrictHint } from './role-options';

/** The editable part of a user, checked with the same rules as the invitation. */
const editUserForm = userInviteBody.pick({ displayName: true, role: true, districtIds: true, regionIds: true });
const FIELDS = ['displayName', 'role', 'districtIds', 'regionIds'] as const;

const sameSet = (a: readonly string[], b: readonly string[]) =>
  a.length === b.length && a.every((x) => b.includes(x));

export function EditUserForm({ user, onClose }: { user: UserDto; onClose: (saved: boolean) => void }) {
  const { t } = useTranslation('users');
  const update = useUpdateUser();
  const districts = useDistrictOptions();
  const headingRef = useRef<HTMLHeadingElement>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    control,
    handleSubmit,
    setError,
    watch,
    formState: { errors, isSubmitting },
  } = useForm({
    resolver: zodResolver(editUserForm),
    defaultValues: { displayName: user.displayName, role: user.role, districtIds: user.districts.map((d) => d.id), regionIds: user.regions.map((r) => r.id) },
  });
  const role = watch('role');
  const districtHint = useDistrictHint(role);

  useEffect(() => headingRef.current?.focus(), []);

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    const changes: UserUpdateBody = {};
    if (values.displayName !== user.displayName) changes.displayName = values.displayName;
    if (values.role !== user.role) changes.role = values.role;
    if (!sameSet(values.districtIds, user.districts.map((d) => d.id))) changes.districtIds = values.districtIds;
    if (!sameSet(values.regionIds, user.regions.map((r) => r.id))) changes.regionIds = values.regionIds;
    if (Object.keys(changes).length === 0) {
      setFormError(t('edit.nothingChanged'));
      return;
    }
    try {
      await update.mutateAsync({ id: user.id, changes });
      onClose(true);
    } catch (error) {
      const unmatched = applyServerFieldErrors(error, setError, FIELDS);
      setFormError(formErrorText(error, unmatched));
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4 pt-2" aria-labelledby={`edit-${user.id}`}>
      <h3 id={`edit-${user.id}`} ref={headingRef} tabIndex={-1} className="font-bold">
        <Trans
          t={t}
          i18nKey="edit.title"
          values={{ name: user.displayName, email: user.email }}
          components={{ muted: <span className="font-normal text-ink-muted" /> }}
        />
      </h3>
      <FormMessage kind="error">{formError}</FormMessage>
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label={t('fields.name')} autoComplete="off" error={errors.displayName?.message} {...register('displayName')} />
        <SelectField label={t('fields.role')} error={errors.role?.message} {...register('role')}>
          <RoleOptions />
        </SelectField>
      </div>
      <Controller
        control={control}
        name="districtIds"
        render={({ field, fieldState }) => (
          <SearchPicker
            legend={t('fields.districts')}
            hint={districtHint}
            options={districts.options}
            emptyText={districts.isPending ? t('loadingDistricts') : t('edit.noDistricts')}
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
      <div className="flex flex-wrap gap-2">
        <button type="submit" className="btn btn-primary" disabled={isSubmitting}>
          {isSubmitting ? t('edit.saving') : t('edit.save')}
        </button>
        <button type="button" className="btn btn-secondary" onClick={() => onClose(false)}>
          {t('edit.cancel')}
        </button>
      </div>
    </form>
  );
}
