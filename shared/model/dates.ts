/**
 * Calendar dates as UTC day numbers (days since 1970-01-01). The model works on calendar dates
 * ("YYYY-MM-DD"), never on instants, so no time zone can shift a day.
 */

const MS_PER_DAY = 86_400_000;
const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

/** True when `text` is a real calendar date written YYYY-MM-DD. */
export function isIsoDate(text: string): boolean {
  return !Number.isNaN(parseIsoDateOrNaN(text));
}

function parseIsoDateOrNaN(text: string): number {
  const m = ISO_DATE.exec(text);
  if (!m) return Number.NaN;
  const y = Number(m[1]);
  const mo = Number(m[2]);
  const d = Number(m[3]);
  if (mo < 1 || mo > 12 || d < 1 || d > daysInMonth(y, mo)) return Number.NaN;
  return dayNumber(y, mo, d);
}

/** Day number of a YYYY-MM-DD date; throws RangeError on anything else. */
export function parseIsoDate(text: string): number {
  const n = parseIsoDateOrNaN(text);
  if (Number.isNaN(n)) throw new RangeError(`not a calendar date (YYYY-MM-DD): ${JSON.stringify(text)}`);
  return n;
}

/** Day number of year/month/day (month 1–12). */
export function dayNumber(year: number, month: number, day: number): number {
  const d = new Date(0);
  d.setUTCFullYear(year, month - 1, day);
  d.setUTCHours(0, 0, 0, 0);
  return Math.round(d.getTime() / MS_PER_DAY);
}

/** YYYY-MM-DD of a day number. */
export function formatIsoDate(day: number): string {
  const d = new Date(day * MS_PER_DAY);
  const y = d.getUTCFullYear();
  const m = d.getUTCMonth() + 1;
  const dd = d.getUTCDate();
  return `${String(y).padStart(4, '0')}-${m < 10 ? '0' : ''}${m}-${dd < 10 ? '0' : ''}${dd}`;
}

/** Calendar parts of a day number. */
export function dateParts(day: number): { year: number; month: number; day: number } {
  const d = new Date(day * MS_PER_DAY);
  return { year: d.getUTCFullYear(), month: d.getUTCMonth() + 1, day: d.getUTCDate() };
}

/** Weekday of a day number: 0 = Sunday … 6 = Saturday (1970-01-01 was a Thursday). */
export function weekday(day: number): number {
  return (((day + 4) % 7) + 7) % 7;
}

export function isLeapYear(year: number): boolean {
  return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
}

export function daysInMonth(year: number, month: number): number {
  return [31, isLeapYear(year) ? 29 : 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31][month - 1] ?? 0;
}

/** Day of year, 1 January = 1. */
export function dayOfYear(day: number): number {
  const { year } = dateParts(day);
  return day - dayNumber(year, 1, 1) + 1;
}

/** Parse "MM-DD" (a biofix month-day) into month and day; throws RangeError when invalid. */
export function parseMonthDay(text: string): { month: number; day: number } {
  const m = /^(\d{2})-(\d{2})$/.exec(text);
  const month = m ? Number(m[1]) : 0;
  const day = m ? Number(m[2]) : 0;
  if (!m || month < 1 || month > 12 || day < 1 || day > daysInMonth(2000, month)) {
    throw new RangeError(`not a month-day (MM-DD): ${JSON.stringify(text)}`);
  }
  return { month, day };
}
