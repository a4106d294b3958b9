import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { OutboxWorker } from '../../server/outbox/outbox.worker';
import { createTestApp, type TestApp } from '../support/test-app';
import { countRows, makeDistrict, makeUser, signedInAgent } from '../support/factories';
import { makeDrivers, makeTier } from '../support/flags-factories';
import { mailsTo, waitForMail } from '../support/mail';

type Agent = Awaited<ReturnType<typeof signedInAgent>>;

// Two Mondays: one with approval off, one with approval on.
const FIRST = '2026-12-14';
const SECOND = '2026-12-21';
let t: TestApp;
let admin: Agent;
let officer: Agent;
let supervisor: Agent;
let workerAgent: Agent;
let worker: { id: string; email: string };
let base: { id: string };
let teamId: string;

beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
  base = await makeDistrict(t.ds, { name: 'Approval district' });
  await makeTier(t.ds, { districtId: base.id, epiWeek: 48, tier: 'high', drivers: makeDrivers({ larval: 0.8 }) });
  await t.ds.query(`UPDATE district_tiers SET leading_driver = 'larval' WHERE district_id = $1`, [base.id]);
  admin = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'admin' })).email);
  officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
  supervisor = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'supervisor' })).email);
  worker = await makeUser(t.ds, { role: 'worker', districtIds: [base.id] });
  workerAgent = await signedInAgent(t.app, worker.email);
  teamId = (await officer.post('/api/field-teams').send({ name: 'Approval team', baseDistrictId: base.id, memberIds: [worker.id], kinds: ['larviciding'], daysPerWeek: 2 })).body.id;
});
afterAll(() => t.close());

const rows = () => countRows(t.ds, 'field_settings', 'field_weeks', 'field_week_days', 'audit_events', 'outbox_messages');

describe('Field week approval setting', () => {
  it('when nobody has set it, then approval is off and publishing mails the members at once', async () => {
    expect((await admin.get('/api/field-settings')).body).toEqual({ approvalRequired: false, updatedAt: null, updatedBy: null });
    const week = (await officer.post('/api/field-weeks/proposal').send({ weekStart: FIRST })).body;
    const res = await officer.post(`/api/field-weeks/${week.id}/publish`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'published', mailed: 1, submittedAt: null, review: null });
  });

  it('when the admin sends a setting without a reason or with a word for true, then nothing is written and the field is named', async () => {
    const before = await rows();
    const noReason = await admin.put('/api/field-settings').send({ approvalRequired: true });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.fields.map((f: { path: string }) => f.path)).toEqual(['reason']);
    const word = await admin.put('/api/field-settings').send({ approvalRequired: 'yes', reason: 'Region rule' });
    expect(word.status).toBe(400);
    expect(word.body.error.fields[0].path).toBe('approvalRequired');
    expect(await rows()).toEqual(before);
  });

  it('when the admin turns approval on, then the setting says who changed it and the change is audited with its reason', async () => {
    const res = await admin.put('/api/field-settings').send({ approvalRequired: true, reason: 'The region asks for a second look' });
    expect(res.status).toBe(200);
    expect(res.body.approvalRequired).toBe(true);
    expect(res.body.updatedBy.displayName).toBeTruthy();
    const [audit] = await t.ds.query(`SELECT before, after, reason FROM audit_events WHERE action = 'field-settings.updated'`);
    expect(audit).toMatchObject({ before: { approvalRequired: false }, after: { approvalRequired: true }, reason: 'The region asks for a second look' });
  });

  let weekId: string;
  it('when approval is on and the officer publishes, then the week waits in the supervisors\' queue and nobody is mailed', async () => {
    weekId = (await officer.post('/api/field-weeks/proposal').send({ weekStart: SECOND })).body.id;
    const mailsBefore = (await countRows(t.ds, 'outbox_messages')).outbox_messages;
    const res = await officer.post(`/api/field-weeks/${weekId}/publish`);
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('awaiting_approval');
    expect(res.body.submittedAt).toBeTruthy();
    expect(res.body.mailed).toBeUndefined();
    expect((await countRows(t.ds, 'outbox_messages')).outbox_messages).toBe(mailsBefore);
    const queue = (await supervisor.get('/api/field-weeks/awaiting')).body.weeks;
    expect(queue).toEqual([expect.objectContaining({ id: weekId, weekStart: SECOND, days: 2, teams: 1 })]);
    // The member does not see a week that is not published; the officer cannot change it meanwhile.
    expect((await workerAgent.get(`/api/field-weeks?weekStart=${SECOND}`)).body).toEqual({ week: null });
    const before = await rows();
    expect((await officer.put(`/api/field-weeks/${weekId}/days`).send({ days: [] })).body.error.code).toBe('week_awaiting_approval');
    expect((await officer.post('/api/field-weeks/proposal').send({ weekStart: SECOND })).body.error.code).toBe('week_awaiting_approval');
    expect((await officer.post(`/api/field-weeks/${weekId}/publish`)).body.error.code).toBe('week_awaiting_approval');
    expect(await rows()).toEqual(before);
  });

  it('when the supervisor sends it back without a reason, then nothing changes; with one, the officer has a draft and reads the reason', async () => {
    const before = await rows();
    const bare = await supervisor.post(`/api/field-weeks/${weekId}/send-back`).send({ reason: ' ' });
    expect(bare.status).toBe(400);
    expect(bare.body.error.fields[0].path).toBe('reason');
    expect(await rows()).toEqual(before);

    const res = await supervisor.post(`/api/field-weeks/${weekId}/send-back`).send({ reason: 'Team needs a rest day on Friday' });
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('draft');
    const seen = (await officer.get(`/api/field-weeks?weekStart=${SECOND}`)).body.week;
    expect(seen.review).toMatchObject({ decision: 'sent_back', reason: 'Team needs a rest day on Friday' });
    expect((await supervisor.get('/api/field-weeks/awaiting')).body.weeks).toEqual([]);
    expect((await supervisor.post(`/api/field-weeks/${weekId}/approve`)).body.error.code).toBe('week_not_awaiting');
    const [audit] = await t.ds.query(`SELECT reason FROM audit_events WHERE action = 'field-week.sent-back' AND entity_id = $1`, [weekId]);
    expect(audit.reason).toBe('Team needs a rest day on Friday');
  });

  it('when the officer publishes again and the supervisor approves, then the week is published and the member is mailed and sees it', async () => {
    expect((await officer.post(`/api/field-weeks/${weekId}/publish`)).body.status).toBe('awaiting_approval');
    const res = await supervisor.post(`/api/field-weeks/${weekId}/approve`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'published', mailed: 1, review: { decision: 'approved', reason: null } });
    await new OutboxWorker(t.ctx).drain();
    await waitForMail(worker.email);
    expect((await mailsTo(worker.email)).some((m) => m.subject.includes('21 Dec 2026'))).toBe(true);
    const seen = (await workerAgent.get(`/api/field-weeks?weekStart=${SECOND}`)).body.week;
    expect(seen.status).toBe('published');
    expect(seen.days.length).toBe(2);
    expect((await supervisor.post(`/api/field-weeks/${weekId}/approve`)).status).toBe(409);
  });

  it('when the officer retires a team, then it stays listed as retired and is left out of the next proposal', async () => {
    const res = await officer.post(`/api/field-teams/${teamId}/retire`);
    expect(res.status).toBe(200);
    expect(res.body.retiredAt).toBeTruthy();
    const again = await officer.post(`/api/field-teams/${teamId}/retire`);
    expect(again.body.retiredAt).toBe(res.body.retiredAt);
    expect((await officer.get('/api/field-teams')).body.teams.find((x: { id: string }) => x.id === teamId).retiredAt).toBeTruthy();
    const next = (await officer.post('/api/field-weeks/proposal').send({ weekStart: '2026-12-28' })).body;
    expect(next.days).toEqual([]);
    // The published week still names the team.
    expect((await officer.get(`/api/field-weeks?weekStart=${SECOND}`)).body.week.teams.map((x: { id: string }) => x.id)).toContain(teamId);
    expect((await officer.post(`/api/field-teams/00000000-0000-4000-8000-000000000000/retire`)).status).toBe(404);
  });
});
