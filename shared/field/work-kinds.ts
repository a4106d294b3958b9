import type { DriverId, Tier } from '../tier/tier-settings';
import type { Role } from '../roles';

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

/** Permission table of the Field week (docs/product.md § Roles): the routes and the screen read these rows. */
export const FIELD_ACCESS = {
  /** keep the list of teams */
  manageTeams: ['officer'],
  /** see the teams: the officer, the supervisor who may approve, and team members (their own teams) */
  seeTeams: ['officer', 'supervisor', 'worker'],
  /** propose, edit and publish the Field week */
  planWeek: ['officer'],
  /** see a Field week: planners and approvers all of it, a community worker their own teams' days */
  seeWeek: ['officer', 'supervisor', 'worker'],
  /** approve a week, or send it back with a reason, when the field settings require approval */
  approveWeek: ['supervisor'],
  /** whether a supervisor must approve the week before it is published */
  settings: ['admin'],
} as const satisfies Record<string, readonly Role[]>;
