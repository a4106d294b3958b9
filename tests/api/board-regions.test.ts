import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { boardResponse } from '../../shared/api/board.schema';
import { createTestApp, type TestApp } from '../support/test-app';
import { makeDistrict, makeUser, signedInAgent } from '../support/factories';
import { makeDrivers, makeTier } from '../support/flags-factories';

// Issue 17 item 3: each Ladder row carries its region (the contract in shared/api/board.schema.ts).
let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
}, 120_000);
afterAll(() => t.close());

describe('the board by region', () => {
  it('when districts belong to regions, then each board row names its region and the answer meets the shared contract', async () => {
    const [north] = await t.ds.query(`INSERT INTO regions (code, name) VALUES ('NM', 'Northmoor') RETURNING id`);
    const a = await makeDistrict(t.ds, { regionId: north.id });
    const b = await makeDistrict(t.ds);
    for (const d of [a, b]) await makeTier(t.ds, { districtId: d.id, epiWeek: 30, tier: 'raised', drivers: makeDrivers({ climate: 0.3 }) });
    const officer = await makeUser(t.ds, { role: 'officer' });
    const agent = await signedInAgent(t.app, officer.email);

    const res = await agent.get('/api/board');
    expect(res.status).toBe(200);
    const board = boardResponse.parse(res.body);
    const byCode = new Map(board.rows.map((r) => [r.code, r]));
    expect(byCode.get(a.code)!.region).toEqual({ id: north.id, code: 'NM', name: 'Northmoor' });
    expect(byCode.get(b.code)!.region).toBeNull();

    // Moving a district to a region (an import does this) is seen at once, though no tier changed.
    await t.ds.query(`UPDATE districts SET region_id = $1 WHERE id = $2`, [north.id, b.id]);
    const again = boardResponse.parse((await agent.get('/api/board')).body);
    expect(again.rows.find((r) => r.code === b.code)!.region?.code).toBe('NM');
    // Renaming the region too.
    await t.ds.query(`UPDATE regions SET name = 'North Moor' WHERE id = $1`, [north.id]);
    const renamed = boardResponse.parse((await agent.get('/api/board')).body);
    expect(renamed.rows.find((r) => r.code === a.code)!.region?.name).toBe('North Moor');
  });

  it('when a user is scoped to a region, then the session answer names their regions', async () => {
    const [south] = await t.ds.query(`INSERT INTO regions (code, name) VALUES ('SF', 'Southfen') RETURNING id`);
    const user = await makeUser(t.ds, { role: 'officer' });
    await t.ds.query(`INSERT INTO user_regions (user_id, region_id) VALUES ($1, $2)`, [user.id, south.id]);
    const agent = await signedInAgent(t.app, user.email);
    const me = await agent.get('/api/me');
    expect(me.status).toBe(200);
    expect(me.body.regions).toEqual([{ id: south.id, code: 'SF', name: 'Southfen' }]);
  });
});
