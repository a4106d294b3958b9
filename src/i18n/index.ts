import i18next, { type i18n as I18n } from 'i18next';
import resourcesToBackend from 'i18next-resources-to-backend';
import { initReactI18next } from 'react-i18next';
import { LANGUAGES, isLanguage, matchLanguage, type Language } from '../../shared/languages';
import { BASE_NAMESPACES } from './screen-texts';

/**
 * i18next for the client. The texts are JSON, one file per language and namespace
 * (`locales/<language>/<namespace>.json`; a feature owns its namespace). Each file is its own small chunk
 * of the build, fetched when first needed (i18next-resources-to-backend over Vite's lazy
 * `import.meta.glob`): a person gets only their own language, and only the namespaces of the screens
 * they open. `BASE_NAMESPACES` load at start; each route of src/app/router.tsx loads the namespaces of its
 * screen (src/i18n/screen-texts.ts) with its code (see `loadNamespaces`). A component whose namespace is not loaded
 * yet suspends (react-i18next) until it is. There is no fallback language at run time, so a French user
 * never downloads the English texts: tests/unit/i18n-keys.test.ts keeps every key in every language, and
 * a key missing everywhere is caught by the client tests (see `missingKeys`). The client tests load every
 * file synchronously instead (tests/client/support/setup.ts, `addBundledResources`).
 */
const loaders = import.meta.glob<{ default: Record<string, unknown> }>('./locales/*/*.json');
const fileOf = (lng: string, ns: string) => `./locales/${lng}/${ns}.json`;

/** Every namespace (English has them all). */
export const NAMESPACES = Object.keys(loaders)
  .map((p) => /^\.\/locales\/en\/([^/]+)\.json$/.exec(p)?.[1])
  .filter((ns): ns is string => !!ns);

export { BASE_NAMESPACES };

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
/** Resolves once the base namespaces of the start language are in (the client tests wait for it). */
export const i18nReady = i18n
  .use(
    resourcesToBackend(async (lng: string, ns: string) => {
      const load = loaders[fileOf(lng, ns)];
      if (!load) throw new Error(`no texts for ${lng}/${ns}`);
      return (await load()).default;
    }),
  )
  .use(initReactI18next)
  .init({
    lng: initialLanguage(),
    // No run-time fallback: it would download a second language for every user (see above).
    fallbackLng: false,
    supportedLngs: [...LANGUAGES],
    load: 'currentOnly',
    ns: [...BASE_NAMESPACES],
    defaultNS: 'common',
    interpolation: { escapeValue: false }, // React escapes
    returnNull: false,
    saveMissing: true,
    missingKeyHandler: (_lngs, ns, key) => {
      missingKeys.add(`${ns}:${key}`);
    },
  });

/** Load namespaces in the current language (a route's texts, with its code); resolves when they are in. */
export function loadNamespaces(namespaces: readonly string[]): Promise<void> {
  return i18n.loadNamespaces([...namespaces]);
}

/**
 * Every language and namespace at once, synchronously, from files bundled by the caller: for the client
 * tests only (happy-dom renders without waiting for chunks). The app never calls it.
 */
export function addBundledResources(files: Record<string, { default: Record<string, unknown> }>): void {
  for (const [file, mod] of Object.entries(files)) {
    const m = /\/locales\/([^/]+)\/([^/]+)\.json$/.exec(file);
    if (m) i18n.addResourceBundle(m[1], m[2], mod.default, true, true);
  }
}

/** Switch the interface language (and remember it on this device). */
export async function setLanguage(lng: Language): Promise<void> {
  try {
    globalThis.localStorage?.setItem(STORAGE_KEY, lng);
  } catch {
    // not remembered on this device; the account's setting still applies after sign-in
  }
  // i18next fetches the namespaces in use in the new language before it switches, so the screen changes in one step.
  if (i18n.language !== lng) await i18n.changeLanguage(lng);
  if (typeof document !== 'undefined') document.documentElement.lang = lng;
}

export type { Language } from '../../shared/languages';
