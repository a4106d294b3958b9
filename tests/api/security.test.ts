import { randomUUID } from 'node:crypto';
import { mkdtempSync, readdirSync, rmSync, watch, existsSync, mkdirSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import bcrypt from 'bcryptjs';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { COMMON_PASSWORDS, CONTEXT_WORDS } from '../../server/auth/common-passwords';
import { hashPassword } from '../../server/auth/passwords';
import { parseConfig } from '../../server/config';
import { createTestApp, type TestApp } from '../support/test-app';
import { countRows, makeUser, signedInAgent, square, TEST_PASSWORD } from '../support/factories';
import { CASES_TABLES, disease, insertCounts, makeReportingDistrict, weeksAgo } from '../support/cases-factories';
import { makeFlag } from '../support/flags-factories';
import { makeStation } from '../support/weather-factories';
import { linkToken, waitForMail } from '../support/mail';
import { OutboxWorker } from '../../server/outbox/outbox.worker';

/**
 * OWASP ASVS 5.0 level 2, the parts that apply (docs/security.md maps each requirement to its test).
 * Figures a reader needs (lock-out attempt and duration, list size, bcrypt cost) are printed with
 * the `[security]` prefix so the closing note can quote them.
 */
type Agent = Awaited<ReturnType<typeof signedInAgent>>;
const figure = (what: string, value: unknown) => console.log(`[security] ${what}: ${value}`);

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
});
afterAll(() => t.close());

const sessionCookieOf = (res: request.Response) =>
  ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => /broodcast_session=/.test(c)) ?? '';
const cookiePair = (setCookie: string) => setCookie.split(';')[0];
const signIn = (app: TestApp['app'], email: string, password = TEST_PASSWORD) =>
  request(app).post('/api/auth/sign-in').send({ email, password });

describe('access control: district scoping and object-level checks (ASVS V8.2.1, V8.2.2)', () => {
  let A: { id: string; code: string; name: string };
  let B: { id: string; code: string; name: string };
  let worker: Agent;
  let epi: Agent;
  let officer: Agent;
  let dengueId: string;
  let countB: string;
  let stationB: string;
  const SURVEY_PLACE = 'Bravo creek ward 7731';
  const B_CASES = 7731;

  /** A refusal that leaks nothing of district B. */
  const refusedWithoutB = (res: request.Response) => {
    expect([403, 404]).toContain(res.status);
    const text = JSON.stringify(res.body);
    for (const secret of [B.name, B.code, SURVEY_PLACE, String(B_CASES)]) expect(text).not.toContain(secret);
  };
  /** An answer that lists only what the caller may see: nothing of district B. */
  const listsNothingOfB = (res: request.Response) => {
    expect(res.status).toBe(200);
    const text = res.text;
    for (const secret of [B.id, B.name, B.code, SURVEY_PLACE]) expect(text).not.toContain(secret);
  };

  beforeAll(async () => {
    A = await makeReportingDistrict(t.ds);
    await t.ds.query('UPDATE districts SET boundary = $2, centroid_lat = 20.5, centroid_lon = 10.5 WHERE id = $1', [A.id, JSON.stringify(square(10, 20))]);
    B = await makeReportingDistrict(t.ds);
    await t.ds.query('UPDATE districts SET boundary = $2, centroid_lat = 40.5, centroid_lon = 30.5 WHERE id = $1', [B.id, JSON.stringify(square(30, 40))]);
    dengueId = (await disease(t.ds, 'DENV')).id;
    worker = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'worker', districtIds: [A.id] })).email);
    epi = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'epidemiologist', districtIds: [A.id] })).email);
    officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
    const w = weeksAgo(3);
    await insertCounts(t.ds, B.id, dengueId, [{ year: w.year, week: w.week, cases: B_CASES }]);
    countB = (await t.ds.query('SELECT id FROM case_counts WHERE district_id = $1', [B.id]))[0].id;
    // A has a station of its own, so B's station never feeds A's series (a district without one is
    // interpolated from the nearest stations, whose district names it then shows).
    await makeStation(t.ds, { latitude: 20.5, longitude: 10.5 });
    stationB = (await makeStation(t.ds, { latitude: 40.5, longitude: 30.5 })).id;
    const survey = await officer.post('/api/surveys').send({
      id: randomUUID(), districtId: B.id, locality: SURVEY_PLACE, date: '2026-03-10', housesInspected: 20, housesPositive: 3,
      containersInspected: 60, containersPositive: 4, pupae: 8, containerTypes: ['tyre'],
    });
    expect(survey.status).toBe(201);
    const supervisor = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'supervisor' })).email);
    const flag = await makeFlag(t.ds, { districtId: B.id });
    expect((await supervisor.post(`/api/flags/${flag.id}/approve`).send({ version: 1 })).status).toBe(200);
  });

  it('when a community worker of district A reads district B by id, then every route answers 403 or 404 and the body holds none of B', async () => {
    const reads = [
      `/api/districts/${B.id}`,
      `/api/districts/${B.id}/file`,
      `/api/districts/${B.id}/cases?diseaseId=${dengueId}`,
      `/api/districts/${B.id}/surveys`,
      `/api/weather/districts/${B.id}/series`,
      `/api/weather/stations/${stationB}/days`,
      `/api/advisories?districtId=${B.id}`,
      `/api/cases/counts/${countB}/revisions`,
      `/api/flags`,
      `/api/weather/uploads`,
      `/api/users`,
      `/api/bulletins/preview?districtId=${B.id}`,
    ];
    for (const url of reads) {
      const res = await worker.get(url);
      expect.soft(res.status, url).not.toBe(200);
      refusedWithoutB(res);
    }
    figure('worker reads of another district refused', `${reads.length}/${reads.length}`);
  });

  it('when a community worker of district A lists the Ladder, districts, boundaries, stations, counts and advisories, then nothing of district B comes back', async () => {
    for (const url of ['/api/board', '/api/districts', '/api/districts/boundaries', '/api/weather/stations',
      `/api/cases/grid?diseaseId=${dengueId}&scope=all`, '/api/advisories', '/api/subscriptions/me', '/api/me']) {
      listsNothingOfB(await worker.get(url));
    }
  });

  it('when a community worker of district A writes for district B, then it is refused and nothing is written', async () => {
    const before = await countRows(t.ds, ...CASES_TABLES, 'subscriptions');
    refusedWithoutB(await worker.post('/api/surveys').send({
      id: randomUUID(), districtId: B.id, locality: 'Not mine', date: '2026-03-10', housesInspected: 2, housesPositive: 1,
      containersInspected: 6, containersPositive: 1, pupae: 0, containerTypes: ['tyre'],
    }));
    refusedWithoutB(await worker.put('/api/subscriptions/me').send({ districts: [{ districtId: B.id, advisory: true, bulletin: true }] }));
    expect(await countRows(t.ds, ...CASES_TABLES, 'subscriptions')).toEqual(before);
  });

  it('when an epidemiologist assigned to district A changes or reads the history of district B, then every route answers 403 and nothing is written', async () => {
    const w = weeksAgo(2);
    const before = await countRows(t.ds, ...CASES_TABLES, 'flags');
    const writes = [
      await epi.put(`/api/districts/${B.id}/cases`).send({ diseaseId: dengueId, year: w.year, week: w.week, cases: 1, reason: 'not mine' }),
      await epi.post(`/api/districts/${B.id}/weeks/close`).send({ year: w.year, week: w.week }),
      await epi.put(`/api/districts/${B.id}/channel-settings`).send({ diseaseId: dengueId, excludedYears: [2024] }),
      await epi.get(`/api/cases/counts/${countB}/revisions`),
      await epi.post('/api/flags').send({ districtId: B.id, note: 'not my district' }),
    ];
    for (const res of writes) {
      expect(res.status).toBe(403);
      refusedWithoutB(res);
    }
    const csv = `district,year,week,disease,cases\n${B.code},${w.year},${w.week},DENV,40\n`;
    const upload = await epi.post('/api/cases/uploads').field('reason', 'not mine').attach('file', Buffer.from(csv), 'b.csv');
    expect(upload.status).toBe(422);
    expect(upload.body.report.problems[0]).toMatchObject({ column: 'district', reason: expect.stringMatching(/not one of your assigned/) });
    expect(await countRows(t.ds, ...CASES_TABLES, 'flags')).toEqual(before);
  });

  it('when objects are asked for by ids that do not exist, then the answer is 404 (flags, uploads, counts, users, districts), never another object', async () => {
    const admin = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'admin' })).email);
    const supervisor = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'supervisor' })).email);
    const id = randomUUID();
    expect((await supervisor.get(`/api/flags/${id}`)).status).toBe(404);
    expect((await supervisor.post(`/api/flags/${id}/approve`).send({ version: 1 })).status).toBe(404);
    expect((await admin.get(`/api/weather/uploads/${id}`)).status).toBe(404);
    expect((await admin.get(`/api/cases/counts/${id}/revisions`)).status).toBe(404);
    expect((await admin.patch(`/api/users/${id}`).send({ displayName: 'Nobody' })).status).toBe(404);
    expect((await admin.get(`/api/districts/${id}/file`)).status).toBe(404);
    expect((await supervisor.get(`/api/bulletins/preview?districtId=${id}`)).status).toBe(404);
  });

  it('when a survey id of district B is sent again for district A, then it is refused rather than showing B\'s survey', async () => {
    const [row] = await t.ds.query('SELECT id FROM larval_surveys WHERE district_id = $1', [B.id]);
    const own = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'worker', districtIds: [A.id] })).email);
    const res = await own.post('/api/surveys').send({
      id: row.id, districtId: A.id, locality: 'Mine', date: '2026-03-10', housesInspected: 2, housesPositive: 1,
      containersInspected: 6, containersPositive: 1, pupae: 0, containerTypes: ['tyre'],
    });
    expect(res.status).toBe(409);
    expect(res.text).not.toContain(SURVEY_PLACE);
  });
});

describe('sessions (ASVS V7, V3.3)', () => {
  it('when a user signs in, then the cookie is HttpOnly, SameSite=Strict, Path=/ and expires with the session lifetime', async () => {
    const user = await makeUser(t.ds, { role: 'officer' });
    const res = await signIn(t.app, user.email);
    const cookie = sessionCookieOf(res);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Strict/i);
    expect(cookie).toMatch(/Path=\//);
    const expires = Date.parse(/Expires=([^;]+)/i.exec(cookie)![1]);
    const hours = (expires - Date.now()) / 3_600_000;
    expect(hours).toBeGreaterThan(11.9);
    expect(hours).toBeLessThanOrEqual(12);
    figure('session lifetime (hours, SESSION_TTL_HOURS default)', Math.round(hours));
  });

  it('when cookies are Secure (behind TLS), then the session cookie is __Host- prefixed and Secure, and only that name is read', async () => {
    const secure = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000', COOKIE_SECURE: 'true' });
    try {
      const user = await makeUser(secure.ds, { role: 'officer' });
      const res = await signIn(secure.app, user.email);
      const cookie = sessionCookieOf(res);
      expect(cookie).toMatch(/^__Host-broodcast_session=/);
      expect(cookie).toMatch(/; Secure/i);
      expect(cookie).not.toMatch(/Domain=/i);
      const token = cookiePair(cookie).split('=')[1];
      expect((await request(secure.app).get('/api/me').set('Cookie', `__Host-broodcast_session=${token}`)).status).toBe(200);
      expect((await request(secure.app).get('/api/me').set('Cookie', `broodcast_session=${token}`)).status).toBe(401);
      const csp = String(res.headers['content-security-policy']);
      expect(csp).toMatch(/upgrade-insecure-requests/);
    } finally {
      await secure.close();
    }
  });

  it('when a session has expired (in the database or in the token), then its cookie is refused', async () => {
    const user = await makeUser(t.ds, { role: 'officer' });
    const cookie = cookiePair(sessionCookieOf(await signIn(t.app, user.email)));
    expect((await request(t.app).get('/api/me').set('Cookie', cookie)).status).toBe(200);
    await t.ds.query(`UPDATE sessions SET expires_at = now() - interval '1 second' WHERE user_id = $1`, [user.id]);
    expect((await request(t.app).get('/api/me').set('Cookie', cookie)).status).toBe(401);
    const jwt = (await import('jsonwebtoken')).default;
    const [session] = await t.ds.query(`INSERT INTO sessions (user_id, expires_at) VALUES ($1, now() + interval '1 hour') RETURNING id`, [user.id]);
    const stale = jwt.sign({ sid: session.id, exp: Math.floor(Date.now() / 1000) - 10 }, t.ctx.config.JWT_SECRET, { subject: user.id, issuer: 'broodcast' });
    expect((await request(t.app).get('/api/me').set('Cookie', `broodcast_session=${stale}`)).status).toBe(401);
  });

  it('when a user signs out, then the token used after sign-out is refused', async () => {
    const user = await makeUser(t.ds, { role: 'officer' });
    const cookie = cookiePair(sessionCookieOf(await signIn(t.app, user.email)));
    expect((await request(t.app).post('/api/auth/sign-out').set('Cookie', cookie)).status).toBe(204);
    expect((await request(t.app).get('/api/me').set('Cookie', cookie)).status).toBe(401);
    expect((await request(t.app).post('/api/flags').set('Cookie', cookie).send({})).status).toBe(401);
  });

  it('when a browser holding a session signs in again, then a new token is issued and the old one is refused', async () => {
    const user = await makeUser(t.ds, { role: 'officer' });
    const first = cookiePair(sessionCookieOf(await signIn(t.app, user.email)));
    const again = await request(t.app).post('/api/auth/sign-in').set('Cookie', first).send({ email: user.email, password: TEST_PASSWORD });
    const second = cookiePair(sessionCookieOf(again));
    expect(second).not.toBe(first);
    expect((await request(t.app).get('/api/me').set('Cookie', first)).status).toBe(401);
    expect((await request(t.app).get('/api/me').set('Cookie', second)).status).toBe(200);
  });

  it('when an admin changes a user\'s role, districts or deactivates them, then the old cookie is refused and never keeps the old privileges', async () => {
    const admin = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'admin' })).email);
    const d1 = await makeReportingDistrict(t.ds);
    const d2 = await makeReportingDistrict(t.ds);
    const epiUser = await makeUser(t.ds, { role: 'epidemiologist', districtIds: [d1.id] });

    // Districts changed: the old session ends; a new sign-in carries the new assignment.
    let cookie = cookiePair(sessionCookieOf(await signIn(t.app, epiUser.email)));
    expect((await admin.patch(`/api/users/${epiUser.id}`).send({ districtIds: [d2.id] })).status).toBe(200);
    expect((await request(t.app).get('/api/me').set('Cookie', cookie)).status).toBe(401);
    const me = await request(t.app).get('/api/me').set('Cookie', cookiePair(sessionCookieOf(await signIn(t.app, epiUser.email))));
    expect(me.body.districts.map((d: { id: string }) => d.id)).toEqual([d2.id]);

    // Role lowered: the old session ends; a new one has only the new role's rights.
    cookie = cookiePair(sessionCookieOf(await signIn(t.app, epiUser.email)));
    expect((await admin.patch(`/api/users/${epiUser.id}`).send({ role: 'worker' })).status).toBe(200);
    expect((await request(t.app).put(`/api/districts/${d2.id}/cases`).set('Cookie', cookie).send({})).status).toBe(401);
    const fresh = cookiePair(sessionCookieOf(await signIn(t.app, epiUser.email)));
    expect((await request(t.app).put(`/api/districts/${d2.id}/cases`).set('Cookie', fresh).send({})).status).toBe(403);

    // Deactivated: refused at once.
    expect((await admin.patch(`/api/users/${epiUser.id}`).send({ active: false })).status).toBe(200);
    expect((await request(t.app).get('/api/me').set('Cookie', fresh)).status).toBe(401);
  });
});

describe('cross-site request forgery (ASVS V3.5.1–V3.5.3)', () => {
  let officer: Agent;
  let user: { email: string };
  beforeAll(async () => {
    user = await makeUser(t.ds, { role: 'officer' });
    officer = await signedInAgent(t.app, user.email);
  });
  const station = () => ({ code: `X-${Math.random().toString(36).slice(2, 8).toUpperCase()}`, name: 'Forged station', latitude: 20.5, longitude: 10.5 });

  it('when a state-changing request comes from another site (Origin or Sec-Fetch-Site), then it is 403 csrf_rejected and nothing is written', async () => {
    const before = await countRows(t.ds, 'weather_stations', 'audit_events');
    const forged = [
      await officer.post('/api/weather/stations').set('Origin', 'https://elsewhere.example').send(station()),
      await officer.post('/api/weather/stations').set('Sec-Fetch-Site', 'cross-site').send(station()),
      await officer.post('/api/weather/stations').set('Sec-Fetch-Site', 'same-site').send(station()),
      await officer.post('/api/weather/stations').set('Origin', 'null').send(station()),
      await officer.put('/api/subscriptions/me').set('Origin', 'http://127.0.0.1:9999').send({ districts: [] }),
      await request(t.app).post('/api/auth/sign-in').set('Origin', 'https://elsewhere.example').send({ email: user.email, password: TEST_PASSWORD }),
    ];
    for (const res of forged) {
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe('csrf_rejected');
    }
    expect(await countRows(t.ds, 'weather_stations', 'audit_events')).toEqual(before);
    figure('cross-site unsafe requests refused', `${forged.length}/${forged.length}`);
  });

  it('when a multipart upload comes from another site, then it is refused before the file is read and no upload is recorded', async () => {
    const before = await countRows(t.ds, 'weather_uploads', 'case_counts');
    const weather = await officer.post('/api/weather/uploads').set('Sec-Fetch-Site', 'cross-site')
      .attach('file', Buffer.from('station,date,tmin,tmax\nA,2026-01-01,1,2\n'), 'w.csv');
    expect(weather.status).toBe(403);
    expect(weather.body.error.code).toBe('csrf_rejected');
    const epi = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'epidemiologist' })).email);
    const cases = await epi.post('/api/cases/uploads').set('Origin', 'https://elsewhere.example')
      .attach('file', Buffer.from('district,year,week,disease,cases\n'), 'c.csv');
    expect(cases.status).toBe(403);
    expect(await countRows(t.ds, 'weather_uploads', 'case_counts')).toEqual(before);
  });

  it('when the request is same-origin, typed by the user, or from a non-browser client, then it passes; reads from anywhere pass', async () => {
    const own = await officer.post('/api/weather/stations').set('Origin', t.ctx.config.APP_URL).set('Sec-Fetch-Site', 'same-origin').send(station());
    expect(own.status).toBe(201);
    const host = await officer.post('/api/weather/stations').set('Host', 'broodcast.internal:8443').set('Origin', 'http://broodcast.internal:8443').send(station());
    expect(host.status).toBe(201);
    expect((await officer.post('/api/weather/stations').send(station())).status).toBe(201);
    expect((await officer.get('/api/weather/stations').set('Sec-Fetch-Site', 'cross-site')).status).toBe(200);
  });
});

describe('passwords (ASVS V6.2, V11.4)', () => {
  it('when the server hashes a password with its default settings, then it is bcrypt with cost 12; production refuses a lower cost', async () => {
    const cost = parseConfig({ DATABASE_URL: 'postgres://u:p@127.0.0.1:1/db', JWT_SECRET: 'x'.repeat(40) }).BCRYPT_COST;
    const started = performance.now();
    const hash = await hashPassword('a-long-enough-secret', cost);
    const ms = Math.round(performance.now() - started);
    expect(hash).toMatch(/^\$2[aby]\$12\$/);
    expect(bcrypt.getRounds(hash)).toBeGreaterThanOrEqual(12);
    figure('bcrypt cost (default) and one hash on this machine', `${cost}, ${ms} ms`);
    expect(() => parseConfig({
      NODE_ENV: 'production', COOKIE_SECURE: 'true', BCRYPT_COST: '10', DATABASE_URL: 'postgres://u:p@127.0.0.1:1/db', JWT_SECRET: 'x'.repeat(40),
    })).toThrow(/BCRYPT_COST/);
  });

  it('when the shipped list of common passwords is counted, then it holds at least 3,000 that meet the length rule, and the service words are listed', () => {
    const policy = [...COMMON_PASSWORDS].filter((p) => p.length >= 10);
    expect(policy.length).toBeGreaterThanOrEqual(3000);
    expect(CONTEXT_WORDS).toEqual(expect.arrayContaining(['broodcast', 'halvern', 'mosquito', 'dengue', 'malaria']));
    figure('common passwords shipped (10+ characters)', policy.length);
  });

  it('when a new password is short, common, only a service word, or built on the e-mail name, then it is 400 naming password and the link stays usable; 64 characters with spaces and accents are accepted', async () => {
    const user = await makeUser(t.ds, { role: 'officer', email: `fieldlead${Date.now()}@test.example` });
    await request(t.app).post('/api/auth/password-reset').send({ email: user.email });
    await new OutboxWorker(t.ctx).drain(); // the reset mail goes through the outbox
    const token = linkToken(await waitForMail(user.email))!;
    const refused = ['short-1', 'password123', 'Qwertyuiop1', 'Football2024', 'Broodcast2026!', 'mosquito-123456', `${user.email.split('@')[0]}-x`];
    for (const password of refused) {
      const res = await request(t.app).post('/api/auth/password-reset/confirm').send({ token, password });
      expect(res.status, password).toBe(400);
      expect(res.body.error.fields[0].path).toBe('password');
    }
    const long = 'un mot de passe très long, avec des espaces — et rien à deviner 42'.slice(0, 64);
    expect(long.length).toBe(64);
    expect((await request(t.app).post('/api/auth/password-reset/confirm').send({ token, password: long })).status).toBe(204);
    // Checked exactly as typed: another letter case is another password.
    expect((await signIn(t.app, user.email, long)).status).toBe(200);
    expect((await signIn(t.app, user.email, long.toUpperCase())).status).toBe(401);
  });
});

describe('lock-out after repeated failures (ASVS V6.3.1)', () => {
  it('when one account gets wrong passwords, then from the 11th attempt sign-in is refused with 429 for the rest of the 15-minute window, even with the right password', async () => {
    const app = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' }); // account limit and window at their defaults
    try {
      const user = await makeUser(app.ds, { role: 'officer' });
      const statuses: number[] = [];
      for (let i = 0; i < 10; i++) statuses.push((await signIn(app.app, user.email, 'wrong-password-x')).status);
      expect(statuses).toEqual(Array(10).fill(401));
      const locked = await signIn(app.app, user.email);
      expect(locked.status).toBe(429);
      expect(locked.body.error.code).toBe('too_many_attempts');
      const retryAfter = Number(locked.headers['retry-after']);
      expect(retryAfter).toBeGreaterThan(14 * 60);
      expect(retryAfter).toBeLessThanOrEqual(15 * 60);
      // Another account from the same address is not locked out by this one.
      expect((await signIn(app.app, (await makeUser(app.ds, { role: 'officer' })).email)).status).toBe(200);
      figure('sign-in refused from attempt', `${statuses.length + 1} (limit ${app.ctx.config.SIGN_IN_LIMIT_PER_ACCOUNT} failures per account)`);
      figure('refused for (Retry-After, seconds)', `${retryAfter} (window ${app.ctx.config.SIGN_IN_WINDOW_MINUTES} min)`);
    } finally {
      await app.close();
    }
  });

  it('when a user signs in successfully many times, then the successes never lock them out', async () => {
    const app = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000', SIGN_IN_LIMIT_PER_ACCOUNT: '3' });
    try {
      const user = await makeUser(app.ds, { role: 'officer' });
      for (let i = 0; i < 6; i++) expect((await signIn(app.app, user.email)).status).toBe(200);
    } finally {
      await app.close();
    }
  });

  it('when one address tries many accounts, then from the 51st attempt it gets 429; password-reset requests for one account stop after 10', async () => {
    const app = await createTestApp(); // every limit at its default
    try {
      const statuses: number[] = [];
      for (let i = 0; i < 51; i++) statuses.push((await signIn(app.app, `nobody-${i}@test.example`, 'whatever-1234')).status);
      expect(statuses.slice(0, 50).every((s) => s === 401)).toBe(true);
      expect(statuses[50]).toBe(429);
      figure('address lock-out from attempt', `51 (limit ${app.ctx.config.SIGN_IN_LIMIT_PER_ADDRESS} per ${app.ctx.config.SIGN_IN_WINDOW_MINUTES} min)`);
      const resets: number[] = [];
      for (let i = 0; i < 11; i++) resets.push((await request(app.app).post('/api/auth/password-reset').send({ email: 'someone@test.example' })).status);
      expect(resets.slice(0, 10)).toEqual(Array(10).fill(202));
      expect(resets[10]).toBe(429);
    } finally {
      await app.close();
    }
  });
});

describe('headers (ASVS V3.4)', () => {
  it('when the app answers a page or the API, then the policy allows only its own scripts, styles and fonts, and the other headers are set', async () => {
    for (const url of ['/', '/api/health', '/api/nothing-here']) {
      const res = await request(t.app).get(url).set('Accept', url === '/' ? 'text/html' : 'application/json');
      const csp = String(res.headers['content-security-policy']);
      const directive = (name: string) => csp.split(';').map((d) => d.trim()).find((d) => d.startsWith(`${name} `));
      expect(directive('default-src')).toBe("default-src 'self'");
      expect(directive('script-src')).toBe("script-src 'self'");
      expect(directive('style-src')).toBe("style-src 'self'");
      expect(directive('font-src')).toBe("font-src 'self'");
      expect(directive('object-src')).toBe("object-src 'none'");
      expect(directive('base-uri')).toBe("base-uri 'none'");
      expect(directive('frame-ancestors')).toBe("frame-ancestors 'none'");
      expect(csp).not.toMatch(/unsafe-inline|unsafe-eval|\*/);
      expect(res.headers['x-content-type-options']).toBe('nosniff');
      expect(res.headers['referrer-policy']).toBe('no-referrer');
      expect(res.headers['strict-transport-security']).toMatch(/max-age=(\d{8,}|3153[6-9]\d{3}).*includeSubDomains/);
      expect(res.headers['x-powered-by']).toBeUndefined();
    }
    const res = await request(t.app).get('/api/health');
    expect(res.headers['cache-control']).toBe('no-store');
    figure('Content-Security-Policy', res.headers['content-security-policy']);
  });
});

describe('uploads (ASVS V5.2, V5.3)', () => {
  let dir: string;
  let app: TestApp;
  let officer: Agent;
  let epi: Agent;
  beforeAll(async () => {
    dir = mkdtempSync(path.join(os.tmpdir(), 'broodcast-sec-'));
    mkdirSync(path.join(dir, 'a', 'uploads'), { recursive: true });
    app = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000', WEATHER_UPLOAD_DIR: path.join(dir, 'a', 'uploads') });
    officer = await signedInAgent(app.app, (await makeUser(app.ds, { role: 'officer' })).email);
    epi = await signedInAgent(app.app, (await makeUser(app.ds, { role: 'epidemiologist' })).email);
  });
  afterAll(async () => {
    await app.close();
    rmSync(dir, { recursive: true, force: true });
  });

  it('when a file is named ../../x.csv or ..\\x.csv, then it reaches the disk only under a generated name inside the upload folder', async () => {
    const seen: string[] = [];
    const watchers = [dir, path.join(dir, 'a'), path.join(dir, 'a', 'uploads')].map((d) =>
      watch(d, (_event, name) => seen.push(path.join(d, String(name)))));
    try {
      for (const name of ['../../x.csv', '..\\x.csv', '/etc/cron.d/x.csv']) {
        const res = await officer.post('/api/weather/uploads?wait=true').attach('file', Buffer.from('station,date,tmin,tmax\nNOPE,2026-01-01,1,2\n'), name);
        expect(res.status, name).toBe(201);
      }
      await new Promise((r) => setTimeout(r, 100));
    } finally {
      for (const w of watchers) w.close();
    }
    const uploads = path.join(dir, 'a', 'uploads');
    expect(seen.length).toBeGreaterThan(0);
    for (const p of seen) {
      expect(path.dirname(p)).toBe(uploads);
      expect(path.basename(p)).toMatch(/^[0-9a-f-]{36}\.upload$/);
    }
    expect(existsSync(path.join(dir, 'x.csv'))).toBe(false);
    expect(existsSync(path.join(dir, 'a', 'x.csv'))).toBe(false);
    expect(readdirSync(dir).sort()).toEqual(['a']);
  });

  it('when a file is over the size limit, then the answer is 413 naming the limit and nothing is recorded', async () => {
    const small = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000', WEATHER_UPLOAD_MAX_BYTES: '200', WEATHER_UPLOAD_DIR: path.join(dir, 'a', 'uploads') });
    try {
      const agent = await signedInAgent(small.app, (await makeUser(small.ds, { role: 'admin' })).email);
      const before = await countRows(small.ds, 'weather_uploads');
      const weather = await agent.post('/api/weather/uploads').attach('file', Buffer.from('station,date,tmin,tmax\n' + 'A,2026-01-01,1,2\n'.repeat(50)), 'w.csv');
      expect(weather.status).toBe(413);
      expect(weather.body.error).toMatchObject({ code: 'file_too_large', message: 'The file is larger than the limit of 200 bytes.' });
      expect(weather.body.error.fields).toEqual([{ path: 'file', message: 'is larger than the limit of 200 bytes' }]);
      expect(await countRows(small.ds, 'weather_uploads')).toEqual(before);
    } finally {
      await small.close();
    }
    const cases = await epi.post('/api/cases/uploads').attach('file', Buffer.alloc(2 * 1024 * 1024 + 1, 'a'), 'big.csv');
    expect(cases.status).toBe(413);
    expect(cases.body.error.message).toBe('The file is larger than the limit of 2 MB.');
    const admin = await signedInAgent(app.app, (await makeUser(app.ds, { role: 'admin' })).email);
    const json = await admin.post('/api/districts').send({ code: 'BIG-1', name: 'x'.repeat(1_100_000) });
    expect(json.status).toBe(413);
    expect(json.body.error.message).toBe('The body is larger than the limit of 1 MB.');
    figure('upload limits', 'weather WEATHER_UPLOAD_MAX_BYTES (default 200 MB), cases 2 MB, JSON 1 MB (boundaries 10 MB)');
  });

  it('when a file is not CSV by name, declared type or content, then the answer is 415 naming the field and nothing is recorded', async () => {
    const before = await countRows(app.ds, 'weather_uploads', 'case_counts', 'audit_events');
    const png = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]);
    const tries = [
      await officer.post('/api/weather/uploads').attach('file', Buffer.from('station,date\n'), '../../etc/passwd'),
      await officer.post('/api/weather/uploads').attach('file', Buffer.from('station,date\n'), 'sheet.xlsx'),
      await officer.post('/api/weather/uploads').attach('file', Buffer.from('station,date\n'), { filename: 'w.csv', contentType: 'image/png' }),
      await epi.post('/api/cases/uploads').attach('file', png, 'cases.csv'),
      await epi.post('/api/cases/uploads').attach('file', Buffer.from([0x50, 0x4b, 0x03, 0x04, 1, 2, 3]), 'cases.csv'),
      await epi.post('/api/cases/uploads').attach('file', Buffer.from('district,year\n'), '..\\cases.exe'),
    ];
    for (const res of tries) {
      expect(res.status).toBe(415);
      expect(res.body.error.code).toBe('unsupported_file_type');
      expect(res.body.error.fields[0].path).toBe('file');
    }
    expect(await countRows(app.ds, 'weather_uploads', 'case_counts', 'audit_events')).toEqual(before);
  });

  it('when the intake report is downloaded as CSV, then cells starting with = + - @ tab or CR are neutralised', async () => {
    const evil = ['=cmd|calc', '+1+1', '-2-2', '@SUM(A1)', '\tTAB', '\rCR'];
    const body = 'station,date,tmin,tmax\n' + evil.map((s) => `"${s}",2026-01-01,1,2`).join('\n') + '\n';
    const res = await officer.post('/api/weather/uploads?wait=true').attach('file', Buffer.from(body), 'evil.csv');
    expect(res.status).toBe(201);
    const file = await officer.get(`/api/weather/uploads/${res.body.id}/issues?format=csv`);
    expect(file.status).toBe(200);
    expect(file.headers['content-disposition']).toMatch(/^attachment; filename="intake-report-[0-9a-f]{8}\.csv"$/);
    const cells = file.text.split('\n').slice(1).filter(Boolean).map((line) => line.split(',')[1]);
    expect(cells.length).toBeGreaterThanOrEqual(evil.length);
    for (const cell of cells) expect(cell.replace(/^"/, '')).not.toMatch(/^[=+\-@\t\r]/);
  });
});
