import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ABILITIES, isAbility, may, mayIn, PERMISSIONS, rolesWith } from '../../shared/permissions';
import { ROLES } from '../../shared/roles';
import { createTestApp, type TestApp } from '../support/test-app';

/**
 * The one permission table (shared/permissions.ts) is what the routes read. Whether a role may call a
 * route is checked independently by route-access.test.ts; this file checks that every route names an
 * ability of the table instead of listing roles.
 */
let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

describe('permission table', () => {
  it('when the app is built, then every route declares public, signed-in or an ability of the table (never a list of roles)', () => {
    const listing = t.app.locals.routes
      .filter((r) => typeof r.access !== 'string' || !(r.access === 'public' || r.access === 'signed-in' || isAbility(r.access)))
      .map((r) => `${r.method.toUpperCase()} ${r.path}: ${JSON.stringify(r.access)} — name an ability of shared/permissions.ts`);
    expect(listing).toEqual([]);
  });

  it('when an ability lists roles, then each is a real role, listed once', () => {
    for (const ability of ABILITIES) {
      const roles = rolesWith(ability);
      expect(roles.length, ability).toBeGreaterThan(0);
      expect(new Set(roles).size, ability).toBe(roles.length);
      for (const role of roles) expect(ROLES, ability).toContain(role);
    }
    expect(rolesWith('board.read')).toEqual(ROLES);
    expect(PERMISSIONS['users.manage']).toEqual(['admin']);
  });

  it('when nobody is signed in, then nobody may do anything', () => {
    for (const ability of ABILITIES) expect(may(null, ability), ability).toBe(false);
  });

  it('when a district-scoped role acts outside its districts, then it may not; roles that see every district may', () => {
    expect(mayIn('epidemiologist', 'cases.closeWeek', true)).toBe(true);
    expect(mayIn('epidemiologist', 'cases.closeWeek', false)).toBe(false);
    expect(mayIn('supervisor', 'cases.closeWeek', false)).toBe(true);
    expect(mayIn('worker', 'surveys.record', false)).toBe(false);
    expect(mayIn('officer', 'surveys.record', false)).toBe(true);
    expect(mayIn('admin', 'cases.enter', true)).toBe(false);
  });
});
