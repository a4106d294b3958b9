import { describe, expect, it } from 'vitest';
import { doublingTime, growthSeries, incidencePer100k, logLinearGrowth, weekOnWeekGrowth } from '../../shared/signals';

// Growth ratio, percent change and doubling time ln 2 / ln r: common practice (exponential growth).

describe('weekOnWeekGrowth and doublingTime', () => {
  it('when 20 cases are followed by 30, then ratio 1.5, +50 % and doubling in 1.7095 weeks [derived]', () => {
    // 30/20 = 1.5; (1.5 − 1)·100 = 50; ln 2 / ln 1.5 = 0.693147/0.405465 = 1.709511
    const g = weekOnWeekGrowth(20, 30);
    expect(g.ratio).toBe(1.5);
    expect(g.percent).toBe(50);
    expect(g.doublingWeeks).toBeCloseTo(1.709511, 5);
  });

  it('when cases double in a week, then the doubling time is 1 week [derived]', () => {
    expect(doublingTime(2)).toBeCloseTo(1, 12);
  });

  it('when cases fall or stay level, then percent is ≤ 0 and there is no doubling time', () => {
    expect(weekOnWeekGrowth(40, 30)).toEqual({ ratio: 0.75, percent: -25, doublingWeeks: null });
    expect(weekOnWeekGrowth(30, 30).doublingWeeks).toBeNull();
  });

  it('when the earlier week had zero cases, then ratio, percent and doubling time are null (not Infinity)', () => {
    expect(weekOnWeekGrowth(0, 5)).toEqual({ ratio: null, percent: null, doublingWeeks: null });
  });

  it('when a series is given, then the first week is null and each later week compares with the one before', () => {
    const s = growthSeries([10, 20, 10]);
    expect(s[0].ratio).toBeNull();
    expect(s[1].ratio).toBe(2);
    expect(s[2].percent).toBe(-50);
  });
});

describe('logLinearGrowth (least-squares fit of ln count on week)', () => {
  it('when counts are 10, 20, 40, then the slope is ln 2 and doubling is 1 week [derived]', () => {
    const f = logLinearGrowth([10, 20, 40]);
    expect(f.slope).toBeCloseTo(Math.LN2, 12);
    expect(f.ratio).toBeCloseTo(2, 12);
    expect(f.doublingWeeks).toBeCloseTo(1, 12);
  });

  it('when counts are 10, 12, 18, 20, then the slope is 0.24849 and doubling 2.789 weeks [derived]', () => {
    // ln counts 2.302585, 2.484907, 2.890372, 2.995732; x = 0..3, x̄ = 1.5, Sxx = 5
    // Sxy = −1.5·2.302585 − 0.5·2.484907 + 0.5·2.890372 + 1.5·2.995732 = 1.242453
    // slope = 1.242453/5 = 0.248491; doubling = 0.693147/0.248491 = 2.789
    const f = logLinearGrowth([10, 12, 18, 20]);
    expect(f.slope).toBeCloseTo(0.248491, 5);
    expect(f.doublingWeeks).toBeCloseTo(2.7894, 3);
  });

  it('when a count is zero or there is one week only, then it throws; a falling series has no doubling time', () => {
    expect(() => logLinearGrowth([0, 2, 4])).toThrow();
    expect(() => logLinearGrowth([3])).toThrow();
    expect(logLinearGrowth([40, 20, 10]).doublingWeeks).toBeNull();
  });
});

describe('incidencePer100k (count / population · 100,000; common practice)', () => {
  it('when 45 cases occur in 250,000 people, then the incidence is 18 per 100,000 [derived]', () => {
    // 45 / 250000 · 100000 = 18
    expect(incidencePer100k(45, 250_000)).toBe(18);
  });

  it('when 1 case occurs in 3,000 people, then the incidence is 33.33 per 100,000 [derived]', () => {
    expect(incidencePer100k(1, 3000)).toBeCloseTo(33.3333, 4);
  });

  it('when the population is zero, then the incidence is null; a negative count throws', () => {
    expect(incidencePer100k(3, 0)).toBeNull();
    expect(() => incidencePer100k(-1, 100)).toThrow();
    expect(() => incidencePer100k(1, 10.5)).toThrow();
  });
});
