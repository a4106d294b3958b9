import type { QueryClient } from '@tanstack/react-query';

/**
 * Offline support of the client (docs/offline.md), started once by src/main.tsx:
 * - remembers the signed-in user on this device so the layout opens without a connection;
 * - registers the service worker that vite-plugin-pwa generates (/sw.js, precached shell, NetworkOnly
 *   for /api) — in production builds only, never under `vite` dev or the client tests (happy-dom).
 * A new version installs in the background and takes over at once (skipWaiting + clientsClaim); the
 * page already open keeps its code until it is next opened or reloaded.
 */
export function startOfflineSupport(queryClient: QueryClient): void {
  // Its own chunk (it checks the kept copy with zod, which the sign-in page does not otherwise need); any
  // answer already in the cache when it arrives is remembered by watchSession itself.
  void import('./offline-session').then(({ watchSession }) => watchSession(queryClient));
  if (!import.meta.env.PROD || import.meta.env.MODE === 'test') return;
  if (typeof navigator === 'undefined' || !('serviceWorker' in navigator)) return;
  const register = () =>
    navigator.serviceWorker.register('/sw.js', { scope: '/', updateViaCache: 'none' }).then(
      (registration) => {
        // Look for a new version whenever the app comes back to the foreground (at most hourly).
        let lastCheck = Date.now();
        document.addEventListener('visibilitychange', () => {
          if (document.visibilityState === 'visible' && Date.now() - lastCheck > 3600_000) {
            lastCheck = Date.now();
            void registration.update().catch(() => undefined);
          }
        });
      },
      (error: unknown) => console.warn('Broodcast works online only here: the service worker was not registered.', error),
    );
  // After the first paint, so registering never slows the start.
  if (document.readyState === 'complete') void register();
  else window.addEventListener('load', () => void register(), { once: true });
}
