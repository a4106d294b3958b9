import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { signInBody } from '../../../../shared/api/auth.schema';
import type { Me } from '../../../../shared/api/auth.schema';
import { isApiError } from '../../../lib/api-client';
import { applyServerFieldErrors, formErrorText } from '../../../lib/form-errors';
import { FormMessage, TextField } from '../../../components/form';
import { useSignIn } from '../api/sign-in.api';

export const WRONG_CREDENTIALS_MESSAGE = 'The e-mail or password is not right.';
export const RATE_LIMITED_MESSAGE = 'Too many sign-in attempts. Wait a few minutes, then try again.';

/** What to say after a failed sign-in: never which of the two was wrong. */
export function signInErrorText(error: unknown): string {
  if (isApiError(error) && error.status === 401) return WRONG_CREDENTIALS_MESSAGE;
  if (isApiError(error) && error.status === 429) return RATE_LIMITED_MESSAGE;
  return formErrorText(error);
}

export function SignInForm({ onSignedIn }: { onSignedIn: (me: Me) => void }) {
  const signIn = useSignIn();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    setValue,
    formState: { errors, isSubmitting },
  } = useForm({ resolver: zodResolver(signInBody), defaultValues: { email: '', password: '' } });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      const me = await signIn.mutateAsync(values);
      onSignedIn(me);
    } catch (error) {
      const unmatched = applyServerFieldErrors(error, setError, ['email', 'password']);
      setFormError(isApiError(error) && error.status === 400 ? formErrorText(error, unmatched) : signInErrorText(error));
      if (isApiError(error) && error.status === 401) setValue('password', '');
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
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
      <TextField
        label="Password"
        type="password"
        autoComplete="current-password"
        error={errors.password?.message}
        {...register('password')}
      />
      <button type="submit" className="btn btn-primary w-full" disabled={isSubmitting}>
        {isSubmitting ? 'Signing in…' : 'Sign in'}
      </button>
    </form>
  );
}
