import { useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { Trans, useTranslation } from 'react-i18next';
import { FormMessage } from '../../components/form';
import { useAcceptInvite } from './api/invite-accept.api';
import { AuthShell } from './components/auth-shell';
import { SetPasswordForm } from './components/set-password.form';

export function InviteAcceptPage() {
  const { t } = useTranslation('auth');
  const [params] = useSearchParams();
  const token = params.get('token');
  const accept = useAcceptInvite();
  const [done, setDone] = useState(false);

  return (
    <AuthShell title={t('invite.title')}>
      {done ? (
        <FormMessage kind="success">
          <Trans t={t} i18nKey="invite.done" components={{ link: <Link to="/sign-in" className="link" /> }} />
        </FormMessage>
      ) : !token ? (
        <FormMessage kind="error">{t('invite.noToken')}</FormMessage>
      ) : (
        <>
          <p className="mb-4 text-sm text-ink-muted">{t('invite.lead')}</p>
          <SetPasswordForm
            token={token}
            submit={accept.mutateAsync}
            submitLabel={t('invite.submit')}
            invalidLink={<>{t('invite.invalidLink')}</>}
            onDone={() => setDone(true)}
          />
        </>
      )}
    </AuthShell>
  );
}
