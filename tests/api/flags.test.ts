import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runSeasonNow } from '../../server/season/season-run.service';
import { OutboxWorker } from '../../server/outbox/outbox.worker';
import { createTestApp, type TestApp } from '../support/test-app';
import { countRows, makeDistrict, makeUser, signedInAgent } from '../support/factories';
import { makeCaseHistory, makeSeasonDistrict } from '../support/season-factories';
import { makeFlag, rawSource, waitForMails } from '../support/flags-factories';
import { englishMessage } from '../../server/flags/flag-texts';
import { composeMessage } from '../../shared/flags/advisory-message';

let t: TestApp;
const AS_OF = '2026-08-20';

beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
});
afterAll(() => t.close());

const supervisor = async () => signedInAgent(t.app, (await makeUser(t.ds, { role: 'supervisor' })).email);

describe('flags raised by the season run', () => {
  it('when cases cross above the channel, then the run raises a flag with drivers, message and actions, and a second run raises no duplicate', async () => {
    const warm = await makeSeasonDistrict(t.ds, { warmth: 2 });
    await makeCaseHistory(t.ds, warm.id, { base: 2, year: 2026, current: Array.from({ length: 33 }, (_, i) => (i > 28 ? 30 + i : 3)) });
    await runSeasonNow(t.ctx, { asOf: AS_OF });
    const flags = await t.ds.query(`SELECT * FROM flags WHERE district_id = $1 ORDER BY reason`, [warm.id]);
    const above = flags.find((f: { reason: string }) => f.reason === 'channel-above');
    expect(above).toMatchObject({ status: 'open', source: 'season-run', epi_year: 2026, epi_week: 33, raised_by: null });
    expect(above.drivers.map((d: { id: string }) => d.id)).toEqual(['climate', 'vectorClock', 'larval', 'cases']);
    expect(above.suggested_message).toMatch(/above the usual range/);
    expect(above.suggested_message).toMatch(/national health authority/);
    expect(above.actions.map((a: { id: string }) => a.id)).toContain('case-finding');
    const audit = await t.ds.query(`SELECT action FROM audit_events WHERE entity = 'flag' AND entity_id = $1`, [above.id]);
    expect(audit).toEqual([{ action: 'flag.raised' }]);

    const before = await countRows(t.ds, 'flags');
    await runSeasonNow(t.ctx, { asOf: AS_OF });
    expect(await countRows(t.ds, 'flags')).toEqual(before);
    // Decided flags are not raised again for the same week either.
    await t.ds.query(`UPDATE flags SET status = 'rejected', decided_at = now() WHERE district_id = $1`, [warm.id]);
    await runSeasonNow(t.ctx, { asOf: AS_OF });
    expect(await countRows(t.ds, 'flags')).toEqual(before);
  });

  it('when a district stays in a cold Baseline, then no flag is raised', async () => {
    const cool = await makeSeasonDistrict(t.ds, { lat: 33, profileId: 'culex-wnv', warmth: -12 });
    await runSeasonNow(t.ctx, { asOf: AS_OF });
    expect(await t.ds.query(`SELECT id FROM flags WHERE district_id = $1`, [cool.id])).toEqual([]);
  });
});

describe('raising a flag by hand', () => {
  it('when an epidemiologist raises a flag for an assigned district, then it is open and audited; a second is refused with 409 and bad input writes nothing', async () => {
    const mine = await makeDistrict(t.ds);
    const other = await makeDistrict(t.ds);
    const epi = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'epidemiologist', districtIds: [mine.id] })).email);
    const before = await countRows(t.ds, 'flags', 'audit_events');
    const bad = await epi.post('/api/flags').send({ districtId: mine.id, note: 'x', actions: ['fogging'] });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.map((f: { path: string }) => f.path)).toEqual(expect.arrayContaining(['note', 'actions.0']));
    const notMine = await epi.post('/api/flags').send({ districtId: other.id, note: 'Clinic reports many fevers' });
    expect(notMine.status).toBe(403);
    expect(await countRows(t.ds, 'flags', 'audit_events')).toEqual(before);

    const ok = await epi.post('/api/flags').send({ districtId: mine.id, note: 'Clinic reports many fevers', actions: ['case-finding'] });
    expect(ok.status).toBe(201);
    expect(ok.body).toMatchObject({ status: 'open', reason: 'manual', source: 'manual', note: 'Clinic reports many fevers', version: 1 });
    expect(ok.body.actions.map((a: { id: string }) => a.id)).toEqual(['case-finding']);
    expect(ok.body.caution).toMatch(/trained staff/);
    // The note is internal: the public message is composed from the numbers without it (issue 16).
    expect(ok.body.suggestedMessage).not.toMatch(/Clinic reports many fevers/);
    expect(ok.body.publicMessage).toBeNull();
    const again = await epi.post('/api/flags').send({ districtId: mine.id, note: 'Still many fevers' });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('flag_open');
  });
});

describe('the sign-off queue', () => {
  it('when a supervisor opens the queue, then open flags come highest tier first, then newest', async () => {
    const d = await makeDistrict(t.ds);
    const d2 = await makeDistrict(t.ds);
    const old = await makeFlag(t.ds, { districtId: d.id, reason: 'tier-rise', tier: 'critical', createdAt: new Date(Date.now() - 86_400_000) });
    const newer = await makeFlag(t.ds, { districtId: d2.id, reason: 'tier-rise', tier: 'critical' });
    const low = await makeFlag(t.ds, { districtId: d.id, reason: 'manual', tier: 'raised' });
    const res = await (await supervisor()).get('/api/flags');
    expect(res.status).toBe(200);
    const ids = res.body.flags.map((f: { id: string }) => f.id);
    expect(ids.indexOf(newer.id)).toBeLessThan(ids.indexOf(old.id));
    expect(ids.indexOf(old.id)).toBeLessThan(ids.indexOf(low.id));
    expect(res.body.flags.every((f: { status: string }) => f.status === 'open')).toBe(true);
  });

  it('when a supervisor approves with an edited message, then it becomes an advisory mailed to the subscribers, every step is audited and the flag page shows it', async () => {
    const d = await makeDistrict(t.ds);
    const worker = await makeUser(t.ds, { role: 'worker', districtIds: [d.id] });
    const otherWorker = await makeUser(t.ds, { role: 'worker', districtIds: [(await makeDistrict(t.ds)).id] });
    const admin = await makeUser(t.ds, { role: 'admin' });
    const flag = await makeFlag(t.ds, { districtId: d.id, reason: 'channel-above', tier: 'high' });
    const sup = await supervisor();
    const message = 'Cases are climbing in this district. Empty standing water at home and see a clinician early with fever.';
    const res = await sup.post(`/api/flags/${flag.id}/approve`).send({ message, version: 1 });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'approved', finalMessage: message, version: 2, advisoryId: expect.any(String) });

    const queued = await t.ds.query(`SELECT to_address FROM outbox_messages WHERE advisory_id = $1`, [res.body.advisoryId]);
    const to = queued.map((q: { to_address: string }) => q.to_address);
    expect(to).toContain(worker.email);
    expect(to).not.toContain(otherWorker.email);
    expect(to).not.toContain(admin.email); // admins receive by subscription only

    await new OutboxWorker(t.ctx).drain();
    const [mail] = await waitForMails([worker.email], 1);
    expect(mail.subject).toMatch(/^Broodcast advisory: Test district .* High tier$/);
    expect(mail.text).toContain(message);
    expect(mail.text).toMatch(/trained staff only/);
    expect(mail.text).toMatch(/licensed clinician/);
    expect(mail.html).toContain('Remove breeding water');
    expect(mail.html).toMatch(/\/unsubscribe\?token=/);

    const page = await sup.get(`/api/flags/${flag.id}`);
    expect(page.body.history.map((h: { action: string }) => h.action)).toEqual(['flag.approved', 'advisory.issued']);
    expect(page.body.history[0]).toMatchObject({ actor: { displayName: 'Test supervisor' }, after: { edited: true } });

    const again = await sup.post(`/api/flags/${flag.id}/reject`).send({ reason: 'too late' });
    expect(again.status).toBe(409);
    const advisories = await signedInAgent(t.app, worker.email).then((a) => a.get('/api/advisories'));
    expect(advisories.body.advisories.map((a: { flagId: string }) => a.flagId)).toEqual([flag.id]);
    const others = await signedInAgent(t.app, otherWorker.email).then((a) => a.get('/api/advisories'));
    expect(others.body.advisories).toEqual([]);
  });

  it('when two supervisors act on the same flag at once, then one wins and the other is told with 409', async () => {
    const d = await makeDistrict(t.ds);
    const flag = await makeFlag(t.ds, { districtId: d.id, reason: 'tier-rise' });
    const [a, b] = [await supervisor(), await supervisor()];
    const results = await Promise.all([
      a.post(`/api/flags/${flag.id}/approve`).send({}),
      b.post(`/api/flags/${flag.id}/reject`).send({ reason: 'Counts were a data-entry error' }),
    ]);
    const statuses = results.map((r) => r.status).sort();
    expect(statuses).toEqual([200, 409]);
    expect(results.find((r) => r.status === 409)!.body.error.code).toBe('flag_decided');
    const [row] = await t.ds.query(`SELECT status, version FROM flags WHERE id = $1`, [flag.id]);
    expect(row.version).toBe(2);
    const decisions = await t.ds.query(`SELECT action FROM audit_events WHERE entity = 'flag' AND entity_id = $1`, [flag.id]);
    expect(decisions).toHaveLength(1);
    expect(await t.ds.query(`SELECT count(*)::int AS n FROM advisories WHERE flag_id = $1`, [flag.id])).toEqual([{ n: row.status === 'approved' ? 1 : 0 }]);
  });

  it('when a supervisor rejects without a reason or with a stale version, then nothing is written; with a reason the flag is rejected and audited', async () => {
    const d = await makeDistrict(t.ds);
    const flag = await makeFlag(t.ds, { districtId: d.id, reason: 'tier-rise' });
    const sup = await supervisor();
    const before = await countRows(t.ds, 'flags', 'audit_events', 'advisories', 'outbox_messages');
    const noReason = await sup.post(`/api/flags/${flag.id}/reject`).send({});
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.fields[0].path).toBe('reason');
    const stale = await sup.post(`/api/flags/${flag.id}/reject`).send({ reason: 'Not needed', version: 7 });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('flag_changed');
    expect(await countRows(t.ds, 'flags', 'audit_events', 'advisories', 'outbox_messages')).toEqual(before);
    expect((await t.ds.query(`SELECT status FROM flags WHERE id = $1`, [flag.id]))[0].status).toBe('open');

    const ok = await sup.post(`/api/flags/${flag.id}/reject`).send({ reason: 'The rise comes from a reporting backlog' });
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({ status: 'rejected', decisionReason: 'The rise comes from a reporting backlog', advisoryId: null });
    const [event] = await t.ds.query(`SELECT reason FROM audit_events WHERE entity = 'flag' AND entity_id = $1 AND action = 'flag.rejected'`, [flag.id]);
    expect(event.reason).toBe('The rise comes from a reporting backlog');
  });

  it('when the supervisor raised the flag themself, then they may not sign it off', async () => {
    const d = await makeDistrict(t.ds);
    const user = await makeUser(t.ds, { role: 'supervisor' });
    const flag = await makeFlag(t.ds, { districtId: d.id, raisedBy: user.id });
    const res = await (await signedInAgent(t.app, user.email)).post(`/api/flags/${flag.id}/approve`).send({});
    expect(res.status).toBe(403);
    expect((await t.ds.query(`SELECT status FROM flags WHERE id = $1`, [flag.id]))[0].status).toBe('open');
  });
});

describe('advisories in the reader\'s language', () => {
  it('when a French community worker and an English one receive the same advisory, then each reads it in their own language, the suggested message included', async () => {
    const d = await makeDistrict(t.ds);
    const fr = await makeUser(t.ds, { role: 'worker', districtIds: [d.id] });
    const en = await makeUser(t.ds, { role: 'worker', districtIds: [d.id] });
    await t.ds.query(`UPDATE users SET language = 'fr' WHERE id = $1`, [fr.id]);
    const flag = await makeFlag(t.ds, { districtId: d.id, reason: 'channel-above', tier: 'high' });
    const drivers = [{ id: 'cases' as const, contribution: 0.4 }, { id: 'climate' as const, contribution: 0.2 }];
    // As the season run writes it: Broodcast's own suggestion, approved unedited.
    const composed = composeMessage({ district: d.name, reason: 'channel-above', tier: 'high', previousTier: null, epiYear: 2026, epiWeek: 33, drivers });
    const suggestion = englishMessage(composed);
    await t.ds.query(`UPDATE flags SET suggested_message = $2, drivers = $3, message_code = $4, message_params = $5 WHERE id = $1`, [
      flag.id, suggestion, JSON.stringify(drivers.map((x) => ({ ...x, label: x.id, score: 0.5, weight: 0.3, detail: {} }))), composed.code, JSON.stringify(composed.params),
    ]);
    const res = await (await supervisor()).post(`/api/flags/${flag.id}/approve`).send({ version: 1 });
    expect(res.status).toBe(200);
    await new OutboxWorker(t.ctx).drain();

    const [french] = await waitForMails([fr.email], 1);
    expect(french.subject).toBe(`Avis Broodcast : ${d.name} — niveau Élevé`);
    for (const words of ['Que faire', 'Supprimer les gîtes larvaires', 'Rechercher activement les cas', 'personnel formé', 'autorité sanitaire nationale',
      'clinicien agréé', 'ne pose aucun diagnostic', 'dépassent la fourchette habituelle', 'Signal des cas (67 % du score)', 'Ne plus recevoir de courriels'])
      expect(french.text.replace(/\u202f|\u00a0/g, ' ')).toContain(words);
    expect(french.text).not.toContain('What to do');
    expect(french.html).toContain('<html lang="fr">');
    expect(await rawSource(french)).toMatch(/^Content-Language: fr\r?$/m);

    const [english] = await waitForMails([en.email], 1);
    expect(english.subject).toBe(`Broodcast advisory: ${d.name} — High tier`);
    expect(english.text).toContain(suggestion);
    expect(english.text).toContain('What to do');
  });

  it('when the supervisor edits the message, then every reader gets the words as approved, around them their own language', async () => {
    const d = await makeDistrict(t.ds);
    const es = await makeUser(t.ds, { role: 'worker', districtIds: [d.id] });
    await t.ds.query(`UPDATE users SET language = 'es' WHERE id = $1`, [es.id]);
    const flag = await makeFlag(t.ds, { districtId: d.id, reason: 'manual', tier: 'raised' });
    const message = 'Vacíe el agua estancada en casa esta semana y acuda a la clínica si tiene fiebre.';
    expect((await (await supervisor()).post(`/api/flags/${flag.id}/approve`).send({ message })).status).toBe(200);
    await new OutboxWorker(t.ctx).drain();
    const [mail] = await waitForMails([es.email], 1);
    expect(mail.subject).toBe(`Aviso de Broodcast: ${d.name} — nivel Elevado`);
    expect(mail.text).toContain(message);
    for (const words of ['Qué hacer', 'Eliminar el agua donde se crían', 'personal capacitado', 'autoridad sanitaria nacional', 'profesional clínico habilitado'])
      expect(mail.text).toContain(words);
  });
});
