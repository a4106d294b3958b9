import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../support/test-app';
import { countRows, makeDistrict, makeUser, signedInAgent, square } from '../support/factories';
import { linkToken, waitForMail } from '../support/mail';
import { csv, makeStation } from '../support/weather-factories';
import { OutboxWorker } from '../../server/outbox/outbox.worker';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
});
afterAll(() => t.close());

describe('each user\'s language and units', () => {
  it('when a user has chosen nothing, then /api/me answers English, °C and mm', async () => {
    const user = await makeUser(t.ds, { role: 'worker' });
    const me = await (await signedInAgent(t.app, user.email)).get('/api/me');
    expect(me.status).toBe(200);
    expect(me.body.preferences).toEqual({ language: 'en', temperatureUnit: 'C', rainUnit: 'mm' });
  });

  it('when a user saves French and °F, then /api/me and the sign-in answer carry them and the change is audited', async () => {
    const user = await makeUser(t.ds, { role: 'epidemiologist' });
    const agent = await signedInAgent(t.app, user.email);
    const res = await agent.patch('/api/me/preferences').send({ language: 'fr', temperatureUnit: 'F' });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ language: 'fr', temperatureUnit: 'F', rainUnit: 'mm' });
    expect((await agent.get('/api/me')).body.preferences).toEqual({ language: 'fr', temperatureUnit: 'F', rainUnit: 'mm' });
    const signIn = await request(t.app).post('/api/auth/sign-in').send({ email: user.email, password: 'a-test-password-42' });
    expect(signIn.body.preferences.language).toBe('fr');
    const audit = await t.ds.query(`SELECT actor_id, before, after FROM audit_events WHERE entity = 'user' AND entity_id = $1 AND action = 'user.preferences-updated'`, [user.id]);
    expect(audit).toEqual([{ actor_id: user.id, before: { language: 'en', temperatureUnit: 'C', rainUnit: 'mm' }, after: { language: 'fr', temperatureUnit: 'F', rainUnit: 'mm' } }]);
    // Preferences change nothing of the session: still signed in.
    expect((await agent.get('/api/me')).status).toBe(200);
  });

  it('when the body is wrong (a language not offered, a unit, an unknown field, nothing), then the answer is 400 naming the field and nothing is written', async () => {
    const user = await makeUser(t.ds, { role: 'officer' });
    const agent = await signedInAgent(t.app, user.email);
    const before = await countRows(t.ds, 'users', 'audit_events');
    const lang = await agent.patch('/api/me/preferences').send({ language: 'de' });
    expect(lang.status).toBe(400);
    expect(lang.body.error.fields.map((f: { path: string }) => f.path)).toEqual(['language']);
    const unit = await agent.patch('/api/me/preferences').send({ rainUnit: 'cm', temperatureUnit: 'K' });
    expect(unit.status).toBe(400);
    expect(unit.body.error.fields.map((f: { path: string }) => f.path).sort()).toEqual(['rainUnit', 'temperatureUnit']);
    const extra = await agent.patch('/api/me/preferences').send({ language: 'es', role: 'admin' });
    expect(extra.status).toBe(400);
    expect(JSON.stringify(extra.body.error)).toMatch(/role/);
    expect((await agent.patch('/api/me/preferences').send({})).status).toBe(400);
    expect(await countRows(t.ds, 'users', 'audit_events')).toEqual(before);
    expect((await agent.get('/api/me')).body.preferences.language).toBe('en');
    expect((await request(t.app).patch('/api/me/preferences').send({ language: 'fr' })).status).toBe(401);
  });
});

describe('mail in the recipient\'s language', () => {
  it('when an admin invites someone in Spanish, then the invitation is written in Spanish and the account keeps the language', async () => {
    const admin = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'admin' })).email);
    const email = `invitado-${Date.now()}@test.example`;
    const res = await admin.post('/api/users').send({ email, displayName: 'Rosa Campo', role: 'worker', language: 'es' });
    expect(res.status).toBe(201);
    await new OutboxWorker(t.ctx).drain(); // the invitation goes through the outbox
    const mail = await waitForMail(email);
    expect(mail.subject).toBe('Broodcast: su invitación');
    expect(mail.text).toContain('Hola, Rosa Campo:');
    expect(mail.text).toContain('con el rol de Agente comunitario');
    expect(mail.text).toContain('durante 72 horas');
    expect(mail.text).toContain('Elegir su contraseña');
    expect(linkToken(mail)).toBeTruthy();
    expect((await t.ds.query(`SELECT language FROM users WHERE email = $1`, [email]))[0].language).toBe('es');
    const bad = await admin.post('/api/users').send({ email: `x-${Date.now()}@test.example`, displayName: 'X', role: 'worker', language: 'xx' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.map((f: { path: string }) => f.path)).toEqual(['language']);
  });

  it('when a Portuguese user asks for a new password, then the link comes in Portuguese (1 hour, singular)', async () => {
    const user = await makeUser(t.ds, { role: 'officer' });
    await t.ds.query(`UPDATE users SET language = 'pt' WHERE id = $1`, [user.id]);
    expect((await request(t.app).post('/api/auth/password-reset').send({ email: user.email })).status).toBe(202);
    await new OutboxWorker(t.ctx).drain(); // the reset mail goes through the outbox
    const mail = await waitForMail(user.email);
    expect(mail.subject).toBe('Broodcast: definir uma nova palavra-passe');
    expect(mail.text).toContain('durante 1 hora.');
    expect(mail.text).toContain('Definir uma nova palavra-passe');
  });
});

describe('the intake report in the reader\'s units', () => {
  it('when the report of an upload in °F and inches is downloaded, then values come in °C and mm by default, or in the units asked for, named in the header, with formula cells still neutralised', async () => {
    const officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
    await makeDistrict(t.ds, { boundary: square(40, 10), centroidLat: 10.5, centroidLon: 40.5 });
    const station = await makeStation(t.ds, { latitude: 10.5, longitude: 40.5 });
    // Tmin above Tmax (rejected, values as the file gave them, in °F); rain beyond the physical limit (rejected, inches).
    const upload = await officer
      .post('/api/weather/uploads?wait=true')
      .field('tempUnit', 'F')
      .field('rainUnit', 'in')
      .attach('file', Buffer.from(csv('station,date,tmin,tmax,rh,rain', [
        [station.code, '2026-03-01', 95, 50, 60, 0],
        [station.code, '2026-03-02', 50, 68, 60, 100],
        ['=CMD()', '2026-03-03', 50, 68, 60, 0],
      ])), 'f.csv');
    expect(upload.status).toBe(201);
    const report = (q: string) => officer.get(`/api/weather/uploads/${upload.body.id}/issues?format=csv${q}`);
    const rows = (text: string) => text.trim().split('\n').map((l) => l.split(','));

    const si = await report('');
    expect(si.status).toBe(200);
    const siRows = rows(si.text);
    expect(siRows[0]).toEqual(['row', 'station', 'date', 'column', 'value (°C; mm)', 'outcome', 'rule', 'reason']);
    expect(siRows.find((r) => r[3] === 'tmin' && r[6] === 'tmin-above-tmax')![4]).toBe('35'); // 95 °F
    expect(siRows.find((r) => r[3] === 'rain')![4]).toBe('2540'); // 100 in

    const us = await report('&temperature=F&rain=in');
    const usRows = rows(us.text);
    expect(usRows[0][4]).toBe('value (°F; in)');
    expect(usRows.find((r) => r[3] === 'tmin' && r[6] === 'tmin-above-tmax')![4]).toBe('95');
    expect(usRows.find((r) => r[3] === 'rain')![4]).toBe('100');
    expect(us.text).toContain("'=CMD()");
    expect(us.text).not.toMatch(/(^|,)=/m);

    const bad = await report('&temperature=K');
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.map((f: { path: string }) => f.path)).toEqual(['temperature']);
  });
});
