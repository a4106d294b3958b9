import { useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { Trans, useTranslation } from 'react-i18next';
import { FormMessage } from '../../components/form';
import { useConfirmPasswordReset } from './api/password-reset-confirm.api';
import { AuthShell } from './components/auth-shell';
import { SetPasswordForm } from './components/set-password.form';

const askAgain = { link: <Link to="/forgot-password" className="link" /> };

export function PasswordResetConfirmPage() {
  const { t } = useTranslation('auth');
  const [params] = useSearchParams();
  const token = params.get('token');
  const confirm = useConfirmPasswordReset();
  const [done, setDone] = useState(false);

  return (
    <AuthShell title={t('resetConfirm.title')}>
      {done ? (
        <FormMessage kind="success">
          <Trans t={t} i18nKey="resetConfirm.done" components={{ link: <Link to="/sign-in" className="link" /> }} />
        </FormMessage>
      ) : !token ? (
        <FormMessage kind="error">
          <Trans t={t} i18nKey="resetConfirm.noToken" components={askAgain} />
        </FormMessage>
      ) : (
        <SetPasswordForm
          token={token}
          submit={confirm.mutateAsync}
          submitLabel={t('resetConfirm.submit')}
          invalidLink={<Trans t={t} i18nKey="resetConfirm.invalidLink" components={askAgain} />}
          onDone={() => setDone(true)}
        />
      )}
    </AuthShell>
  );
}
