import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SeasonRunService, runSeasonNow } from '../../server/season/season-run.service';
import { SeasonRepository } from '../../server/season/season.repository';
import { createTestApp, type TestApp } from '../support/test-app';
import { countRows, makeDistrict, makeUser, signedInAgent } from '../support/factories';
import { CASES_TABLES, disease, weeksAgo } from '../support/cases-factories';
import { makeSeasonDistrict } from '../support/season-factories';

type Agent = Awaited<ReturnType<typeof signedInAgent>>;

/** Issue 14, "void, never delete": an entry made in error is voided with a reason, stays readable, and counts nowhere. */
let t: TestApp;
let district: { id: string; name: string };
let other: { id: string };
const AS_OF = '2026-11-30';

beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
  district = await makeSeasonDistrict(t.ds, { to: AS_OF });
  await t.ds.query(`INSERT INTO case_district_settings (district_id, active_from) VALUES ($1, '2015-01-01')`, [district.id]);
  other = await makeDistrict(t.ds);
});
afterAll(() => t.close());

const rows = () => countRows(t.ds, ...CASES_TABLES);
const agent = async (role: string, districtIds: string[] = []) => signedInAgent(t.app, (await makeUser(t.ds, { role: role as never, districtIds })).email);
const larvalInputs = async () => {
  const [tier] = await t.ds.query(`SELECT drivers FROM district_tiers WHERE district_id = $1 ORDER BY epi_year DESC, epi_week DESC LIMIT 1`, [district.id]);
  return tier.drivers.find((d: { id: string }) => d.id === 'larval').detail;
};
const fingerprint = async () => (await t.ds.query(`SELECT fingerprint FROM district_run_state WHERE district_id = $1`, [district.id]))[0]?.fingerprint;

describe('voiding a larval survey', () => {
  let worker: Agent;
  let surveyId: string;

  beforeAll(async () => {
    worker = await agent('worker', [district.id]);
    surveyId = randomUUID();
    const res = await worker.post('/api/surveys').send({
      id: surveyId, districtId: district.id, locality: 'Harbour ward', date: '2026-11-25', housesInspected: 100, housesPositive: 40,
      containersInspected: 300, containersPositive: 90, pupae: 50, containerTypes: ['tyre'],
    });
    expect(res.status).toBe(201);
    await runSeasonNow(t.ctx, { asOf: AS_OF });
  });

  it('when the reason is missing or blank, then the answer is 400 naming reason and nothing is written', async () => {
    const before = await rows();
    for (const body of [{}, { reason: '   ' }]) {
      const res = await worker.post(`/api/surveys/${surveyId}/void`).send(body);
      expect(res.status).toBe(400);
      expect(res.body.error.fields.map((f: { path: string }) => f.path)).toContain('reason');
    }
    expect(await rows()).toEqual(before);
  });

  it('when a role that does not enter surveys, or a worker of another district, voids it, then it is refused and nothing is written', async () => {
    const before = await rows();
    expect((await (await agent('epidemiologist', [district.id])).post(`/api/surveys/${surveyId}/void`).send({ reason: 'x' })).status).toBe(403);
    expect((await (await agent('worker', [other.id])).post(`/api/surveys/${surveyId}/void`).send({ reason: 'x' })).status).toBe(403);
    expect(await rows()).toEqual(before);
  });

  it('when the worker voids it with a reason, then it stays listed with the reason, counts in no index or tier, the audit keeps it, and the season run recomputes the district', async () => {
    expect((await larvalInputs()).breteau).toBe(90);
    const printBefore = await fingerprint();
    const before = await rows();
    const res = await worker.post(`/api/surveys/${surveyId}/void`).send({ reason: 'Entered for the wrong ward' });
    expect(res.status).toBe(200);
    expect(res.body.voided).toMatchObject({ reason: 'Entered for the wrong ward' });
    expect(await rows()).toEqual({ ...before, audit_events: before.audit_events + 1 }); // no row deleted
    const [audit] = await t.ds.query(`SELECT action, reason, before FROM audit_events WHERE entity_id = $1 AND action = 'larval-survey.voided'`, [surveyId]);
    expect(audit).toMatchObject({ reason: 'Entered for the wrong ward', before: { housesInspected: 100 } });

    const list = await worker.get(`/api/districts/${district.id}/surveys`);
    expect(list.body.surveys.find((s: { id: string }) => s.id === surveyId).voided.reason).toBe('Entered for the wrong ward');
    expect(list.body.weeks).toEqual([]);
    const admin = await agent('admin');
    const file = await admin.get(`/api/districts/${district.id}/file`);
    expect(file.status).toBe(200);
    expect(file.body.larval).toEqual([]); // the week's only survey was voided

    const run = (await new SeasonRunService(t.ctx).runLocked({ kind: 'nightly', asOf: AS_OF }))!;
    expect(run.districtsDone).toBeGreaterThanOrEqual(1);
    expect(await fingerprint()).not.toBe(printBefore);
    expect((await larvalInputs()).breteau).toBeNull();
    expect((await worker.post(`/api/surveys/${surveyId}/void`).send({ reason: 'again' })).status).toBe(409);
  });
});

describe('voiding a weekly case count', () => {
  let epi: Agent;
  let dengueId: string;
  let countId: string;
  const week = weeksAgo(3);

  beforeAll(async () => {
    epi = await agent('epidemiologist', [district.id]);
    dengueId = (await disease(t.ds)).id;
    const res = await epi.put(`/api/districts/${district.id}/cases`).send({ diseaseId: dengueId, year: week.year, week: week.week, cases: 37 });
    expect(res.status).toBe(200);
    countId = res.body.count.id;
  });

  it('when the reason is missing, then 400 names reason; when an officer or an epidemiologist of another district voids, then 403; nothing is written', async () => {
    const before = await rows();
    const res = await epi.post(`/api/cases/counts/${countId}/void`).send({});
    expect(res.status).toBe(400);
    expect(res.body.error.fields.map((f: { path: string }) => f.path)).toContain('reason');
    expect((await (await agent('officer')).post(`/api/cases/counts/${countId}/void`).send({ reason: 'x' })).status).toBe(403);
    expect((await (await agent('epidemiologist', [other.id])).post(`/api/cases/counts/${countId}/void`).send({ reason: 'x' })).status).toBe(403);
    expect(await rows()).toEqual(before);
  });

  it('when the epidemiologist voids it, then the history shows the void with its reason, the grid marks it, and it counts in no signal, District file or season input', async () => {
    const before = await rows();
    const res = await epi.post(`/api/cases/counts/${countId}/void`).send({ reason: 'Duplicate of the hospital report' });
    expect(res.status).toBe(200);
    expect(res.body.count).toMatchObject({ cases: 37, version: 2, voided: { reason: 'Duplicate of the hospital report' } });
    expect(await rows()).toEqual({ ...before, case_count_revisions: before.case_count_revisions + 1, audit_events: before.audit_events + 1 });

    const history = await epi.get(`/api/cases/counts/${countId}/revisions`);
    expect(history.body.revisions.map((r: { kind: string }) => r.kind)).toEqual(['entry', 'void']);
    expect(history.body.revisions[1]).toMatchObject({ reason: 'Duplicate of the hospital report', old: { cases: 37 }, new: { cases: 37 } });

    const grid = await epi.get(`/api/cases/grid?diseaseId=${dengueId}`);
    const cell = grid.body.rows.find((r: { district: { id: string } }) => r.district.id === district.id).cells
      .find((c: { year: number; week: number }) => c.year === week.year && c.week === week.week);
    expect(cell.count.voided.reason).toBe('Duplicate of the hospital report');

    const signals = await epi.get(`/api/districts/${district.id}/cases?diseaseId=${dengueId}&year=${week.year}`);
    const w = signals.body.weeks.find((x: { week: number }) => x.week === week.week);
    expect(w).toMatchObject({ cases: null, voided: true, countId });
    const seasonCases = await new SeasonRepository(t.ds).cases([district.id], week.year);
    expect(seasonCases).toEqual([]);
    const file = await (await agent('admin')).get(`/api/districts/${district.id}/file?season=${week.year}`);
    expect(JSON.stringify(file.body.cases)).not.toContain('37');
  });

  it('when the week is entered again after the void, then the count counts again and the history shows entry, void, correction', async () => {
    const res = await epi.put(`/api/districts/${district.id}/cases`).send({ diseaseId: dengueId, year: week.year, week: week.week, cases: 12 });
    expect(res.status).toBe(200);
    expect(res.body.count.voided).toBeNull();
    const history = await epi.get(`/api/cases/counts/${countId}/revisions`);
    expect(history.body.revisions.map((r: { kind: string }) => r.kind)).toEqual(['entry', 'void', 'correction']);
    expect(await new SeasonRepository(t.ds).cases([district.id], week.year)).toMatchObject([{ cases: 12 }]);
  });
});
