import { useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { userInviteBody } from '../../../../shared/api/users.schema';
import { applyServerFieldErrors, formErrorText } from '../../../lib/form-errors';
import { CheckboxGroup, FormMessage, SelectField, TextField } from '../../../components/form';
import { useInviteUser } from '../api/invite-user.api';
import { useDistrictOptions } from './district-options';
import { districtHint, RoleOptions } from './role-options';

const FIELDS = ['email', 'displayName', 'role', 'districtIds'] as const;

export function InviteUserForm() {
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
    defaultValues: { email: '', displayName: '', role: undefined, districtIds: [] },
  });
  const role = watch('role');

  const onSubmit = handleSubmit(async (values) => {
    setMessage(null);
    try {
      const user = await invite.mutateAsync(values);
      reset();
      setMessage({ kind: 'success', text: `Invitation sent to ${user.email}. The account shows “invite pending” until it is accepted.` });
    } catch (error) {
      const unmatched = applyServerFieldErrors(error, setError, FIELDS);
      setMessage({ kind: 'error', text: formErrorText(error, unmatched) });
    }
  });

  const roleError = errors.role?.type === 'server' ? errors.role.message : errors.role ? 'Choose a role.' : undefined;

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-labelledby="invite-title">
      <h2 id="invite-title" className="section-title">
        Invite a user
      </h2>
      <p className="text-sm text-ink-muted">Broodcast e-mails the person a link to choose their password.</p>
      {message ? <FormMessage kind={message.kind}>{message.text}</FormMessage> : null}
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField
          label="E-mail"
          type="email"
          autoComplete="off"
          spellCheck={false}
          error={errors.email?.message}
          {...register('email')}
        />
        <TextField label="Name" autoComplete="off" error={errors.displayName?.message} {...register('displayName')} />
        <SelectField label="Role" error={roleError} {...register('role')}>
          <RoleOptions placeholder="Choose a role" />
        </SelectField>
      </div>
      <Controller
        control={control}
        name="districtIds"
        render={({ field, fieldState }) => (
          <CheckboxGroup
            legend="Districts"
            hint={districts.error ? `The districts could not be loaded: ${districts.error.message}` : districtHint(role)}
            options={districts.options}
            emptyText={districts.isPending ? 'Loading districts…' : 'No districts yet. Create them under Districts.'}
            value={field.value ?? []}
            onChange={field.onChange}
            error={fieldState.error?.message}
          />
        )}
      />
      <button type="submit" className="btn btn-primary" disabled={isSubmitting}>
        {isSubmitting ? 'Sending the invitation…' : 'Send the invitation'}
      </button>
    </form>
  );
}
