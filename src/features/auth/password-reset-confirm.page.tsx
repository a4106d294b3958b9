import { useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { FormMessage } from '../../components/form';
import { useConfirmPasswordReset } from './api/password-reset-confirm.api';
import { AuthShell } from './components/auth-shell';
import { SetPasswordForm } from './components/set-password.form';

const invalidLink = (
  <>
    This reset link has already been used or has expired.{' '}
    <Link to="/forgot-password" className="link">
      Ask for a new link
    </Link>
    .
  </>
);

export function PasswordResetConfirmPage() {
  const [params] = useSearchParams();
  const token = params.get('token');
  const confirm = useConfirmPasswordReset();
  const [done, setDone] = useState(false);

  return (
    <AuthShell title="Choose a new password">
      {done ? (
        <FormMessage kind="success">
          Your new password is set.{' '}
          <Link to="/sign-in" className="link">
            Sign in
          </Link>
          .
        </FormMessage>
      ) : !token ? (
        <FormMessage kind="error">
          This page needs the link from the reset e-mail, complete.{' '}
          <Link to="/forgot-password" className="link">
            Ask for a new link
          </Link>
          .
        </FormMessage>
      ) : (
        <SetPasswordForm
          token={token}
          submit={confirm.mutateAsync}
          submitLabel="Set the new password"
          invalidLink={invalidLink}
          onDone={() => setDone(true)}
        />
      )}
    </AuthShell>
  );
}
