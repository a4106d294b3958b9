import { describe, expect, it } from 'vitest';
import { calendarDay, dateProblem, dateSchema, isoDate } from '../../shared/api/date.schema';
import { dayOfIsoDate } from '../../shared/weather/qc';

const messages = (text: unknown, schema = isoDate) => {
  const r = schema.safeParse(text);
  return r.success ? [] : r.error.issues.map((i) => i.message);
};

describe('the shared date type', () => {
  it('when a real date from 1900 to 2100 is given, then it is accepted and its day number is right', () => {
    for (const d of ['1900-01-01', '1970-01-01', '2026-08-20', '2100-12-31']) expect(messages(d), d).toEqual([]);
    expect(calendarDay('1970-01-01')).toBe(0);
    expect(calendarDay('1970-01-02')).toBe(1);
    expect(calendarDay('1900-01-01')).toBe(-25_567); // 70 years with 17 leap days: 70 × 365 + 17 [derived]
    expect(calendarDay('2100-12-31')).toBe(Date.UTC(2100, 11, 31) / 86_400_000);
  });

  it('when the leap day is checked, then the Gregorian rule applies (every 4 years, not centuries unless divisible by 400; common practice)', () => {
    expect(dateProblem('2024-02-29')).toBeNull();
    expect(dateProblem('2000-02-29')).toBeNull();
    expect(dateProblem('2023-02-29')).toBe('calendar');
    expect(dateProblem('1900-02-29')).toBe('calendar');
    expect(dateProblem('2100-02-29')).toBe('calendar');
    expect(calendarDay('2024-03-01') - calendarDay('2024-02-28')).toBe(2);
    expect(calendarDay('2023-03-01') - calendarDay('2023-02-28')).toBe(1);
  });

  it('when a date is impossible, badly written or out of range, then it is refused with a message saying which', () => {
    const calendar = ['2026-02-30', '2026-13-01', '2026-00-10', '2026-04-31', '2026-99-99', '2026-01-00'];
    for (const d of calendar) expect([d, dateProblem(d)]).toEqual([d, 'calendar']);
    const format = ['', '2026-1-01', '26-01-01', '2026/01/01', '2026-01-01T00:00:00Z', ' 2026-01-01', '2026-01-0x', '+026-01-01', '２０２６-01-01'];
    for (const d of format) expect([d, dateProblem(d)]).toEqual([d, 'format']);
    const range = ['0000-01-01', '0001-01-01', '0099-06-15', '1899-12-31', '2101-01-01', '9999-12-31'];
    for (const d of range) expect([d, dateProblem(d)]).toEqual([d, 'range']);
    expect(messages('2026-02-30')).toEqual(['must be a date (YYYY-MM-DD)']);
    expect(messages('0099-06-15')).toEqual(['must be between 1900-01-01 and 2100-12-31']);
    expect(messages(20260101)).toEqual(['must be a date (YYYY-MM-DD)']);
    for (const d of [...calendar, ...format, ...range]) expect(Number.isNaN(calendarDay(d)), d).toBe(true);
  });

  it('when a field documents another range, then that range applies', () => {
    const since1990 = dateSchema({ minYear: 1990, maxYear: 2100 });
    expect(messages('1989-12-31', since1990)).toEqual(['must be between 1990-01-01 and 2100-12-31']);
    expect(messages('1990-01-01', since1990)).toEqual([]);
  });

  it('when the weather intake reads a date, then it uses the same rule: year 0099 is not read as 1999', () => {
    expect(Number.isNaN(dayOfIsoDate('0099-06-15'))).toBe(true);
    expect(Number.isNaN(dayOfIsoDate('2026-02-30'))).toBe(true);
    expect(dayOfIsoDate('1999-06-15')).toBe(calendarDay('1999-06-15'));
  });
});
