import type { ReactNode, SyntheticEvent } from 'react';
import { createBrowserRouter, matchRoutes, type RouteObject } from 'react-router-dom';
import { loadNamespaces } from '../i18n';
import { SCREEN_TEXTS, type ScreenModule } from '../i18n/screen-texts';
import { meQueryOptions } from '../features/auth/api/me.api';
import { loadAuthSchemas } from '../features/auth/api/auth-schemas';
import { rolesWith } from '../../shared/permissions';
import { rolesFor } from './navigation';
import { NotFoundPage } from './not-found.page';
import { queryClient } from './query-client';
import { LoadingScreen, RouteErrorPage, ScreenErrorPage } from './route-error.page';
import { RequireRole, sessionLoader } from './session';

type LazyParts = Awaited<ReturnType<Extract<NonNullable<RouteObject['lazy']>, (...args: never[]) => unknown>>>;

/**
 * Every screen is its own chunk (React Router lazy routes), fetched with its texts in the user's language
 * (src/i18n/screen-texts.ts), both at once, the first time its route is matched or preloaded. So the
 * sign-in page brings no chart, map or table code, and a screen's code arrives only when it is opened or
 * likely to be (see `preloadPath`). The promise is kept, so a preload and the navigation share one fetch;
 * a failed fetch (offline) is forgotten and tried again next time.
 */
function screen<M>(texts: ScreenModule, load: () => Promise<M>, parts: (m: M) => LazyParts): () => Promise<LazyParts> {
  let pending: Promise<LazyParts> | null = null;
  return () =>
    (pending ??= Promise.all([load(), loadNamespaces(SCREEN_TEXTS[texts])]).then(
      ([m]) => parts(m),
      (error: unknown) => {
        pending = null;
        throw error;
      },
    ));
}

const guarded = (roles: Parameters<typeof RequireRole>[0]['roles'], page: ReactNode) => <RequireRole roles={roles}>{page}</RequireRole>;

/** Fetch the code and texts of the screens at `path` (no navigation), when a person is likely to open it. */
export function preloadPath(path: string): void {
  for (const match of matchRoutes(routes, path) ?? []) {
    const lazy = match.route.lazy;
    if (typeof lazy === 'function') void (lazy as () => Promise<unknown>)().catch(() => undefined);
  }
}

/** Where a pointer or the keyboard is heading: a link about to be followed has its screen preloaded. */
function preloadLinkTarget(event: SyntheticEvent) {
  const link = (event.target as Element | null)?.closest?.('a[href]');
  if (link instanceof HTMLAnchorElement && link.origin === window.location.origin) preloadPath(link.pathname);
}

/** Around the signed-in layout: hovering, touching or focusing any link preloads its screen. */
function PreloadLinks({ children }: { children: ReactNode }) {
  return (
    <div className="contents" onPointerOver={preloadLinkTarget} onTouchStart={preloadLinkTarget} onFocus={preloadLinkTarget}>
      {children}
    </div>
  );
}

/**
 * Around the sign-in page: once the person starts on the form, the form's check (zod, kept off the first
 * screen), the signed-in layout and the screen they will land on (the Ladder, or the `next` address) are
 * fetched while they type.
 */
let signInIntent = false;
function onSignInIntent() {
  if (signInIntent) return;
  signInIntent = true;
  // The form's check (the shared contract, zod and its resolver), kept off the first screen's code.
  void Promise.all([loadAuthSchemas(), import('@hookform/resolvers/zod')]).catch(() => undefined);
  const next = new URLSearchParams(window.location.search).get('next');
  preloadPath(next && next.startsWith('/') && !next.startsWith('//') ? next.split('?')[0] : '/');
}
function PreloadAfterSignIn({ children }: { children: ReactNode }) {
  return (
    <div className="contents" onPointerDown={onSignInIntent} onFocus={onSignInIntent} onKeyDown={onSignInIntent}>
      {children}
    </div>
  );
}

/**
 * The Ladder's data, asked for as soon as its route is matched (beside its code, not after it): once the
 * signed-in user is known, the board and the region map's boundaries go into the query cache.
 */
function prefetchLadderData() {
  void queryClient
    .ensureQueryData(meQueryOptions())
    .then(async () => {
      const [{ boardQueryOptions }, { boundariesQueryOptions }] = await Promise.all([
        import('../features/ladder/api/board.api'),
        import('../features/region-map/api/boundaries.api'),
      ]);
      await Promise.all([queryClient.prefetchQuery(boardQueryOptions()), queryClient.prefetchQuery(boundariesQueryOptions())]);
    })
    .catch(() => undefined); // no session: the layout's loader sends the person to sign in
  return null;
}

/**
 * The routes. Screens without a session stand alone; everything else sits in the signed-in layout, whose
 * loader sends a person without a session to /sign-in. Each guarded screen takes its roles from the
 * navigation data, so the menu and the guard agree.
 */
export const routes: RouteObject[] = [
  {
    path: '/sign-in',
    lazy: screen('features/auth/sign-in.page', () => import('../features/auth/sign-in.page'), ({ SignInPage }) => ({
      element: (
        <PreloadAfterSignIn>
          <SignInPage />
        </PreloadAfterSignIn>
      ),
    })),
  },
  {
    path: '/forgot-password',
    lazy: screen('features/auth/password-reset-request.page', () => import('../features/auth/password-reset-request.page'), (m) => ({ Component: m.PasswordResetRequestPage })),
  },
  {
    path: '/reset-password',
    lazy: screen('features/auth/password-reset-confirm.page', () => import('../features/auth/password-reset-confirm.page'), (m) => ({ Component: m.PasswordResetConfirmPage })),
  },
  {
    path: '/invite/accept',
    lazy: screen('features/auth/invite-accept.page', () => import('../features/auth/invite-accept.page'), (m) => ({ Component: m.InviteAcceptPage })),
  },
  {
    // The one-click unsubscribe link of every mail: no session needed.
    path: '/unsubscribe',
    lazy: screen('features/subscriptions/unsubscribe.page', () => import('../features/subscriptions/unsubscribe.page'), (m) => ({ Component: m.UnsubscribePage })),
  },
  {
    id: 'signed-in',
    path: '/',
    loader: sessionLoader(queryClient),
    lazy: screen('app/app-layout', () => import('./app-layout'), ({ AppLayout }) => ({
      element: (
        <PreloadLinks>
          <AppLayout />
        </PreloadLinks>
      ),
    })),
    errorElement: <RouteErrorPage />,
    HydrateFallback: LoadingScreen,
    children: [
      {
        errorElement: <ScreenErrorPage />,
        children: [
          {
            index: true,
            loader: prefetchLadderData,
            lazy: screen('features/ladder/ladder.page', () => import('../features/ladder/ladder.page'), ({ LadderPage }) => ({
              element: guarded(rolesFor('ladder'), <LadderPage />),
            })),
          },
          {
            path: 'admin/users',
            lazy: screen('features/users/users-admin.page', () => import('../features/users/users-admin.page'), ({ UsersAdminPage }) => ({
              element: guarded(rolesFor('users'), <UsersAdminPage />),
            })),
          },
          {
            path: 'admin/districts',
            lazy: screen('features/districts/districts-admin.page', () => import('../features/districts/districts-admin.page'), ({ DistrictsAdminPage }) => ({
              element: guarded(rolesFor('districts'), <DistrictsAdminPage />),
            })),
          },
          {
            path: 'admin/tier-settings',
            lazy: screen('features/tier-settings/tier-settings.page', () => import('../features/tier-settings/tier-settings.page'), ({ TierSettingsPage }) => ({
              element: guarded(rolesFor('tier-settings'), <TierSettingsPage />),
            })),
          },
          {
            path: 'admin/profiles',
            lazy: screen('features/profiles/profiles.page', () => import('../features/profiles/profiles.page'), ({ ProfilesPage }) => ({
              element: guarded(rolesFor('profiles'), <ProfilesPage />),
            })),
          },
          {
            path: 'cases',
            lazy: screen('features/cases/case-ledger.page', () => import('../features/cases/case-ledger.page'), ({ CaseLedgerPage }) => ({
              element: guarded(rolesFor('case-ledger'), <CaseLedgerPage />),
            })),
          },
          {
            // Part of the District file: every signed-in role (the server keeps community workers to their district).
            path: 'districts/:id/cases',
            lazy: screen('features/cases/district-cases.page', () => import('../features/cases/district-cases.page'), (m) => ({ Component: m.DistrictCasesPage })),
          },
          {
            path: 'surveys',
            lazy: screen('features/surveys/surveys.page', () => import('../features/surveys/surveys.page'), ({ SurveysPage }) => ({
              element: guarded(rolesFor('surveys'), <SurveysPage />),
            })),
          },
          {
            // The printable District file (static SVG drawings, no ECharts).
            path: 'districts/:id/print',
            lazy: screen('features/district-file/print/district-print.page', () => import('../features/district-file/print/district-print.page'), ({ DistrictPrintPage }) => ({
              element: guarded(rolesFor('ladder'), <DistrictPrintPage />),
            })),
          },
          {
            // The District file, with ECharts, loads only when a District file is opened.
            path: 'districts/:id',
            lazy: screen('features/district-file/district-file.page', () => import('../features/district-file/district-file.page'), ({ DistrictFilePage }) => ({
              element: guarded(rolesFor('ladder'), <DistrictFilePage />),
            })),
          },
          {
            path: 'field-log',
            lazy: screen('features/field-log/field-log.page', () => import('../features/field-log/field-log.page'), ({ FieldLogPage }) => ({
              element: guarded(rolesFor('field-log'), <FieldLogPage />),
            })),
          },
          {
            path: 'field-week',
            lazy: screen('features/field-week/field-week.page', () => import('../features/field-week/field-week.page'), ({ FieldWeekPage }) => ({
              element: guarded(rolesFor('field-week'), <FieldWeekPage />),
            })),
          },
          {
            path: 'season-runs',
            lazy: screen('features/season-runs/season-runs.page', () => import('../features/season-runs/season-runs.page'), ({ SeasonRunsPage }) => ({
              element: guarded(rolesFor('season-runs'), <SeasonRunsPage />),
            })),
          },
          {
            path: 'look-back',
            lazy: screen('features/look-back/look-back.page', () => import('../features/look-back/look-back.page'), ({ LookBackPage }) => ({
              element: guarded(rolesFor('look-back'), <LookBackPage />),
            })),
          },
          {
            path: 'intake',
            lazy: screen('features/weather/intake.page', () => import('../features/weather/intake.page'), ({ IntakePage }) => ({
              element: guarded(rolesFor('intake'), <IntakePage />),
            })),
          },
          {
            // Stations and district weather series: every signed-in role (community workers: their own district).
            path: 'weather/stations',
            lazy: screen('features/weather/stations.page', () => import('../features/weather/stations.page'), (m) => ({ Component: m.StationsPage })),
          },
          {
            path: 'weather/districts/:id?',
            lazy: screen('features/weather/district-weather.page', () => import('../features/weather/district-weather.page'), (m) => ({ Component: m.DistrictWeatherPage })),
          },
          {
            path: 'sign-off',
            lazy: screen('features/flags/sign-off.page', () => import('../features/flags/sign-off.page'), ({ SignOffPage }) => ({
              element: guarded(rolesFor('sign-off'), <SignOffPage />),
            })),
          },
          {
            // Raise a flag by hand: health officers and epidemiologists (docs/product.md § Roles).
            path: 'flags/new',
            lazy: screen('features/flags/raise-flag.page', () => import('../features/flags/raise-flag.page'), ({ RaiseFlagPage }) => ({
              element: guarded(rolesWith('flags.raise'), <RaiseFlagPage />),
            })),
          },
          {
            path: 'flags/:id',
            lazy: screen('features/flags/flag.page', () => import('../features/flags/flag.page'), ({ FlagPage }) => ({
              element: guarded(rolesWith('flags.read'), <FlagPage />),
            })),
          },
          {
            path: 'advisories',
            lazy: screen('features/flags/advisories.page', () => import('../features/flags/advisories.page'), ({ AdvisoriesPage }) => ({
              element: guarded(rolesFor('advisories'), <AdvisoriesPage />),
            })),
          },
          {
            path: 'bulletin',
            lazy: screen('features/bulletins/bulletin.page', () => import('../features/bulletins/bulletin.page'), ({ BulletinPage }) => ({
              element: guarded(rolesFor('bulletin'), <BulletinPage />),
            })),
          },
          {
            // Every signed-in role chooses its own mail.
            path: 'preferences',
            lazy: screen('features/subscriptions/preferences.page', () => import('../features/subscriptions/preferences.page'), (m) => ({ Component: m.PreferencesPage })),
          },
          {
            // Every signed-in role sets its own language and display units.
            path: 'settings',
            lazy: screen('features/settings/settings.page', () => import('../features/settings/settings.page'), (m) => ({ Component: m.SettingsPage })),
          },
          { path: '*', element: <NotFoundPage /> },
        ],
      },
    ],
  },
];

export const createAppRouter = () => createBrowserRouter(routes);
