import { useState, type ReactNode } from 'react';
import { useForm } from 'react-hook-form';
import { useTranslation } from 'react-i18next';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { newPassword } from '../../../../shared/api/common.schema';
import type { PasswordResetConfirmBody } from '../../../../shared/api/auth.schema';
import { isApiError } from '../../../lib/api-client';
import { applyServerFieldErrors, formErrorText } from '../../../lib/form-errors';
import { FormMessage, TextField } from '../../../components/form';

const setPasswordForm = z
  .object({ password: newPassword, confirmPassword: z.string() })
  .refine((v) => v.password === v.confirmPassword, {
    path: ['confirmPassword'],
    message: 'does not match the new password',
  });

/**
 * Choose a password from a mailed link (password reset or invitation). The token comes from the link;
 * a used or expired link (`token_invalid`) gets its own message and a way on.
 */
export function SetPasswordForm({
  token,
  submit,
  submitLabel,
  invalidLink,
  onDone,
}: {
  token: string;
  submit: (body: PasswordResetConfirmBody) => Promise<unknown>;
  submitLabel: string;
  /** What to say, and where to go, when the link is used, expired or malformed. */
  invalidLink: ReactNode;
  onDone: () => void;
}) {
  const { t } = useTranslation('auth');
  const [formError, setFormError] = useState<ReactNode>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm({ resolver: zodResolver(setPasswordForm), defaultValues: { password: '', confirmPassword: '' } });

  const onSubmit = handleSubmit(async ({ password }) => {
    setFormError(null);
    try {
      await submit({ token, password });
      onDone();
    } catch (error) {
      if (isApiError(error) && (error.code === 'token_invalid' || error.fields.some((f) => f.path === 'token'))) {
        setFormError(invalidLink);
        return;
      }
      const unmatched = applyServerFieldErrors(error, setError, ['password']);
      setFormError(formErrorText(error, unmatched));
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <FormMessage kind="error">{formError}</FormMessage>
      <TextField
        label={t('setPassword.newPassword')}
        type="password"
        autoComplete="new-password"
        hint={t('setPassword.hint')}
        error={errors.password?.message}
        {...register('password')}
      />
      <TextField
        label={t('setPassword.repeat')}
        type="password"
        autoComplete="new-password"
        error={errors.confirmPassword?.message}
        {...register('confirmPassword')}
      />
      <button type="submit" className="btn btn-primary w-full" disabled={isSubmitting}>
        {isSubmitting ? t('setPassword.saving') : submitLabel}
      </button>
    </form>
  );
}
