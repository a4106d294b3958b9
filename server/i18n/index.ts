import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import i18next, { type TFunction } from 'i18next';
import { isLanguage, LANGUAGES, type Language } from '../../shared/languages';
import { formattersFor, type Formatters } from '../../shared/locale-format';

/**
 * i18next for the server's own words: mails (invite, password reset), advisories, the weekly bulletin
 * (HTML, text, PDF) and the flag texts Broodcast suggests. Resources are
 * `server/i18n/locales/<language>/<namespace>.json`, read once at start; tests/unit/i18n-keys.test.ts
 * checks that every language has the same keys and placeholders. Each mail is written in its
 * recipient's language (their user preference), English when there is none.
 */
export type { Language } from '../../shared/languages';
export const DEFAULT_LANGUAGE: Language = 'en';

const root = fileURLToPath(new URL('./locales/', import.meta.url));
const resources: Record<string, Record<string, Record<string, unknown>>> = {};
for (const lng of LANGUAGES) {
  resources[lng] = {};
  for (const file of readdirSync(join(root, lng)).filter((f) => f.endsWith('.json')))
    resources[lng][file.slice(0, -'.json'.length)] = JSON.parse(readFileSync(join(root, lng, file), 'utf8'));
}

export type ServerNamespace = 'common' | 'auth' | 'advisory' | 'bulletin' | 'flags' | 'field';

const instance = i18next.createInstance();
void instance.init({
  resources,
  lng: DEFAULT_LANGUAGE,
  fallbackLng: DEFAULT_LANGUAGE,
  supportedLngs: [...LANGUAGES],
  ns: Object.keys(resources.en),
  defaultNS: 'common',
  initAsync: false,
  // Mail HTML is escaped where it is built (escapeHtml); plain text and PDF must not be.
  interpolation: { escapeValue: false },
  returnNull: false,
});

/** A language from a stored value, English for anything else (a subscriber without a preference). */
export const languageOr = (x: unknown): Language => (isLanguage(x) ? x : DEFAULT_LANGUAGE);

/** The translate function of one language and namespace (`t('key', { vars })`). */
export function textsFor(language: Language, ns: ServerNamespace = 'common'): TFunction {
  return instance.getFixedT(languageOr(language), ns);
}

/** Locale-aware numbers and dates for a mail or a PDF in `language` ('-' for a missing value). */
export function formatFor(language: Language): Formatters {
  return formattersFor(languageOr(language), '-');
}

/**
 * Text for pdfkit's built-in fonts, which encode WinAnsi (Windows-1252) only: the narrow and ordinary
 * no-break spaces that Intl puts in French numbers and percentages become plain spaces, and the few
 * other signs outside that code page get their nearest equivalent. Accented Latin letters are kept.
 */
export function pdfText(s: string): string {
  return s
    .replace(/[\u202f\u00a0\u2009]/g, ' ')
    .replace(/\u2212/g, '-')
    .replace(/\u2192/g, '->')
    .replace(/[\u2264]/g, '<=')
    .replace(/[\u2265]/g, '>=');
}
