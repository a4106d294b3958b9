import type { DriverId, Tier } from '../tier/tier-settings';
import { rolesWith } from '../permissions';

/** The kinds of field work a team can be trained for (terms of the trade). */
export const WORK_KINDS = [
  'source-reduction',
  'larviciding',
  'indoor-residual-spraying',
  'space-spraying',
  'case-investigation',
  'community-clean-up',
  'health-education',
] as const;
export type WorkKind = (typeof WORK_KINDS)[number];

/**
 * Broodcast's own rule (not a published one): the kinds of work a district needs this week, from the
 * driver leading its tier. A team may go to a district when it is trained for at least one of them.
 * - larval indices lead → remove and treat breeding sites (source reduction, larviciding, clean-up);
 * - cases lead → investigate cases and act on adult vectors around them (case investigation, indoor
 *   residual spraying, space spraying);
 * - the vector clock leads → adults are maturing and infective soon (indoor residual spraying, space
 *   spraying, larviciding);
 * - climate leads → conditions favour breeding ahead of cases (source reduction, community clean-up,
 *   health education);
 * - no leading driver → health education and community clean-up.
 */
export const WORK_FOR_DRIVER: Record<DriverId | 'none', readonly WorkKind[]> = {
  larval: ['source-reduction', 'larviciding', 'community-clean-up'],
  cases: ['case-investigation', 'indoor-residual-spraying', 'space-spraying'],
  vectorClock: ['indoor-residual-spraying', 'space-spraying', 'larviciding'],
  climate: ['source-reduction', 'community-clean-up', 'health-education'],
  none: ['health-education', 'community-clean-up'],
};

export const workNeededFor = (leadingDriver: DriverId | null): readonly WorkKind[] => WORK_FOR_DRIVER[leadingDriver ?? 'none'];

/**
 * Broodcast's own rule: district-days a district needs in a week by its tier. Baseline needs no visit
 * (it is listed as out, with its reason); each tier above asks one more day.
 */
export const DAYS_NEEDED_BY_TIER: Record<Tier, number> = { baseline: 0, raised: 1, high: 2, critical: 3 };

/**
 * @deprecated The Field week's rows now live in the permission table (shared/permissions.ts, field.*);
 * this alias is read from it and stays only so that code written against it still compiles.
 */
export const FIELD_ACCESS = {
  manageTeams: rolesWith('field.manageTeams'),
  seeTeams: rolesWith('field.seeTeams'),
  planWeek: rolesWith('field.plan'),
  seeWeek: rolesWith('field.seeWeek'),
  approveWeek: rolesWith('field.approve'),
  settings: rolesWith('field.settings'),
} as const;
