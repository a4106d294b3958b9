import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BulletinsService } from '../../server/bulletins/bulletins.service';
import { enqueueMail } from '../../server/outbox/outbox.repository';
import { OutboxWorker } from '../../server/outbox/outbox.worker';
import { SeasonRunService, runSeasonNow } from '../../server/season/season-run.service';
import { createTestApp, type TestApp } from '../support/test-app';
import { makeUser, signedInAgent } from '../support/factories';
import { makeSeasonDistrict } from '../support/season-factories';

/**
 * Issue 14, "isolation": a fault planted in ONE district's stored inputs (or one message) never stops a
 * region-wide job; the failing one is named with a coded reason and every other one completes.
 */
let t: TestApp;
let districts: { id: string; name: string }[];
const AS_OF = '2026-08-20';

beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000', SMTP_PORT: '9', OUTBOX_MAX_ATTEMPTS: '5' });
  districts = [];
  for (let i = 0; i < 4; i++) districts.push(await makeSeasonDistrict(t.ds, { warmth: i - 2 }));
});
afterAll(() => t.close());

const failedWarnings = (run: { warnings: { code: string }[] }) => run.warnings.filter((w) => w.code === 'district_failed');

describe('a region-wide job with one broken district', () => {
  it('when one district\'s stored profile is unknown to the model, then the season run finishes the others and names the broken one with a coded reason', async () => {
    const broken = districts[1];
    await t.ds.query(`UPDATE district_profiles SET profile_id = 'no-such-profile' WHERE district_id = $1`, [broken.id]);
    try {
      const run = (await runSeasonNow(t.ctx, { asOf: AS_OF }))!;
      expect(run.status).toBe('succeeded');
      expect(run.error).toBeNull();
      expect(run.districtsTotal).toBe(4);
      expect(run.districtsDone).toBe(3);
      expect(failedWarnings(run)).toEqual([{
        code: 'district_failed', districtId: broken.id, districtName: broken.name, params: { stage: 'compute' },
        reason: { code: 'unknown_profile', params: { profileId: 'no-such-profile' } },
      }]);
      const tiers = await t.ds.query(`SELECT district_id FROM district_tiers WHERE run_id = $1`, [run.id]);
      expect(tiers.map((r: { district_id: string }) => r.district_id).sort()).toEqual(districts.filter((d) => d !== broken).map((d) => d.id).sort());
      // The Season runs screen reads the counts and the named warning, with no English sentence or JSON dump in it.
      const admin = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'admin' })).email);
      const res = await admin.get(`/api/season-runs/${run.id}`);
      expect(res.status).toBe(200);
      expect(res.body).toMatchObject({ districtsDone: 3, districtsTotal: 4, districtsFailed: 1 });
      expect(JSON.stringify(res.body.warnings)).not.toMatch(/RangeError|known:|"message"/);
    } finally {
      await t.ds.query(`UPDATE district_profiles SET profile_id = 'aedes-aegypti-dengue' WHERE district_id = $1`, [broken.id]);
    }
    // Its fingerprint was not written, so the next incremental run tries it again (and now succeeds).
    const next = (await new SeasonRunService(t.ctx).runLocked({ kind: 'nightly', asOf: AS_OF }))!;
    expect(next.districtsTotal).toBe(1);
    expect(next.districtsDone).toBe(1);
    expect(failedWarnings(next)).toEqual([]);
  });

  it('when writing one district\'s results throws, then the rest of its batch is still written and the run names that district', async () => {
    const broken = districts[2];
    const run = (await runSeasonNow(t.ctx, {
      asOf: AS_OF,
      districtHook: (stage, id) => { if (stage === 'write' && id === broken.id) throw Object.assign(new Error('planted'), { code: '23514' }); },
    }))!;
    expect(run.status).toBe('succeeded');
    expect(run.districtsDone).toBe(3);
    expect(failedWarnings(run)).toEqual([expect.objectContaining({
      districtId: broken.id, districtName: broken.name, params: { stage: 'write' }, reason: { code: 'database_error', params: { sqlState: '23514' } },
    })]);
  });

  it('when one district\'s stored tier cannot be rendered, then the bulletin send mails every other district and answers what it left out, not 500', async () => {
    await runSeasonNow(t.ctx, { asOf: AS_OF });
    const broken = districts[0];
    const readers = [];
    for (const d of districts) readers.push({ d, user: await makeUser(t.ds, { role: 'epidemiologist', districtIds: [d.id] }) });
    // A malformed stored value: the drivers of the week's tier are an object, not a list.
    await t.ds.query(`UPDATE district_tiers SET drivers = '{"broken": true}'::jsonb WHERE district_id = $1`, [broken.id]);
    const sup = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'supervisor' })).email);
    const before = (await t.ds.query(`SELECT count(*)::int AS n FROM outbox_messages`))[0].n;
    const res = await sup.post('/api/bulletins/send').send({});
    expect(res.status).toBe(200);
    expect(res.body.bulletinsWritten).toBe(3);
    expect(res.body.districtsFailed).toEqual([{ districtId: broken.id, districtName: broken.name, reason: { code: 'unexpected_error', params: { kind: 'TypeError' } } }]);
    const queued = await t.ds.query(
      `SELECT m.to_address FROM outbox_messages m JOIN bulletin_digests g ON g.id = m.digest_id ORDER BY m.created_at`,
    );
    expect((await t.ds.query(`SELECT count(*)::int AS n FROM outbox_messages`))[0].n - before).toBe(res.body.messagesQueued);
    const to = new Set(queued.map((r: { to_address: string }) => r.to_address));
    for (const { d, user } of readers) expect(to.has(user.email)).toBe(d !== broken);
    expect(await t.ds.query(`SELECT 1 FROM bulletins WHERE district_id = $1`, [broken.id])).toEqual([]);
  });

  it('when the Monday bulletin job meets a district whose bulletin throws, then the job still writes the others', async () => {
    await t.ds.query(`DELETE FROM outbox_messages`);
    await t.ds.query(`DELETE FROM bulletins`);
    const service = new BulletinsService(t.ctx);
    service.districtHook = (id) => { if (id === districts[3].id) throw new Error('planted'); };
    const out = (await service.sendLocked())!;
    // districts[0] still has its broken tier from the test before: both are named, the other two written.
    expect(out.districtsFailed.map((f) => f.districtId).sort()).toEqual([districts[0].id, districts[3].id].sort());
    expect(out.bulletinsWritten).toBe(2);
    expect((await t.ds.query(`SELECT 1 FROM bulletins`)).length).toBe(2);
  });
});

describe('the outbox with one message that fails for good', () => {
  it('when the mail server refuses one message permanently, then it is failed at once and every other message is delivered', async () => {
    await t.ds.query(`DELETE FROM outbox_messages`);
    const to = ['a@iso.example', 'refused@iso.example', 'b@iso.example', 'nul@iso.example', 'c@iso.example'];
    await t.ds.transaction((m) => enqueueMail(m, t.ctx.config, to.map((x) => ({ kind: 'advisory' as const, to: x, subject: 'S', text: 'x', html: '<p>x</p>' }))));
    const delivered: string[] = [];
    const mailer = {
      send: async (msg: { to: string }) => {
        if (msg.to === 'refused@iso.example') throw Object.assign(new Error('550 5.1.1 mailbox unknown'), { responseCode: 550 });
        // An error whose text PostgreSQL cannot store (a NUL byte) must not block the queue either.
        if (msg.to === 'nul@iso.example') throw new Error('bad\u0000answer');
        delivered.push(msg.to);
      },
      close: () => undefined,
    };
    const counts = await new OutboxWorker(t.ctx, { mailer: mailer as never }).drain();
    expect(delivered.sort()).toEqual(['a@iso.example', 'b@iso.example', 'c@iso.example']);
    expect(counts).toEqual({ sent: 3, retry: 1, failed: 1 });
    const rows = await t.ds.query(`SELECT to_address, status, attempts FROM outbox_messages WHERE to_address IN ('refused@iso.example', 'nul@iso.example') ORDER BY to_address`);
    expect(rows).toEqual([
      { to_address: 'nul@iso.example', status: 'pending', attempts: 1 },
      { to_address: 'refused@iso.example', status: 'failed', attempts: 1 },
    ]);
  });
});
