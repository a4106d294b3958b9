import { DISTRICT_SCOPED_ROLES, ROLES, type Role } from './roles';

/**
 * The one permission table (docs/product.md § Roles): every named ability and the roles that have it.
 * The server's routes (`access: 'users.manage'`), the client's menu, router guards and buttons, and the
 * services' own `canX` flags all read this table; nothing else lists roles. District scope (an
 * epidemiologist or a community worker only in their assigned districts) is applied on top of it by the
 * services (`server/auth/principal.ts`).
 *
 * The route × role test (tests/api/route-access.test.ts with tests/api/access/*.access.ts) is written
 * independently of this table on purpose: a change here that gives a role more than the roles document
 * says fails there.
 *
 * Hand-written rather than a package (CASL and the like): abilities here are plain role lists, read
 * identically on both sides, and a package would add a rule language nobody needs yet.
 */
export const PERMISSIONS = {
  // — administration —
  /** invite users, change their role, districts and whether they may sign in */
  'users.manage': ['admin'],
  /** create and edit districts, their populations and boundaries; import districts, populations and stations */
  'districts.manage': ['admin'],
  /** assign season profiles to districts and add variants */
  'profiles.manage': ['admin'],
  /** change the tier rule's settings and preview them */
  'tierSettings.manage': ['admin'],
  /** change when flags are raised automatically */
  'flagSettings.manage': ['admin'],
  /** add diseases to the case ledger */
  'diseases.manage': ['admin'],
  /** see and remove the demo region */
  'demo.manage': ['admin'],
  /** read the API's OpenAPI document */
  'api.describe': ['admin'],

  // — weather —
  /** upload, correct, void and confirm weather; keep stations; resolve conflicts; pull the feed (the Intake screen) */
  'weather.upload': ['admin', 'officer'],

  // — cases —
  /** the Case ledger screen */
  'cases.ledger': ['epidemiologist', 'supervisor'],
  /** enter, upload and void weekly case counts (in one's assigned districts) */
  'cases.enter': ['epidemiologist'],
  /** read the revisions of a case count (epidemiologists: in their assigned districts) */
  'cases.readHistory': ['admin', 'supervisor', 'epidemiologist'],
  /** close and reopen a reporting week (epidemiologists: in their assigned districts) */
  'cases.closeWeek': ['epidemiologist', 'supervisor'],
  /** set a district's endemic-channel settings and epidemic years */
  'cases.channelSettings': ['admin', 'epidemiologist'],

  // — larval surveys —
  /** record and void larval surveys (community workers: in their districts) */
  'surveys.record': ['officer', 'worker'],

  // — flags, sign-off, bulletins —
  /** read flags and follow an advisory to its flag */
  'flags.read': ['admin', 'officer', 'epidemiologist', 'supervisor'],
  /** raise a flag by hand */
  'flags.raise': ['officer', 'epidemiologist'],
  /** approve or reject a flag (the Sign-off screen) */
  'flags.signOff': ['supervisor'],
  /** preview the weekly bulletin (the Bulletin screen) */
  'bulletins.preview': ['supervisor'],
  /** send the weekly bulletin now */
  'bulletins.send': ['admin', 'supervisor'],
  /** read the outbox */
  'outbox.read': ['admin', 'supervisor'],

  // — season runs and the Look-back —
  /** start and follow season runs (and be pointed at them while the ladder is empty) */
  'seasonRuns.start': ['admin', 'officer'],
  /** start a Look-back (docs/skill.md) */
  'lookBack.start': ['admin', 'officer', 'epidemiologist'],
  /** read Look-back runs and their scores */
  'lookBack.read': ['admin', 'epidemiologist', 'officer', 'supervisor'],

  // — the Field week (issue 19) —
  /** keep the list of field teams */
  'field.manageTeams': ['officer'],
  /** see the teams: the officer, the supervisor who may approve, and team members (their own teams) */
  'field.seeTeams': ['officer', 'supervisor', 'worker'],
  /** propose, edit and publish the Field week */
  'field.plan': ['officer'],
  /** see a Field week: planners and approvers all of it, a community worker their own teams' days */
  'field.seeWeek': ['officer', 'supervisor', 'worker'],
  /** approve a week, or send it back with a reason, when the field settings require approval */
  'field.approve': ['supervisor'],
  /** whether a supervisor must approve the week before it is published */
  'field.settings': ['admin'],

  // — the Field log (issue 19) —
  /** record a piece of field work: team members (community workers) and health officers, as surveys */
  'fieldRecords.record': ['officer', 'worker'],
  /** read field records and a district's field-work timeline (district-scoped roles: their districts) */
  'fieldRecords.read': 'signed-in',

  // — every signed-in role —
  /** the ladder, district files, advisories, settings: every signed-in role (workers: their districts) */
  'board.read': 'signed-in',
} as const satisfies Record<string, readonly Role[] | 'signed-in'>;

export type Ability = keyof typeof PERMISSIONS;

export const ABILITIES = Object.keys(PERMISSIONS) as Ability[];

/** The roles that have an ability ('signed-in' means every role). */
export function rolesWith(ability: Ability): readonly Role[] {
  const who: readonly Role[] | 'signed-in' = PERMISSIONS[ability];
  return who === 'signed-in' ? ROLES : who;
}

/** Whether a role has an ability (no role: nobody signed in, so no). */
export function may(role: Role | null | undefined, ability: Ability): boolean {
  return !!role && rolesWith(ability).includes(role);
}

export const isAbility = (name: string): name is Ability => Object.hasOwn(PERMISSIONS, name);

/**
 * Whether a role has an ability in one district: roles limited to their assigned districts
 * (DISTRICT_SCOPED_ROLES: epidemiologists, community workers) only where `assigned`, the others everywhere.
 */
export function mayIn(role: Role | null | undefined, ability: Ability, assigned: boolean): boolean {
  return may(role, ability) && (assigned || !DISTRICT_SCOPED_ROLES.includes(role!));
}
