import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../support/test-app';
import { ALL_TABLES, countRows, makeDistrict, makeUser, signedInAgent, TEST_PASSWORD } from '../support/factories';
import { linkToken, waitForMail } from '../support/mail';
import { OutboxWorker } from '../../server/outbox/outbox.worker';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ACCOUNT: '5', SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
});
afterAll(() => t.close());

describe('sign-in', () => {
  it('when the e-mail and password are right, then the answer is 200 with the user and an httpOnly SameSite cookie', async () => {
    const district = await makeDistrict(t.ds);
    const user = await makeUser(t.ds, { role: 'epidemiologist', districtIds: [district.id] });
    const res = await request(t.app).post('/api/auth/sign-in').send({ email: user.email.toUpperCase(), password: TEST_PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ email: user.email, role: 'epidemiologist', districts: [{ id: district.id }] });
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/broodcast_session=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Strict/i);
    expect(cookie).toMatch(/Expires=/i);
  });

  it('when the password is wrong or the account unknown, then both get the same 401 that names neither part', async () => {
    const user = await makeUser(t.ds, { role: 'officer' });
    const wrong = await request(t.app).post('/api/auth/sign-in').send({ email: user.email, password: 'not-the-password' });
    const unknown = await request(t.app).post('/api/auth/sign-in').send({ email: 'nobody@test.example', password: 'whatever-1234' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
    expect(wrong.body.error.message).toBe('The e-mail or password is not right.');
  });

  it('when a deactivated user or one who never accepted the invite signs in, then the answer is 401', async () => {
    const off = await makeUser(t.ds, { role: 'officer', active: false });
    const pending = await makeUser(t.ds, { role: 'officer', password: null });
    for (const email of [off.email, pending.email]) {
      const res = await request(t.app).post('/api/auth/sign-in').send({ email, password: TEST_PASSWORD });
      expect(res.status).toBe(401);
    }
  });

  it('when one account is tried too often, then further attempts get 429 even with the right password', async () => {
    const user = await makeUser(t.ds, { role: 'officer' });
    for (let i = 0; i < 5; i++) await request(t.app).post('/api/auth/sign-in').send({ email: user.email, password: 'wrong-password' });
    const res = await request(t.app).post('/api/auth/sign-in').send({ email: user.email, password: TEST_PASSWORD });
    expect(res.status).toBe(429);
    expect(res.body.error.code).toBe('too_many_attempts');
    // Messages are data: what was limited and the wait come as parameters for the client to word.
    expect(res.body.error.params).toEqual({ what: 'sign-in', retryAfterMinutes: expect.any(Number) });
    expect(res.body.error.params.retryAfterMinutes).toBeGreaterThanOrEqual(1);
    expect(Number(res.headers['retry-after'])).toBeLessThanOrEqual(res.body.error.params.retryAfterMinutes * 60);
  });

  it('when the body has an unknown field or a bad e-mail, then the answer is 400 naming the field', async () => {
    const res = await request(t.app).post('/api/auth/sign-in').send({ email: 'not-an-email', password: 'x', remember: true });
    expect(res.status).toBe(400);
    const paths = res.body.error.fields.map((f: { path: string }) => f.path);
    expect(paths).toEqual(expect.arrayContaining(['email', 'remember']));
  });
});

describe('session', () => {
  it('when signed in, then GET /api/me answers the user; without a session it answers 401', async () => {
    const user = await makeUser(t.ds, { role: 'supervisor' });
    const agent = await signedInAgent(t.app, user.email);
    const me = await agent.get('/api/me');
    expect(me.status).toBe(200);
    expect(me.body).toMatchObject({ email: user.email, role: 'supervisor', districts: [] });
    expect((await request(t.app).get('/api/me')).status).toBe(401);
  });

  it('when a user signs out, then the same token is refused afterwards', async () => {
    const user = await makeUser(t.ds, { role: 'officer' });
    const res = await request(t.app).post('/api/auth/sign-in').send({ email: user.email, password: TEST_PASSWORD });
    const cookie = String(res.headers['set-cookie']).split(';')[0];
    expect((await request(t.app).get('/api/me').set('Cookie', cookie)).status).toBe(200);
    expect((await request(t.app).post('/api/auth/sign-out').set('Cookie', cookie)).status).toBe(204);
    expect((await request(t.app).get('/api/me').set('Cookie', cookie)).status).toBe(401);
  });

  it('when a token is signed with another secret, then it is refused', async () => {
    const jwt = await import('jsonwebtoken');
    const forged = jwt.default.sign({ sid: crypto.randomUUID() }, 'another-secret-another-secret-another', { subject: crypto.randomUUID(), issuer: 'broodcast' });
    expect((await request(t.app).get('/api/me').set('Cookie', `broodcast_session=${forged}`)).status).toBe(401);
  });
});

describe('password reset and invitations', () => {
  it('when a user asks for a reset, then a one-time link is mailed, sets the new password once and ends old sessions', async () => {
    const user = await makeUser(t.ds, { role: 'officer', email: `reset-${Date.now()}@test.example` });
    const oldAgent = await signedInAgent(t.app, user.email);
    const ask = await request(t.app).post('/api/auth/password-reset').send({ email: user.email });
    expect(ask.status).toBe(202);
    await new OutboxWorker(t.ctx).drain(); // the reset mail goes through the outbox
    const mail = await waitForMail(user.email);
    expect(mail.subject).toBe('Broodcast: set a new password');
    const token = linkToken(mail)!;
    expect(token).toBeTruthy();
    const confirm = await request(t.app).post('/api/auth/password-reset/confirm').send({ token, password: 'a-brand-new-secret' });
    expect(confirm.status).toBe(204);
    expect((await oldAgent.get('/api/me')).status).toBe(401);
    await signedInAgent(t.app, user.email, 'a-brand-new-secret');
    const again = await request(t.app).post('/api/auth/password-reset/confirm').send({ token, password: 'another-new-secret' });
    expect(again.status).toBe(400);
    expect(again.body.error.code).toBe('token_invalid');
  });

  it('when a reset is asked for an unknown e-mail, then the answer is the same 202 and nothing is written', async () => {
    const before = await countRows(t.ds, ...ALL_TABLES, 'outbox_messages');
    const res = await request(t.app).post('/api/auth/password-reset').send({ email: 'nobody-here@test.example' });
    expect(res.status).toBe(202);
    expect(await countRows(t.ds, ...ALL_TABLES, 'outbox_messages')).toEqual(before);
  });

  it('when the new password is too short or common, then the answer is 400 naming password and the token stays usable', async () => {
    const user = await makeUser(t.ds, { role: 'officer', email: `weak-${Date.now()}@test.example` });
    await request(t.app).post('/api/auth/password-reset').send({ email: user.email });
    await new OutboxWorker(t.ctx).drain();
    const token = linkToken(await waitForMail(user.email))!;
    const short = await request(t.app).post('/api/auth/password-reset/confirm').send({ token, password: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields[0].path).toBe('password');
    const common = await request(t.app).post('/api/auth/password-reset/confirm').send({ token, password: 'password123' });
    expect(common.status).toBe(400);
    expect(common.body.error.fields[0].path).toBe('password');
    expect((await request(t.app).post('/api/auth/password-reset/confirm').send({ token, password: 'a-good-long-one' })).status).toBe(204);
  });

  it('when an admin invites a user, then the invite link lets them choose a password and sign in', async () => {
    const admin = await makeUser(t.ds, { role: 'admin' });
    const agent = await signedInAgent(t.app, admin.email);
    const district = await makeDistrict(t.ds);
    const email = `invited-${Date.now()}@test.example`;
    const res = await agent.post('/api/users').send({ email, displayName: 'New Worker', role: 'worker', districtIds: [district.id] });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ email, role: 'worker', invitePending: true, districts: [{ id: district.id }] });
    // The invitation goes through the outbox (written with the account), not from inside the request.
    const [queued] = await t.ds.query(`SELECT kind, status FROM outbox_messages WHERE to_address = $1`, [email]);
    expect(queued).toEqual({ kind: 'invite', status: 'pending' });
    await new OutboxWorker(t.ctx).drain();
    const mail = await waitForMail(email);
    expect(mail.subject).toBe('Broodcast: your invitation');
    expect(mail.text).toMatch(/\/invite\/accept\?token=[A-Za-z0-9_-]+&lang=en/);
    const accept = await request(t.app).post('/api/auth/invite/accept').send({ token: linkToken(mail), password: 'my-field-password' });
    expect(accept.status).toBe(204);
    const worker = await signedInAgent(t.app, email, 'my-field-password');
    expect((await worker.get('/api/me')).body.districts).toEqual([{ id: district.id, code: district.code, name: district.name }]);
  });
});
