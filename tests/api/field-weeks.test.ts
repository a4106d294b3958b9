import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { OutboxWorker } from '../../server/outbox/outbox.worker';
import { createTestApp, type TestApp } from '../support/test-app';
import { countRows, makeDistrict, makeUser, signedInAgent } from '../support/factories';
import { makeDrivers, makeTier } from '../support/flags-factories';
import { waitForMail } from '../support/mail';

type Agent = Awaited<ReturnType<typeof signedInAgent>>;

const MONDAY = '2026-12-07';
let t: TestApp;
let officer: Agent;
let supervisor: Agent;
let workerAgent: Agent;
let worker: { id: string; email: string };
let member2: { id: string; email: string };
const d: Record<'A' | 'B' | 'C' | 'D', { id: string; name: string }> = {} as never;
const team: Record<'T1' | 'T2', string> = {} as never;

/** A district with a tier of week 48, its score and leading driver as a season run would store them. */
async function tiered(key: keyof typeof d, tier: string, score: number, driver: string, lat = 20.5) {
  d[key] = await makeDistrict(t.ds, { name: `District ${key}`, centroidLat: lat });
  await makeTier(t.ds, { districtId: d[key].id, epiWeek: 48, tier, drivers: makeDrivers({ [driver]: score }) });
  await t.ds.query(`UPDATE district_tiers SET leading_driver = $2 WHERE district_id = $1`, [d[key].id, driver]);
}

beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
  // The hand-solvable case of tests/unit/field-week-proposal.test.ts, through the API.
  await tiered('A', 'high', 0.8, 'cases');
  await tiered('B', 'high', 0.7, 'larval');
  await tiered('C', 'raised', 0.6, 'larval', 30.5); // about 1,100 km north: beyond the limit
  await tiered('D', 'baseline', 0.1, 'climate');
  officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
  supervisor = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'supervisor' })).email);
  worker = await makeUser(t.ds, { role: 'worker', districtIds: [d.B.id] });
  await t.ds.query(`UPDATE users SET language = 'fr' WHERE id = $1`, [worker.id]);
  workerAgent = await signedInAgent(t.app, worker.email);
  member2 = await makeUser(t.ds, { role: 'officer' });
  team.T1 = (await officer.post('/api/field-teams').send({ name: 'One', baseDistrictId: d.A.id, memberIds: [worker.id], kinds: ['larviciding', 'case-investigation'], daysPerWeek: 2 })).body.id;
  team.T2 = (await officer.post('/api/field-teams').send({ name: 'Two', baseDistrictId: d.A.id, memberIds: [member2.id], kinds: ['case-investigation'], daysPerWeek: 2 })).body.id;
});
afterAll(() => t.close());

const rows = () => countRows(t.ds, 'field_weeks', 'field_week_days', 'audit_events', 'outbox_messages');

describe('Field week', () => {
  let weekId: string;

  it('when the officer asks for a proposal, then the solver sends each team where it covers most risk, says why each district is in or out, and beats the Ladder order', async () => {
    const res = await officer.post('/api/field-weeks/proposal').send({ weekStart: MONDAY, maxTravelKm: 100 });
    expect(res.status).toBe(200);
    weekId = res.body.id;
    expect(res.body).toMatchObject({ weekStart: MONDAY, status: 'draft', edited: false, maxTravelKm: 100, visitWeight: 1, ladderWeek: { year: 2026, week: 48 } });
    expect(res.body.workingDays).toEqual(['2026-12-07', '2026-12-08', '2026-12-09', '2026-12-10', '2026-12-11']);
    expect(res.body.days).toEqual(expect.arrayContaining([
      { teamId: team.T1, districtId: d.B.id, day: '2026-12-07' }, { teamId: team.T1, districtId: d.B.id, day: '2026-12-08' },
      { teamId: team.T2, districtId: d.A.id, day: '2026-12-07' }, { teamId: team.T2, districtId: d.A.id, day: '2026-12-08' },
    ]));
    expect(res.body.days).toHaveLength(4);
    const why = Object.fromEntries(res.body.districts.map((x: { districtId: string; reason: unknown }) => [x.districtId, x.reason]));
    expect(why[d.A.id]).toEqual({ code: 'planned', params: { days: 2, teams: ['Two'] } });
    expect(why[d.C.id]).toMatchObject({ code: 'out_of_reach', params: { limitKm: 100 } });
    expect(why[d.D.id]).toEqual({ code: 'not_needed', params: { tier: 'baseline' } });
    // Risk = score × population (100,000 each): 0.8 and 0.7 covered; the Ladder order covers A only.
    expect(res.body.coveredRisk).toBeCloseTo(150_000, 3);
    expect(res.body.ladderOrderRisk).toBeCloseTo(80_000, 3);
  });

  it('when a team member looks before it is published, then there is no week for them; the supervisor sees the draft', async () => {
    expect((await workerAgent.get(`/api/field-weeks?weekStart=${MONDAY}`)).body).toEqual({ week: null });
    expect((await supervisor.get(`/api/field-weeks?weekStart=${MONDAY}`)).body.week.id).toBe(weekId);
  });

  it('when the officer edits the days with a day outside the week, an unknown team or more days than a team has, then nothing is written and each field is named', async () => {
    const before = await rows();
    const bad = [
      { teamId: team.T1, districtId: d.B.id, day: '2026-12-12' },
      { teamId: randomUUID(), districtId: d.B.id, day: '2026-12-07' },
      { teamId: team.T2, districtId: randomUUID(), day: '2026-12-07' },
      { teamId: team.T2, districtId: d.A.id, day: '2026-12-08' },
      { teamId: team.T2, districtId: d.A.id, day: '2026-12-09' },
    ];
    const res = await officer.put(`/api/field-weeks/${weekId}/days`).send({ days: bad });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_plan');
    expect(res.body.error.fields.map((f: { path: string }) => f.path)).toEqual(['days.0.day', 'days.1.teamId', 'days.2.districtId', 'days.4.teamId']);
    const twice = await officer.put(`/api/field-weeks/${weekId}/days`).send({ days: [bad[3], bad[3]] });
    expect(twice.status).toBe(400);
    expect(twice.body.error.fields[0].path).toBe('days');
    expect(await rows()).toEqual(before);
  });

  it('when the officer picks another district for a day, then the edit is kept and marked edited', async () => {
    const days = [
      { teamId: team.T1, districtId: d.B.id, day: '2026-12-07' },
      { teamId: team.T1, districtId: d.A.id, day: '2026-12-09' },
      { teamId: team.T2, districtId: d.A.id, day: '2026-12-07' },
    ];
    const res = await officer.put(`/api/field-weeks/${weekId}/days`).send({ days });
    expect(res.status).toBe(200);
    expect(res.body.edited).toBe(true);
    expect(res.body.days).toEqual(expect.arrayContaining(days));
    expect(res.body.days).toHaveLength(3);
  });

  it('when the officer publishes, then each team member gets their days by mail in their language, and sees only their own team', async () => {
    const res = await officer.post(`/api/field-weeks/${weekId}/publish`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'published', mailed: 2 });
    await new OutboxWorker(t.ctx).drain();
    const fr = await waitForMail(worker.email);
    expect(fr.subject).toContain('Semaine de terrain');
    expect(fr.text).toContain('District B');
    expect(fr.text).toContain('District A'); // the day the officer added
    expect(fr.text).toContain('traitement larvicide'); // the work B needs, in French
    expect(fr.text).toContain('personnel formé'); // the caution: products by trained staff only
    const en = await waitForMail(member2.email);
    expect(en.subject).toBe('Field week from 7 Dec 2026: your days');
    expect(en.text).toContain('District A');
    expect(en.text).not.toContain('District B');

    const seen = (await workerAgent.get(`/api/field-weeks?weekStart=${MONDAY}`)).body.week;
    expect(seen.teams.map((x: { id: string }) => x.id)).toEqual([team.T1]);
    expect(seen.days.every((x: { teamId: string }) => x.teamId === team.T1)).toBe(true);
  });

  it('when a published week is proposed again, edited or published again, then it is refused and nothing changes', async () => {
    const before = await rows();
    expect((await officer.post('/api/field-weeks/proposal').send({ weekStart: MONDAY })).status).toBe(409);
    expect((await officer.put(`/api/field-weeks/${weekId}/days`).send({ days: [] })).status).toBe(409);
    expect((await officer.post(`/api/field-weeks/${weekId}/publish`)).body.error.code).toBe('week_published');
    expect(await rows()).toEqual(before);
  });

  it('when a proposal names a week start that is not a Monday, then it is refused naming the field', async () => {
    const res = await officer.post('/api/field-weeks/proposal').send({ weekStart: '2026-12-08' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields[0].path).toBe('weekStart');
  });
});
