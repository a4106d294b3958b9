import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { changedDriver, computeTier, DEFAULT_TIER_SETTINGS as S, tierOf, tierSettingsSchema, type TierInputs } from '../../shared/tier';

// The tier is Broodcast's own documented rule (docs/tier.md), not a published index: these worked
// cases are computed by hand from that rule.
const full: TierInputs = {
  climate: { rvc14: 0.8, seasonOpen: true },
  vectorClock: { eipShare: 1, generationsRatio: 1 },
  larval: { breteau: 25, house: 10 },
  cases: { zone: 'above', aberrationAlarm: true, growthRatio: 1.4, cases: 40 },
  weatherAgeDays: 1,
  caseAgeWeeks: 1,
};

describe('tier', () => {
  it('when every driver has data, then the score is the weighted mean of the driver scores (hand-computed)', () => {
    // climate 0.8; vector clock (1 + 0.5)/2 = 0.75; larval 25/50 = 0.5; cases 0.6·1 + 0.25·1 + 0.15·0.4 = 0.91
    // score = 0.3·0.8 + 0.2·0.75 + 0.15·0.5 + 0.35·0.91 = 0.24 + 0.15 + 0.075 + 0.3185 = 0.7835 → critical
    const r = computeTier(full, S);
    expect(r.score).toBeCloseTo(0.7835, 4);
    expect(r.tier).toBe('critical');
    expect(r.confidence).toBe('ok');
    expect(r.leadingDriver).toBe('cases');
    expect(r.drivers.map((d) => d.score)).toEqual([0.8, 0.75, 0.5, 0.91]);
  });

  it('when larval data is missing, then its weight is shared among the others and a note says so', () => {
    // (0.24 + 0.15 + 0.3185) / 0.85 = 0.8335
    const r = computeTier({ ...full, larval: { breteau: null, house: null } }, S);
    expect(r.score).toBeCloseTo(0.8335, 3);
    expect(r.drivers.find((d) => d.id === 'larval')!.contribution).toBe(0);
    expect(r.notes.join(' ')).toMatch(/Larval indices: no data/);
  });

  it('when the season window is closed, then climate scores 0 whatever the vectorial capacity', () => {
    const r = computeTier({ ...full, climate: { rvc14: 0.9, seasonOpen: false } }, S);
    expect(r.drivers[0].score).toBe(0);
  });

  it('when the weather is older than the setting or absent, then the tier is marked stale', () => {
    expect(computeTier({ ...full, weatherAgeDays: 10 }, S).confidence).toBe('stale');
    expect(computeTier({ ...full, weatherAgeDays: null }, S).notes).toContain('No weather for this district.');
  });

  it('when no driver has data, then the confidence is insufficient and the tier is baseline', () => {
    const r = computeTier({
      climate: { rvc14: null, seasonOpen: null }, vectorClock: { eipShare: null, generationsRatio: null },
      larval: { breteau: null, house: null }, cases: { zone: null, aberrationAlarm: null, growthRatio: null, cases: null },
      weatherAgeDays: null, caseAgeWeeks: null,
    }, S);
    expect(r.confidence).toBe('insufficient');
    expect(r.tier).toBe('baseline');
  });

  it('when scores sit on the cut points, then each cut belongs to the higher tier', () => {
    expect([0.2499, 0.25, 0.5, 0.75].map((x) => tierOf(x, S))).toEqual(['baseline', 'raised', 'high', 'critical']);
  });

  it('when the cases driver moved most since last week, then it is named as the change', () => {
    const now = computeTier(full, S).drivers;
    const before = computeTier({ ...full, cases: { zone: 'within', aberrationAlarm: false, growthRatio: 1, cases: 10 } }, S).drivers;
    expect(changedDriver(now, before)).toBe('cases');
    expect(changedDriver(now, now)).toBeNull();
  });

  it('when settings have falling cut points or no weight, then the schema refuses them', () => {
    expect(tierSettingsSchema.safeParse({ ...S, cuts: { raised: 0.6, high: 0.5, critical: 0.75 } }).success).toBe(false);
    expect(tierSettingsSchema.safeParse({ ...S, weights: { climate: 0, vectorClock: 0, larval: 0, cases: 0 } }).success).toBe(false);
    expect(tierSettingsSchema.safeParse(S).success).toBe(true);
  });

  it('when inputs vary at random, then the score stays within 0–1 and contributions add up to it (property)', () => {
    const maybe = <T>(a: fc.Arbitrary<T>) => fc.option(a, { nil: null });
    fc.assert(fc.property(
      maybe(fc.double({ min: 0, max: 2, noNaN: true })), maybe(fc.boolean()), maybe(fc.double({ min: 0, max: 3, noNaN: true })),
      maybe(fc.double({ min: 0, max: 200, noNaN: true })), maybe(fc.constantFrom('below', 'within', 'above' as const)),
      maybe(fc.boolean()), maybe(fc.double({ min: 0, max: 5, noNaN: true })),
      (rvc, open, gen, bi, zone, alarm, growth) => {
        const r = computeTier({
          climate: { rvc14: rvc, seasonOpen: open }, vectorClock: { eipShare: rvc, generationsRatio: gen },
          larval: { breteau: bi, house: null }, cases: { zone, aberrationAlarm: alarm, growthRatio: growth, cases: null },
          weatherAgeDays: 0, caseAgeWeeks: 0,
        }, S);
        expect(r.score).toBeGreaterThanOrEqual(0);
        expect(r.score).toBeLessThanOrEqual(1);
        expect(Math.abs(r.drivers.reduce((a, d) => a + d.contribution, 0) - r.score)).toBeLessThan(0.001);
      }), { numRuns: 500 });
  });
});
