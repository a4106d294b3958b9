import { useEffect, useRef } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { Trans, useTranslation } from 'react-i18next';
import { FormMessage } from '../../components/form';
import { errorText } from '../../lib/error-text';
import { AuthShell } from '../auth/components/auth-shell';
import { useUnsubscribe } from './api/subscriptions.api';

/**
 * The landing page of the one-click link in every mail: no sign-in. The change is a POST made by this page,
 * so a mail scanner that merely fetches the link changes nothing.
 */
export function UnsubscribePage() {
  const { t } = useTranslation('subscriptions');
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
    <AuthShell title={t('unsubscribe.title')}>
      {!token ? (
        <FormMessage kind="error">{t('unsubscribe.noToken')}</FormMessage>
      ) : unsubscribe.isPending || unsubscribe.isIdle ? (
        <p>{t('unsubscribe.stopping')}</p>
      ) : unsubscribe.isError ? (
        <FormMessage kind="error">{errorText(unsubscribe.error)}</FormMessage>
      ) : (
        <FormMessage kind="success">
          {t('unsubscribe.done', { email: unsubscribe.data.email, district: unsubscribe.data.districtName })}
        </FormMessage>
      )}
      <p className="mt-4 text-sm">
        <Trans t={t} i18nKey="unsubscribe.choose" components={{ link: <Link className="link" to="/preferences" /> }} />
      </p>
    </AuthShell>
  );
}
