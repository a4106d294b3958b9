import { useState } from 'react';
import { useForm, type Resolver } from 'react-hook-form';
import { useTranslation } from 'react-i18next';
import type { Me, SignInBody } from '../../../../shared/api/auth.schema';
import { i18n } from '../../../i18n';
import { isApiError } from '../../../lib/api-client';
import { applyServerFieldErrors, formErrorText } from '../../../lib/form-errors';
import { FormMessage, TextField } from '../../../components/form';
import { useSignIn } from '../api/sign-in.api';
import { loadAuthSchemas } from '../api/auth-schemas';

/**
 * The form is checked with the shared contract (signInBody) through the zod resolver, both fetched on the
 * first check (on submit) rather than with the page, so the first screen carries no zod; the page starts
 * the fetch as soon as the person starts on the form (src/app/router.tsx), well before they submit.
 */
const signInResolver: Resolver<SignInBody> = async (values, context, options) => {
  const [{ zodResolver }, { signInBody }] = await Promise.all([import('@hookform/resolvers/zod'), loadAuthSchemas()]);
  return zodResolver(signInBody)(values, context, options);
};

/** What to say after a failed sign-in, in the interface language: never which of the two was wrong. */
export function signInErrorText(error: unknown): string {
  if (isApiError(error) && error.status === 401) return i18n.t('signIn.wrongCredentials', { ns: 'auth' });
  if (isApiError(error) && error.status === 429) return i18n.t('signIn.rateLimited', { ns: 'auth' });
  return formErrorText(error);
}

export function SignInForm({ onSignedIn }: { onSignedIn: (me: Me) => void }) {
  const { t } = useTranslation('auth');
  const signIn = useSignIn();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    setValue,
    formState: { errors, isSubmitting },
  } = useForm<SignInBody>({ resolver: signInResolver, defaultValues: { email: '', password: '' } });

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
        label={t('fields.email')}
        type="email"
        autoComplete="username"
        inputMode="email"
        spellCheck={false}
        error={errors.email?.message}
        {...register('email')}
      />
      <TextField
        label={t('fields.password')}
        type="password"
        autoComplete="current-password"
        error={errors.password?.message}
        {...register('password')}
      />
      <button type="submit" className="btn btn-primary w-full" disabled={isSubmitting}>
        {isSubmitting ? t('signIn.submitting') : t('signIn.submit')}
      </button>
    </form>
  );
}
