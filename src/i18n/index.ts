import i18next, { type i18n as I18n } from 'i18next';
import { initReactI18next } from 'react-i18next';
import { LANGUAGES, isLanguage, matchLanguage, type Language } from '../../shared/languages';

/**
 * i18next for the client. Resources are bundled JSON, one file per language and namespace
 * (`locales/<language>/<namespace>.json`; a feature owns its namespace), loaded eagerly so the first
 * paint is already translated and tests need no waiting. English is the fallback; a key missing in a
 * language is caught by tests/unit/i18n-keys.test.ts, and a key missing everywhere by the client tests
 * (see `missingKeys`).
 */
const modules = import.meta.glob<{ default: Record<string, unknown> }>('./locales/*/*.json', { eager: true });

export const resources: Record<string, Record<string, Record<string, unknown>>> = {};
for (const [path, mod] of Object.entries(modules)) {
  const m = /\.\/locales\/([^/]+)\/([^/]+)\.json$/.exec(path);
  if (!m) continue;
  (resources[m[1]] ??= {})[m[2]] = mod.default;
}
export const NAMESPACES = Object.keys(resources.en ?? {});

/** Keys asked for that English lacks, as "namespace:key" (client tests fail when this is not empty). */
export const missingKeys = new Set<string>();

const STORAGE_KEY = 'broodcast.language';

/** The language before sign-in: the one last chosen on this device, else the browser's, else English. */
export function initialLanguage(): Language {
  try {
    const stored = globalThis.localStorage?.getItem(STORAGE_KEY);
    if (isLanguage(stored)) return stored;
  } catch {
    // storage may be unavailable (private mode): fall through
  }
  const nav = globalThis.navigator;
  for (const tag of nav?.languages ?? [nav?.language]) {
    const lng = matchLanguage(tag);
    if (lng) return lng;
  }
  return 'en';
}

export const i18n: I18n = i18next.createInstance();
void i18n.use(initReactI18next).init({
  resources,
  lng: initialLanguage(),
  fallbackLng: 'en',
  supportedLngs: [...LANGUAGES],
  ns: NAMESPACES,
  defaultNS: 'common',
  initAsync: false,
  interpolation: { escapeValue: false }, // React escapes
  returnNull: false,
  saveMissing: true,
  missingKeyHandler: (_lngs, ns, key) => {
    missingKeys.add(`${ns}:${key}`);
  },
});

/** Switch the interface language (and remember it on this device). */
export async function setLanguage(lng: Language): Promise<void> {
  try {
    globalThis.localStorage?.setItem(STORAGE_KEY, lng);
  } catch {
    // not remembered on this device; the account's setting still applies after sign-in
  }
  if (i18n.language !== lng) await i18n.changeLanguage(lng);
  if (typeof document !== 'undefined') document.documentElement.lang = lng;
}

export type { Language } from '../../shared/languages';
