import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ROLES, type Role } from '../../shared/roles';
import { createTestApp, type TestApp } from '../support/test-app';
import { makeDistrict, makeUser, signedInAgent } from '../support/factories';
import { casesAccess } from './access/cases.access';
import { foundationAccess, signOutAccess } from './access/foundation.access';
import { weatherAccess } from './access/weather.access';
import { seasonAccess } from './access/season.access';
import { flagsAccess } from './access/flags.access';
import { profilesAccess } from './access/profiles.access';
import { importsAccess } from './access/imports.access';
import { lookBackAccess } from './access/look-back.access';
import { fieldAccess } from './access/field.access';
import { fieldRecordsAccess } from './access/field-records.access';

/**
 * Every API route × every role (and no session). The expected access is written here, from
 * docs/product.md § Roles, not read from the routes: a route missing from this table fails the suite, and a
 * route whose declared access differs from the table fails too.
 */
type Who = Role | 'anonymous';
const EVERYBODY: Who[] = ['anonymous', ...ROLES];

// One table per feature (tests/api/access/*.access.ts), merged; the sign-out row goes last because it
// ends the sessions the other rows use.
const EXPECTED: Record<string, Who[]> = { ...foundationAccess, ...weatherAccess, ...casesAccess, ...seasonAccess, ...flagsAccess, ...profilesAccess, ...importsAccess, ...lookBackAccess, ...fieldAccess, ...fieldRecordsAccess, ...signOutAccess };

let t: TestApp;
const agents = new Map<Who, ReturnType<typeof request.agent>>();
let districtId: string;

beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
  const district = await makeDistrict(t.ds);
  districtId = district.id;
  for (const role of ROLES) {
    const user = await makeUser(t.ds, { role, districtIds: [district.id] });
    agents.set(role, await signedInAgent(t.app, user.email));
  }
  agents.set('anonymous', request.agent(t.app));
});
afterAll(() => t.close());

describe('route access', () => {
  it('when the app is built, then every mounted route is in the access table and declared the same way', () => {
    const declared = t.app.locals.routes.map((r) => `${r.method.toUpperCase()} ${r.path}`);
    expect(declared.sort()).toEqual(Object.keys(EXPECTED).sort());
    // Nothing is mounted on the API router except through the route table.
    const apiLayer = (t.app as any).router.stack.find((l: any) => l.name === 'router');
    const mounted = apiLayer.handle.stack.filter((l: any) => l.route).map((l: any) =>
      `${Object.keys(l.route.methods)[0].toUpperCase()} ${l.route.path}`);
    expect(mounted.sort()).toEqual(declared.sort());
  });

  for (const [key, allowed] of Object.entries(EXPECTED)) {
    const [method, path] = key.split(' ');
    for (const who of EVERYBODY) {
      const mayCall = allowed.includes(who);
      it(`when ${who} calls ${key}, then the answer is ${mayCall ? 'not a refusal' : who === 'anonymous' ? '401' : '403'}`, async () => {
        const url = '/api' + path.replace(':id', districtId);
        const agent = agents.get(who)!;
        // Public auth routes get an invalid body, so nothing changes; others an empty one.
        const res = await (agent as any)[method.toLowerCase()](url).send({});
        if (mayCall) expect([401, 403]).not.toContain(res.status);
        else expect(res.status).toBe(who === 'anonymous' ? 401 : 403);
      });
    }
  }
});
