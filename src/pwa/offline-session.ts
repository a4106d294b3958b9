import type { QueryClient } from '@tanstack/react-query';
import { meResponse, type Me } from '../../shared/api/auth.schema';
import { isApiError, isUnauthorized } from '../lib/api-client';
import { queryKeys } from '../lib/query-keys';

/**
 * The signed-in user remembered on this device, so the app opens offline (docs/offline.md). The service
 * worker never caches /api, so without a connection GET /api/me cannot answer; the signed-in layout then
 * uses the copy kept here, made from the last answer the server gave. It is forgotten on sign-out (the
 * query cache is cleared), when the server answers 401, and after SESSION_MAX_AGE_MS. It only opens the
 * screens: every call still goes to the server, which checks the real session.
 */
export const OFFLINE_SESSION_KEY = 'broodcast.offline.session.v1';
/** A week: as long as a survey trip may last without a connection, well within the session's own life. */
export const SESSION_MAX_AGE_MS = 7 * 24 * 3600_000;

type Kept = { me: Me; savedAt: number };
type Storage = Pick<globalThis.Storage, 'getItem' | 'setItem' | 'removeItem'>;

const storage = (): Storage | null => {
  try {
    return globalThis.localStorage ?? null;
  } catch {
    return null;
  }
};

export function rememberSession(me: Me, now = Date.now(), store: Storage | null = storage()): void {
  try {
    store?.setItem(OFFLINE_SESSION_KEY, JSON.stringify({ me, savedAt: now } satisfies Kept));
  } catch {
    // storage full or refused: the app simply does not open offline
  }
}

export function forgetSession(store: Storage | null = storage()): void {
  try {
    store?.removeItem(OFFLINE_SESSION_KEY);
  } catch {
    // nothing kept
  }
}

/** The remembered user, if any and not too old. */
export function rememberedSession(now = Date.now(), store: Storage | null = storage()): Kept | null {
  try {
    const raw = store?.getItem(OFFLINE_SESSION_KEY);
    if (!raw) return null;
    const kept = JSON.parse(raw) as Partial<Kept>;
    const me = meResponse.safeParse(kept.me);
    if (!me.success || typeof kept.savedAt !== 'number' || now - kept.savedAt > SESSION_MAX_AGE_MS) return null;
    return { me: me.data, savedAt: kept.savedAt };
  } catch {
    return null;
  }
}

let restoring = false;

/** Keeps the remembered copy in step with the `me` query: saved on each answer, dropped on 401 or sign-out. */
export function watchSession(queryClient: QueryClient): () => void {
  // Started after the first screen (src/pwa/register.ts): a user already loaded is remembered now, with the
  // time of that answer (a copy restored from this device keeps its own time).
  const current = queryClient.getQueryState(queryKeys.me);
  if (current?.status === 'success' && current.data) {
    const me = meResponse.safeParse(current.data);
    if (me.success) rememberSession(me.data, current.dataUpdatedAt);
  }
  return queryClient.getQueryCache().subscribe((event) => {
    if (event.query.queryKey[0] !== queryKeys.me[0]) return;
    if (event.type === 'removed') return forgetSession();
    if (event.type !== 'updated') return;
    const { action } = event;
    if (action.type === 'success' && action.data) {
      const me = meResponse.safeParse(action.data);
      if (me.success && !restoring) rememberSession(me.data);
    } else if (action.type === 'error' && isUnauthorized(action.error)) forgetSession();
  });
}

/**
 * For the signed-in layout's loader: when the browser is offline (or the server cannot be reached) and no
 * user is loaded yet, put the remembered one in the query cache — marked as old, so it is fetched again as
 * soon as the connection is back. Returns whether it did.
 */
export function restoreOfflineSession(queryClient: QueryClient, error?: unknown): boolean {
  const unreachable = error === undefined ? globalThis.navigator?.onLine === false : isApiError(error) && error.status === 0;
  if (!unreachable || queryClient.getQueryData(queryKeys.me)) return false;
  const kept = rememberedSession();
  if (!kept) return false;
  restoring = true;
  try {
    queryClient.setQueryData(queryKeys.me, kept.me, { updatedAt: kept.savedAt });
  } finally {
    restoring = false;
  }
  return true;
}
