import { describe, expect, it } from 'vitest';
import { aberration, c1, c2, c3, summariseBaseline } from '../../shared/signals';

// Method: Hutwagner, Thompson, Seeman & Treadwell 2003, J. Urban Health 80(Suppl 1):i89–i96 (C1, C2, C3).
// Check values: shared reference CHECK-VALUES.md "Case thresholds" [derived], and hand computations below.

// A series built from the 7-week pattern 2, 3, 4, 3, 2, 3, 4: any 7 consecutive weeks of weeks 0–8
// hold the same values in another order, so every baseline inside them has mean 3 and SD 0.816497.
const PATTERN = [2, 3, 4, 3, 2, 3, 4, 2, 3];
const SERIES = [...PATTERN, 4, 5, 6]; // weeks 9, 10, 11 rise

describe('summariseBaseline', () => {
  it('when the baseline is 2, 3, 4, 3, 2, 3, 4, then mean 3, SD 0.8165 and threshold 5.449 (CHECK-VALUES) [derived]', () => {
    // mean 21/7 = 3; squares of deviations 1+0+1+0+1+0+1 = 4; 4/6 = 0.666667; SD 0.816497;
    // threshold = 3 + 3·0.816497 = 5.449490
    const b = summariseBaseline([2, 3, 4, 3, 2, 3, 4]);
    expect(b.mean).toBe(3);
    expect(b.sd).toBeCloseTo(0.8165, 4);
    expect(b.threshold).toBeCloseTo(5.449, 3);
  });

  it('when the baseline is flat, then the SD used is the floor and the threshold is mean + 3·floor (product rule)', () => {
    const b = summariseBaseline([4, 4, 4, 4, 4, 4, 4]);
    expect(b.sd).toBe(0);
    expect(b.sdUsed).toBe(0.5);
    expect(b.threshold).toBe(5.5);
  });
});

describe('C1 (baseline: the 7 preceding weeks)', () => {
  it('when the CHECK-VALUES baseline is followed by 6, then the statistic is 3.674 and the week alarms [derived]', () => {
    // (6 − 3) / 0.816497 = 3.674235 > 3; week 8: baseline 3,4,3,2,3,4,6 has mean 25/7 = 3.571429,
    // squares (−4/7)²+(3/7)²+(−4/7)²+(−11/7)²+(−4/7)²+(3/7)²+(17/7)² = 476/49, /6 = 1.619048, SD 1.272418,
    // (3 − 3.571429)/1.272418 = −0.449089
    const r = c1([2, 3, 4, 3, 2, 3, 4, 6, 3]);
    expect(r.statistic.slice(0, 7)).toEqual(Array(7).fill(null));
    expect(r.alarm.slice(0, 7)).toEqual(Array(7).fill(null));
    expect(r.statistic[7]).toBeCloseTo(3.674235, 5);
    expect(r.statistic[8]).toBeCloseTo(-0.449089, 5);
    expect(r.alarm.slice(7)).toEqual([true, false]);
  });

  it('when 5 follows the baseline, then 5 < 5.449 and no alarm; 5.5 would be over the threshold [derived]', () => {
    expect(c1([2, 3, 4, 3, 2, 3, 4, 5]).alarm[7]).toBe(false);
    expect(c1([2, 3, 4, 3, 2, 3, 4, 5.5]).alarm[7]).toBe(true);
  });

  it('when run on the rising series, then weeks 7–11 give −1.2247, 0, 1.2247, 2.4495, 2.4394 [derived]', () => {
    // weeks 7–10: baseline mean 3, SD 0.816497 → (2−3), (3−3), (4−3), (5−3) over 0.816497.
    // week 11: baseline 2,3,4,2,3,4,5: mean 23/7; squares (81+4+25+81+4+25+144)/49 = 364/49;
    // /6 = 1.238095; SD 1.112697; (6 − 23/7)/1.112697 = 2.714286/1.112697 = 2.439375
    const r = c1(SERIES);
    const expected = [-1.224745, 0, 1.224745, 2.44949, 2.439375];
    expected.forEach((v, i) => expect(r.statistic[7 + i]).toBeCloseTo(v, 5));
    expect(r.alarm.slice(7)).toEqual([false, false, false, false, false]);
  });
});

describe('C2 (baseline: the 7 weeks ending 3 weeks before; a 2-week gap)', () => {
  it('when run on the rising series, then weeks 9–11 give 1.2247, 2.4495, 3.6742 and only week 11 alarms [derived]', () => {
    // baselines weeks 0–6, 1–7, 2–8: mean 3, SD 0.816497 each; (4−3), (5−3), (6−3) over 0.816497
    const r = c2(SERIES);
    expect(r.statistic.slice(0, 9)).toEqual(Array(9).fill(null));
    expect(r.statistic[9]).toBeCloseTo(1.224745, 5);
    expect(r.statistic[10]).toBeCloseTo(2.44949, 5);
    expect(r.statistic[11]).toBeCloseTo(3.674235, 5);
    expect(r.alarm.slice(9)).toEqual([false, false, true]);
  });

  it('when the spike sits in the 2-week gap, then it does not enter the baseline of the week after [derived]', () => {
    // week 9 = 20 would sit in C1's baseline of week 10 but not in C2's (weeks 1–7), which stays at mean 3
    const series = [...PATTERN, 20, 5];
    expect(c2(series).statistic[10]).toBeCloseTo(2.44949, 5);
  });
});

describe('C3 (Σ max(0, C2 − 1) over the current and 2 preceding weeks)', () => {
  it('when run on the rising series, then week 11 sums to 4.348 and alarms; earlier weeks are null [derived]', () => {
    // max(0, 1.224745 − 1) + max(0, 2.449490 − 1) + max(0, 3.674235 − 1)
    //   = 0.224745 + 1.449490 + 2.674235 = 4.348469 > 2
    const r = c3(SERIES);
    expect(r.statistic.slice(0, 11)).toEqual(Array(11).fill(null));
    expect(r.statistic[11]).toBeCloseTo(4.348469, 5);
    expect(r.alarm[11]).toBe(true);
  });

  it('when the last three C2 values are at most 1, then C3 is 0 and does not alarm [derived]', () => {
    // weeks 9–11 = 3, 3, 3: C2 = 0, 0, 0 → 0
    const r = c3([...PATTERN, 3, 3, 3]);
    expect(r.statistic[11]).toBe(0);
    expect(r.alarm[11]).toBe(false);
  });

  it('when C2 is 1.2247, 2.4495, 2.4495, then C3 = 0.2247 + 1.4495 + 1.4495 = 3.124 [derived]', () => {
    expect(c3([...PATTERN, 4, 5, 5]).statistic[11]).toBeCloseTo(3.123724, 5);
  });
});

describe('zero SD (product rule: SD used = max(sample SD, 0.5 cases))', () => {
  it('when seven weeks of zero are followed by 1 and 2, then C1 is 2 (no alarm) and 3.714 (alarm) [derived]', () => {
    // week 7: baseline all 0, SD 0 → floor 0.5: (1 − 0)/0.5 = 2
    // week 8: baseline six 0s and a 1: mean 1/7, SD √((6/49 + 36/49)/6) = √(1/7) = 0.377964 < 0.5 → 0.5:
    //         (2 − 0.142857)/0.5 = 3.714286
    const r = c1([0, 0, 0, 0, 0, 0, 0, 1, 2]);
    expect(r.statistic[7]).toBe(2);
    expect(r.statistic[8]).toBeCloseTo(3.714286, 5);
    expect(r.alarm.slice(7)).toEqual([false, true]);
  });

  it('when the week equals a flat baseline, then the statistic is 0 and everything stays JSON-safe', () => {
    const r = c1([5, 5, 5, 5, 5, 5, 5, 5]);
    expect(r.statistic[7]).toBe(0);
    expect(JSON.parse(JSON.stringify(r))).toEqual(r);
  });

  it('when a larger floor is passed, then it is used instead', () => {
    expect(c1([0, 0, 0, 0, 0, 0, 0, 4], { sdFloor: 2 }).statistic[7]).toBe(2);
    expect(() => c1([0, 0, 0, 0, 0, 0, 0, 4], { sdFloor: 0 })).toThrow();
  });
});

describe('aberration (by name) and input checks', () => {
  it('when called by name, then it gives the same result as the named function', () => {
    expect(aberration('c1', SERIES)).toEqual(c1(SERIES));
    expect(aberration('c2', SERIES)).toEqual(c2(SERIES));
    expect(aberration('c3', SERIES)).toEqual(c3(SERIES));
  });

  it('when the series is shorter than a baseline, then every entry is null', () => {
    expect(c1([1, 2, 3])).toEqual({ statistic: [null, null, null], alarm: [null, null, null] });
    expect(c1([])).toEqual({ statistic: [], alarm: [] });
  });

  it('when the series holds a non-finite number, then it throws', () => {
    expect(() => c1([1, 2, Number.POSITIVE_INFINITY])).toThrow();
  });
});
