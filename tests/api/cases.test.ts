import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { createTestApp, type TestApp } from '../support/test-app';
import { countRows, makeUser, signedInAgent } from '../support/factories';
import { CASES_TABLES, disease, insertCounts, makeReportingDistrict, weeksAgo } from '../support/cases-factories';
import { signalsResponse } from '../../shared/api/cases.schema';

type Agent = Awaited<ReturnType<typeof signedInAgent>>;

/*
 * A fixed clock, so no test depends on today's week (weeksAgo(6) in January would fall in the previous
 * year, a Sunday would move the reporting deadline): Wednesday 17 June 2026, in MMWR week 24 (14–20 June).
 * Only Date is faked (timers stay real); agents sign in on the real clock first, as sessions are checked
 * against the database's own time, and every request then runs on the fixed one.
 */
const FIXED_NOW = new Date('2026-06-17T10:00:00Z');
const onFixedClock = () => vi.useFakeTimers({ toFake: ['Date'], now: FIXED_NOW });
/** Signs a new user in on the real clock, then goes back to the fixed one. */
async function signIn(email: string): Promise<Agent> {
  vi.useRealTimers();
  try {
    return await signedInAgent(t.app, email);
  } finally {
    onFixedClock();
  }
}

let t: TestApp;
let own: { id: string; code: string };
let other: { id: string; code: string };
let dengueId: string;
let epi: Agent;
let epiId: string;
let otherEpi: Agent;
let supervisor: Agent;
let admin: Agent;
let officer: Agent;

beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
  own = await makeReportingDistrict(t.ds);
  other = await makeReportingDistrict(t.ds);
  dengueId = (await disease(t.ds, 'DENV')).id;
  const epiUser = await makeUser(t.ds, { role: 'epidemiologist', districtIds: [own.id] });
  epiId = epiUser.id;
  epi = await signedInAgent(t.app, epiUser.email);
  otherEpi = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'epidemiologist', districtIds: [other.id] })).email);
  supervisor = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'supervisor' })).email);
  admin = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'admin' })).email);
  officer = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'officer' })).email);
  onFixedClock();
});
afterAll(async () => {
  vi.useRealTimers();
  await t.close();
});

const rows = () => countRows(t.ds, ...CASES_TABLES);
const put = (agent: Agent, districtId: string, body: Record<string, unknown>) =>
  agent.put(`/api/districts/${districtId}/cases`).send({ diseaseId: dengueId, ...body });
const paths = (res: { body: { error: { fields?: { path: string }[] } } }) => (res.body.error.fields ?? []).map((f) => f.path);

describe('entering and correcting weekly counts', () => {
  it('when an epidemiologist enters a count for an assigned district, then it is stored with its entry revision and an audit event', async () => {
    const w = weeksAgo(0);
    const res = await put(epi, own.id, { year: w.year, week: w.week, cases: 12, confirmed: 4, probable: 6, ageBands: { '0-4': 2, '15-44': 7 } });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ outcome: 'created', closed: false, count: { cases: 12, confirmed: 4, probable: 6, version: 1, late: false } });
    const history = await epi.get(`/api/cases/counts/${res.body.count.id}/revisions`);
    expect(history.body.revisions).toMatchObject([{ version: 1, kind: 'entry', old: null, new: { cases: 12 }, actor: { id: epiId } }]);
    const audit = await t.ds.query(`SELECT action, after FROM audit_events WHERE entity = 'case_count' AND entity_id = $1`, [res.body.count.id]);
    expect(audit).toMatchObject([{ action: 'case-count.entered', after: { cases: 12 } }]);
  });

  it('when a recorded count is sent with another number and no reason, then it is refused naming reason; with a reason it is corrected and the old value stays readable', async () => {
    const w = weeksAgo(1);
    const first = await put(epi, own.id, { year: w.year, week: w.week, cases: 5 });
    const before = await rows();
    const silent = await put(epi, own.id, { year: w.year, week: w.week, cases: 8 });
    expect(silent.status).toBe(400);
    expect(paths(silent)).toEqual(['reason']);
    expect(await rows()).toEqual(before);

    const same = await put(epi, own.id, { year: w.year, week: w.week, cases: 5 });
    expect(same.body.outcome).toBe('unchanged');
    expect(await rows()).toEqual(before);

    const fixed = await put(epi, own.id, { year: w.year, week: w.week, cases: 8, reason: 'Three reports from the district hospital arrived late' });
    expect(fixed.body).toMatchObject({ outcome: 'corrected', count: { id: first.body.count.id, cases: 8, version: 2 } });
    const history = await supervisor.get(`/api/cases/counts/${first.body.count.id}/revisions`);
    expect(history.body.revisions.map((r: { kind: string }) => r.kind)).toEqual(['entry', 'correction']);
    expect(history.body.revisions[1]).toMatchObject({ old: { cases: 5 }, new: { cases: 8 }, reason: 'Three reports from the district hospital arrived late' });
    const audit = await t.ds.query(`SELECT before, after, reason FROM audit_events WHERE action = 'case-count.corrected' AND entity_id = $1`, [first.body.count.id]);
    expect(audit[0]).toMatchObject({ before: { cases: 5 }, after: { cases: 8 }, reason: expect.stringMatching(/late/) });
  });

  it('when a count is negative, fractional, in week 54, in week 53 of a 52-week year, in the future or before the district reported, then each is refused naming the field and nothing is written', async () => {
    const late = await makeReportingDistrict(t.ds, '2026-06-01');
    const epi2 = await signIn((await makeUser(t.ds, { role: 'epidemiologist', districtIds: [own.id, late.id] })).email);
    const w = weeksAgo(2);
    const next = weeksAgo(0);
    const before = await rows();
    const cases = [
      [{ year: w.year, week: w.week, cases: -1 }, 'cases'],
      [{ year: w.year, week: w.week, cases: 2.5 }, 'cases'],
      [{ year: w.year, week: 54, cases: 1 }, 'week'],
      // 2026 has 52 Sunday-start weeks: week 1 begins 2026-01-04 and week 1 of 2027 on 2027-01-03 (CHECK-VALUES.md rule).
      [{ year: 2026, week: 53, cases: 1 }, 'week'],
      [{ year: next.year + 1, week: 1, cases: 1 }, 'week'],
      [{ year: w.year, week: w.week, cases: 5, confirmed: 4, probable: 3 }, 'confirmed'],
    ] as const;
    for (const [body, field] of cases) {
      const res = await put(epi, own.id, body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(paths(res)).toContain(field);
    }
    const early = await put(epi2, late.id, { year: 2026, week: 10, cases: 3 });
    expect(early.status).toBe(400);
    expect(early.body.error.message).toMatch(/started reporting/);
    expect(await rows()).toEqual(before);
  });

  it('when an epidemiologist changes, uploads, closes or reads the history of another district, then every route answers 403 and nothing is written', async () => {
    const w = weeksAgo(3);
    const theirs = await put(otherEpi, other.id, { year: w.year, week: w.week, cases: 4 });
    expect(theirs.status).toBe(200);
    const before = await rows();
    expect((await put(epi, other.id, { year: w.year, week: w.week, cases: 40, reason: 'not mine' })).status).toBe(403);
    expect((await epi.post(`/api/districts/${other.id}/weeks/close`).send({ year: w.year, week: w.week })).status).toBe(403);
    expect((await epi.put(`/api/districts/${other.id}/channel-settings`).send({ diseaseId: dengueId, excludedYears: [2024] })).status).toBe(403);
    expect((await epi.get(`/api/cases/counts/${theirs.body.count.id}/revisions`)).status).toBe(403);
    const csv = `district,year,week,disease,cases\n${other.code},${w.year},${w.week},DENV,40\n`;
    const upload = await epi.post('/api/cases/uploads').field('reason', 'not mine').attach('file', Buffer.from(csv), 'other.csv');
    expect(upload.status).toBe(422);
    expect(upload.body.report.problems[0]).toMatchObject({ row: 2, column: 'district', value: other.code });
    expect(await rows()).toEqual(before);
    // The aggregate count stays readable to everybody signed in; the line-level history to admin and supervisor.
    expect((await officer.get(`/api/districts/${other.id}/cases?diseaseId=${dengueId}`)).status).toBe(200);
    expect((await admin.get(`/api/cases/counts/${theirs.body.count.id}/revisions`)).status).toBe(200);
  });

  it('when a community worker reads weekly counts, then only their own district comes back and another is refused', async () => {
    const worker = await signIn((await makeUser(t.ds, { role: 'worker', districtIds: [own.id] })).email);
    const grid = await worker.get(`/api/cases/grid?diseaseId=${dengueId}`);
    expect(grid.status).toBe(200);
    expect(grid.body.rows.map((r: { district: { id: string } }) => r.district.id)).toEqual([own.id]);
    expect((await worker.get(`/api/districts/${other.id}/cases?diseaseId=${dengueId}`)).status).toBe(403);
    const all = await officer.get(`/api/cases/grid?diseaseId=${dengueId}&scope=all`);
    expect(all.body.rows.map((r: { district: { id: string } }) => r.district.id)).toEqual(expect.arrayContaining([own.id, other.id]));
    expect(all.body.rows.every((r: { editable: boolean }) => !r.editable)).toBe(true);
  });
});

describe('closing weeks, late reports and completeness', () => {
  it('when a week is closed, then a new count needs a reason and is marked late, and a correction needs a reason too', async () => {
    const w = weeksAgo(4);
    const closed = await epi.post(`/api/districts/${own.id}/weeks/close`).send({ year: w.year, week: w.week });
    expect(closed.status).toBe(200);
    expect(closed.body.alreadyClosed).toBe(false);
    const again = await supervisor.post(`/api/districts/${own.id}/weeks/close`).send({ year: w.year, week: w.week });
    expect(again.body.alreadyClosed).toBe(true);
    const before = await rows();
    const noReason = await put(epi, own.id, { year: w.year, week: w.week, cases: 3 });
    expect(noReason.status).toBe(400);
    expect(paths(noReason)).toEqual(['reason']);
    expect(await rows()).toEqual(before);
    const late = await put(epi, own.id, { year: w.year, week: w.week, cases: 3, reason: 'Clinic register found after closing' });
    expect(late.body).toMatchObject({ outcome: 'created', closed: true, count: { late: true } });
    expect((await put(epi, own.id, { year: w.year, week: w.week, cases: 4 })).status).toBe(400);
  });

  it('when a closed week is reopened with a reason, then the lock goes, the counts stay, and the audit keeps who closed it and why it was reopened', async () => {
    const w = weeksAgo(5);
    await put(epi, own.id, { year: w.year, week: w.week, cases: 7 });
    expect((await supervisor.post(`/api/districts/${own.id}/weeks/close`).send({ year: w.year, week: w.week })).status).toBe(200);
    // No reason: refused, naming the field, nothing written.
    const before = await rows();
    const noReason = await epi.post(`/api/districts/${own.id}/weeks/reopen`).send({ year: w.year, week: w.week });
    expect(noReason.status).toBe(400);
    expect(paths(noReason)).toEqual(['reason']);
    // Another district's epidemiologist and an officer may not reopen it.
    expect((await otherEpi.post(`/api/districts/${own.id}/weeks/reopen`).send({ year: w.year, week: w.week, reason: 'not mine' })).status).toBe(403);
    expect((await officer.post(`/api/districts/${own.id}/weeks/reopen`).send({ year: w.year, week: w.week, reason: 'not allowed' })).status).toBe(403);
    expect(await rows()).toEqual(before);

    const res = await epi.post(`/api/districts/${own.id}/weeks/reopen`).send({ year: w.year, week: w.week, reason: 'Closed before the last clinic reported' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ districtId: own.id, year: w.year, week: w.week, reopened: true });
    const [audit] = await t.ds.query(`SELECT actor_id, before, after, reason FROM audit_events WHERE action = 'case-week.reopened' ORDER BY id DESC LIMIT 1`);
    expect(audit.actor_id).toBe(epiId);
    expect(audit.reason).toBe('Closed before the last clinic reported');
    expect(audit.before).toMatchObject({ districtId: own.id, year: w.year, week: w.week });
    expect(audit.before.closedAt).toEqual(expect.any(String));
    // The week is open again: a correction still needs a reason (a count is recorded), the count is kept.
    const grid = await epi.get(`/api/cases/grid?diseaseId=${dengueId}&weeks=8`);
    const cell = grid.body.rows.find((r: { district: { id: string } }) => r.district.id === own.id).cells.find((c: { year: number; week: number }) => c.year === w.year && c.week === w.week);
    expect(cell.closed).toBe(false);
    expect(cell.count.cases).toBe(7);
    // Reopening an open week changes nothing.
    const again = await epi.post(`/api/districts/${own.id}/weeks/reopen`).send({ year: w.year, week: w.week, reason: 'twice' });
    expect(again.body.reopened).toBe(false);
  });

  it('when the current week is closed, then it is refused because it is not over', async () => {
    const w = weeksAgo(0);
    const res = await supervisor.post(`/api/districts/${own.id}/weeks/close`).send({ year: w.year, week: w.week });
    expect(res.status).toBe(400);
    expect(paths(res)).toEqual(['week']);
  });

  it('when reports arrive after the deadline, then they are marked late and the completeness figure counts on-time reports of due weeks', async () => {
    const d = await makeReportingDistrict(t.ds);
    const e = await signIn((await makeUser(t.ds, { role: 'epidemiologist', districtIds: [d.id] })).email);
    const old = weeksAgo(6);
    const res = await put(e, d.id, { year: old.year, week: old.week, cases: 2 });
    expect(res.body.count.late).toBe(true);
    const now = weeksAgo(0);
    expect((await put(e, d.id, { year: now.year, week: now.week, cases: 1 })).body.count.late).toBe(false);
    const grid = await e.get(`/api/cases/grid?diseaseId=${dengueId}&weeks=12`);
    const row = grid.body.rows.find((r: { district: { id: string } }) => r.district.id === d.id);
    // Of the 12 weeks shown, the current one and the one before are not yet due (3-day deadline).
    expect(row.completeness.received).toBe(1);
    expect(row.completeness.onTime).toBe(0);
    expect(row.completeness.expected).toBeGreaterThanOrEqual(10);
    expect(row.completeness.share).toBe(0);
    expect(row.editable).toBe(true);
  });
});

describe('uploading counts', () => {
  it('when a good file is uploaded twice, then the first loads every row and the second changes nothing', async () => {
    const d = await makeReportingDistrict(t.ds);
    const e = await signIn((await makeUser(t.ds, { role: 'epidemiologist', districtIds: [d.id] })).email);
    const a = weeksAgo(2);
    const b = weeksAgo(3);
    const csv = `District,Year,Week,Disease,Cases\r\n${d.code},${a.year},${a.week},DENV,7\r\n"${d.code}",${b.year},${b.week},denv,0\r\n${d.code},${b.year},${b.week},WNV,1\r\n`;
    const first = await e.post('/api/cases/uploads').attach('file', Buffer.from(csv), 'week.csv');
    expect(first.status).toBe(200);
    expect(first.body).toMatchObject({ accepted: true, rows: 3, created: 3, corrected: 0, unchanged: 0, problems: [] });
    const before = await rows();
    const second = await e.post('/api/cases/uploads').attach('file', Buffer.from(csv), 'week.csv');
    expect(second.body).toMatchObject({ accepted: true, created: 0, corrected: 0, unchanged: 3 });
    expect(await rows()).toEqual(before);
  });

  it('when a file has bad rows, then the report names row, column, value and reason for each and nothing is written', async () => {
    const w = weeksAgo(2);
    const csv = [
      'district,year,week,disease,cases',
      `${own.code},${w.year},${w.week},DENV,-3`,
      `${own.code},${w.year},54,DENV,2`,
      `NOPE-1,${w.year},${w.week},DENV,2`,
      `${own.code},${w.year},${w.week},FLU,2`,
      `${own.code},${w.year},${w.week},DENV,2.5`,
      `${own.code},${w.year},${w.week - 1 || 1},WNV,4`,
      `${own.code},${w.year},${w.week - 1 || 1},WNV,5`,
    ].join('\n');
    const before = await rows();
    const res = await epi.post('/api/cases/uploads').attach('file', Buffer.from(csv), 'bad.csv');
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('upload_rejected');
    const problems = res.body.report.problems.map((p: { row: number; column: string; value: string }) => [p.row, p.column, p.value]);
    expect(problems).toEqual([
      [2, 'cases', '-3'],
      [3, 'week', '54'],
      [4, 'district', 'NOPE-1'],
      [5, 'disease', 'FLU'],
      [6, 'cases', '2.5'],
      [8, 'week', String(w.week - 1 || 1)],
    ]);
    expect(res.body.report.problems[0].reason).toMatch(/negative/);
    expect(await rows()).toEqual(before);
  });

  it('when an upload changes a recorded count, then it needs a reason; with one it corrects the count in the same transaction as the rest', async () => {
    const w = weeksAgo(5);
    await put(epi, own.id, { year: w.year, week: w.week, cases: 9 });
    const csv = `district,year,week,disease,cases\n${own.code},${w.year},${w.week},DENV,11\n${own.code},${w.year},${w.week},MAL-PV,2\n`;
    const before = await rows();
    const refused = await epi.post('/api/cases/uploads').attach('file', Buffer.from(csv), 'fix.csv');
    expect(refused.status).toBe(422);
    expect(refused.body.report.problems).toMatchObject([{ row: 2, column: 'cases', value: '11', reason: expect.stringMatching(/reason/) }]);
    expect(await rows()).toEqual(before);
    const ok = await epi.post('/api/cases/uploads').field('reason', 'Laboratory results added').attach('file', Buffer.from(csv), 'fix.csv');
    expect(ok.body).toMatchObject({ accepted: true, created: 1, corrected: 1 });
  });

  it('when the file has a wrong header, is missing or is too large, then it is refused with the reason', async () => {
    const header = await epi.post('/api/cases/uploads').attach('file', Buffer.from('district,year,wk,disease,cases,extra\n'), 'h.csv');
    expect(header.status).toBe(422);
    expect(header.body.report.problems.map((p: { column: string }) => p.column)).toEqual(['week', 'wk', 'extra']);
    const missing = await epi.post('/api/cases/uploads').send({});
    expect(missing.status).toBe(400);
    expect(paths(missing)).toEqual(['file']);
    const big = await epi.post('/api/cases/uploads').attach('file', Buffer.alloc(2 * 1024 * 1024 + 10, 'a'), 'big.csv');
    expect(big.status).toBe(413);
  });
});

describe('signals of a district', () => {
  it('when six prior seasons are on record, then this season carries the channel, the zone, incidence, C1–C3, CUSUM and growth', async () => {
    const d = await makeReportingDistrict(t.ds);
    // A fixed past season (not today's week, which is still open for reporting and so carries no signal;
    // docs/case-ledger.md "Open weeks"): week 20 of 2024.
    const now = { year: 2024, week: 20 };
    const history: { year: number; week: number; cases: number }[] = [];
    // The same week in the prior seasons holds 3, 7, 15, 1, 7 (and an epidemic 90 in the year before).
    const sameWeek: Record<number, number> = { [now.year - 6]: 3, [now.year - 5]: 7, [now.year - 4]: 15, [now.year - 3]: 1, [now.year - 2]: 7, [now.year - 1]: 90 };
    for (const [year, cases] of Object.entries(sameWeek)) history.push({ year: Number(year), week: now.week, cases });
    for (let week = 1; week < now.week; week++) history.push({ year: now.year, week, cases: 2 });
    history.push({ year: now.year, week: now.week, cases: 40 });
    await insertCounts(t.ds, d.id, dengueId, history);

    const withEpidemic = await officer.get(`/api/districts/${d.id}/cases?diseaseId=${dengueId}&year=${now.year}`);
    expect(withEpidemic.status).toBe(200);
    expect(withEpidemic.body.seasonsUsed).toHaveLength(6);

    const e = await signIn((await makeUser(t.ds, { role: 'epidemiologist', districtIds: [d.id] })).email);
    expect((await e.put(`/api/districts/${d.id}/channel-settings`).send({ diseaseId: dengueId, excludedYears: [now.year - 1] })).status).toBe(200);
    const res = await e.get(`/api/districts/${d.id}/cases?diseaseId=${dengueId}&year=${now.year}`);
    expect(res.body.excludedYears).toEqual([now.year - 1]);
    expect(res.body.seasonsUsed).toEqual([now.year - 2, now.year - 3, now.year - 4, now.year - 5, now.year - 6]);
    // The notes come as codes with parameters, never English sentences (issue 15, messages as data).
    expect(signalsResponse.safeParse(res.body).success).toBe(true);
    expect(res.body.notes).toContainEqual({ code: 'channel-excluded-years', params: { years: [now.year - 1] } });
    const last = res.body.weeks.find((w: { week: number }) => w.week === now.week);
    expect(last.open).toBe(false);
    // Bortman (1999) geometric channel; worked example of docs/signals.md [derived]: 3, 7, 15, 1, 7 → 1.2725 / 5.0629 / 15.1752.
    expect(last.channel.lower).toBeCloseTo(1.2725, 3);
    expect(last.channel.centre).toBeCloseTo(5.0629, 3);
    expect(last.channel.upper).toBeCloseTo(15.1752, 3);
    expect(last.zone).toBe('above');
    // Incidence per 100,000 with the factory population of 100,000: 40 cases → 40.
    expect(last.incidence).toBeCloseTo(40, 6);
    // Seven weeks of 2 then 40: far above mean + 3 SD with the SD floor of 0.5 (Hutwagner et al. 2003; docs/signals.md).
    expect(last.c1.alarm).toBe(true);
    expect(last.growth.ratio).toBeCloseTo(20, 6);
    expect(last.cusum.statistic).toBeGreaterThan(0);
    expect(res.body.canEnter).toBe(true);
    expect(res.body.priorSeasons.map((s: { year: number }) => s.year)).toEqual([1, 2, 3, 4, 5, 6].map((n) => now.year - 7 + n));
  });
});

describe('diseases', () => {
  it('when anybody signed in lists diseases, then the base four come back; an admin adds one and a duplicate code or unknown profile is refused', async () => {
    const list = await officer.get('/api/diseases');
    expect(list.body.diseases.map((d: { code: string }) => d.code).sort()).toEqual(['DENV', 'MAL-PF', 'MAL-PV', 'WNV']);
    expect(list.body.diseases.find((d: { code: string }) => d.code === 'DENV').profileIds).toEqual(['aedes-aegypti-dengue', 'aedes-albopictus-dengue']);
    const added = await admin.post('/api/diseases').send({ code: 'CHIKV', name: 'Chikungunya', profileIds: ['aedes-aegypti-dengue'] });
    expect(added.status).toBe(201);
    const before = await rows();
    expect((await admin.post('/api/diseases').send({ code: 'CHIKV', name: 'Again' })).status).toBe(409);
    const unknown = await admin.post('/api/diseases').send({ code: 'ZIKV', name: 'Zika', profileIds: ['no-such-profile'] });
    expect(unknown.status).toBe(400);
    expect(paths(unknown)).toEqual(['profileIds']);
    expect(await rows()).toEqual(before);
  });
});
