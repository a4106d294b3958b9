import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { createTestApp, type TestApp } from '../support/test-app';
import { makeUser, signedInAgent } from '../support/factories';
import { disease, insertCounts, makeReportingDistrict } from '../support/cases-factories';
import { bulletinText } from '../../server/bulletins/bulletin.render';
import type { BulletinData } from '../../server/bulletins/bulletin-data';

/**
 * Weeks have a state (issue 16, item 5): a week is open until its reporting deadline (its last day plus
 * CASE_REPORT_DEADLINE_DAYS, 3 by default) passes or it is closed, and an open week enters no signal.
 * The clock is fixed (no test depends on today's week number): Monday 8 June 2026, in MMWR week 23
 * (7–13 June); week 22 (31 May–6 June) is open until 9 June; week 21 is the newest complete week.
 */
const TODAY = new Date('2026-06-08T10:00:00Z');

type Agent = Awaited<ReturnType<typeof signedInAgent>>;
let t: TestApp;
let own: { id: string; code: string };
let dengueId: string;
let epi: Agent;

beforeAll(async () => {
  t = await createTestApp({ SIGN_IN_LIMIT_PER_ADDRESS: '1000' });
  own = await makeReportingDistrict(t.ds);
  dengueId = (await disease(t.ds, 'DENV')).id;
  // Signed in on the real clock; only the requests below run on the fixed one.
  epi = await signedInAgent(t.app, (await makeUser(t.ds, { role: 'epidemiologist', districtIds: [own.id] })).email);
  // Seven prior seasons of about 10 cases a week (weeks 1–30): a channel around 10.
  const prior = [];
  for (let year = 2019; year <= 2025; year++) for (let week = 1; week <= 30; week++) prior.push({ year, week, cases: 8 + ((year + week) % 5) });
  await insertCounts(t.ds, own.id, dengueId, prior);
  // This season: 10 a week up to week 21; week 22 still open with a partial 2 (read as complete it would
  // be a fall of 80 %); week 23 open with 40 (read as complete it would be far above the channel).
  await insertCounts(t.ds, own.id, dengueId, [
    ...Array.from({ length: 21 }, (_, i) => ({ year: 2026, week: i + 1, cases: 10 })),
    { year: 2026, week: 22, cases: 2 },
    { year: 2026, week: 23, cases: 40 },
  ]);
});
afterEach(() => vi.useRealTimers());
afterAll(() => t.close());

const onFixedClock = () => vi.useFakeTimers({ toFake: ['Date'], now: TODAY });
const signals = () => epi.get(`/api/districts/${own.id}/cases?diseaseId=${dengueId}&year=2026`);
type Week = { week: number; open: boolean; zone: unknown; cases: number | null; c1: { statistic: unknown }; c2: { statistic: unknown }; c3: { statistic: unknown }; cusum: { statistic: unknown }; growth: { ratio: unknown; percent: unknown } };

describe('open weeks', () => {
  it('when a week’s reporting deadline has not passed, then it is open: its partial count is shown but it has no C1–C3, CUSUM, zone or growth, and the headline week is the last complete one', async () => {
    onFixedClock();
    const res = await signals();
    expect(res.status).toBe(200);
    expect(res.body.lastCompleteWeek).toBe(21);
    expect(res.body.deadlineDays).toBe(3);
    const byWeek = new Map<number, Week>(res.body.weeks.map((w: Week) => [w.week, w]));
    expect(res.body.weeks).toHaveLength(23);
    for (const n of [22, 23]) {
      const w = byWeek.get(n)!;
      expect(w.open).toBe(true);
      expect(w.zone).toBeNull();
      for (const s of [w.c1, w.c2, w.c3, w.cusum]) expect(s.statistic).toBeNull();
      expect(w.growth).toMatchObject({ ratio: null, percent: null });
    }
    expect(byWeek.get(22)!.cases).toBe(2);
    expect(byWeek.get(22)).toMatchObject({ deadline: '2026-06-09' });
    const w21 = byWeek.get(21)!;
    expect(w21.open).toBe(false);
    expect(w21.zone).not.toBeNull();
    expect(w21.c2.statistic).not.toBeNull();
    // The fitted doubling time ends at the last complete week (weeks 18–21, all 10: not growing).
    expect(res.body.fittedGrowth).toMatchObject({ weeks: 4, ratio: expect.closeTo(1, 6), doublingWeeks: null });
  });

  it('when the open week is closed, then it counts as complete at once and gets its zone and statistics', async () => {
    onFixedClock();
    const closed = await epi.post(`/api/districts/${own.id}/weeks/close`).send({ year: 2026, week: 22 });
    expect(closed.status).toBe(200);
    const res = await signals();
    expect(res.body.lastCompleteWeek).toBe(22);
    const w22 = res.body.weeks.find((w: Week) => w.week === 22);
    expect(w22).toMatchObject({ open: false, closed: true });
    expect(w22.zone).toBe('below');
    expect(w22.c1.statistic).not.toBeNull();
    expect(res.body.weeks.find((w: Week) => w.week === 23)).toMatchObject({ open: true, zone: null });
    await epi.post(`/api/districts/${own.id}/weeks/reopen`).send({ year: 2026, week: 22, reason: 'Closed to test the week state' });
  });

  it('when the grid and the District file are read, then they mark the open weeks (openFrom 22)', async () => {
    onFixedClock();
    const grid = await epi.get(`/api/cases/grid?diseaseId=${dengueId}&weeks=4`);
    expect(grid.status).toBe(200);
    const row = grid.body.rows.find((r: { district: { id: string } }) => r.district.id === own.id);
    expect(row.cells.map((c: { week: number; open: boolean }) => [c.week, c.open])).toEqual([[20, false], [21, false], [22, true], [23, true]]);
    const file = await epi.get(`/api/districts/${own.id}/file?season=2026`);
    expect(file.status).toBe(200);
    expect(file.body.cases[0]).toMatchObject({ openFrom: 22 });
  });

  it('when a bulletin shows an open week whose partial count lies above the channel, then it does not call it above the channel and says reporting is still open', () => {
    const week = (n: number, count: number, open: boolean) => ({ week: n, count, lower: 6, centre: 10, upper: 14, open });
    const data: BulletinData = {
      district: { id: own.id, code: own.code, name: 'Test district', isDemo: false },
      epiYear: 2026, epiWeek: 23, asOf: '2026-06-08', tier: null, ranking: [], tierHistory: [], advisories: [], actions: [],
      cases: [{ diseaseName: 'Dengue', weeks: [week(20, 10, false), week(21, 20, false), week(22, 2, true), week(23, 40, true)] }],
    };
    const text = bulletinText(data, 'en');
    const line = (n: number) => text.split('\n').find((l) => l.includes(`week ${n}:`))!;
    expect(line(23)).not.toMatch(/above the channel/);
    expect(line(23)).toMatch(/reporting still open/);
    expect(line(22)).not.toMatch(/below the channel/);
    // A complete week keeps its zone.
    expect(line(21)).toMatch(/above the channel/);
  });
});

describe('corrections keep every field', () => {
  it('when a stored count is read for the entry form, then every field comes back; a correction sending only the total keeps the split', async () => {
    onFixedClock();
    const put = (body: Record<string, unknown>) => epi.put(`/api/districts/${own.id}/cases`).send({ diseaseId: dengueId, year: 2026, week: 20, ...body });
    const read = () => epi.get(`/api/districts/${own.id}/cases/count?diseaseId=${dengueId}&year=2026&week=20`);
    await put({ cases: 47, confirmed: 19, probable: 28, reason: 'Split received from the laboratory' });
    const stored = await read();
    expect(stored.status).toBe(200);
    expect(stored.body.count).toMatchObject({ cases: 47, confirmed: 19, probable: 28 });
    const fixed = await put({ cases: 49, reason: 'Two late reports' });
    expect(fixed.body.count).toMatchObject({ cases: 49, confirmed: 19, probable: 28 });
    const none = await epi.get(`/api/districts/${own.id}/cases/count?diseaseId=${dengueId}&year=2026&week=40`);
    expect(none.body).toEqual({ count: null });
    const bad = await epi.get(`/api/districts/${own.id}/cases/count?diseaseId=${dengueId}&year=2026&week=54`);
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.map((f: { path: string }) => f.path)).toContain('week');
  });
});
