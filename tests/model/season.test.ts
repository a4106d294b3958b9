import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { accumulate, computeSeason, computeSeasonColumns, degreeDays, getProfile, traitsAt, type SeasonInputDay } from '../../shared/model';
import { expectClose } from '../support/close';

const dates = (start: string, n: number) => Array.from({ length: n }, (_, i) => new Date(Date.parse(`${start}T00:00:00Z`) + i * 86_400_000).toISOString().slice(0, 10));

describe('accumulation from a biofix, with gaps kept in view (Broodcast rule, docs/model.md)', () => {
  it('when a day is a gap, then its value is null, it adds nothing and the total is incomplete from that day on', () => {
    const r = accumulate(
      [
        { date: '2024-04-01', degreeDays: 5 },
        { date: '2024-04-02', degreeDays: 6 },
        { date: '2024-04-03', degreeDays: null },
        { date: '2024-04-04', degreeDays: 7, filled: true },
      ],
      '2024-04-02',
    );
    expect(r.map((d) => d.cumulative)).toEqual([0, 6, 6, 13]);
    expect(r.map((d) => d.complete)).toEqual([true, true, false, false]);
    expect(r[2].degreeDays).toBeNull();
    expect(r[3].filled).toBe(true);
  });
  it('when a gap falls before the biofix, then the season total stays complete', () => {
    const r = accumulate([{ date: '2024-03-31', degreeDays: null }, { date: '2024-04-01', degreeDays: 4 }], '2024-04-01');
    expect(r[1]).toMatchObject({ cumulative: 4, complete: true });
  });
  it('when any season is accumulated, then the final total equals the sum of the known days since the biofix (property)', () => {
    fc.assert(
      fc.property(fc.array(fc.option(fc.double({ min: 0, max: 30, noNaN: true }), { nil: null }), { minLength: 1, maxLength: 120 }), fc.integer({ min: 0, max: 130 }), (vals, b) => {
        const ds = dates('2024-01-01', vals.length);
        const biofix = dates('2024-01-01', b + 1)[b];
        const r = accumulate(vals.map((v, i) => ({ date: ds[i], degreeDays: v })), biofix);
        const sum = vals.reduce<number>((s, v, i) => (ds[i] >= biofix && v !== null ? s + v : s), 0);
        expectClose(r[r.length - 1].cumulative, sum);
        expect(r[r.length - 1].complete).toBe(!vals.some((v, i) => v === null && ds[i] >= biofix));
      }),
    );
  });
});

describe('season computation (vector clock per day)', () => {
  const culex = getProfile('culex-wnv');
  const falc = getProfile('anopheles-falciparum');
  const constant = (n: number, tmin: number, tmax: number, start = '2024-06-01'): SeasonInputDay[] => dates(start, n).map((date) => ({ date, tmin, tmax, rh: 70 }));

  it('when the weather is constant, then the traits equal the constant-temperature traits and generations follow K', () => {
    const days = computeSeason(falc, { lat: 10, biofix: '2024-06-01' }, constant(40, 20, 30));
    const t = traitsAt(falc, 25);
    const last = days[39];
    expect(last.eipDays).toBeCloseTo(t.eipDays!, 5);
    expect(last.survival).toBeCloseTo(t.survival, 6);
    expect(last.relativeVectorialCapacity).toBeCloseTo(t.relativeVectorialCapacity, 6);
    expect(last.survivalThroughEip).toBeCloseTo(Math.pow(t.survival, t.eipDays!), 5);
    const dd = degreeDays({ method: 'single-sine', lower: falc.development.lowerThreshold.value, upper: 34, tmin: 20, tmax: 30 }).degreeDays;
    expect(last.cumulativeDegreeDays).toBeCloseTo(40 * dd, 9);
    expect(last.generations).toBe(Math.floor((40 * dd) / falc.development.degreeDaysPerGeneration.value));
    expect(last.ranges!.eipDays.high).toBeCloseTo(111 / 7, 4); // slow end: 18 °C threshold
  });

  it('when the season has a gap, then that day is null and the total is marked incomplete from there on, never zero-filled', () => {
    const input = constant(10, 18, 30);
    input[4] = { date: input[4].date, tmin: null, tmax: null };
    const days = computeSeason(culex, { lat: 33, biofix: '2024-06-01' }, input);
    expect(days[4].degreeDays).toBeNull();
    expect(days.map((d) => d.complete)).toEqual([true, true, true, true, false, false, false, false, false, false]);
    expect(days[9].cumulativeDegreeDays).toBeCloseTo(9 * days[0].degreeDays!, 9);
    expect(days[3].nextTminFallback).toBe(false);
  });

  it('when the profile uses a double method, then the last day and the day before a gap fall back to today\'s Tmin and say so', () => {
    const dbl = structuredClone(culex);
    dbl.development.method.value = 'double-sine';
    const input = constant(5, 18, 30);
    input[2] = { date: input[2].date, tmin: null, tmax: null };
    const days = computeSeason(dbl, { lat: 33, biofix: '2024-06-01' }, input);
    expect(days.map((d) => d.nextTminFallback)).toEqual([false, true, false, false, true]);
  });

  it('when the season sum is taken, then it equals the sum of the days (property)', () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.double({ min: -5, max: 30, noNaN: true }), fc.double({ min: 0, max: 15, noNaN: true })), { minLength: 1, maxLength: 60 }), (rows) => {
        const input = dates('2024-05-01', rows.length).map((date, i) => ({ date, tmin: rows[i][0], tmax: rows[i][0] + rows[i][1] }));
        const days = computeSeason(culex, { lat: 40, biofix: '2024-05-01' }, input);
        const sum = days.reduce((s, d) => s + (d.degreeDays ?? 0), 0);
        expectClose(days[days.length - 1].cumulativeDegreeDays, sum);
      }),
    );
  });

  it('when Culex days shorten below the critical photoperiod in autumn, then the season window closes and the relative capacity is 0', () => {
    const input = dates('2024-07-01', 150).map((date) => ({ date, tmin: 18, tmax: 30 }));
    const days = computeSeason(culex, { lat: 40, biofix: '2024-04-01' }, input);
    expect(days[0].seasonOpen).toBe(true);
    const closed = days.find((d) => !d.seasonOpen)!;
    expect(closed.dayLengthHours!).toBeLessThan(13.5);
    expect(closed.relativeVectorialCapacity).toBe(0);
  });

  it('when the recent mean falls below the closing temperature and rises between the two, then the window stays closed (hysteresis)', () => {
    const temps = [...Array(10).fill(20), ...Array(10).fill(5), ...Array(14).fill(11)];
    const input = dates('2024-06-01', temps.length).map((date, i) => ({ date, tmin: temps[i] - 3, tmax: temps[i] + 3 }));
    const days = computeSeason(culex, { lat: 40, biofix: '2024-04-01' }, input);
    expect(days[5].seasonOpen).toBe(true);
    expect(days[19].seasonOpen).toBe(false);
    expect(days[33].seasonOpen).toBe(false); // 7-day mean 11 °C: above closing 10, below opening 12
  });

  it('when dates are not consecutive, then computeSeason throws a RangeError', () => {
    expect(() => computeSeason(culex, { lat: 40 }, [{ date: '2024-06-01', tmin: 1, tmax: 2 }, { date: '2024-06-03', tmin: 1, tmax: 2 }])).toThrow(RangeError);
  });

  it('when the columns path is used directly, then it gives the object path\'s numbers with NaN for gaps', () => {
    const tmin = Float64Array.from([15, 16, Number.NaN, 17]);
    const tmax = Float64Array.from([28, 29, Number.NaN, 30]);
    const c = computeSeasonColumns(culex, { lat: 35, biofix: '2024-06-01' }, { startDate: '2024-06-01', tmin, tmax });
    const o = computeSeason(culex, { lat: 35, biofix: '2024-06-01' }, dates('2024-06-01', 4).map((date, i) => ({ date, tmin: Number.isNaN(tmin[i]) ? null : tmin[i], tmax: Number.isNaN(tmax[i]) ? null : tmax[i] })));
    expect(Number.isNaN(c.degreeDays[2])).toBe(true);
    expect(c.cumulativeDegreeDays[3]).toBeCloseTo(o[3].cumulativeDegreeDays, 12);
    expect(c.relativeVectorialCapacity[3]).toBeCloseTo(o[3].relativeVectorialCapacity!, 12);
  });
});
