import { useTranslation } from 'react-i18next';
import { LANGUAGE_LOCALES, isLanguage } from './languages';

/**
 * Locale-aware formatting of numbers, dates and epidemiological weeks for the current language
 * (Intl; no library needed). Dates from the API are calendar dates (YYYY-MM-DD) and are formatted in
 * UTC so they never shift by a day; instants (ISO date-times) are shown in the viewer's time zone.
 */
export function localeOf(language: string): string {
  const base = language.split('-')[0];
  return isLanguage(base) ? LANGUAGE_LOCALES[base] : 'en-GB';
}

export interface Formatters {
  locale: string;
  /** A number with at most `digits` decimals (exactly `digits` when `fixed`); '—' for null. */
  number: (x: number | null | undefined, digits?: number, fixed?: boolean) => string;
  /** A calendar date (YYYY-MM-DD), e.g. "3 Mar 2026" / "3 mars 2026". */
  date: (iso: string | null | undefined) => string;
  /** An instant (ISO date-time) with the time of day. */
  dateTime: (iso: string | null | undefined) => string;
  /** A share 0…1 as a percentage. */
  percent: (x: number | null | undefined, digits?: number) => string;
}

const cache = new Map<string, Formatters>();

export function formattersFor(language: string): Formatters {
  const locale = localeOf(language);
  const hit = cache.get(locale);
  if (hit) return hit;
  const numberFormats = new Map<string, Intl.NumberFormat>();
  const nf = (digits: number, fixed: boolean) => {
    const key = `${digits}:${fixed}`;
    let f = numberFormats.get(key);
    if (!f) {
      f = new Intl.NumberFormat(locale, { maximumFractionDigits: digits, minimumFractionDigits: fixed ? digits : 0 });
      numberFormats.set(key, f);
    }
    return f;
  };
  const dateFormat = new Intl.DateTimeFormat(locale, { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });
  const dateTimeFormat = new Intl.DateTimeFormat(locale, { dateStyle: 'medium', timeStyle: 'short' });
  const f: Formatters = {
    locale,
    number: (x, digits = 0, fixed = false) => (x === null || x === undefined || Number.isNaN(x) ? '—' : nf(digits, fixed).format(x)),
    date: (iso) => (iso ? dateFormat.format(new Date(`${iso.slice(0, 10)}T00:00:00Z`)) : '—'),
    dateTime: (iso) => (iso ? dateTimeFormat.format(new Date(iso)) : '—'),
    percent: (x, digits = 0) =>
      x === null || x === undefined || Number.isNaN(x) ? '—' : new Intl.NumberFormat(locale, { style: 'percent', maximumFractionDigits: digits }).format(x),
  };
  cache.set(locale, f);
  return f;
}

/** The formatters of the current interface language (re-renders when it changes). */
export function useFormat(): Formatters {
  const { i18n } = useTranslation();
  return formattersFor(i18n.language);
}
