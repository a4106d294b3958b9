import { useState } from 'react';
import { Link } from 'react-router-dom';
import { useForm } from 'react-hook-form';
import { Trans, useTranslation } from 'react-i18next';
import { zodResolver } from '@hookform/resolvers/zod';
import { passwordResetRequestBody } from '../../../shared/api/auth.schema';
import { isApiError } from '../../lib/api-client';
import { applyServerFieldErrors, formErrorText } from '../../lib/form-errors';
import { FormMessage, TextField } from '../../components/form';
import { useRequestPasswordReset } from './api/password-reset.api';
import { AuthShell } from './components/auth-shell';

export function PasswordResetRequestPage() {
  const { t } = useTranslation('auth');
  const request = useRequestPasswordReset();
  const [sentTo, setSentTo] = useState<string | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm({ resolver: zodResolver(passwordResetRequestBody), defaultValues: { email: '' } });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await request.mutateAsync(values);
      setSentTo(values.email);
    } catch (error) {
      const unmatched = applyServerFieldErrors(error, setError, ['email']);
      setFormError(
        isApiError(error) && error.status === 429
          ? t('resetRequest.rateLimited')
          : formErrorText(error, unmatched),
      );
    }
  });

  return (
    <AuthShell title={t('resetRequest.title')}>
      {sentTo ? (
        <FormMessage kind="success">
          <p>
            <Trans t={t} i18nKey="resetRequest.sent" values={{ email: sentTo }} components={{ strong: <strong /> }} />
          </p>
          <p className="mt-2">{t('resetRequest.noMessage')}</p>
        </FormMessage>
      ) : (
        <form onSubmit={onSubmit} noValidate className="space-y-4">
          <p className="text-sm text-ink-muted">{t('resetRequest.lead')}</p>
          <FormMessage kind="error">{formError}</FormMessage>
          <TextField
            label={t('fields.email')}
            type="email"
            autoComplete="username"
            inputMode="email"
            spellCheck={false}
            error={errors.email?.message}
            {...register('email')}
          />
          <button type="submit" className="btn btn-primary w-full" disabled={isSubmitting}>
            {isSubmitting ? t('resetRequest.submitting') : t('resetRequest.submit')}
          </button>
        </form>
      )}
      <p className="mt-5 text-sm">
        <Link to="/sign-in" className="link">
          {t('backToSignIn')}
        </Link>
      </p>
    </AuthShell>
  );
}
