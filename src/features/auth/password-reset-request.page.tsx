import { useState } from 'react';
import { Link } from 'react-router-dom';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { passwordResetRequestBody } from '../../../shared/api/auth.schema';
import { isApiError } from '../../lib/api-client';
import { applyServerFieldErrors, formErrorText } from '../../lib/form-errors';
import { FormMessage, TextField } from '../../components/form';
import { useRequestPasswordReset } from './api/password-reset.api';
import { AuthShell } from './components/auth-shell';

export function PasswordResetRequestPage() {
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
          ? 'Too many requests for a reset link. Wait a few minutes, then try again.'
          : formErrorText(error, unmatched),
      );
    }
  });

  return (
    <AuthShell title="Reset your password">
      {sentTo ? (
        <FormMessage kind="success">
          <p>
            If a Broodcast account uses <strong>{sentTo}</strong>, a message with a link to choose a new password
            is on its way. The link works once and only for a limited time.
          </p>
          <p className="mt-2">No message after a few minutes? Check the spam folder, or ask an admin.</p>
        </FormMessage>
      ) : (
        <form onSubmit={onSubmit} noValidate className="space-y-4">
          <p className="text-sm text-ink-muted">Enter the e-mail address of your account. Broodcast will send it a link.</p>
          <FormMessage kind="error">{formError}</FormMessage>
          <TextField
            label="E-mail"
            type="email"
            autoComplete="username"
            inputMode="email"
            spellCheck={false}
            error={errors.email?.message}
            {...register('email')}
          />
          <button type="submit" className="btn btn-primary w-full" disabled={isSubmitting}>
            {isSubmitting ? 'Sending…' : 'Send the reset link'}
          </button>
        </form>
      )}
      <p className="mt-5 text-sm">
        <Link to="/sign-in" className="link">
          Back to sign-in
        </Link>
      </p>
    </AuthShell>
  );
}
