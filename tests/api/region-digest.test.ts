import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BulletinsService } from '../../server/bulletins/bulletins.service';
import { OutboxWorker } from '../../server/outbox/outbox.worker';
import { runSeasonNow } from '../../server/season/season-run.service';
import { createTestApp, type TestApp } from '../support/test-app';
import { makeUser, signedInAgent } from '../support/factories';
import { makeSeasonDistrict } from '../support/season-factories';
import { waitForMails } from '../support/flags-factories';

// Issue 17 item 3: the weekly bulletin of a person scoped to a region covers that region's districts.
let t: TestApp;
const districts: { id: string; name: string }[] = [];
let regionId: string;

beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
  for (let i = 0; i < 4; i++) districts.push(await makeSeasonDistrict(t.ds, { warmth: -2 + i }));
  [{ id: regionId }] = await t.ds.query(`INSERT INTO regions (code, name) VALUES ('SF', 'Southfen') RETURNING id`);
  await t.ds.query(`UPDATE districts SET region_id = $1 WHERE id = ANY($2::uuid[])`, [regionId, [districts[0].id, districts[1].id]]);
  await runSeasonNow(t.ctx, { asOf: '2026-08-20' });
}, 240_000);
afterAll(() => t.close());

describe('the bulletin of a regional user', () => {
  it('when an officer and an epidemiologist are scoped to a region, then their digests cover its districts only, while an unscoped officer still gets every district', async () => {
    const regionalOfficer = await makeUser(t.ds, { role: 'officer' });
    const regionalEpi = await makeUser(t.ds, { role: 'epidemiologist' });
    const everywhere = await makeUser(t.ds, { role: 'officer' });
    for (const u of [regionalOfficer, regionalEpi]) await t.ds.query(`INSERT INTO user_regions (user_id, region_id) VALUES ($1, $2)`, [u.id, regionId]);

    // What the preferences page shows follows the same rule.
    const agent = await signedInAgent(t.app, regionalOfficer.email);
    const subs = await agent.get('/api/subscriptions/me');
    expect(subs.status).toBe(200);
    const bulletin = (subs.body.districts as { districtId: string; bulletin: boolean }[]).filter((d) => d.bulletin).map((d) => d.districtId).sort();
    expect(bulletin).toEqual([districts[0].id, districts[1].id].sort());

    const out = (await new BulletinsService(t.ctx).sendLocked())!;
    expect(out.recipientsFailed).toEqual([]);
    await new OutboxWorker(t.ctx).drain();
    const [officerMail] = await waitForMails([regionalOfficer.email], 1);
    const [epiMail] = await waitForMails([regionalEpi.email], 1);
    const [allMail] = await waitForMails([everywhere.email], 1);
    for (const mail of [officerMail, epiMail]) {
      expect(mail.text).toContain(districts[0].name);
      expect(mail.text).toContain(districts[1].name);
      expect(mail.text).not.toContain(districts[2].name);
      expect(mail.text).not.toContain(districts[3].name);
    }
    for (const d of districts) expect(allMail.text).toContain(d.name);
    // The regional digest names the region, not the installation's region name.
    expect(officerMail.subject).toContain('Southfen');
    expect(allMail.subject).not.toContain('Southfen');
  });
});
