import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../support/test-app';
import { ALL_TABLES, countRows, makeDistrict, makeUser, randomId, signedInAgent } from '../support/factories';

let t: TestApp;
let admin: Awaited<ReturnType<typeof signedInAgent>>;
let adminId: string;
beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
  const user = await makeUser(t.ds, { role: 'admin' });
  adminId = user.id;
  admin = await signedInAgent(t.app, user.email);
});
afterAll(() => t.close());

describe('users admin', () => {
  it('when an admin lists users, then each comes with role, status and districts', async () => {
    const district = await makeDistrict(t.ds);
    const epi = await makeUser(t.ds, { role: 'epidemiologist', districtIds: [district.id] });
    const res = await admin.get('/api/users');
    expect(res.status).toBe(200);
    expect(res.body.users.find((u: { id: string }) => u.id === epi.id)).toMatchObject({
      role: 'epidemiologist', active: true, invitePending: false, districts: [{ id: district.id, code: district.code }],
    });
  });

  it('when an invite names an unknown district, a taken e-mail or a bad role, then it is refused with the field and nothing is written', async () => {
    const existing = await makeUser(t.ds, { role: 'officer' });
    const before = await countRows(t.ds, ...ALL_TABLES);
    const unknownDistrict = await admin.post('/api/users').send({ email: 'a@test.example', displayName: 'A', role: 'worker', districtIds: [randomId()] });
    expect(unknownDistrict.status).toBe(400);
    expect(unknownDistrict.body.error.fields).toEqual([{ path: 'districtIds', message: expect.any(String) }]);
    const taken = await admin.post('/api/users').send({ email: existing.email, displayName: 'B', role: 'officer' });
    expect(taken.status).toBe(409);
    const badRole = await admin.post('/api/users').send({ email: 'c@test.example', displayName: 'C', role: 'mayor' });
    expect(badRole.status).toBe(400);
    expect(badRole.body.error.fields[0].path).toBe('role');
    expect(await countRows(t.ds, ...ALL_TABLES)).toEqual(before);
  });

  it('when an admin changes a role, then the change is audited and the user must sign in again', async () => {
    const officer = await makeUser(t.ds, { role: 'officer' });
    const agent = await signedInAgent(t.app, officer.email);
    const res = await admin.patch(`/api/users/${officer.id}`).send({ role: 'supervisor' });
    expect(res.status).toBe(200);
    expect(res.body.role).toBe('supervisor');
    expect((await agent.get('/api/me')).status).toBe(401);
    const audit = await t.ds.query(`SELECT before, after FROM audit_events WHERE entity = 'user' AND entity_id = $1 AND action = 'user.updated'`, [officer.id]);
    expect(audit[0].before.role).toBe('officer');
    expect(audit[0].after.role).toBe('supervisor');
  });

  it('when an admin deactivates a user, then that user can no longer sign in', async () => {
    const worker = await makeUser(t.ds, { role: 'worker' });
    expect((await admin.patch(`/api/users/${worker.id}`).send({ active: false })).body.active).toBe(false);
    const res = await (await import('supertest')).default(t.app).post('/api/auth/sign-in').send({ email: worker.email, password: 'a-test-password-42' });
    expect(res.status).toBe(401);
  });

  it('when an admin tries to demote themselves, then the answer is 400 and nothing changes', async () => {
    const before = await countRows(t.ds, ...ALL_TABLES);
    const res = await admin.patch(`/api/users/${adminId}`).send({ role: 'officer' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields[0].path).toBe('role');
    expect(await countRows(t.ds, ...ALL_TABLES)).toEqual(before);
  });

  it('when the user id is not a UUID or unknown, then the answer is 400 or 404', async () => {
    expect((await admin.patch('/api/users/42').send({ role: 'officer' })).body.error.fields[0].path).toBe('id');
    expect((await admin.patch(`/api/users/${randomId()}`).send({ role: 'officer' })).status).toBe(404);
  });
});
