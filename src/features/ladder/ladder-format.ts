import { DRIVER_LABELS, TIER_LABELS, type DriverId, type Tier } from '../../../shared/tier';
import type { LadderRow } from '../../../shared/api/board.schema';

export type ChannelZone = NonNullable<LadderRow['channelZone']>;
export type Confidence = LadderRow['confidence'];

export const ZONE_LABELS: Record<ChannelZone, string> = {
  below: 'Below the channel',
  within: 'Within the channel',
  above: 'Above the channel',
};

/** The mark shown instead of a confident look when the tier rests on old or missing inputs. */
export const CONFIDENCE_MARKS: Record<Confidence, string | null> = {
  ok: null,
  stale: 'stale inputs',
  insufficient: 'not enough data',
};

export const tierLabel = (t: Tier) => TIER_LABELS[t];
export const driverLabel = (d: DriverId | null) => (d ? DRIVER_LABELS[d] : '—');
export const zoneLabel = (z: ChannelZone | null) => (z ? ZONE_LABELS[z] : '—');

/** "up 1", "down 2", "no change"; null (no tier last week) reads "new this week". */
export function tierChangeText(change: number | null): string {
  if (change === null) return 'new this week';
  if (change === 0) return 'no change';
  return change > 0 ? `up ${change}` : `down ${-change}`;
}

/** An arrow for the eye; the words above are what screen readers and the CSV get. */
export function tierChangeArrow(change: number | null): string {
  if (change === null) return '•';
  if (change === 0) return '→';
  return change > 0 ? '↑' : '↓';
}

/** "Raised–High" when the low and high estimates differ; null when they agree. */
export function tierRangeText(row: Pick<LadderRow, 'tierLow' | 'tierHigh'>): string | null {
  return row.tierLow === row.tierHigh ? null : `${TIER_LABELS[row.tierLow]}–${TIER_LABELS[row.tierHigh]}`;
}

const dateFormat = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });
const dateTimeFormat = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' });

/** "3 Jun 2025" from "2025-06-03" (a calendar day, read in UTC so it never shifts). */
export function formatDay(iso: string | null): string {
  if (!iso) return '—';
  const d = new Date(iso.length === 10 ? `${iso}T00:00:00Z` : iso);
  return Number.isNaN(d.getTime()) ? iso : dateFormat.format(d);
}

export function formatDateTime(iso: string | null): string {
  if (!iso) return '—';
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? iso : dateTimeFormat.format(d);
}

export const formatScore = (x: number | null | undefined, digits = 2) => (x === null || x === undefined ? '—' : x.toFixed(digits));
export const formatCount = (x: number | null | undefined) => (x === null || x === undefined ? '—' : x.toLocaleString('en-GB'));
export const epiWeekText = (year: number | null, week: number | null) =>
  year === null || week === null ? null : `week ${week} of ${year}`;
