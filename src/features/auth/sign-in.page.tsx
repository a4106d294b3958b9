import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { useTranslation } from 'react-i18next';
import { isSafeNext } from '../../app/session';
import { AuthShell } from './components/auth-shell';
import { SignInForm } from './components/sign-in.form';

export function SignInPage() {
  const { t } = useTranslation('auth');
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const next = params.get('next');
  return (
    <AuthShell title={t('signIn.title')}>
      <SignInForm onSignedIn={() => navigate(isSafeNext(next) ? next : '/', { replace: true })} />
      <p className="mt-5 text-sm">
        <Link to="/forgot-password" className="link">
          {t('signIn.forgot')}
        </Link>
      </p>
    </AuthShell>
  );
}
