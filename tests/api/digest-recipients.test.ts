import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { recipientsOf, recipientsOfDistricts } from '../../server/bulletins/recipients.repository';
import { runSeasonNow } from '../../server/season/season-run.service';
import { createTestApp, type TestApp } from '../support/test-app';
import { makeUser, signedInAgent } from '../support/factories';
import { makeSeasonDistrict } from '../support/season-factories';

// Issue 21: the digest preview asked who receives each district's bulletin once per district (N+1). It
// now asks once for all of them; the answer must stay the same person for person, district for district.
let t: TestApp;
const d: { id: string; name: string }[] = [];
const users: Record<string, { id: string; email: string }> = {};

beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
  for (let i = 0; i < 5; i++) d.push(await makeSeasonDistrict(t.ds, { warmth: -2 + i }));
  await runSeasonNow(t.ctx, { asOf: '2026-08-20' });
  const [{ id: regionId }] = await t.ds.query(`INSERT INTO regions (code, name) VALUES ('DR', 'Drennock') RETURNING id`);
  await t.ds.query(`UPDATE districts SET region_id = $1 WHERE id = ANY($2::uuid[])`, [regionId, [d[1].id, d[4].id]]);
  users.officer = await makeUser(t.ds, { role: 'officer' }); // default: every district
  users.regional = await makeUser(t.ds, { role: 'supervisor', districtIds: [d[0].id] }); // own district and its region's
  await t.ds.query(`INSERT INTO user_regions (user_id, region_id) VALUES ($1, $2)`, [users.regional.id, regionId]);
  users.epi = await makeUser(t.ds, { role: 'epidemiologist', districtIds: [d[0].id, d[2].id] }); // default: assigned ones
  users.worker = await makeUser(t.ds, { role: 'worker', districtIds: [d[3].id] }); // subscribed to d3 and d1; d1 is not theirs
  users.admin = await makeUser(t.ds, { role: 'admin' }); // subscribed to d2's bulletin and d0's advisories
  users.chooser = await makeUser(t.ds, { role: 'officer' }); // chose d4 only, and d1 switched off
  users.inactive = await makeUser(t.ds, { role: 'officer', active: false });
  users.pending = await makeUser(t.ds, { role: 'officer', password: null });
  const sub = (userId: string, districtId: string, kinds: string[], active = true) =>
    t.ds.query(`INSERT INTO subscriptions (user_id, district_id, kinds, active) VALUES ($1, $2, $3, $4)`, [userId, districtId, kinds, active]);
  await sub(users.worker.id, d[3].id, ['bulletin', 'advisory']);
  await sub(users.worker.id, d[1].id, ['bulletin']);
  await sub(users.admin.id, d[2].id, ['bulletin']);
  await sub(users.admin.id, d[0].id, ['advisory']);
  await sub(users.chooser.id, d[4].id, ['bulletin', 'advisory']);
  await sub(users.chooser.id, d[1].id, ['bulletin'], false);
}, 240_000);
afterAll(() => t.close());

describe('digest recipients in one query', () => {
  it('when five districts have officers, a regional supervisor, an epidemiologist, a worker, an admin and people who chose, then one query gives the same recipients in the same order as asking district by district', async () => {
    for (const kind of ['bulletin', 'advisory'] as const) {
      const oneByOne = [];
      for (const x of d) oneByOne.push(...(await recipientsOf(t.ds.manager, x.id, kind)).map((r) => ({ districtId: x.id, ...r })));
      const together = await recipientsOfDistricts(t.ds.manager, d.map((x) => x.id), kind);
      expect(together).toEqual(oneByOne);
      expect(oneByOne.length).toBeGreaterThan(d.length); // a real mix, not an empty comparison
      // The planted cases, named: nobody inactive or pending; the worker only for their own district.
      const ids = new Set(together.map((r) => r.userId));
      expect(ids.has(users.inactive.id) || ids.has(users.pending.id)).toBe(false);
      expect(together.filter((r) => r.userId === users.worker.id).map((r) => r.districtId)).toEqual([d[3].id]);
    }
    const only = await recipientsOfDistricts(t.ds.manager, d.map((x) => x.id), 'bulletin', users.regional.id);
    expect(only.map((r) => r.districtId)).toEqual([d[0].id, d[1].id, d[4].id]);
    expect(await recipientsOfDistricts(t.ds.manager, [], 'bulletin')).toEqual([]);
  });

  it('when each person asks for their digest preview, then it covers exactly the districts whose bulletin they receive', async () => {
    const counted = new Map<string, number>(
      (await t.ds.query(`SELECT district_id, confidence FROM district_tiers`)).map((r: { district_id: string; confidence: string }) => [r.district_id, r.confidence === 'insufficient' ? 0 : 1]),
    );
    for (const name of ['officer', 'regional', 'epi', 'worker', 'admin', 'chooser']) {
      const u = users[name];
      let expected = 0;
      const names: string[] = [];
      for (const x of d) {
        if ((await recipientsOf(t.ds.manager, x.id, 'bulletin')).some((r) => r.userId === u.id) && counted.get(x.id)) {
          expected += 1;
          names.push(x.name);
        }
      }
      const agent = await signedInAgent(t.app, u.email);
      const res = await agent.get('/api/bulletins/digest/preview?language=en');
      expect(res.status, name).toBe(200);
      expect(res.body.districts, name).toBe(expected);
      for (const n of names) expect(res.body.text, name).toContain(n);
    }
  });
});
