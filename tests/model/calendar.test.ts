import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { dayLength, epiWeek, epiWeekStart, weeksInYear, formatIsoDate, parseIsoDate } from '../../shared/model';
import { expectClose } from '../support/close';

describe('day length: Forsythe, Rykiel, Stahl, Wu & Schoolfield 1995, Ecological Modelling 80:87–95 (CBM model)', () => {
  it('when latitude 40° N on day 172 with p = 0.8333° (sunrise), then 15.02 hours [derived]', () => {
    expect(dayLength(40, 172, { definition: 'sunrise' })).toBeCloseTo(15.02, 2);
    expect(dayLength(40, '2023-06-21')).toBeCloseTo(15.02, 2); // 2023-06-21 is day 172
  });
  it('when civil twilight (p = 6°) is used, then the day is longer than sunrise to sunset (common practice)', () => {
    expect(dayLength(40, 172, { definition: 'civil' })).toBeGreaterThan(dayLength(40, 172, { definition: 'sunrise' }) + 0.5);
  });
  it('when at the equator, then every day is close to 12 hours (a little over, from refraction) [derived]', () => {
    for (const j of [1, 80, 172, 266, 355]) expect(Math.abs(dayLength(0, j) - 12.1)).toBeLessThan(0.1);
  });
  it('when north of the Arctic circle at midsummer, then 24 hours; at midwinter, 0 hours [derived]', () => {
    expect(dayLength(75, 172)).toBe(24);
    expect(dayLength(75, 355)).toBe(0);
  });
  it('when the axial tilt is zero and p = 0 (geometric), then every day is 12 hours at every latitude (common practice, property test)', () => {
    fc.assert(
      fc.property(fc.double({ min: -90, max: 90, noNaN: true }), fc.integer({ min: 1, max: 366 }), (lat, j) => {
        expectClose(dayLength(lat, j, { axialTiltDeg: 0, definition: 'geometric' }), 12);
      }),
    );
  });
});

describe('epidemiological weeks: MMWR (Sunday start, week 1 has ≥ 4 days of the year) [derived from the rule]', () => {
  it('when 2025 starts, then MMWR week 1 begins on Sunday 2024-12-29', () => {
    expect(epiWeek('2025-01-01', 'mmwr')).toEqual({ year: 2025, week: 1, start: '2024-12-29' });
    expect(epiWeek('2024-12-29', 'mmwr')).toEqual({ year: 2025, week: 1, start: '2024-12-29' });
    expect(epiWeekStart(2025, 1, 'mmwr')).toBe('2024-12-29');
  });
  it('when 2026 starts, then MMWR week 1 begins on Sunday 2026-01-04 and 2026-01-03 is week 53 of 2025', () => {
    expect(epiWeekStart(2026, 1, 'mmwr')).toBe('2026-01-04');
    expect(epiWeek('2026-01-03', 'mmwr')).toEqual({ year: 2025, week: 53, start: '2025-12-28' });
    expect(weeksInYear(2025, 'mmwr')).toBe(53);
  });
  it('when years are counted, then 2024 has 52 MMWR weeks and 2020 has 53 [derived]', () => {
    expect(weeksInYear(2024, 'mmwr')).toBe(52);
    expect(weeksInYear(2020, 'mmwr')).toBe(53);
  });
});

describe('epidemiological weeks: ISO 8601 (Monday start, week 1 holds the first Thursday) [derived from the rule]', () => {
  it('when 2021-01-03 (a Sunday), then it is ISO week 53 of 2020', () => {
    expect(epiWeek('2021-01-03', 'iso')).toEqual({ year: 2020, week: 53, start: '2020-12-28' });
  });
  it('when 2024-12-30 (a Monday), then it starts ISO week 1 of 2025', () => {
    expect(epiWeek('2024-12-30', 'iso')).toEqual({ year: 2025, week: 1, start: '2024-12-30' });
    expect(epiWeek('2025-01-05', 'iso')).toEqual({ year: 2025, week: 1, start: '2024-12-30' });
  });
  it('when years are counted, then 2020 and 2026 have 53 ISO weeks and 2025 has 52', () => {
    expect(weeksInYear(2020, 'iso')).toBe(53);
    expect(weeksInYear(2026, 'iso')).toBe(53);
    expect(weeksInYear(2025, 'iso')).toBe(52);
  });
  it('when a week does not exist, then epiWeekStart throws a RangeError', () => {
    expect(() => epiWeekStart(2025, 53, 'iso')).toThrow(RangeError);
  });
  it('when any date from 1990 to 2060 is mapped to its week and back, then the week starts on the right weekday, contains the date, and round-trips (property)', () => {
    const lo = parseIsoDate('1990-01-01');
    const hi = parseIsoDate('2060-12-31');
    fc.assert(
      fc.property(fc.integer({ min: lo, max: hi }), fc.constantFrom('mmwr', 'iso' as const), (d, system) => {
        const w = epiWeek(formatIsoDate(d), system);
        const s = parseIsoDate(w.start);
        expect(d - s).toBeGreaterThanOrEqual(0);
        expect(d - s).toBeLessThan(7);
        expect(new Date(s * 86_400_000).getUTCDay()).toBe(system === 'mmwr' ? 0 : 1);
        expect(epiWeekStart(w.year, w.week, system)).toBe(w.start);
      }),
    );
  });
});
