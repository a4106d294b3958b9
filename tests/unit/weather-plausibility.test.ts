import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  dayOfYear, doyDistance, heldReason, judge, MAD_CONSTANT, modifiedZ, MODIFIED_Z_LIMIT, otherUnitReading, robustStats,
} from '../../shared/weather/plausibility';

const stats = (values: number[]) => robustStats(Float64Array.from(values), values.length);

describe('the plausibility statistics', () => {
  // Iglewicz & Hoaglin 1993, "How to Detect and Handle Outliers" (ASQC Basic References in Quality Control
  // vol. 16), §3.3: Mi = 0.6745 (xi − x̃) / MAD, potential outliers |Mi| > 3.5.
  it('when the sample is 2, 3, 3, 4, 4, 5, 100, then the median is 4, the MAD 1, and 100 is an outlier while 5 is not', () => {
    const s = stats([2, 3, 3, 4, 4, 5, 100]);
    expect(s).toEqual({ median: 4, mad: 1, n: 7 });
    expect(modifiedZ(100, s, 0)).toBeCloseTo(MAD_CONSTANT * 96, 10);
    expect(Math.abs(modifiedZ(100, s, 0))).toBeGreaterThan(MODIFIED_Z_LIMIT);
    expect(Math.abs(modifiedZ(5, s, 0))).toBeLessThan(MODIFIED_Z_LIMIT);
  });

  it('when any sample is given, then the in-place selection gives the same median and MAD as sorting', () => {
    const sorted = (v: number[]) => [...v].sort((a, b) => a - b);
    const med = (v: number[]) => {
      const s = sorted(v);
      return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
    };
    fc.assert(
      fc.property(fc.array(fc.integer({ min: -400, max: 400 }).map((x) => x / 4), { minLength: 1, maxLength: 80 }), (v) => {
        const m = med(v);
        expect(stats(v)).toEqual({ median: m, mad: med(v.map((x) => Math.abs(x - m))), n: v.length });
      }),
      { numRuns: 500 },
    );
  });

  it('when the sample has an even count, then the median is the mean of the middle two', () => {
    expect(stats([1, 2, 3, 10]).median).toBe(2.5);
  });

  it('when the values are all equal, then the MAD floor keeps an ordinary change plausible', () => {
    const s = stats(Array.from({ length: 40 }, () => 20));
    expect(s.mad).toBe(0);
    expect(judge(22, s, 'temperature', 'C').implausible).toBe(false); // 0.6745 × 2 / 1 = 1.35 (floor 1 °C, derived)
    expect(judge(30, s, 'temperature', 'C').implausible).toBe(true);
  });

  // (°F − 32) × 5/9 = °C: the definition of the Fahrenheit scale.
  it('when a December value at a cold station is 59 in a °C upload, then it is implausible and fits as °F (15 °C)', () => {
    const december = stats(Array.from({ length: 93 }, (_, i) => 14 + (i % 5) - 2)); // about 12–16 °C
    const v = judge(59, december, 'temperature', 'C');
    expect(v.implausible).toBe(true);
    expect(v.alternative).toBe(15);
    expect(heldReason([{ column: 'tmax', value: 59, median: 14, mad: 1, z: v.z, n: 93, basis: 'station', alternative: v.alternative }], 'C')).toBe('looks_fahrenheit');
    expect(otherUnitReading(15, 'F')).toBe(59);
  });

  it('when an implausible value does not fit the other unit either, then the reason names the basis of the check', () => {
    const s = stats(Array.from({ length: 60 }, (_, i) => 25 + (i % 3)));
    const v = judge(45, s, 'temperature', 'C');
    expect(v).toMatchObject({ implausible: true, alternative: null });
    expect(heldReason([{ column: 'tmax', value: 45, median: 26, mad: 1, z: v.z, n: 60, basis: 'neighbours', alternative: null }], 'C')).toBe('unlike_neighbours');
  });

  it('when days are counted across the new year, then 30 December and 2 January are 3 days apart', () => {
    const dec30 = Date.UTC(2025, 11, 30) / 86_400_000;
    const jan2 = Date.UTC(2026, 0, 1) / 86_400_000 + 1;
    expect(dayOfYear(jan2)).toBe(1);
    expect(doyDistance(dayOfYear(dec30), dayOfYear(jan2))).toBeCloseTo(3.25, 5); // on a 365.25-day year
  });
});
