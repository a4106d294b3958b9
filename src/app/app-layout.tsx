import { Navigate, NavLink, Outlet, useLocation, useNavigate } from 'react-router-dom';
import { useTranslation } from 'react-i18next';
import type { Role } from '../../shared/roles';
import { OfflineBanner } from '../components/offline-banner';
import { useRoleLabel } from '../lib/labels';
import { isUnauthorized } from '../lib/api-client';
import { useMe } from '../features/auth/api/me.api';
import { useSignOut } from '../features/auth/api/sign-out.api';
import { PreferencesProvider } from '../features/settings/preferences-provider';
import { MainNav } from './main-nav';
import { SessionProvider, signInPath } from './session';
import { LoadingScreen, RouteErrorPage } from './route-error.page';

/** The frame of every signed-in screen: product name, who is signed in, sign-out, the main navigation. */
export function AppLayout() {
  const me = useMe();
  const location = useLocation();
  const { t } = useTranslation('app');

  if (me.isError && isUnauthorized(me.error)) {
    return <Navigate to={signInPath(location.pathname + location.search)} replace />;
  }
  if (!me.data) return me.isError ? <RouteErrorPage error={me.error} /> : <LoadingScreen />;

  return (
    <SessionProvider me={me.data}>
      <div className="min-h-dvh bg-paper text-ink">
        <a href="#main" className="skip-link">
          {t('layout.skipLink')}
        </a>
        <AppHeader displayName={me.data.displayName} role={me.data.role} />
        <OfflineBanner />
        <main id="main" tabIndex={-1} className="mx-auto w-full max-w-6xl px-4 py-6 sm:px-6 sm:py-8">
          <PreferencesProvider me={me.data}>
            <Outlet />
          </PreferencesProvider>
        </main>
      </div>
    </SessionProvider>
  );
}

function AppHeader({ displayName, role }: { displayName: string; role: Role }) {
  const { t } = useTranslation('app');
  const roleLabel = useRoleLabel();
  const navigate = useNavigate();
  const signOut = useSignOut({ leave: () => navigate('/sign-in', { replace: true }) });
  const onSignOut = () => signOut.mutate();

  return (
    <header className="app-header">
      <div className="mx-auto flex w-full max-w-6xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-3 sm:px-6">
        <NavLink to="/" className="brand text-xl" aria-label={t('layout.brandLabel')}>
          Broodcast
        </NavLink>
        <div className="ml-auto flex min-w-0 items-center gap-3 text-sm">
          <p className="min-w-0 text-right leading-tight">
            <span className="block truncate font-bold">{displayName}</span>
            <span data-testid="current-role" className="block text-accent-100">
              {roleLabel(role)}
            </span>
          </p>
          <button type="button" className="btn btn-on-accent" onClick={onSignOut} disabled={signOut.isPending}>
            {t('layout.signOut')}
          </button>
        </div>
      </div>
      <MainNav role={role} />
    </header>
  );
}
