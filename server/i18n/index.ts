import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import i18next, { type TFunction } from 'i18next';
import { LANGUAGES, type Language } from '../../shared/api/auth.schema';

/**
 * i18next for the server's own words: mails (invite, password reset), advisories, the weekly bulletin
 * (HTML, text, PDF) and the flag texts Broodcast suggests. Resources are
 * `server/i18n/locales/<language>/<namespace>.json`, read once at start; tests/unit/i18n-keys.test.ts
 * checks that every language has the same keys and placeholders. Each mail is written in its
 * recipient's language (their user preference), English when there is none.
 */
export type { Language } from '../../shared/api/auth.schema';
export const DEFAULT_LANGUAGE: Language = 'en';

const root = fileURLToPath(new URL('./locales/', import.meta.url));
const resources: Record<string, Record<string, Record<string, unknown>>> = {};
for (const lng of LANGUAGES) {
  resources[lng] = {};
  for (const file of readdirSync(join(root, lng)).filter((f) => f.endsWith('.json')))
    resources[lng][file.slice(0, -'.json'.length)] = JSON.parse(readFileSync(join(root, lng, file), 'utf8'));
}

export type ServerNamespace = 'common' | 'auth' | 'advisory' | 'bulletin' | 'flags';

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
export const languageOr = (x: unknown): Language => ((LANGUAGES as readonly unknown[]).includes(x) ? (x as Language) : DEFAULT_LANGUAGE);

/** The translate function of one language and namespace (`t('key', { vars })`). */
export function textsFor(language: Language, ns: ServerNamespace = 'common'): TFunction {
  return instance.getFixedT(languageOr(language), ns);
}

/** Intl locale per language (the client uses the same: src/i18n/languages.ts). */
export const LOCALES: Record<Language, string> = { en: 'en-GB', fr: 'fr', es: 'es', pt: 'pt-PT' };

export interface ServerFormat {
  locale: string;
  /** A number with at most `digits` decimals (exactly `digits` when `fixed`); '-' for null. */
  number: (x: number | null | undefined, digits?: number, fixed?: boolean) => string;
  /** A share 0…1 as a whole percentage. */
  percent: (x: number) => string;
  /** A calendar date (YYYY-MM-DD or an ISO instant, read in UTC), e.g. "20 Aug 2026" / "20 août 2026". */
  date: (iso: string) => string;
}

const formats = new Map<Language, ServerFormat>();

/** Locale-aware numbers and dates for a mail or a PDF in `language`. */
export function formatFor(language: Language): ServerFormat {
  const lng = languageOr(language);
  const hit = formats.get(lng);
  if (hit) return hit;
  const locale = LOCALES[lng];
  const numberFormats = new Map<string, Intl.NumberFormat>();
  const nf = (digits: number, fixed: boolean) => {
    const key = `${digits}:${fixed}`;
    let f = numberFormats.get(key);
    if (!f) numberFormats.set(key, (f = new Intl.NumberFormat(locale, { maximumFractionDigits: digits, minimumFractionDigits: fixed ? digits : 0 })));
    return f;
  };
  const percent = new Intl.NumberFormat(locale, { style: 'percent', maximumFractionDigits: 0 });
  const dateFormat = new Intl.DateTimeFormat(locale, { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });
  const f: ServerFormat = {
    locale,
    number: (x, digits = 0, fixed = false) => (x === null || x === undefined || Number.isNaN(x) ? '-' : nf(digits, fixed).format(x)),
    percent: (x) => percent.format(x),
    date: (iso) => dateFormat.format(new Date(iso.length === 10 ? `${iso}T00:00:00Z` : iso)),
  };
  formats.set(lng, f);
  return f;
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
