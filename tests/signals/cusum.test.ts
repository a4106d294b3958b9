import { describe, expect, it } from 'vitest';
import { cusum } from '../../shared/signals';

// Method: Page 1954, "Continuous inspection schemes", Biometrika 41:100–115 [memory for the pages], in
// the standardised upper form S_t = max(0, S_{t−1} + (x_t − μ)/σ − k) given in CHECK-VALUES.md;
// k = 0.5 and h = 4 are common practice.

describe('cusum', () => {
  it('when μ 3, σ 1, k 0.5, h 4 and the series is 3, 5, 6, 2, 7, 8, then S is 0, 1.5, 4, 2.5, 6, 10.5 [derived]', () => {
    // z = x − 3:      0,   2,   3,  −1,   4,    5
    // S = max(0, S + z − 0.5):
    //   max(0, 0 + 0 − 0.5) = 0; 0 + 2 − 0.5 = 1.5; 1.5 + 3 − 0.5 = 4; 4 − 1 − 0.5 = 2.5;
    //   2.5 + 4 − 0.5 = 6; 6 + 5 − 0.5 = 10.5
    // alarm when S > 4: week 2 (S = 4 exactly) does not alarm
    const r = cusum({ series: [3, 5, 6, 2, 7, 8], mean: 3, sd: 1, k: 0.5, h: 4 });
    expect(r.statistic).toEqual([0, 1.5, 4, 2.5, 6, 10.5]);
    expect(r.alarm).toEqual([false, false, false, false, true, true]);
  });

  it('when σ is 2, then each step is standardised by it [derived]', () => {
    // μ 10, σ 2, k 0.5: x 14 → z 2 → S 1.5; x 16 → z 3 → S 4; x 6 → z −2 → S 1.5
    const r = cusum({ series: [14, 16, 6], mean: 10, sd: 2, k: 0.5, h: 5 });
    expect(r.statistic).toEqual([1.5, 4, 1.5]);
    expect(r.alarm).toEqual([false, false, false]);
  });

  it('when the series stays under the mean, then S stays at 0', () => {
    expect(cusum({ series: [1, 0, 2], mean: 3, sd: 1, k: 0.5, h: 4 }).statistic).toEqual([0, 0, 0]);
  });

  // Restart after an alarm: common practice once a signal has been acted on (Montgomery, Introduction
  // to Statistical Quality Control, the CUSUM chapter on the tabular CUSUM [from memory, not checked
  // against the page]). The values below are derived by hand.
  it('when cases rise then fall and restart is on, then S restarts at 0 after the alarm and the alarm ends as cases fall [derived]', () => {
    // μ 0, σ 1, k 0.5, h 4; z = 0, 2, 3, 4, 2, 1, 0, 0, −1, 0
    // with restart: 0; 1.5; 4; 7.5 (alarm, then S := 0); 0 + 2 − 0.5 = 1.5; 1.5 + 1 − 0.5 = 2;
    //   2 − 0.5 = 1.5; 1.5 − 0.5 = 1; max(0, 1 − 1.5) = 0; 0
    // without: 0, 1.5, 4, 7.5, 9, 9.5, 9, 8.5, 7, 6.5 — alarm in every week from the fourth on
    const series = [0, 2, 3, 4, 2, 1, 0, 0, -1, 0];
    const r = cusum({ series, mean: 0, sd: 1, k: 0.5, h: 4, restart: true });
    expect(r.statistic).toEqual([0, 1.5, 4, 7.5, 1.5, 2, 1.5, 1, 0, 0]);
    expect(r.alarm).toEqual([false, false, false, true, false, false, false, false, false, false]);
    const plain = cusum({ series, mean: 0, sd: 1, k: 0.5, h: 4 });
    expect(plain.statistic).toEqual([0, 1.5, 4, 7.5, 9, 9.5, 9, 8.5, 7, 6.5]);
    expect(plain.alarm.filter(Boolean)).toHaveLength(7);
  });

  it('when restart is on and the excess stays, then the alarm comes again once S passes h anew [derived]', () => {
    // the first check series with restart: 0, 1.5, 4, 2.5, 6 (alarm, S := 0), 0 + 5 − 0.5 = 4.5 (alarm)
    const r = cusum({ series: [3, 5, 6, 2, 7, 8], mean: 3, sd: 1, k: 0.5, h: 4, restart: true });
    expect(r.statistic).toEqual([0, 1.5, 4, 2.5, 6, 4.5]);
    expect(r.alarm).toEqual([false, false, false, false, true, true]);
  });

  it('when σ is zero or h is not positive, then it throws', () => {
    expect(() => cusum({ series: [1], mean: 3, sd: 0, k: 0.5, h: 4 })).toThrow();
    expect(() => cusum({ series: [1], mean: 3, sd: 1, k: 0.5, h: 0 })).toThrow();
  });
});
