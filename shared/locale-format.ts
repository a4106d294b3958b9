import { LANGUAGE_LOCALES, isLanguage } from './languages';

/**
 * Locale-aware formatting of numbers, dates and shares for a language (Intl; no library needed), for
 * the client's screens (src/i18n/format.ts) and the server's mail and PDFs (server/i18n). Calendar dates
 * (YYYY-MM-DD) are formatted in UTC so they never shift by a day; instants (ISO date-times) get the time
 * of day in the viewer's time zone.
 */
export function localeOf(language: string): string {
  const base = language.split('-')[0];
  return isLanguage(base) ? LANGUAGE_LOCALES[base] : 'en-GB';
}

export interface Formatters {
  locale: string;
  /** A number with at most `digits` decimals (exactly `digits` when `fixed`); the `none` sign for null. */
  number: (x: number | null | undefined, digits?: number, fixed?: boolean) => string;
  /** A calendar date (YYYY-MM-DD, or the UTC date of an instant), e.g. "3 Mar 2026" / "3 mars 2026". */
  date: (iso: string | null | undefined) => string;
  /** An instant (ISO date-time) with the time of day. */
  dateTime: (iso: string | null | undefined) => string;
  /** A share 0…1 as a percentage. */
  percent: (x: number | null | undefined, digits?: number) => string;
}

const cache = new Map<string, Formatters>();

/** The formatters of a language; `none` stands for a missing value (an em dash on screen). */
export function formattersFor(language: string, none = '—'): Formatters {
  const locale = localeOf(language);
  const key = `${locale}|${none}`;
  const hit = cache.get(key);
  if (hit) return hit;
  const numberFormats = new Map<string, Intl.NumberFormat>();
  const nf = (digits: number, fixed: boolean, style?: 'percent') => {
    const k = `${digits}:${fixed}:${style ?? ''}`;
    let f = numberFormats.get(k);
    if (!f) {
      f = new Intl.NumberFormat(locale, { style, maximumFractionDigits: digits, minimumFractionDigits: fixed ? digits : 0 });
      numberFormats.set(k, f);
    }
    return f;
  };
  const missing = (x: number | null | undefined): x is null | undefined => x === null || x === undefined || Number.isNaN(x);
  const dateFormat = new Intl.DateTimeFormat(locale, { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });
  const dateTimeFormat = new Intl.DateTimeFormat(locale, { dateStyle: 'medium', timeStyle: 'short' });
  const f: Formatters = {
    locale,
    number: (x, digits = 0, fixed = false) => (missing(x) ? none : nf(digits, fixed).format(x)),
    date: (iso) => (iso ? dateFormat.format(new Date(iso.length === 10 ? `${iso}T00:00:00Z` : iso)) : none),
    dateTime: (iso) => (iso ? dateTimeFormat.format(new Date(iso)) : none),
    percent: (x, digits = 0) => (missing(x) ? none : nf(digits, false, 'percent').format(x)),
  };
  cache.set(key, f);
  return f;
}
