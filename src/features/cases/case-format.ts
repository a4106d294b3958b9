import type { WeekRef } from '../../../shared/api/cases.schema';

const dayMonth = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', timeZone: 'UTC' });
const dateTime = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short' });

export const weekLabel = (w: { year: number; week: number }) => `W${w.week} ${w.year}`;
export const weekSpan = (w: WeekRef) => `${dayMonth.format(new Date(`${w.start}T00:00:00Z`))}–${dayMonth.format(new Date(`${w.end}T00:00:00Z`))}`;
export const formatDateTime = (iso: string) => dateTime.format(new Date(iso));
export const formatNumber = (n: number | null | undefined, digits = 0) =>
  n === null || n === undefined ? '—' : n.toLocaleString('en', { maximumFractionDigits: digits, minimumFractionDigits: digits });
export const formatShare = (share: number | null) => (share === null ? '—' : `${Math.round(share * 100)} %`);
