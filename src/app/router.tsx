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
          { path: '*', element: <NotFoundPage /> },
        ],
      },
    ],
  },
];

export const createAppRouter = () => createBrowserRouter(routes);
