import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BulletinsService } from '../../server/bulletins/bulletins.service';
import { recipientsOf } from '../../server/bulletins/subscriptions.service';
import { textsFor } from '../../server/i18n';
import { OutboxWorker } from '../../server/outbox/outbox.worker';
import { runSeasonNow } from '../../server/season/season-run.service';
import { createTestApp, type TestApp } from '../support/test-app';
import { countRows, makeUser, signedInAgent } from '../support/factories';
import { makeSeasonDistrict } from '../support/season-factories';
import { attachment, caughtFor, pdfPages, rawSource, waitForMails } from '../support/flags-factories';

// Issue 16, items 8, 9 and 10: one bulletin per person, unsubscribe that asks first, the tier settings' dry run.
let t: TestApp;
const districts: { id: string; name: string }[] = [];
const fr = (key: string, vars?: Record<string, unknown>) => textsFor('fr', 'bulletin')(key, vars);
const en = (key: string, vars?: Record<string, unknown>) => textsFor('en', 'bulletin')(key, vars);

beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
  for (let i = 0; i < 12; i++) districts.push(await makeSeasonDistrict(t.ds, { warmth: -6 + i }));
  await runSeasonNow(t.ctx, { asOf: '2026-08-20' });
}, 240_000);
afterAll(() => t.close());

describe('one bulletin per person', () => {
  it('when a supervisor follows 12 districts, then the week brings ONE mail with the named PDF; a French worker reads French; one reader whose digest fails does not stop the others', async () => {
    const sup = await makeUser(t.ds, { role: 'supervisor' });
    const worker = await makeUser(t.ds, { role: 'worker', districtIds: [districts[3].id] });
    await t.ds.query(`UPDATE users SET language = 'fr' WHERE id = $1`, [worker.id]);
    const broken = await makeUser(t.ds, { role: 'officer' });
    const service = new BulletinsService(t.ctx);
    service.recipientHook = (userId) => { if (userId === broken.id) throw new Error('planted'); };
    const out = (await service.sendLocked())!;
    expect(out).toMatchObject({ epiYear: 2026, epiWeek: 33, bulletinsWritten: 12, districtsFailed: [] });
    expect(out.recipientsFailed).toEqual([{ userId: broken.id, email: broken.email, reason: { code: 'unexpected_error', params: { kind: 'Error' } } }]);
    expect(out.messagesQueued).toBe(out.digestsWritten);
    expect(await t.ds.query(`SELECT 1 FROM outbox_messages WHERE to_address = $1`, [broken.email])).toEqual([]);
    await new OutboxWorker(t.ctx).drain();

    const [mail] = await waitForMails([sup.email], 1);
    await new Promise((r) => setTimeout(r, 300));
    expect(await caughtFor([sup.email])).toHaveLength(1); // one mail, not twelve
    expect(mail.subject).toBe(en('digest.subject', { region: 'Halvern', week: 33, year: 2026, count: 12 }));
    for (const d of districts) expect(mail.text).toContain(d.name);
    expect(mail.text).toContain(en('digest.changesHeading'));
    expect(mail.html).toContain('<meta charset="utf-8">');
    expect(mail.text).toContain(textsFor('en', 'common')('cautions.estimate'));
    expect(mail.attachments).toHaveLength(1);
    const pdf = await attachment(mail);
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    expect(pdfPages(pdf)).toBeGreaterThanOrEqual(1);
    const source = (await rawSource(mail)).replace(/\r?\n[ \t]+/g, ' ');
    expect(source).toMatch(/^List-Unsubscribe: <http:\/\/[^>]+\/api\/unsubscribe\/[\w.-]+>/m);
    expect(source).toMatch(/^List-Unsubscribe-Post: List-Unsubscribe=One-Click/m);
    expect(source).toMatch(/filename="?broodcast-halvern-2026-w33\.pdf/);

    const [fmail] = await waitForMails([worker.email], 1);
    expect(fmail.subject).toBe(fr('digest.subject', { region: 'Halvern', week: 33, year: 2026, count: 1 }));
    expect(fmail.text).toContain(districts[3].name);
    expect(fmail.text).toContain(textsFor('fr', 'common')('cautions.authority'));
    expect(fmail.html).toContain('<html lang="fr">');
    expect(await rawSource(fmail)).toMatch(/filename="?broodcast-halvern-2026-w33\.pdf/);

    // The same week again queues nothing for anybody already served.
    const before = await countRows(t.ds, 'bulletins', 'bulletin_digests', 'outbox_messages');
    service.recipientHook = undefined;
    const again = (await service.sendLocked())!;
    expect(again).toMatchObject({ bulletinsWritten: 0, digestsWritten: 1, messagesQueued: 1 }); // only the reader who failed
    const after = await countRows(t.ds, 'bulletins', 'bulletin_digests', 'outbox_messages');
    expect(after.bulletin_digests - before.bulletin_digests).toBe(1);
  });

  it('when a supervisor previews their digest with ?language=fr, then it is French and names its PDF; nothing is written', async () => {
    const sup = await makeUser(t.ds, { role: 'supervisor' });
    const agent = await signedInAgent(t.app, sup.email);
    const before = await countRows(t.ds, 'bulletin_digests', 'outbox_messages');
    const res = await agent.get('/api/bulletins/digest/preview?language=fr');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ language: 'fr', layout: 'overview', districts: 12, filename: 'broodcast-halvern-2026-w33.pdf' });
    expect(res.body.subject).toBe(fr('digest.subject', { region: 'Halvern', week: 33, year: 2026, count: 12 }));
    const html = await agent.get('/api/bulletins/digest/preview/html?language=pt');
    expect(html.text).toContain('<html lang="pt">');
    expect(html.text).toContain('<meta charset="utf-8">');
    const one = await agent.get(`/api/bulletins/preview?districtId=${districts[0].id}&language=es`);
    expect(one.body.language).toBe('es');
    expect(one.body.text).toContain(textsFor('es', 'bulletin')('driversHeading'));
    expect(await countRows(t.ds, 'bulletin_digests', 'outbox_messages')).toEqual(before);
  });

  it('when an invitation is still pending, then that address receives no bulletin and no advisory until the account is taken up', async () => {
    const pending = await makeUser(t.ds, { role: 'officer', password: null });
    const taken = await makeUser(t.ds, { role: 'officer' });
    for (const kind of ['bulletin', 'advisory'] as const) {
      const to = (await recipientsOf(t.ds.manager, districts[0].id, kind)).map((r) => r.userId);
      expect(to).toContain(taken.id);
      expect(to).not.toContain(pending.id);
    }
  });
});

describe('unsubscribe', () => {
  it('when the link is opened, then nothing changes; the one-click POST stops the weekly bulletin (advisories stay); undo puts it back', async () => {
    await t.ds.query(`DELETE FROM bulletin_digests`);
    const officer = await makeUser(t.ds, { role: 'officer' });
    await new BulletinsService(t.ctx).sendLocked();
    await new OutboxWorker(t.ctx).drain();
    const [mail] = await waitForMails([officer.email], 1);
    const token = /\/unsubscribe\?token=([\w.-]+)/.exec(mail.text)![1];

    const before = await countRows(t.ds, 'subscriptions', 'audit_events');
    const look = await request(t.app).get(`/api/unsubscribe/${token}`);
    expect(look.status).toBe(200);
    expect(look.body).toEqual({ email: officer.email, districtName: null, scope: 'bulletin', language: 'en', subscribed: true });
    expect(await countRows(t.ds, 'subscriptions', 'audit_events')).toEqual(before);

    // A mail program's one-click POST (RFC 8058): a form body, no session, no cookie.
    const off = await request(t.app).post(`/api/unsubscribe/${token}`).type('form').send('List-Unsubscribe=One-Click');
    expect(off.status).toBe(200);
    expect(off.body).toMatchObject({ scope: 'bulletin', subscribed: false });
    const subs = await t.ds.query(`SELECT kinds, active FROM subscriptions WHERE user_id = $1`, [officer.id]);
    expect(subs).toHaveLength(12);
    expect(subs.every((s: { kinds: string[] }) => s.kinds.join() === 'advisory')).toBe(true);

    const undo = await request(t.app).post(`/api/unsubscribe/${token}/undo`).send({});
    expect(undo.status).toBe(200);
    expect(undo.body).toMatchObject({ subscribed: true });
    const back = await t.ds.query(`SELECT kinds FROM subscriptions WHERE user_id = $1`, [officer.id]);
    expect(back.every((s: { kinds: string[] }) => s.kinds.includes('bulletin') && s.kinds.includes('advisory'))).toBe(true);

    const bad = await request(t.app).get(`/api/unsubscribe/${token.slice(0, -3)}abc`);
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe('token_invalid');
  });
});

describe('tier settings', () => {
  it('when an admin previews new cut points, then the districts whose tier would change are listed from → to and nothing is written; saving needs a reason', async () => {
    const admin = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'admin' })).email);
    const { settings } = (await admin.get('/api/tier-settings')).body;
    const before = await countRows(t.ds, 'tier_settings_versions', 'district_tiers', 'audit_events');
    const same = await admin.post('/api/tier-settings/preview').send({ settings });
    expect(same.status).toBe(200);
    expect(same.body).toMatchObject({ epiYear: 2026, epiWeek: 33, districts: 12, changes: [] }); // the stored tiers are reproduced
    const low = await admin.post('/api/tier-settings/preview').send({ settings: { ...settings, cuts: { raised: 0.01, high: 0.02, critical: 0.03 } } });
    expect(low.status).toBe(200);
    const tiers = await t.ds.query(`SELECT district_id, tier, score FROM district_tiers WHERE epi_week = 33`);
    const expected = tiers.filter((r: { tier: string; score: number }) => r.tier !== 'critical' && r.score >= 0.03).length;
    expect(low.body.changes).toHaveLength(expected);
    for (const c of low.body.changes) expect(c).toMatchObject({ to: 'critical', from: tiers.find((r: { district_id: string }) => r.district_id === c.districtId).tier });
    expect(await countRows(t.ds, 'tier_settings_versions', 'district_tiers', 'audit_events')).toEqual(before);

    const noReason = await admin.put('/api/tier-settings').send({ settings });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.fields.map((f: { path: string }) => f.path)).toContain('reason');
    expect(await countRows(t.ds, 'tier_settings_versions', 'audit_events')).toEqual({ tier_settings_versions: before.tier_settings_versions, audit_events: before.audit_events });
    const bad = await admin.post('/api/tier-settings/preview').send({ settings: { ...settings, cuts: { raised: 0.6, high: 0.5, critical: 0.7 } } });
    expect(bad.status).toBe(400);
    const ok = await admin.put('/api/tier-settings').send({ settings, reason: 'Same values, recorded for the test' });
    expect(ok.status).toBe(200);
    const history = (await admin.get('/api/tier-settings')).body.history;
    expect(history[0]).toMatchObject({ version: ok.body.version, reason: 'Same values, recorded for the test', changedByName: 'Test admin' });
    const officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
    expect((await officer.post('/api/tier-settings/preview').send({ settings })).status).toBe(403);
  });
});
