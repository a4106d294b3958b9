import { createContext, useContext, type ReactNode } from 'react';
import { redirect, type LoaderFunctionArgs } from 'react-router-dom';
import type { QueryClient } from '@tanstack/react-query';
import type { Me } from '../../shared/api/auth.schema';
import type { Role } from '../../shared/roles';
import { isUnauthorized } from '../lib/api-client';
import { meQueryOptions } from '../features/auth/api/me.api';
import { NotAllowedPage } from './not-allowed.page';

/** The remembered user (docs/offline.md), fetched only when needed: it brings zod to check the copy. */
const offlineSession = () => import('../pwa/offline-session');

/** Where to send someone without a session, remembering where they were going. */
export function signInPath(next?: string): string {
  return next && next !== '/' && isSafeNext(next) ? `/sign-in?next=${encodeURIComponent(next)}` : '/sign-in';
}

/** Only same-site paths are followed after sign-in ("/x", never "//host" or "https://…"). */
export function isSafeNext(next: string | null | undefined): next is string {
  return !!next && next.startsWith('/') && !next.startsWith('//') && !next.startsWith('/\\');
}

/** Route loader of the signed-in part of the app: no session (401) → the sign-in page. */
export const sessionLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    // offline: the user remembered on this device (docs/offline.md)
    if (globalThis.navigator?.onLine === false) (await offlineSession()).restoreOfflineSession(queryClient);
    try {
      await queryClient.ensureQueryData(meQueryOptions());
    } catch (error) {
      if ((await offlineSession()).restoreOfflineSession(queryClient, error)) return null;
      if (isUnauthorized(error)) {
        const url = new URL(request.url);
        throw redirect(signInPath(url.pathname + url.search));
      }
      throw error;
    }
    return null;
  };

const SessionContext = createContext<Me | null>(null);

export function SessionProvider({ me, children }: { me: Me; children: ReactNode }) {
  return <SessionContext value={me}>{children}</SessionContext>;
}

/** The signed-in user; only inside the signed-in layout. */
export function useSession(): Me {
  const me = useContext(SessionContext);
  if (!me) throw new Error('useSession() used outside the signed-in layout');
  return me;
}

export function canUse(role: Role, roles: readonly Role[]): boolean {
  return roles.includes(role);
}

/** Shows the "Not allowed" page instead of a screen the signed-in role may not use. */
export function RequireRole({ roles, children }: { roles: readonly Role[]; children: ReactNode }) {
  const me = useSession();
  return canUse(me.role, roles) ? children : <NotAllowedPage />;
}
