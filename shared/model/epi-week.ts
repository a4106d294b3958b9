import { dateParts, dayNumber, formatIsoDate, parseIsoDate, weekday } from './dates';

/**
 * Epidemiological weeks.
 * - `mmwr`: the Sunday-start week of national notifiable-disease reporting (the MMWR week): weeks run
 *   Sunday to Saturday and week 1 is the first such week with at least four days in the calendar year.
 * - `iso`: ISO 8601: Monday to Sunday, week 1 holds the year's first Thursday.
 * Both rules make week 1 the week that contains 4 January; they differ only in the first weekday.
 * A year has 52 or 53 weeks; the days of late December or early January can belong to the
 * neighbouring week-year.
 */

export const EPI_WEEK_SYSTEMS = ['mmwr', 'iso'] as const;
export type EpiWeekSystem = (typeof EPI_WEEK_SYSTEMS)[number];

export interface EpiWeek {
  /** The week-year (may differ from the calendar year near 1 January). */
  year: number;
  /** 1…53 */
  week: number;
  /** First day of the week, YYYY-MM-DD (a Sunday for mmwr, a Monday for iso). */
  start: string;
}

function checkSystem(system: EpiWeekSystem): void {
  if (system !== 'mmwr' && system !== 'iso') throw new RangeError(`unknown epidemiological week system: ${String(system)}`);
}

/** Day number of the first day of week 1 of `year`. */
export function weekOneStart(year: number, system: EpiWeekSystem): number {
  checkSystem(system);
  const jan4 = dayNumber(year, 1, 4);
  const wd = weekday(jan4); // 0 = Sunday
  return jan4 - (system === 'mmwr' ? wd : (wd + 6) % 7);
}

/** Number of weeks (52 or 53) in the week-year `year`. */
export function weeksInYear(year: number, system: EpiWeekSystem): number {
  return (weekOneStart(year + 1, system) - weekOneStart(year, system)) / 7;
}

/** Fast path on day numbers: the week containing day `day`. */
export function epiWeekOfDay(day: number, system: EpiWeekSystem): { year: number; week: number; startDay: number } {
  let year = dateParts(day).year;
  let start = weekOneStart(year + 1, system);
  if (day >= start) {
    year += 1;
  } else {
    start = weekOneStart(year, system);
    if (day < start) {
      year -= 1;
      start = weekOneStart(year, system);
    }
  }
  const week = Math.floor((day - start) / 7) + 1;
  return { year, week, startDay: start + (week - 1) * 7 };
}

/** The epidemiological week of a YYYY-MM-DD date. */
export function epiWeek(date: string, system: EpiWeekSystem): EpiWeek {
  const w = epiWeekOfDay(parseIsoDate(date), system);
  return { year: w.year, week: w.week, start: formatIsoDate(w.startDay) };
}

/** First day (YYYY-MM-DD) of week `week` of week-year `year`; throws RangeError if the week does not exist. */
export function epiWeekStart(year: number, week: number, system: EpiWeekSystem): string {
  if (!Number.isInteger(year) || !Number.isInteger(week)) throw new RangeError('year and week must be integers');
  const n = weeksInYear(year, system);
  if (week < 1 || week > n) throw new RangeError(`week ${week} does not exist in ${system} year ${year} (1…${n})`);
  return formatIsoDate(weekOneStart(year, system) + (week - 1) * 7);
}

/** Last day (YYYY-MM-DD) of a week. */
export function epiWeekEnd(year: number, week: number, system: EpiWeekSystem): string {
  return formatIsoDate(parseIsoDate(epiWeekStart(year, week, system)) + 6);
}
