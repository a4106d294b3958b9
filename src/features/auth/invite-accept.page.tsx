import { useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { FormMessage } from '../../components/form';
import { useAcceptInvite } from './api/invite-accept.api';
import { AuthShell } from './components/auth-shell';
import { SetPasswordForm } from './components/set-password.form';

const invalidLink = (
  <>This invitation has already been used or has expired. Ask the admin who invited you to send a new one.</>
);

export function InviteAcceptPage() {
  const [params] = useSearchParams();
  const token = params.get('token');
  const accept = useAcceptInvite();
  const [done, setDone] = useState(false);

  return (
    <AuthShell title="Welcome to Broodcast">
      {done ? (
        <FormMessage kind="success">
          Your account is ready.{' '}
          <Link to="/sign-in" className="link">
            Sign in
          </Link>{' '}
          with your e-mail address and the password you just chose.
        </FormMessage>
      ) : !token ? (
        <FormMessage kind="error">
          This page needs the complete link from the invitation e-mail. Open the link again, or ask the admin who
          invited you for a new invitation.
        </FormMessage>
      ) : (
        <>
          <p className="mb-4 text-sm text-ink-muted">You have been invited. Choose a password to open your account.</p>
          <SetPasswordForm
            token={token}
            submit={accept.mutateAsync}
            submitLabel="Open my account"
            invalidLink={invalidLink}
            onDone={() => setDone(true)}
          />
        </>
      )}
    </AuthShell>
  );
}
