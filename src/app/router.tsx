import { createBrowserRouter, type RouteObject } from 'react-router-dom';
import { SignInPage } from '../features/auth/sign-in.page';
import { PasswordResetRequestPage } from '../features/auth/password-reset-request.page';
import { PasswordResetConfirmPage } from '../features/auth/password-reset-confirm.page';
import { InviteAcceptPage } from '../features/auth/invite-accept.page';
import { LadderPage } from '../features/ladder/ladder.page';
import { UsersAdminPage } from '../features/users/users-admin.page';
import { DistrictsAdminPage } from '../features/districts/districts-admin.page';
import { AppLayout } from './app-layout';
import { rolesFor } from './navigation';
import { NotFoundPage } from './not-found.page';
import { queryClient } from './query-client';
import { LoadingScreen, RouteErrorPage, ScreenErrorPage } from './route-error.page';
import { RequireRole, sessionLoader } from './session';

/**
 * The routes. Screens without a session stand alone; everything else sits in the signed-in layout, whose
 * loader sends a person without a session to /sign-in. Each guarded screen takes its roles from the
 * navigation data, so the menu and the guard agree.
 */
export const routes: RouteObject[] = [
  { path: '/sign-in', element: <SignInPage /> },
  { path: '/forgot-password', element: <PasswordResetRequestPage /> },
  { path: '/reset-password', element: <PasswordResetConfirmPage /> },
  { path: '/invite/accept', element: <InviteAcceptPage /> },
  {
    // The one-click unsubscribe link of every mail: no session needed.
    path: '/unsubscribe',
    lazy: async () => ({ Component: (await import('../features/subscriptions/unsubscribe.page')).UnsubscribePage }),
  },
  {
    id: 'signed-in',
    path: '/',
    loader: sessionLoader(queryClient),
    element: <AppLayout />,
    errorElement: <RouteErrorPage />,
    HydrateFallback: LoadingScreen,
    children: [
      {
        errorElement: <ScreenErrorPage />,
        children: [
          {
            index: true,
            element: (
              <RequireRole roles={rolesFor('ladder')}>
                <LadderPage />
              </RequireRole>
            ),
          },
          {
            path: 'admin/users',
            element: (
              <RequireRole roles={rolesFor('users')}>
                <UsersAdminPage />
              </RequireRole>
            ),
          },
          {
            path: 'admin/districts',
            element: (
              <RequireRole roles={rolesFor('districts')}>
                <DistrictsAdminPage />
              </RequireRole>
            ),
          },
          {
            path: 'admin/profiles',
            lazy: async () => {
              const { ProfilesPage } = await import('../features/profiles/profiles.page');
              return { element: <RequireRole roles={rolesFor('profiles')}><ProfilesPage /></RequireRole> };
            },
          },
          {
            path: 'cases',
            lazy: async () => {
              const { CaseLedgerPage } = await import('../features/cases/case-ledger.page');
              return { element: <RequireRole roles={rolesFor('case-ledger')}><CaseLedgerPage /></RequireRole> };
            },
          },
          {
            // Part of the District file: every signed-in role (the server keeps community workers to their district).
            path: 'districts/:id/cases',
            lazy: async () => ({ Component: (await import('../features/cases/district-cases.page')).DistrictCasesPage }),
          },
          {
            path: 'surveys',
            lazy: async () => {
              const { SurveysPage } = await import('../features/surveys/surveys.page');
              return { element: <RequireRole roles={rolesFor('surveys')}><SurveysPage /></RequireRole> };
            },
          },
          {
            // The printable District file (static SVG drawings, no ECharts).
            path: 'districts/:id/print',
            lazy: async () => {
              const { DistrictPrintPage } = await import('../features/district-file/print/district-print.page');
              return { element: <RequireRole roles={rolesFor('ladder')}><DistrictPrintPage /></RequireRole> };
            },
          },
          {
            // The District file, with ECharts, loads only when a District file is opened.
            path: 'districts/:id',
            lazy: async () => {
              const { DistrictFilePage } = await import('../features/district-file/district-file.page');
              return { element: <RequireRole roles={rolesFor('ladder')}><DistrictFilePage /></RequireRole> };
            },
          },
          {
            path: 'season-runs',
            lazy: async () => {
              const { SeasonRunsPage } = await import('../features/season-runs/season-runs.page');
              return { element: <RequireRole roles={rolesFor('season-runs')}><SeasonRunsPage /></RequireRole> };
            },
          },
          {
            path: 'intake',
            lazy: async () => {
              const { IntakePage } = await import('../features/weather/intake.page');
              return { element: <RequireRole roles={rolesFor('intake')}><IntakePage /></RequireRole> };
            },
          },
          {
            // Stations and district weather series: every signed-in role (community workers: their own district).
            path: 'weather/stations',
            lazy: async () => ({ Component: (await import('../features/weather/stations.page')).StationsPage }),
          },
          {
            path: 'weather/districts/:id?',
            lazy: async () => ({ Component: (await import('../features/weather/district-weather.page')).DistrictWeatherPage }),
          },
          {
            path: 'sign-off',
            lazy: async () => {
              const { SignOffPage } = await import('../features/flags/sign-off.page');
              return { element: <RequireRole roles={rolesFor('sign-off')}><SignOffPage /></RequireRole> };
            },
          },
          {
            // Raise a flag by hand: health officers and epidemiologists (DESIGN.md §2).
            path: 'flags/new',
            lazy: async () => {
              const { RaiseFlagPage } = await import('../features/flags/raise-flag.page');
              return { element: <RequireRole roles={['officer', 'epidemiologist']}><RaiseFlagPage /></RequireRole> };
            },
          },
          {
            path: 'flags/:id',
            lazy: async () => {
              const { FlagPage } = await import('../features/flags/flag.page');
              return { element: <RequireRole roles={['admin', 'officer', 'epidemiologist', 'supervisor']}><FlagPage /></RequireRole> };
            },
          },
          {
            path: 'advisories',
            lazy: async () => {
              const { AdvisoriesPage } = await import('../features/flags/advisories.page');
              return { element: <RequireRole roles={rolesFor('advisories')}><AdvisoriesPage /></RequireRole> };
            },
          },
          {
            path: 'bulletin',
            lazy: async () => {
              const { BulletinPage } = await import('../features/bulletins/bulletin.page');
              return { element: <RequireRole roles={rolesFor('bulletin')}><BulletinPage /></RequireRole> };
            },
          },
          {
            // Every signed-in role chooses its own mail.
            path: 'preferences',
            lazy: async () => ({ Component: (await import('../features/subscriptions/preferences.page')).PreferencesPage }),
          },
          {
            // Every signed-in role sets its own language and display units.
            path: 'settings',
            lazy: async () => ({ Component: (await import('../features/settings/settings.page')).SettingsPage }),
          },
          { path: '*', element: <NotFoundPage /> },
        ],
      },
    ],
  },
];

export const createAppRouter = () => createBrowserRouter(routes);
