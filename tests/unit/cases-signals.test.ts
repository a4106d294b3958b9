import { describe, expect, it } from 'vitest';
import { buildSignals } from '../../server/cases/case-signals';
import { currentWeek, deadlineOf, firstOpenWeek, isDue, isOpenWeek, weekRef, weeksEndingWith } from '../../server/cases/case-weeks';
import { caseCountBody, weekProblem } from '../../shared/api/cases.schema';
import { surveyBody } from '../../shared/api/surveys.schema';
import { buildDemoCases } from '../../sample/demo-cases';

const series = (weeks: number, values: Record<number, number>, fill: number | null = null) =>
  Array.from({ length: weeks }, (_, i) => values[i + 1] ?? fill);

const base = {
  method: 'geometric' as const,
  cusum: { k: 0.5, h: 4 },
  population: 250_000,
  excludedYears: [] as number[],
};

describe('open weeks', () => {
  it('when a week’s deadline has not passed and it is not closed, then it is open; the open weeks are the newest ones and closing completes a week early', () => {
    // MMWR 2026: week 22 runs 31 May–6 June; with a 3-day deadline its counts are due by 9 June (common practice: a fixed reporting deadline).
    expect(deadlineOf(2026, 22, 'mmwr', 3)).toBe('2026-06-09');
    expect(isOpenWeek(2026, 22, 'mmwr', 3, '2026-06-09', false)).toBe(true);
    expect(isOpenWeek(2026, 22, 'mmwr', 3, '2026-06-10', false)).toBe(false);
    expect(isOpenWeek(2026, 22, 'mmwr', 3, '2026-06-08', true)).toBe(false);
    expect(firstOpenWeek(2026, 23, 'mmwr', 3, '2026-06-08', new Set())).toBe(22);
    expect(firstOpenWeek(2026, 23, 'mmwr', 3, '2026-06-08', new Set([22]))).toBe(23);
    expect(firstOpenWeek(2025, 52, 'mmwr', 3, '2026-06-08', new Set())).toBeNull();
  });

  it('when the newest weeks are open, then they keep their counts but get no zone, C1–C3, CUSUM or growth, and the fit ends at the last complete week', () => {
    const counts = new Map<number, (number | null)[]>([
      [2023, series(52, {}, 10)],
      [2024, series(52, {}, 12)],
      [2025, series(52, {}, 8)],
      [2026, series(52, { 9: 1, 10: 60 }, 10)],
    ]);
    const r = buildSignals({ ...base, year: 2026, lastWeek: 10, weeksInTargetYear: 52, counts, openFrom: 9 });
    expect(r.lastCompleteWeek).toBe(8);
    for (const w of r.weeks.slice(8)) {
      expect(w.open).toBe(true);
      expect(w.zone).toBeNull();
      expect([w.c1.statistic, w.c2.statistic, w.c3.statistic, w.cusum.statistic, w.growth.ratio]).toEqual([null, null, null, null, null]);
    }
    expect(r.weeks[9].cases).toBe(60);
    expect(r.weeks[7]).toMatchObject({ open: false, zone: 'within' });
    expect(r.fittedGrowth?.ratio).toBeCloseTo(1, 9);
    // The same season read with every week complete: week 10's 60 is above the channel.
    expect(buildSignals({ ...base, year: 2026, lastWeek: 10, weeksInTargetYear: 52, counts }).weeks[9].zone).toBe('above');
  });
});

describe('case signals of a season', () => {
  it('when five prior seasons hold 3, 7, 15, 1, 7 for a week, then the channel is Bortman’s geometric band of docs/signals.md', () => {
    // Bortman 1999, Rev. Panam. Salud Pública 5(1):1–8; worked example [derived] in docs/signals.md.
    const counts = new Map<number, (number | null)[]>([
      [2021, series(52, { 10: 3 })],
      [2022, series(52, { 10: 7 })],
      [2023, series(52, { 10: 15 })],
      [2024, series(52, { 10: 1 })],
      [2025, series(53, { 10: 7 })],
      [2026, series(52, { 10: 20 }, 0)],
    ]);
    const r = buildSignals({ ...base, year: 2026, lastWeek: 10, weeksInTargetYear: 52, counts });
    const w10 = r.weeks[9];
    expect(w10.channel!.lower).toBeCloseTo(1.2725, 4);
    expect(w10.channel!.centre).toBeCloseTo(5.0629, 4);
    expect(w10.channel!.upper).toBeCloseTo(15.1752, 4);
    expect(w10.zone).toBe('above');
    expect(w10.seasons).toBe(5);
    expect(w10.incidence).toBeCloseTo(8, 9); // 20 / 250,000 × 100,000
    expect(r.seasonsUsed).toEqual([2025, 2024, 2023, 2022, 2021]);
    expect(r.notes).toEqual([]);
  });

  it('when a season is marked as an epidemic year, then it is left out and fewer than five seasons bring a caution', () => {
    const counts = new Map<number, (number | null)[]>([
      [2023, series(52, { 5: 2 })],
      [2024, series(52, { 5: 90 })],
      [2025, series(53, { 5: 4 })],
      [2026, series(52, { 5: 3 }, 0)],
    ]);
    const r = buildSignals({ ...base, excludedYears: [2024], year: 2026, lastWeek: 5, weeksInTargetYear: 52, counts });
    expect(r.seasonsUsed).toEqual([2025, 2023]);
    expect(r.weeks[4].seasons).toBe(2);
    // Notes are codes with parameters (messages as data), worded by the client.
    expect(r.notes).toEqual([
      { code: 'channel-few-seasons', params: { seasons: 2, recommended: 5, most: 7 } },
      { code: 'channel-excluded-years', params: { years: [2024] } },
    ]);
  });

  it('when week 53 is asked of seasons that had 52 weeks, then their week 52 stands in', () => {
    const counts = new Map<number, (number | null)[]>([
      [2019, series(52, { 52: 4 })],
      [2020, series(53, { 53: 6 })],
      [2021, series(52, { 52: 8 })],
    ]);
    const r = buildSignals({ ...base, method: 'mean-2sd', year: 2020, lastWeek: 53, weeksInTargetYear: 53, counts: new Map([...counts].filter(([y]) => y !== 2021)) });
    // Only 2019 is prior to 2020: one season, no band.
    expect(r.weeks[52].channel).toBeNull();
    const later = buildSignals({ ...base, method: 'mean-2sd', year: 2026, lastWeek: 53, weeksInTargetYear: 53, counts });
    expect(later.weeks[52].seasons).toBe(3);
    expect(later.weeks[52].channel!.centre).toBeCloseTo(6, 9); // mean of 4, 6, 8
  });

  it('when seven quiet weeks of 2, 3, 4, 3, 2, 3, 4 are followed by 6, then C1 alarms (mean 3, SD 0.8165, threshold 5.449)', () => {
    // Hutwagner, Thompson, Seeman & Treadwell 2003, J. Urban Health 80(Suppl 1):i89–i96; CHECK-VALUES.md [derived].
    const counts = new Map<number, (number | null)[]>([[2026, [2, 3, 4, 3, 2, 3, 4, 6, ...series(44, {}, null)]]]);
    const r = buildSignals({ ...base, year: 2026, lastWeek: 8, weeksInTargetYear: 52, counts });
    // The previous season is missing: its weeks count as zero in the lead-in, so week 8's baseline is weeks 1–7.
    expect(r.weeks[7].c1.statistic).toBeCloseTo((6 - 3) / 0.8164966, 4);
    expect(r.weeks[7].c1.alarm).toBe(true);
    expect(r.weeks[7].growth.ratio).toBeCloseTo(1.5, 9);
    expect(r.weeks[7].growth.doublingWeeks).toBeCloseTo(Math.LN2 / Math.log(1.5), 9);
  });

  it('when four weeks each double, then the fitted doubling time is one week', () => {
    const counts = new Map<number, (number | null)[]>([[2026, [0, 0, 2, 4, 8, 16, ...series(46, {}, null)]]]);
    const r = buildSignals({ ...base, year: 2026, lastWeek: 6, weeksInTargetYear: 52, counts });
    expect(r.fittedGrowth!.doublingWeeks).toBeCloseTo(1, 9);
  });
});

describe('epidemiological weeks of the ledger', () => {
  it('when a week is checked, then week 53 of a 52-week year, a future week and a week before the district reported are refused', () => {
    // MMWR: week 1 of 2026 begins on Sunday 2026-01-04, so 2026 has 52 weeks and 2025 has 53 (CHECK-VALUES.md).
    expect(weekProblem(2026, 53, 'mmwr', '2026-12-31')?.path).toBe('week');
    expect(weekProblem(2025, 53, 'mmwr', '2026-12-31')).toBeNull();
    expect(weekProblem(2026, 49, 'mmwr', '2026-12-01')?.message).toMatch(/not started/);
    expect(weekProblem(2026, 48, 'mmwr', '2026-12-01')).toBeNull();
    expect(weekProblem(2026, 10, 'mmwr', '2026-12-01', '2026-06-01')?.message).toMatch(/started reporting/);
  });

  it('when twelve weeks end with week 2, then they run back into the previous week-year', () => {
    const weeks = weeksEndingWith({ year: 2026, week: 2 }, 12, 'mmwr');
    expect(weeks[0]).toMatchObject({ year: 2025, week: 44 }); // 2025 has 53 weeks: 53 … 44 are ten
    expect(weeks.at(-1)).toMatchObject({ year: 2026, week: 2, start: '2026-01-11', end: '2026-01-17' });
    expect(currentWeek('mmwr', '2026-01-03')).toMatchObject({ year: 2025, week: 53 });
    expect(currentWeek('iso', '2026-01-03')).toMatchObject({ year: 2026, week: 1 });
  });

  it('when the deadline is three days, then a week ending Saturday is due from the Wednesday after', () => {
    expect(weekRef(2026, 1, 'mmwr').end).toBe('2026-01-10');
    expect(deadlineOf(2026, 1, 'mmwr', 3)).toBe('2026-01-13');
    expect(isDue(2026, 1, 'mmwr', 3, '2026-01-13')).toBe(false);
    expect(isDue(2026, 1, 'mmwr', 3, '2026-01-14')).toBe(true);
  });
});

describe('the shared contract of counts and surveys', () => {
  it('when a count is negative, fractional or split beyond its total, then the schema names the field', () => {
    const ok = { diseaseId: '00000000-0000-4000-8000-000000000001', year: 2026, week: 3, cases: 4 };
    const path = (body: object) => caseCountBody.safeParse(body).error?.issues[0].path.join('.');
    expect(caseCountBody.safeParse(ok).success).toBe(true);
    expect(path({ ...ok, cases: -1 })).toBe('cases');
    expect(path({ ...ok, cases: 1.5 })).toBe('cases');
    expect(path({ ...ok, week: 54 })).toBe('week');
    expect(path({ ...ok, confirmed: 3, probable: 2 })).toBe('confirmed');
    expect(path({ ...ok, ageBands: { '0-4': 5 } })).toBe('ageBands');
    expect(path({ ...ok, colour: 'red' })).toBe('');
  });

  it('when a survey has more positive houses than inspected, then the shared larval rules name housesPositive', () => {
    const s = {
      id: '00000000-0000-4000-8000-000000000002', districtId: '00000000-0000-4000-8000-000000000003', locality: 'X', date: '2026-01-05',
      housesInspected: 10, housesPositive: 11, containersInspected: 40, containersPositive: 12,
    };
    expect(surveyBody.safeParse(s).error?.issues.map((i) => i.path.join('.'))).toContain('housesPositive');
  });
});

describe('the demo cases', () => {
  it('when built twice for the same day, then they are the same, stop before the current week and hold the epidemic years', () => {
    const a = buildDemoCases('2026-12-01', 'mmwr');
    expect(buildDemoCases('2026-12-01', 'mmwr')).toEqual(a);
    expect(Math.max(...a.filter((c) => c.year === 2026).map((c) => c.week))).toBeLessThan(48);
    const total = (code: string, disease: string, year: number) =>
      a.filter((c) => c.districtCode === code && c.disease === disease && c.year === year).reduce((s, c) => s + c.cases, 0);
    expect(total('HV-01', 'DENV', 2022)).toBeGreaterThan(2 * total('HV-01', 'DENV', 2021));
    expect(total('HV-04', 'MAL-PV', 2024)).toBeGreaterThan(1.5 * total('HV-04', 'MAL-PV', 2023));
    expect(new Set(a.filter((c) => c.districtCode === 'HV-10').map((c) => c.disease))).toEqual(new Set(['WNV']));
    // West Nile virus has no winter cases (Culex in diapause).
    expect(a.filter((c) => c.disease === 'WNV' && c.week < 10).every((c) => c.cases === 0)).toBe(true);
  });
});
