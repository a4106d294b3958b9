import { useEffect, useRef } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { FormMessage } from '../../components/form';
import { AuthShell } from '../auth/components/auth-shell';
import { useUnsubscribe } from './api/subscriptions.api';

/**
 * The landing page of the one-click link in every mail: no sign-in. The change is a POST made by this page,
 * so a mail scanner that merely fetches the link changes nothing.
 */
export function UnsubscribePage() {
  const [params] = useSearchParams();
  const token = params.get('token');
  const unsubscribe = useUnsubscribe();
  const sent = useRef(false);
  useEffect(() => {
    if (token && !sent.current) {
      sent.current = true;
      unsubscribe.mutate(token);
    }
  }, [token, unsubscribe]);

  return (
    <AuthShell title="Stop Broodcast mail">
      {!token ? (
        <FormMessage kind="error">This page needs the complete link from the mail. Open the link again.</FormMessage>
      ) : unsubscribe.isPending || unsubscribe.isIdle ? (
        <p>Stopping your mail…</p>
      ) : unsubscribe.isError ? (
        <FormMessage kind="error">{unsubscribe.error.message}</FormMessage>
      ) : (
        <FormMessage kind="success">
          {unsubscribe.data.email} will no longer receive advisories or bulletins for {unsubscribe.data.districtName}.
        </FormMessage>
      )}
      <p className="mt-4 text-sm">
        To choose exactly which districts you receive,{' '}
        <Link className="link" to="/preferences">
          sign in and open your mail preferences
        </Link>
        .
      </p>
    </AuthShell>
  );
}
