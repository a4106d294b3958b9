import { DRIVERS, type DriverId } from './tier-settings';

/** A driver's part of a tier score, as quoted on flag cards, in advisory messages and in bulletins. */
export interface DriverShare {
  id: DriverId;
  /** Share of the tier score, 0–1, rounded to whole percent so that the shares of a tier add up to 100 %. */
  share: number;
  /** The driver's points of the score (score × weight ÷ weights in use), as stored with the tier. */
  contribution: number;
}

/**
 * THE one computation of "x % of the score" (issue 16: a card said "Case signal 25 %" where its message
 * said "77 % of the score"). The share is a driver's contribution divided by the sum of the contributions
 * (the tier score), so the quoted shares of one tier always add up to 100 %; whole percents by the
 * largest-remainder method (Hamilton's apportionment; common practice for rounded parts of a whole) so
 * that rounding never makes them 99 % or 101 %. Drivers that add nothing (no data, or a score of 0) are
 * left out; highest share first, ties in the drivers' own order. Hand-written: a dozen lines, no package
 * does this on plain numbers without pulling a statistics library.
 */
export function driverShares(drivers: readonly { id: string; contribution: number }[]): DriverShare[] {
  const known = drivers.filter((d): d is { id: DriverId; contribution: number } => (DRIVERS as readonly string[]).includes(d.id) && d.contribution > 0);
  const total = known.reduce((a, d) => a + d.contribution, 0);
  if (!(total > 0)) return [];
  const exact = known.map((d) => (d.contribution / total) * 100);
  const floors = exact.map(Math.floor);
  let left = 100 - floors.reduce((a, b) => a + b, 0);
  const byRemainder = exact.map((x, i) => ({ i, r: x - floors[i] })).sort((a, b) => b.r - a.r || a.i - b.i);
  for (const { i } of byRemainder) {
    if (left <= 0) break;
    floors[i] += 1;
    left -= 1;
  }
  return known
    .map((d, i) => ({ id: d.id, share: floors[i] / 100, contribution: d.contribution }))
    .sort((a, b) => b.share - a.share || b.contribution - a.contribution || DRIVERS.indexOf(a.id) - DRIVERS.indexOf(b.id));
}

/** The share of one driver (0 when it adds nothing). */
export const shareOf = (drivers: readonly { id: string; contribution: number }[], id: DriverId): number =>
  driverShares(drivers).find((s) => s.id === id)?.share ?? 0;
