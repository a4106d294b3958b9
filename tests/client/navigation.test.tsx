import { describe, expect, it } from 'vitest';
import { ROLES } from '../../shared/roles';
import { navItemsFor, rolesFor } from '../../src/app/navigation';

const labels = (role: (typeof ROLES)[number]) => navItemsFor(role).map((i) => i.label);

describe('navigation', () => {
  it('when the user is an admin, then the nav shows Ladder, Users, Districts, Profiles, Tier settings, Season runs, Look-back, Intake, Advisories and Settings', () => {
    expect(labels('admin')).toEqual(['Ladder', 'Users', 'Districts', 'Profiles', 'Tier settings', 'Season runs', 'Look-back', 'Intake', 'Advisories', 'Settings']);
  });

  it('when the user is a health officer, then the nav shows the Ladder but not Users or Districts', () => {
    expect(labels('officer')).toContain('Ladder');
    expect(labels('officer')).not.toContain('Users');
    expect(labels('officer')).not.toContain('Districts');
  });

  it('when the user has any role, then the Ladder is the first item and the admin screens are admin only', () => {
    for (const role of ROLES) expect(navItemsFor(role)[0]).toMatchObject({ label: 'Ladder', to: '/' });
    expect(rolesFor('users')).toEqual(['admin']);
    expect(rolesFor('districts')).toEqual(['admin']);
  });
});
