import { afterEach, beforeAll, expect } from 'vitest';
import { i18n, missingKeys } from '../../../src/i18n';

// Client tests read the English interface; a key that English lacks fails the test that rendered it.
beforeAll(async () => {
  await i18n.changeLanguage('en');
});

afterEach(() => {
  const missing = [...missingKeys];
  missingKeys.clear();
  expect(missing, 'translation keys missing in English').toEqual([]);
});
