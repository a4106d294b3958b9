import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { degreeDays, DEGREE_DAY_METHODS, type DegreeDayMethod } from '../../shared/model';
import { expectAtMost, expectClose } from '../support/close';

const f2c = (f: number) => ((f - 32) * 5) / 9;
/** Degree-days in °C units → °F units. */
const c2fDD = (dd: number) => dd * 1.8;

describe('degree-days: Zalom et al. 1983, DANR Leaflet 21373, Table 7 [pub] (°F, lower 55, upper 90, horizontal cutoff; computed in °C and converted back)', () => {
  // Tmin, Tmax, next Tmin → single triangle, double triangle, single sine, double sine
  const rows: [number, number, number, number | null, number | null, number, number][] = [
    [96, 110, 91, 35, 35, 35, 35],
    [60, 80, 75, 15, 18.75, 15, 18.75],
    [50, 82, 45, 11.39, 10.62, 11.85, 11.31],
    [45, 70, 50, 4.5, 5.06, 5.31, 5.7],
    [75, 95, 60, 29.38, 25.76, 28.91, 25.3],
    [50, 101, 48, 19.56, 19.19, 18.95, 18.69],
  ];
  const methods: DegreeDayMethod[] = ['single-triangle', 'double-triangle', 'single-sine', 'double-sine'];
  for (const [tmin, tmax, next, ...expected] of rows) {
    methods.forEach((method, k) => {
      const want = expected[k];
      if (want === null) return;
      it(`when Tmin ${tmin} °F, Tmax ${tmax} °F, next Tmin ${next} °F by ${method}, then ${want} °F degree-days (±0.01)`, () => {
        const r = degreeDays({ method, cutoff: 'horizontal', lower: f2c(55), upper: f2c(90), tmin: f2c(tmin), tmax: f2c(tmax), tminNext: f2c(next) });
        expect(Math.abs(c2fDD(r.degreeDays) - want)).toBeLessThanOrEqual(0.01);
      });
    });
  }
  it('when the doubtful row 60/100/75 is computed by double triangle, then it gives 27.12 °F, not the printed 24.88 (the cell left out of the table check) [derived]', () => {
    const r = degreeDays({ method: 'double-triangle', lower: f2c(55), upper: f2c(90), tmin: f2c(60), tmax: f2c(100), tminNext: f2c(75) });
    expect(c2fDD(r.degreeDays)).toBeCloseTo(27.125, 2);
  });
});

describe('degree-days: McMaster & Wilhelm 1997, "Growing degree-days: one equation, two interpretations", Agric. For. Meteorol. 87:291–300, Table 1 [pub] (base 0 °C)', () => {
  const rows: [number, number, number, number][] = [
    [20, 10, 15, 15],
    [8, -2, 3, 4],
    [5, -5, 0, 2.5],
    [10, -2, 4, 5],
    [-2, -7, 0, 0],
  ];
  for (const [tmax, tmin, m1, m2] of rows) {
    it(`when Tmax ${tmax}, Tmin ${tmin}, then method 1 (average) gives ${m1} and method 2 (average-clamped) gives ${m2}`, () => {
      expect(degreeDays({ method: 'average', lower: 0, upper: 30, tmin, tmax }).degreeDays).toBeCloseTo(m1, 10);
      expect(degreeDays({ method: 'average-clamped', lower: 0, upper: 30, tmin, tmax }).degreeDays).toBeCloseTo(m2, 10);
    });
  }
  it('when Tmax is above the upper threshold, then average-clamped holds it at the upper threshold (method 2 with the upper cap) [derived]', () => {
    expect(degreeDays({ method: 'average-clamped', lower: 10, upper: 30, tmin: 20, tmax: 36 }).degreeDays).toBeCloseTo(15, 10);
  });
});

describe('degree-days: Celsius cutoffs, lower 10, upper 30, Tmin 20, Tmax 35 [derived] (CHECK-VALUES from the general form A(TL) − A(TU))', () => {
  const cases: [DegreeDayMethod, 'horizontal' | 'vertical' | 'intermediate', number][] = [
    ['single-sine', 'horizontal', 16.229],
    ['single-sine', 'vertical', 8.392],
    ['single-sine', 'intermediate', 14.958],
    ['single-triangle', 'horizontal', 16.667],
    ['single-triangle', 'vertical', 10.0],
    ['single-triangle', 'intermediate', 15.833],
  ];
  for (const [method, cutoff, want] of cases) {
    it(`when ${method} with a ${cutoff} cutoff, then ${want}`, () => {
      expect(degreeDays({ method, cutoff, lower: 10, upper: 30, tmin: 20, tmax: 35 }).degreeDays).toBeCloseTo(want, 3);
    });
  }
});

describe('degree-days: the last-day rule of the double methods (Allen 1976 form; Broodcast rule, documented in docs/model.md)', () => {
  it('when a double method has no next Tmin, then it uses today\'s Tmin, equals the single method and says so', () => {
    const d = degreeDays({ method: 'double-sine', lower: 10, upper: 30, tmin: 12, tmax: 28 });
    const s = degreeDays({ method: 'single-sine', lower: 10, upper: 30, tmin: 12, tmax: 28 });
    expect(d.nextTminFallback).toBe(true);
    expect(s.nextTminFallback).toBe(false);
    expect(d.degreeDays).toBeCloseTo(s.degreeDays, 12);
  });
  it('when the day is entirely below the lower threshold, then degree-days are 0 (common practice)', () => {
    for (const method of DEGREE_DAY_METHODS) expect(degreeDays({ method, lower: 10, upper: 30, tmin: 2, tmax: 9 }).degreeDays).toBe(0);
  });
  it('when lower is not below upper, then it throws a RangeError', () => {
    expect(() => degreeDays({ method: 'single-sine', lower: 30, upper: 10, tmin: 2, tmax: 9 })).toThrow(RangeError);
  });
});

// Property tests (common practice: invariants of the method definitions).
const temp = fc.double({ min: -30, max: 50, noNaN: true });
const day = fc
  .tuple(temp, temp, temp, fc.double({ min: -5, max: 20, noNaN: true }), fc.double({ min: 1, max: 30, noNaN: true }))
  .map(([a, b, next, lower, width]) => ({ tmin: Math.min(a, b), tmax: Math.max(a, b), tminNext: next, lower, upper: lower + width }));
const curveMethods = ['single-sine', 'double-sine', 'single-triangle', 'double-triangle', 'average-clamped'] as const;

describe('degree-days: properties (fast-check)', () => {
  it('when any day is computed by any method and cutoff, then degree-days are never negative', () => {
    fc.assert(
      fc.property(day, fc.constantFrom(...DEGREE_DAY_METHODS), fc.constantFrom('horizontal', 'vertical', 'intermediate' as const), (d, method, cutoff) => {
        expect(degreeDays({ method, cutoff, ...d }).degreeDays).toBeGreaterThanOrEqual(0);
      }),
    );
  });
  it('when the cutoff is horizontal, then sine, triangle and average-clamped never exceed upper − lower (plain average has no upper cap by definition)', () => {
    fc.assert(
      fc.property(day, fc.constantFrom(...curveMethods), (d, method) => {
        expectAtMost(degreeDays({ method, cutoff: 'horizontal', ...d }).degreeDays, d.upper - d.lower);
      }),
    );
  });
  it('when vertical or intermediate cutoffs are used, then they never exceed the horizontal result', () => {
    fc.assert(
      fc.property(day, fc.constantFrom('single-sine', 'double-sine', 'single-triangle', 'double-triangle' as const), (d, method) => {
        const h = degreeDays({ method, cutoff: 'horizontal', ...d }).degreeDays;
        expectAtMost(degreeDays({ method, cutoff: 'vertical', ...d }).degreeDays, h);
        expectAtMost(degreeDays({ method, cutoff: 'intermediate', ...d }).degreeDays, h);
      }),
    );
  });
  it('when tomorrow\'s Tmin equals today\'s, then each double method equals its single method', () => {
    fc.assert(
      fc.property(day, fc.constantFrom('horizontal', 'vertical', 'intermediate' as const), (d, cutoff) => {
        const x = { ...d, cutoff, tminNext: d.tmin };
        expectClose(degreeDays({ ...x, method: 'double-sine' }).degreeDays, degreeDays({ ...x, method: 'single-sine' }).degreeDays);
        expectClose(degreeDays({ ...x, method: 'double-triangle' }).degreeDays, degreeDays({ ...x, method: 'single-triangle' }).degreeDays);
      }),
    );
  });
});
