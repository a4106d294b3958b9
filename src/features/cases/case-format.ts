import { useTranslation } from 'react-i18next';
import type { TFunction } from 'i18next';
import type { SignalNote, WeekRef } from '../../../shared/api/cases.schema';
import { useFormat } from '../../i18n/format';

/**
 * The Case ledger's words and numbers in the interface language: week labels through `common:epiWeekShort`,
 * dates and numbers through useFormat().
 */
export function useCaseFormat() {
  const { t, i18n } = useTranslation('cases');
  const f = useFormat();
  const dayMonth = new Intl.DateTimeFormat(f.locale, { day: 'numeric', month: 'short', timeZone: 'UTC' });
  return {
    t,
    language: i18n.language,
    weekLabel: (w: { year: number; week: number }) => t('common:epiWeekShort', { week: w.week, year: w.year }),
    weekSpan: (w: WeekRef) => `${dayMonth.format(new Date(`${w.start}T00:00:00Z`))}–${dayMonth.format(new Date(`${w.end}T00:00:00Z`))}`,
    formatDateTime: (iso: string) => f.dateTime(iso),
    formatDate: (iso: string) => f.date(iso),
    formatNumber: (n: number | null | undefined, digits = 0) => f.number(n, digits, true),
    formatShare: (share: number | null) => f.percent(share),
    signalNote: (note: SignalNote) => signalNoteText(t, note, f.locale, (n) => f.number(n, 0, true)),
  };
}

/** A case-signal note (a code with parameters from the server) as a sentence in the interface language. */
export function signalNoteText(t: TFunction, note: SignalNote, locale: string, formatNumber: (n: number) => string): string {
  switch (note.code) {
    case 'channel-too-few-seasons':
      return t('cases:district.notes.channelTooFewSeasons', note.params);
    case 'channel-few-seasons':
      return t('cases:district.notes.channelFewSeasons', note.params);
    case 'channel-excluded-years':
      // Years are never grouped (2024, not 2,024); the list's "and" is the language's own.
      return t('cases:district.notes.channelExcludedYears', { years: new Intl.ListFormat(locale, { type: 'conjunction' }).format(note.params.years.map(String)) });
    case 'no-population':
      return t('cases:district.notes.noPopulation', { per: formatNumber(100_000) });
  }
}

/**
 * The case schemas' messages (shared/api/cases.schema.ts) as sentences naming the field, in the interface
 * language; a message not known here is shown as it is (the form's label is put before a predicate).
 */
const EXACT: Record<string, string> = {
  'must be a number': 'number',
  'must be a whole number': 'wholeNumber',
  'cannot be negative': 'negative',
  'is implausibly large (over 1,000,000)': 'implausible',
  'must be a year': 'year',
  'must be a whole year': 'wholeYear',
  'must be 1990 or later': 'yearMin',
  'must be 2100 or earlier': 'yearMax',
  'must be a week number': 'weekNumber',
  'must be a whole week number': 'wholeWeek',
  'must be between 1 and 53': 'weekRange',
  'must say why (at least 3 characters)': 'why',
  'is too long (500 characters at most)': 'reasonLong',
  'is required': 'required',
  'and probable together exceed the cases': 'splitExceeds',
};
const PATTERNS: { re: RegExp; key: string; values: (m: RegExpExecArray) => Record<string, string> }[] = [
  { re: /^(\d+) does not exist in (\d+) \(that year has (\d+) weeks\)$/, key: 'weekMissing', values: (m) => ({ week: m[1], year: m[2], weeks: m[3] }) },
  { re: /^has not started yet \(week (\d+) of (\d+) begins ([\d-]+)\)$/, key: 'notStarted', values: (m) => ({ week: m[1], year: m[2], start: m[3] }) },
  { re: /^is before the district started reporting \(([\d-]+)\)$/, key: 'beforeReporting', values: (m) => ({ date: m[1] }) },
];

export function caseMessage(t: TFunction<'cases'>, label: string, message: string | undefined): string | undefined {
  if (!message) return undefined;
  const exact = EXACT[message];
  if (exact) return t(`validation.${exact}`, { field: label });
  for (const p of PATTERNS) {
    const m = p.re.exec(message);
    if (m) return t(`validation.${p.key}`, { field: label, ...p.values(m) });
  }
  return message;
}
