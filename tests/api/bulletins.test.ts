import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BulletinsService } from '../../server/bulletins/bulletins.service';
import { textsFor } from '../../server/i18n';
import { OutboxWorker } from '../../server/outbox/outbox.worker';
import { runSeasonNow } from '../../server/season/season-run.service';
import { createTestApp, type TestApp } from '../support/test-app';
import { countRows, makeUser, signedInAgent } from '../support/factories';
import { makeCaseHistory, makeSeasonDistrict } from '../support/season-factories';
import { attachment, makeFlag, rawSource, pdfPages, waitForMails } from '../support/flags-factories';

let t: TestApp;
let warm: { id: string; name: string };
let cool: { id: string };

beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
  warm = await makeSeasonDistrict(t.ds, { warmth: 2 });
  cool = await makeSeasonDistrict(t.ds, { lat: 33, profileId: 'culex-wnv', warmth: -12 });
  await makeCaseHistory(t.ds, warm.id, { base: 2, year: 2026, current: Array.from({ length: 33 }, (_, i) => (i > 28 ? 30 + i : 3)) });
  await runSeasonNow(t.ctx, { asOf: '2026-08-20' });
});
afterAll(() => t.close());

describe('the weekly bulletin', () => {
  it('when a supervisor previews the week, then the HTML, the plain text and the PDF are there, with the ranking, drivers, channel and cautions', async () => {
    const sup = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'supervisor' })).email);
    const json = await sup.get(`/api/bulletins/preview?districtId=${warm.id}`);
    expect(json.status).toBe(200);
    expect(json.body).toMatchObject({ districtId: warm.id, epiYear: 2026, epiWeek: 33, alreadySent: false });
    expect(json.body.subject).toMatch(/week 33 of 2026/);
    for (const words of ['Drivers behind the tier', 'Case signal', 'endemic channel', 'The region this week', 'national health authority', 'licensed clinician', 'does not diagnose'])
      expect(json.body.text).toContain(words);
    const html = await sup.get(`/api/bulletins/preview/html?districtId=${warm.id}`);
    expect(html.status).toBe(200);
    expect(html.headers['content-type']).toMatch(/text\/html/);
    expect(html.headers['content-security-policy']).toMatch(/sandbox/);
    expect(html.text).toContain('<svg');
    const pdf = await sup.get(`/api/bulletins/preview/pdf?districtId=${warm.id}`).buffer(true).parse((res, cb) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(pdf.status).toBe(200);
    expect((pdf.body as Buffer).subarray(0, 5).toString()).toBe('%PDF-');
    expect(pdfPages(pdf.body)).toBeGreaterThanOrEqual(1);
    const officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
    expect((await officer.get(`/api/bulletins/preview?districtId=${warm.id}`)).status).toBe(403);
  });

  it('when the week is sent, then each subscriber gets HTML, text and a PDF that opens, with a one-click unsubscribe; a second send queues nothing', async () => {
    const worker = await makeUser(t.ds, { role: 'worker', districtIds: [warm.id] });
    const epi = await makeUser(t.ds, { role: 'epidemiologist', districtIds: [cool.id] });
    const admin = await makeUser(t.ds, { role: 'admin' });
    await makeFlag(t.ds, { districtId: warm.id, reason: 'manual' });
    const sup = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'supervisor' })).email);
    const sent = await sup.post('/api/bulletins/send').send({});
    expect(sent.status).toBe(200);
    expect(sent.body).toMatchObject({ epiYear: 2026, epiWeek: 33, bulletinsWritten: 2 });
    // One digest per person: each mail names the districts it covers.
    const rows = await t.ds.query(`SELECT m.to_address, unnest(g.district_ids)::text AS district_id FROM outbox_messages m JOIN bulletin_digests g ON g.id = m.digest_id`);
    const to = (id: string) => rows.filter((r: { district_id: string }) => r.district_id === id).map((r: { to_address: string }) => r.to_address);
    expect(to(warm.id)).toContain(worker.email);
    expect(to(cool.id)).not.toContain(worker.email);
    expect(to(cool.id)).toContain(epi.email);
    expect([...to(warm.id), ...to(cool.id)]).not.toContain(admin.email);

    await new OutboxWorker(t.ctx).drain();
    const [mail] = await waitForMails([worker.email], 1);
    expect(mail.subject).toBe(textsFor('en', 'bulletin')('digest.subject', { region: 'Halvern', week: 33, year: 2026, count: 1 }));
    expect(mail.text).toContain(warm.name);
    expect(mail.text).toContain('Cases against the endemic channel');
    expect(mail.text).toContain('trained staff only');
    expect(mail.html).toContain('The region this week');
    // maildev's parsed headers leave List-Unsubscribe out: read it in the raw message.
    const source = (await rawSource(mail)).replace(/\r?\n[ \t]+/g, ' '); // unfold folded header lines
    expect(source).toMatch(/^List-Unsubscribe: <http:\/\/[^>]+\/api\/unsubscribe\/[\w.-]+/m);
    expect(source).toMatch(/^List-Unsubscribe-Post: List-Unsubscribe=One-Click/m);
    expect(mail.attachments).toHaveLength(1);
    expect(mail.attachments![0].contentType).toBe('application/pdf');
    const pdf = await attachment(mail);
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    expect(pdfPages(pdf)).toBeGreaterThanOrEqual(1);
    expect(pdf.toString('latin1')).toMatch(/%%EOF\s*$/);

    const before = await countRows(t.ds, 'bulletins', 'outbox_messages');
    const again = await new BulletinsService(t.ctx).sendLocked();
    expect(again).toMatchObject({ bulletinsWritten: 0, messagesQueued: 0 });
    expect(await countRows(t.ds, 'bulletins', 'outbox_messages')).toEqual(before);

    // One click, no sign-in: the worker stops receiving this district.
    const token = /\/unsubscribe\?token=([\w.-]+)/.exec(mail.text)![1];
    const off = await request(t.app).post(`/api/unsubscribe/${token}`).send({});
    expect(off.status).toBe(200);
    expect(off.body).toEqual({ districtName: null, email: worker.email, scope: 'bulletin', language: 'en', subscribed: false });
    const subs = await t.ds.query(`SELECT district_id, kinds, active FROM subscriptions WHERE user_id = $1`, [worker.id]);
    expect(subs).toEqual([{ district_id: warm.id, kinds: ['advisory'], active: true }]); // the weekly bulletin stops, advisories go on
    const bad = await request(t.app).post(`/api/unsubscribe/${token.slice(0, -3)}abc`).send({});
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe('token_invalid');
  });
});

describe('the bulletin in the reader\'s language', () => {
  it('when a French and a Portuguese reader get the week, then subject, text, HTML and PDF are in their language with the cautions whole, and the PDF still opens', async () => {
    await t.ds.query(`DELETE FROM bulletins`); // the week is written again for this test's readers
    const fr = await makeUser(t.ds, { role: 'worker', districtIds: [warm.id] });
    const pt = await makeUser(t.ds, { role: 'worker', districtIds: [warm.id] });
    await t.ds.query(`UPDATE users SET language = 'fr' WHERE id = $1`, [fr.id]);
    await t.ds.query(`UPDATE users SET language = 'pt' WHERE id = $1`, [pt.id]);
    const sent = await new BulletinsService(t.ctx).sendLocked();
    expect(sent).toMatchObject({ epiWeek: 33, bulletinsWritten: 2 });
    const digests = await t.ds.query(`SELECT language FROM bulletin_digests WHERE user_id = ANY($1::uuid[]) ORDER BY 1`, [[fr.id, pt.id]]);
    expect(digests.map((r: { language: string }) => r.language)).toEqual(['fr', 'pt']);
    await new OutboxWorker(t.ctx).drain();

    const [mail] = await waitForMails([fr.email], 1);
    expect(mail.subject).toBe(textsFor('fr', 'bulletin')('digest.subject', { region: 'Halvern', week: 33, year: 2026, count: 1 }));
    for (const words of ['Facteurs du niveau', 'Signal des cas', 'canal endémique', 'La région cette semaine', 'Que faire', 'personnel formé',
      'autorité sanitaire nationale', 'clinicien agréé', 'ne pose aucun diagnostic', textsFor('fr', 'common')('footer.digestStopLink')])
      expect(mail.text).toContain(words);
    expect(mail.text).not.toContain('Drivers behind the tier');
    expect(mail.html).toContain('<html lang="fr">');
    expect(mail.html).toContain('Fourchette habituelle');
    const pdf = await attachment(mail);
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    expect(pdf.toString('latin1')).toMatch(/%%EOF\s*$/);
    expect(pdfPages(pdf)).toBeGreaterThanOrEqual(1);
    const english = (await t.ds.query(`SELECT pdf FROM bulletins WHERE district_id = $1`, [warm.id]))[0].pdf as Buffer;
    expect(pdf.equals(english)).toBe(false); // the French PDF, not the default one

    const [pmail] = await waitForMails([pt.email], 1);
    expect(pmail.subject).toMatch(/^Boletim semanal do Broodcast: /);
    for (const words of ['Casos face ao canal endémico', 'O que fazer', 'pessoal formado', 'autoridade sanitária nacional', 'clínico habilitado'])
      expect(pmail.text).toContain(words);
  });
});

describe('subscriptions', () => {
  it('when nothing is chosen, then the role default shows; saving writes explicit rows, and a community worker cannot take another district', async () => {
    const officer = await makeUser(t.ds, { role: 'officer' });
    const agent = await signedInAgent(t.app, officer.email);
    const mine = await agent.get('/api/subscriptions/me');
    expect(mine.body.source).toBe('default');
    expect(mine.body.districts.every((d: { advisory: boolean; bulletin: boolean }) => d.advisory && d.bulletin)).toBe(true);
    const saved = await agent.put('/api/subscriptions/me').send({ districts: [{ districtId: warm.id, advisory: true, bulletin: false }] });
    expect(saved.status).toBe(200);
    expect(saved.body.source).toBe('chosen');
    expect(saved.body.districts.find((d: { districtId: string }) => d.districtId === warm.id)).toMatchObject({ advisory: true, bulletin: false });
    expect(saved.body.districts.find((d: { districtId: string }) => d.districtId === cool.id)).toMatchObject({ advisory: false, bulletin: false });

    const worker = await makeUser(t.ds, { role: 'worker', districtIds: [cool.id] });
    const wAgent = await signedInAgent(t.app, worker.email);
    expect((await wAgent.get('/api/subscriptions/me')).body.districts.map((d: { districtId: string }) => d.districtId)).toEqual([cool.id]);
    const before = await countRows(t.ds, 'subscriptions', 'audit_events');
    const refused = await wAgent.put('/api/subscriptions/me').send({ districts: [{ districtId: warm.id, advisory: true, bulletin: true }] });
    expect(refused.status).toBe(403);
    const bad = await wAgent.put('/api/subscriptions/me').send({ districts: [{ districtId: cool.id, advisory: 'yes' }] });
    expect(bad.status).toBe(400);
    expect(await countRows(t.ds, 'subscriptions', 'audit_events')).toEqual(before);
  });
});
