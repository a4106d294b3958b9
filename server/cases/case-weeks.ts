import { epiWeek, epiWeekEnd, epiWeekStart, weeksInYear, type EpiWeekSystem } from '../../shared/model/epi-week';
import type { WeekRef } from '../../shared/api/cases.schema';

/** Today's date (YYYY-MM-DD) in the deployment's time zone: the ledger's "now" for future weeks and deadlines. */
export function todayIn(timeZone: string, now = new Date()): string {
  // en-CA formats as YYYY-MM-DD.
  return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(now);
}

export function weekRef(year: number, week: number, system: EpiWeekSystem): WeekRef {
  return { year, week, start: epiWeekStart(year, week, system), end: epiWeekEnd(year, week, system) };
}

export function currentWeek(system: EpiWeekSystem, today: string): WeekRef {
  const w = epiWeek(today, system);
  return weekRef(w.year, w.week, system);
}

/** The `n` weeks ending with `last`, oldest first (crossing into the previous week-year as needed). */
export function weeksEndingWith(last: { year: number; week: number }, n: number, system: EpiWeekSystem): WeekRef[] {
  const out: WeekRef[] = [];
  let { year, week } = last;
  for (let i = 0; i < n; i++) {
    out.unshift(weekRef(year, week, system));
    week -= 1;
    if (week === 0) {
      year -= 1;
      week = weeksInYear(year, system);
    }
  }
  return out;
}

/** A sortable key of a week: 202605 for week 5 of 2026. */
export const weekKey = (year: number, week: number) => year * 100 + week;

/** The last day a week's counts are on time: the week's last day plus the deadline in days. */
export function deadlineOf(year: number, week: number, system: EpiWeekSystem, deadlineDays: number): string {
  const end = new Date(`${epiWeekEnd(year, week, system)}T00:00:00Z`);
  end.setUTCDate(end.getUTCDate() + deadlineDays);
  return end.toISOString().slice(0, 10);
}

/** Whether a week's reports are due (its deadline has passed), so it counts in the completeness figure. */
export const isDue = (year: number, week: number, system: EpiWeekSystem, deadlineDays: number, today: string) =>
  deadlineOf(year, week, system, deadlineDays) < today;

/**
 * Whether a week is still open: its reporting deadline (the week's last day plus
 * CASE_REPORT_DEADLINE_DAYS) has not passed on `today` and nobody closed it. An open week's count is
 * partial: it is drawn and labelled as incomplete and enters no signal (C1–C3, the channel zone,
 * growth, the tier, a bulletin's "above the channel"). docs/case-ledger.md, "Open weeks".
 */
export const isOpenWeek = (year: number, week: number, system: EpiWeekSystem, deadlineDays: number, today: string, closed: boolean) =>
  !closed && !isDue(year, week, system, deadlineDays, today);

/**
 * The first open week of a week-year up to `lastWeek` (weeks from it on are open), or null when every
 * week up to `lastWeek` is complete. Open weeks are the newest ones: a week's deadline passes before the
 * next one's; a week closed early completes it and every week before it for this purpose (closing says the
 * reporting of that week is done, which a person does in order).
 */
export function firstOpenWeek(
  year: number, lastWeek: number, system: EpiWeekSystem, deadlineDays: number, today: string, closedWeeks: ReadonlySet<number>,
): number | null {
  let first: number | null = null;
  for (let w = lastWeek; w >= 1; w--) {
    if (!isOpenWeek(year, w, system, deadlineDays, today, closedWeeks.has(w))) break;
    first = w;
  }
  return first;
}
