import { z } from 'zod';

/**
 * The one calendar-date type of Broodcast's inputs: a real Gregorian date written YYYY-MM-DD, with a
 * year from 1900 to 2100 unless a field documents another range. Every body, query and CSV reader
 * checks its dates with this module (the weather intake's row checks in shared/weather/qc.ts, the
 * survey, station and correction bodies, the `from`/`to`/`date` queries), so an impossible date
 * (2026-02-30, month 13, year 0000) is a 400 or a row-level rejection that names the field, and never
 * reaches PostgreSQL, nor JavaScript's Date (which reads years 0–99 as 1900–1999).
 * Leap years: the Gregorian rule (divisible by 4, except centuries not divisible by 400), common practice.
 */

export const DATE_MIN_YEAR = 1900;
export const DATE_MAX_YEAR = 2100;

export interface YearRange {
  minYear: number;
  maxYear: number;
}

const DEFAULT_RANGE: YearRange = { minYear: DATE_MIN_YEAR, maxYear: DATE_MAX_YEAR };
const DAYS_IN_MONTH = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];
const MS_PER_DAY = 86_400_000;

export type DateProblem = 'format' | 'calendar' | 'range';

/** The value of the digits text[from..to), or -1 when one of them is not a digit. */
function digits(text: string, from: number, to: number): number {
  let v = 0;
  for (let i = from; i < to; i++) {
    const c = text.charCodeAt(i) - 48;
    if (c < 0 || c > 9) return -1;
    v = v * 10 + c;
  }
  return v;
}

/**
 * What is wrong with a date text, or null when it is a real date in range. Hand-written rather than a
 * pattern and `Date`: the weather intake calls it for every distinct date of a file of millions of rows,
 * and `Date.UTC` would move years 0–99 into the 1900s.
 */
export function dateProblem(text: string, range: YearRange = DEFAULT_RANGE): DateProblem | null {
  if (text.length !== 10 || text.charCodeAt(4) !== 45 || text.charCodeAt(7) !== 45) return 'format';
  const y = digits(text, 0, 4);
  const m = digits(text, 5, 7);
  const d = digits(text, 8, 10);
  if (y < 0 || m < 0 || d < 0) return 'format';
  const leap = (y % 4 === 0 && y % 100 !== 0) || y % 400 === 0;
  if (m < 1 || m > 12 || d < 1 || d > (m === 2 && leap ? 29 : DAYS_IN_MONTH[m - 1])) return 'calendar';
  if (y < range.minYear || y > range.maxYear) return 'range';
  return null;
}

/** Days since 1970-01-01 of a real date in range (YYYY-MM-DD), or NaN. */
export function calendarDay(text: string, range: YearRange = DEFAULT_RANGE): number {
  if (dateProblem(text, range) !== null) return Number.NaN;
  // Years are at least 100 here (the range), so Date.UTC takes them as written.
  return Date.UTC(+text.slice(0, 4), +text.slice(5, 7) - 1, +text.slice(8, 10)) / MS_PER_DAY;
}

/** True when `text` is a real date YYYY-MM-DD in range. */
export const isCalendarDate = (text: string, range: YearRange = DEFAULT_RANGE): boolean => dateProblem(text, range) === null;

/** The field messages (the client translates them by their wording: src/lib/error-text.ts). */
export const DATE_MESSAGE = 'must be a date (YYYY-MM-DD)';
export const dateRangeMessage = (range: YearRange = DEFAULT_RANGE) =>
  `must be between ${String(range.minYear).padStart(4, '0')}-01-01 and ${String(range.maxYear).padStart(4, '0')}-12-31`;

/** A zod schema of a date field: a real date YYYY-MM-DD, years 1900–2100 unless `range` says otherwise. */
export function dateSchema(range: YearRange = DEFAULT_RANGE) {
  return z.string({ message: DATE_MESSAGE }).superRefine((text, ctx) => {
    const problem = dateProblem(text, range);
    if (problem === 'range') ctx.addIssue({ code: 'custom', message: dateRangeMessage(range) });
    else if (problem) ctx.addIssue({ code: 'custom', message: DATE_MESSAGE });
  });
}

/** The date of every body and query: a real date YYYY-MM-DD from 1900-01-01 to 2100-12-31. */
export const isoDate = dateSchema();
