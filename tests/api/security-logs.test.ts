import { Writable } from 'node:stream';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import type { AppContext } from '../../server/app-context';
import { createDataSource } from '../../server/db/data-source';
import { createLogger } from '../../server/logger';
import { createMailer } from '../../server/mail/mailer';
import { testConfig } from '../support/test-app';
import { makeUser, signedInAgent, TEST_PASSWORD } from '../support/factories';
import { disease, makeReportingDistrict, weeksAgo } from '../support/cases-factories';
import { makeStation } from '../support/weather-factories';
import { linkToken, waitForMail } from '../support/mail';
import { OutboxWorker } from '../../server/outbox/outbox.worker';

/**
 * Logs (OWASP ASVS 5.0 V16.2.5, V16.3.1–V16.3.3): a run of sign-ins, a password reset, uploads and a
 * case entry at the most verbose level, captured from pino, then searched for every secret and
 * personal figure involved. None may appear; the security events must.
 */
const lines: string[] = [];
const sink = new Writable({
  write(chunk, _enc, done) {
    lines.push(...String(chunk).split('\n').filter(Boolean));
    done();
  },
});

let ctx: AppContext;
let app: ReturnType<typeof createApp>;
beforeAll(async () => {
  const config = testConfig({ LOG_LEVEL: 'trace', SIGN_IN_LIMIT_PER_ADDRESS: '1000', SIGN_IN_LIMIT_PER_ACCOUNT: '3' });
  const ds = createDataSource(config.DATABASE_URL, 5);
  await ds.initialize();
  ctx = { config, ds, mailer: createMailer(config), logger: createLogger(config, sink) };
  app = createApp(ctx);
});
afterAll(async () => {
  ctx.mailer.close();
  await ctx.ds.destroy();
});

describe('logs', () => {
  it('when sign-ins, a password reset, uploads and a case entry run at trace level, then the log holds no password, token, cookie, e-mail address or case figure, and does hold the security events', async () => {
    const stamp = Date.now();
    const district = await makeReportingDistrict(ctx.ds);
    const officerUser = await makeUser(ctx.ds, { role: 'officer', email: `log-officer-${stamp}@test.example` });
    const epiUser = await makeUser(ctx.ds, { role: 'epidemiologist', districtIds: [district.id], email: `log-epi-${stamp}@test.example` });
    const wrongPassword = `Wrong-Horse-${stamp}`;
    const newPassword = `New-Battery-Staple-${stamp}`;
    const secrets: string[] = [TEST_PASSWORD, wrongPassword, newPassword, officerUser.email, epiUser.email];

    // Sign-in: wrong, right (its cookie value is a secret), and a locked-out account.
    expect((await request(app).post('/api/auth/sign-in').send({ email: officerUser.email, password: wrongPassword })).status).toBe(401);
    expect((await request(app).post('/api/auth/sign-in').send({ email: `nobody-${stamp}@test.example`, password: wrongPassword })).status).toBe(401);
    secrets.push(`nobody-${stamp}@test.example`);
    const signIn = await request(app).post('/api/auth/sign-in').send({ email: officerUser.email, password: TEST_PASSWORD });
    expect(signIn.status).toBe(200);
    const cookie = String(signIn.headers['set-cookie']).split(';')[0];
    secrets.push(cookie.split('=')[1]);
    const victim = await makeUser(ctx.ds, { role: 'worker', email: `log-victim-${stamp}@test.example` });
    secrets.push(victim.email);
    for (let i = 0; i < 4; i++) await request(app).post('/api/auth/sign-in').send({ email: victim.email, password: wrongPassword });

    // Password reset: the link's token and the new password are secrets.
    expect((await request(app).post('/api/auth/password-reset').send({ email: officerUser.email })).status).toBe(202);
    await new OutboxWorker(ctx).drain(); // the reset mail goes through the outbox
    const token = linkToken(await waitForMail(officerUser.email))!;
    secrets.push(token);
    expect((await request(app).post('/api/auth/password-reset/confirm').send({ token, password: newPassword })).status).toBe(204);
    const officer = await signedInAgent(app, officerUser.email, newPassword);

    // A weather upload and a case upload and a case entry: the figures are personal health data.
    const station = await makeStation(ctx.ds, { latitude: 20.5, longitude: 10.5 });
    const weather = await officer.post('/api/weather/uploads?wait=true')
      .attach('file', Buffer.from(`station,date,tmin,tmax\n${station.code},2026-01-01,11.5,23.25\n`), 'log.csv');
    expect(weather.status).toBe(201);
    const epi = await signedInAgent(app, epiUser.email);
    const dengueId = (await disease(ctx.ds, 'DENV')).id;
    const w = weeksAgo(2);
    const v = weeksAgo(3);
    const upload = await epi.post('/api/cases/uploads')
      .attach('file', Buffer.from(`district,year,week,disease,cases\n${district.code},${v.year},${v.week},DENV,6421\n`), 'cases.csv');
    expect(upload.status).toBe(200);
    const entry = await epi.put(`/api/districts/${district.id}/cases`).send({ diseaseId: dengueId, year: w.year, week: w.week, cases: 5839 });
    expect(entry.status).toBe(200);
    const figures = ['6421', '5839'];

    // Refusals that must be logged as security events (and still without secrets).
    expect((await epi.get('/api/users')).status).toBe(403);
    expect((await officer.post('/api/weather/stations').set('Origin', 'https://elsewhere.example').send({})).status).toBe(403);
    expect((await request(app).post('/api/auth/sign-out').set('Cookie', cookie)).status).toBe(204);
    expect((await request(app).get('/api/me').set('Cookie', cookie)).status).toBe(401);

    await new Promise((r) => setTimeout(r, 50));
    const log = lines.join('\n');
    expect(lines.length).toBeGreaterThan(20);
    for (const line of lines) expect(() => JSON.parse(line)).not.toThrow();
    for (const secret of secrets) expect(log, `the log holds ${secret.slice(0, 12)}…`).not.toContain(secret);
    for (const n of figures) expect(log).not.toMatch(new RegExp(`(?<![0-9.])${n}(?![0-9])`));
    expect(log).not.toMatch(/eyJ[A-Za-z0-9_-]+\.eyJ/);
    expect(log).not.toMatch(/[A-Za-z0-9._%+-]+@[A-Za-z0-9.-]+\.[A-Za-z]{2,}/);

    const events = lines.map((l) => JSON.parse(l).event).filter(Boolean);
    for (const e of ['auth.sign-in', 'auth.sign-in-failed', 'auth.locked-out', 'auth.password-reset-requested', 'auth.password-reset', 'auth.sign-out', 'access.denied', 'csrf.rejected'])
      expect(events, e).toContain(e);
    const signedIn = lines.map((l) => JSON.parse(l)).find((l) => l.event === 'auth.sign-in');
    expect(signedIn).toMatchObject({ user: officerUser.id, role: 'officer', time: expect.any(Number), level: 30 });
    console.log(`[security] log lines captured: ${lines.length}; secrets searched: ${secrets.length + figures.length}; found: 0`);
  });

  it('when an error carries SQL parameters, a database detail, an e-mail or a token in its text, then the logged line holds none of them', () => {
    const captured: string[] = [];
    const logger = createLogger({ LOG_LEVEL: 'info' }, { write: (s: string) => void captured.push(s) });
    const err = Object.assign(new Error('duplicate key value violates unique constraint "users_email_key" for ann@clinic.example'), {
      query: 'INSERT INTO users (email, password_hash) VALUES ($1, $2)',
      parameters: ['ann@clinic.example', '$2b$12$abcdefghijklmnopqrstuv'],
      detail: 'Key (email)=(ann@clinic.example) already exists.',
      driverError: Object.assign(new Error('pg'), { detail: 'Key (email)=(ann@clinic.example) already exists.' }),
    });
    logger.error({ err, link: 'http://127.0.0.1:5180/reset-password?token=abcDEF123456789xyz', headers: { cookie: 'broodcast_session=eyJhbGciOi.eyJzaWQiOi.sig' } },
      'failed for ann@clinic.example with broodcast_session=eyJhbGciOiJIUzI1NiJ9.eyJzaWQiOiIxIn0.c2ln');
    const text = captured.join('');
    expect(text).toContain('users_email_key');
    for (const s of ['ann@clinic.example', '$2b$12$', 'abcDEF123456789xyz', 'eyJhbGciOi']) expect(text).not.toContain(s);
    expect(text).toContain('[email]');
  });
});
