import { afterEach, beforeAll, expect, vi } from 'vitest';
import { queryClient } from '../../../src/app/query-client';
import { i18n, i18nReady, missingKeys, NAMESPACES } from '../../../src/i18n';
import './bundled-texts';
import { unmountAll } from './render';

// happy-dom's IntersectionObserver never reports; parts that wait to come near the viewport (the
// Ladder's region map) would never load. Here every observed element is in view at once.
class InViewObserver {
  constructor(private readonly callback: IntersectionObserverCallback) {}
  observe(target: Element) {
    queueMicrotask(() => this.callback([{ isIntersecting: true, target } as IntersectionObserverEntry], this as unknown as IntersectionObserver));
  }
  unobserve() {}
  disconnect() {}
  takeRecords() {
    return [];
  }
}
globalThis.IntersectionObserver = InViewObserver as unknown as typeof IntersectionObserver;

// Client tests read the English interface; a key that English lacks fails the test that rendered it.
beforeAll(async () => {
  await i18nReady;
  await i18n.loadNamespaces(NAMESPACES);
  await i18n.changeLanguage('en');
  // Modules the app fetches on first use rather than with its first screen (zod and the contracts, the
  // remembered session, the region map): transformed once here, so a test's short wait measures the app,
  // not the test runner's first transform of zod.
  await Promise.all([
    import('../../../shared/api/auth.schema'),
    import('../../../shared/api/common.schema'),
    import('@hookform/resolvers/zod'),
    import('../../../src/pwa/offline-session'),
    import('../../../src/features/region-map/region-map'),
  ]);
});

// Every test starts with nothing rendered, an empty query cache and the real globals (fetch, …).
afterEach(() => {
  unmountAll();
  queryClient.clear();
  vi.unstubAllGlobals();
  const missing = [...missingKeys];
  missingKeys.clear();
  expect(missing, 'translation keys missing in English').toEqual([]);
});
