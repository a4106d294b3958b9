import { rolesWith } from '../../shared/permissions';
import type { Role } from '../../shared/roles';

/**
 * One entry of the main navigation: where it goes and which roles may see (and use) it. `label` is the
 * English name; the menu shows `app:nav.<id>` in the interface language (the label when that key is missing).
 */
export type NavItem = {
  id: string;
  label: string;
  to: string;
  roles: readonly Role[];
};

/**
 * The main navigation as data. Routes use the same `roles` to decide who may open them, so the menu and
 * the guards never disagree; the roles come from the permission table (shared/permissions.ts). Later issues add Case ledger, Intake, Surveys, Sign-off and Season runs.
 */
export const NAV_ITEMS = [
  { id: 'ladder', label: 'Ladder', to: '/', roles: rolesWith('board.read') },
  { id: 'users', label: 'Users', to: '/admin/users', roles: rolesWith('users.manage') },
  { id: 'districts', label: 'Districts', to: '/admin/districts', roles: rolesWith('districts.manage') },
  { id: 'profiles', label: 'Profiles', to: '/admin/profiles', roles: rolesWith('profiles.manage') },
  { id: 'tier-settings', label: 'Tier settings', to: '/admin/tier-settings', roles: rolesWith('tierSettings.manage') },
  { id: 'case-ledger', label: 'Case ledger', to: '/cases', roles: rolesWith('cases.ledger') },
  { id: 'surveys', label: 'Surveys', to: '/surveys', roles: rolesWith('surveys.record') },
  { id: 'field-log', label: 'Field log', to: '/field-log', roles: rolesWith('fieldRecords.record') },
  { id: 'field-week', label: 'Field week', to: '/field-week', roles: rolesWith('field.seeWeek') },
  { id: 'season-runs', label: 'Season runs', to: '/season-runs', roles: rolesWith('seasonRuns.start') },
  { id: 'look-back', label: 'Look-back', to: '/look-back', roles: rolesWith('lookBack.read') },
  { id: 'intake', label: 'Intake', to: '/intake', roles: rolesWith('weather.upload') },
  { id: 'sign-off', label: 'Sign-off', to: '/sign-off', roles: rolesWith('flags.signOff') },
  { id: 'advisories', label: 'Advisories', to: '/advisories', roles: rolesWith('board.read') },
  { id: 'bulletin', label: 'Bulletin', to: '/bulletin', roles: rolesWith('bulletins.preview') },
  { id: 'settings', label: 'Settings', to: '/settings', roles: rolesWith('board.read') },
] as const satisfies readonly NavItem[];

export type NavItemId = (typeof NAV_ITEMS)[number]['id'];

/** The items a role sees, in menu order. */
export function navItemsFor(role: Role): NavItem[] {
  return NAV_ITEMS.filter((item) => (item.roles as readonly Role[]).includes(role));
}

/** The roles that may use the screen behind a nav item. */
export function rolesFor(id: NavItemId): readonly Role[] {
  const item = NAV_ITEMS.find((i) => i.id === id);
  if (!item) throw new Error(`No navigation item ${id}`);
  return item.roles;
}
