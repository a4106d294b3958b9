import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { OutboxWorker } from '../../server/outbox/outbox.worker';
import { renderMessage } from '../../server/flags/flag-texts';
import { driverShares } from '../../shared/tier/driver-shares';
import { createTestApp, type TestApp } from '../support/test-app';
import { countRows, makeDistrict, makeUser, signedInAgent } from '../support/factories';
import { makeDrivers, makeFlag, makeTier, waitForMails } from '../support/flags-factories';

/**
 * Issue 16 items 3 and 4: flags stay current (tier now beside the flag's tier, superseded, lapsed) and
 * advisory words are composed from the numbers (codes and params, rendered in the reader's language).
 */
let t: TestApp;

beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
});
afterAll(() => t.close());

const supervisor = async () => signedInAgent(t.app, (await makeUser(t.ds, { role: 'supervisor' })).email);
const DAY = 86_400_000;
const plain = (s: string) => s.replace(/[\u202f\u00a0]/g, ' ');

describe('flags stay current', () => {
  it('when a newer season run has computed the district since the flag, then the card shows both tiers and the week, the flag is superseded, and approving it sends the tier of now with the flag\'s date', async () => {
    const d = await makeDistrict(t.ds);
    const worker = await makeUser(t.ds, { role: 'worker', districtIds: [d.id] });
    const then = makeDrivers({ climate: 0.3, vectorClock: 0.2, larval: 0.1, cases: 0.2 });
    const { runId } = await makeTier(t.ds, { districtId: d.id, epiWeek: 40, tier: 'critical', drivers: then });
    const flag = await makeFlag(t.ds, { districtId: d.id, reason: 'tier-rise', tier: 'critical', epiWeek: 40, runId, drivers: then, note: null });
    const sup = await supervisor();

    let card = (await sup.get('/api/flags')).body.flags.find((f: { id: string }) => f.id === flag.id);
    expect(card).toMatchObject({ tier: 'critical', epiWeek: 40, superseded: false, current: { tier: 'critical', epiYear: 2026, epiWeek: 40 } });

    // Two weeks later the run has the district at High, led by cases.
    const now = makeDrivers({ climate: 0.05, cases: 0.5 });
    await makeTier(t.ds, { districtId: d.id, epiWeek: 42, tier: 'high', drivers: now });
    card = (await sup.get('/api/flags')).body.flags.find((f: { id: string }) => f.id === flag.id);
    expect(card).toMatchObject({ status: 'open', tier: 'critical', epiWeek: 40, superseded: true, current: { tier: 'high', epiYear: 2026, epiWeek: 42 } });
    expect(card.proposal.params).toMatchObject({ tier: 'high', epiWeek: 42, flag: { epiWeek: 40, tier: 'critical' } });
    expect(card.proposal.code).toBe('case-led');

    const res = await sup.post(`/api/flags/${flag.id}/approve`).send({ version: card.version });
    expect(res.status).toBe(200);
    const [advisory] = await t.ds.query(`SELECT tier, message, message_code, message_params FROM advisories WHERE flag_id = $1`, [flag.id]);
    expect(advisory.tier).toBe('high');
    expect(advisory.message_code).toBe('case-led');
    const raisedOn = flag.createdAt.toISOString().slice(0, 10);
    expect(advisory.message_params.flag).toMatchObject({ raisedOn, epiYear: 2026, epiWeek: 40, tier: 'critical' });

    await new OutboxWorker(t.ctx).drain();
    const [mail] = await waitForMails([worker.email], 1);
    expect(mail.subject).toBe(`Broodcast advisory: ${d.name} — High tier`);
    expect(mail.text).toMatch(/This advisory comes from a flag raised on \d+ \w+ 2026 for week 40 of 2026 at the Critical tier; it uses the district's estimate for week 42 of 2026\./);
    expect(mail.text).toContain(`Broodcast's current estimate for ${d.name} is the High tier.`);
  });

  it('when a flag is older than the lapse setting, then it leaves the queue for the lapsed list, approving it is refused with 409 flag_lapsed and nothing is written, and an admin may lengthen the lapse with a reason', async () => {
    const d = await makeDistrict(t.ds);
    const old = await makeFlag(t.ds, { districtId: d.id, reason: 'tier-rise', createdAt: new Date(Date.now() - 15 * DAY) });
    const fresh = await makeFlag(t.ds, { districtId: d.id, reason: 'channel-above', createdAt: new Date(Date.now() - 13 * DAY) });
    const sup = await supervisor();
    const queue = await sup.get('/api/flags');
    expect(queue.body.lapseWeeks).toBe(2);
    const ids = queue.body.flags.map((f: { id: string }) => f.id);
    expect(ids).toContain(fresh.id);
    expect(ids).not.toContain(old.id);
    const lapsesAt = Date.parse(queue.body.flags.find((f: { id: string }) => f.id === fresh.id).lapsesAt);
    expect(Math.abs(lapsesAt - (fresh.createdAt.getTime() + 14 * DAY))).toBeLessThanOrEqual(3_600_000); // two weeks (a DST day may differ by an hour)
    const lapsed = await sup.get('/api/flags?status=lapsed');
    expect(lapsed.body.flags.map((f: { id: string; status: string }) => [f.id, f.status])).toEqual([[old.id, 'lapsed']]);

    const before = await countRows(t.ds, 'flags', 'advisories', 'outbox_messages', 'audit_events');
    const refused = await sup.post(`/api/flags/${old.id}/approve`).send({ version: 1 });
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('flag_lapsed');
    expect(await countRows(t.ds, 'flags', 'advisories', 'outbox_messages', 'audit_events')).toEqual(before);

    // The admin's setting: refused without a reason (nothing written), then three weeks with one.
    const admin = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'admin' })).email);
    expect((await admin.get('/api/flag-settings')).body).toMatchObject({ lapseWeeks: 2, updatedBy: null });
    const bad = await admin.put('/api/flag-settings').send({ lapseWeeks: 0 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.map((f: { path: string }) => f.path).sort()).toEqual(['lapseWeeks', 'reason']);
    expect(await countRows(t.ds, 'flag_settings', 'audit_events')).toEqual({ flag_settings: 0, audit_events: before.audit_events });
    const ok = await admin.put('/api/flag-settings').send({ lapseWeeks: 3, reason: 'Supervisors meet every third week' });
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({ lapseWeeks: 3, updatedBy: { displayName: expect.any(String) } });
    const [event] = await t.ds.query(`SELECT before, after, reason FROM audit_events WHERE action = 'flag-settings.updated'`);
    expect(event).toEqual({ before: { lapseWeeks: 2 }, after: { lapseWeeks: 3 }, reason: 'Supervisors meet every third week' });
    expect((await sup.get('/api/flags')).body.flags.map((f: { id: string }) => f.id)).toContain(old.id);
    await admin.put('/api/flag-settings').send({ lapseWeeks: 2, reason: 'Back to the default' });

    // A lapsed flag may still be rejected, which closes it.
    const rejected = await sup.post(`/api/flags/${old.id}/reject`).send({ reason: 'Out of date; the season has moved on' });
    expect(rejected.status).toBe(200);
    expect(rejected.body.status).toBe('rejected');
  });

  it('when a hand-raised flag has lapsed, then raising a new one for the district is accepted and the old one is stored as lapsed, audited', async () => {
    const d = await makeDistrict(t.ds);
    const old = await makeFlag(t.ds, { districtId: d.id, reason: 'manual', createdAt: new Date(Date.now() - 20 * DAY) });
    const officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
    const res = await officer.post('/api/flags').send({ districtId: d.id, note: 'Flooded market again after the storm' });
    expect(res.status).toBe(201);
    const [row] = await t.ds.query(`SELECT status FROM flags WHERE id = $1`, [old.id]);
    expect(row.status).toBe('lapsed');
    const events = await t.ds.query(`SELECT action FROM audit_events WHERE entity = 'flag' AND entity_id = $1`, [old.id]);
    expect(events).toEqual([{ action: 'flag.lapsed' }]);
  });

  it('when a season run catching up a past date raises a flag today, then the flag is as old as that date and lapses, while one for this week waits in the queue', async () => {
    const d = await makeDistrict(t.ds);
    const asOf = (daysAgo: number) => new Date(Date.now() - daysAgo * DAY).toISOString().slice(0, 10);
    const run = async (day: string) => (await t.ds.query(
      `INSERT INTO season_runs (kind, status, started_at, as_of) VALUES ('manual', 'succeeded', now(), $1) RETURNING id`, [day]))[0].id as string;
    const caughtUp = await makeFlag(t.ds, { districtId: d.id, reason: 'tier-rise', epiWeek: 40, runId: await run(asOf(50)) });
    const d2 = await makeDistrict(t.ds);
    const current = await makeFlag(t.ds, { districtId: d2.id, reason: 'tier-rise', epiWeek: 48, runId: await run(asOf(1)) });
    const sup = await supervisor();
    const queue = (await sup.get('/api/flags')).body.flags.map((f: { id: string }) => f.id);
    expect(queue).toContain(current.id);
    expect(queue).not.toContain(caughtUp.id);
    const lapsed = (await sup.get('/api/flags?status=lapsed')).body.flags.map((f: { id: string }) => f.id);
    expect(lapsed).toContain(caughtUp.id);
  });
});

describe('words generated from the numbers', () => {
  it('when a district\'s vector is in diapause, then a flag raised for it says so, in every reader\'s language, and never "conditions favour mosquitoes"', async () => {
    const d = await makeDistrict(t.ds);
    const fr = await makeUser(t.ds, { role: 'worker', districtIds: [d.id] });
    await t.ds.query(`UPDATE users SET language = 'fr' WHERE id = $1`, [fr.id]);
    const drivers = makeDrivers({ climate: 0, vectorClock: 0, cases: 0.05 }, { climate: { rvc14: 0, seasonOpen: false } });
    drivers[0].score = 0;
    await makeTier(t.ds, { districtId: d.id, epiWeek: 48, tier: 'baseline', drivers });
    const officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
    const raised = await officer.post('/api/flags').send({ districtId: d.id, note: 'Two travellers back with fever' });
    expect(raised.status).toBe(201);
    expect(raised.body.message.code).toBe('diapause');
    expect(raised.body.suggestedMessage).toMatch(/diapause/);
    expect(raised.body.suggestedMessage).not.toMatch(/Conditions favour mosquitoes/);
    expect(raised.body.suggestedMessage).toMatch(/infected elsewhere or earlier/);

    expect((await (await supervisor()).post(`/api/flags/${raised.body.id}/approve`).send({ version: 1 })).status).toBe(200);
    await new OutboxWorker(t.ctx).drain();
    const [mail] = await waitForMails([fr.email], 1);
    expect(plain(mail.text)).toContain('repos hivernal (diapause)');
    expect(mail.text).not.toMatch(/favorisent les moustiques/);
    expect(mail.text).not.toContain('Two travellers');
  });

  it('when a hand-raised flag has an internal note and a public message, then the note is never in the public message, the advisory or the mail', async () => {
    const d = await makeDistrict(t.ds);
    const worker = await makeUser(t.ds, { role: 'worker', districtIds: [d.id] });
    await makeTier(t.ds, { districtId: d.id, epiWeek: 44, tier: 'raised', drivers: makeDrivers({ climate: 0.2, cases: 0.1 }) });
    const note = 'cluster of 6 febrile patients at the Harrow Lane school, names with the clinic';
    const publicMessage = 'Empty standing water around homes and schools this week, and see a clinician early with any fever.';
    const epi = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'epidemiologist', districtIds: [d.id] })).email);
    const raised = await epi.post('/api/flags').send({ districtId: d.id, note, message: publicMessage });
    expect(raised.status).toBe(201);
    expect(raised.body).toMatchObject({ note, publicMessage, message: { code: 'custom', params: { text: publicMessage } } });
    expect(JSON.stringify(raised.body.message)).not.toContain('febrile');

    const res = await (await supervisor()).post(`/api/flags/${raised.body.id}/approve`).send({ version: 1 });
    expect(res.status).toBe(200);
    const [advisory] = await t.ds.query(`SELECT message, message_params FROM advisories WHERE flag_id = $1`, [raised.body.id]);
    expect(advisory.message).toBe(publicMessage);
    expect(JSON.stringify(advisory.message_params)).not.toContain('febrile');
    await new OutboxWorker(t.ctx).drain();
    const [mail] = await waitForMails([worker.email], 1);
    expect(mail.text).toContain(publicMessage);
    expect(mail.text + mail.html).not.toContain('febrile');
    const listed = await signedInAgent(t.app, worker.email).then((a) => a.get('/api/advisories'));
    expect(JSON.stringify(listed.body)).not.toContain('febrile');
  });

  it('when a flag\'s drivers are quoted on the card and in the message, then both come from the one share computation and agree', async () => {
    const d = await makeDistrict(t.ds);
    // Contributions 0.25 (cases) and 0.075 (climate): 77 % and 23 % of a 0.325 score, never "25 %".
    const drivers = makeDrivers({ climate: 0.075, cases: 0.25 });
    await makeTier(t.ds, { districtId: d.id, epiWeek: 45, tier: 'raised', drivers });
    const officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
    const raised = await officer.post('/api/flags').send({ districtId: d.id, note: 'Clinic saw more fevers' });
    const shares = driverShares(raised.body.drivers);
    expect(shares.map((s) => [s.id, s.share])).toEqual([['cases', 0.77], ['climate', 0.23]]);
    expect(raised.body.message.params.shares).toEqual(shares.map(({ id, share }) => ({ id, share })));
    expect(raised.body.suggestedMessage).toContain('Case signal (77% of the score) and Climate suitability (23%)');
    expect(raised.body.message.code).toBe('case-led');
  });

  it('when a French reader opens a stored advisory, then it is worded in French from its code and numbers', async () => {
    const d = await makeDistrict(t.ds);
    await makeTier(t.ds, { districtId: d.id, epiWeek: 36, tier: 'high', drivers: makeDrivers({ climate: 0.3, vectorClock: 0.2, cases: 0.1 }) });
    const flag = await makeFlag(t.ds, { districtId: d.id, reason: 'tier-rise', tier: 'high', epiWeek: 36, drivers: makeDrivers({ climate: 0.3, vectorClock: 0.2, cases: 0.1 }) });
    await t.ds.query(`UPDATE flags SET run_id = (SELECT run_id FROM district_tiers WHERE district_id = $1) WHERE id = $2`, [d.id, flag.id]);
    expect((await (await supervisor()).post(`/api/flags/${flag.id}/approve`).send({})).status).toBe(200);
    const worker = await makeUser(t.ds, { role: 'worker', districtIds: [d.id] });
    const listed = (await signedInAgent(t.app, worker.email).then((a) => a.get('/api/advisories'))).body.advisories;
    expect(listed).toHaveLength(1);
    expect(listed[0].message).toMatch(/Warm, humid weather/);
    expect(listed[0].composed.code).toBe('weather-led');
    const french = plain(renderMessage(listed[0].composed.code, listed[0].composed.params, 'fr'));
    expect(french).toContain(`L’estimation hebdomadaire de Broodcast pour ${d.name} est passée au niveau Élevé.`);
    expect(french).toContain('Le temps chaud et humide accélère');
    expect(french).toContain('Conditions climatiques favorables (50 % du score)');
    expect(french).toContain('autorité sanitaire nationale');
    expect(french).not.toMatch(/[A-Z][a-z]+ (tier|weather)/);
  });
});
