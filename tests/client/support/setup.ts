import { afterEach, beforeAll, expect, vi } from 'vitest';
import { queryClient } from '../../../src/app/query-client';
import { i18n, i18nReady, missingKeys, NAMESPACES } from '../../../src/i18n';
import './bundled-texts';
import { unmountAll } from './render';

// Client tests read the English interface; a key that English lacks fails the test that rendered it.
beforeAll(async () => {
  await i18nReady;
  await i18n.loadNamespaces(NAMESPACES);
  await i18n.changeLanguage('en');
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
