import { describe, expect, it } from 'vitest';
import { studentTTwoSided } from '../../shared/signals';

// Reference: NIST/SEMATECH e-Handbook of Statistical Methods, §1.3.6.7.2 "Critical values of the
// Student's t distribution", upper-tail column 0.025 (= two-sided 95 %) and 0.05 (= two-sided 90 %),
// three decimals [pub, read in a transcription of that table]. The same figures are in Fisher & Yates,
// Statistical Tables for Biological, Agricultural and Medical Research, Table III [memory].
const TABLE_95: Array<[df: number, t: number]> = [
  [1, 12.706],
  [2, 4.303],
  [3, 3.182],
  [4, 2.776],
  [5, 2.571],
  [6, 2.447],
  [7, 2.365],
  [10, 2.228],
  [30, 2.042],
];

describe('studentTTwoSided', () => {
  it.each(TABLE_95)('when df is %i at 95 %% two-sided, then t matches the NIST table (%f)', (df, t) => {
    expect(studentTTwoSided(df)).toBeCloseTo(t, 3);
  });

  it('when the level is 90 %, then df 4 gives 2.132 and df 6 gives 1.943 (NIST table, column 0.05) [pub]', () => {
    expect(studentTTwoSided(4, 0.9)).toBeCloseTo(2.132, 3);
    expect(studentTTwoSided(6, 0.9)).toBeCloseTo(1.943, 3);
  });

  it('when df grows large, then t approaches the normal 1.960 from above (NIST table, row ∞) [pub]', () => {
    const t = studentTTwoSided(1000);
    expect(t).toBeGreaterThan(1.96);
    expect(t).toBeCloseTo(1.962, 3); // the table's df 1000 row gives 1.962 [pub]
  });

  it('when df is 2, then t equals the closed form √(2p²/(1 − p²)) with p = 0.95 [derived]', () => {
    // For ν = 2, P(|T| ≤ t) = t / √(t² + 2) (Abramowitz & Stegun 1964, 26.7.4 with one term):
    // solving 0.95 = t/√(t²+2) gives t² = 2·0.9025/0.0975 = 18.5128…, t = 4.30265.
    expect(studentTTwoSided(2)).toBeCloseTo(Math.sqrt((2 * 0.9025) / 0.0975), 10);
  });

  it('when df is not a positive integer or the level is outside (0, 1), then it throws', () => {
    expect(() => studentTTwoSided(0)).toThrow(RangeError);
    expect(() => studentTTwoSided(2.5)).toThrow(RangeError);
    expect(() => studentTTwoSided(4, 1)).toThrow(RangeError);
  });
});
