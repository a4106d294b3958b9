import { describe, expect, it } from 'vitest';
import { aggregateLarvalIndices, larvalIndices } from '../../shared/signals';

// Definitions: WHO (House, Container, Breteau indices; CHECK-VALUES.md "Larval indices");
// Pupa index = pupae per 100 houses, common practice (pupal surveys, Focks & Chadee 1997 [memory]).

describe('larvalIndices', () => {
  it('when 200 houses (30 positive) and 600 containers (45 positive) are inspected, then HI 15, CI 7.5, BI 22.5 (CHECK-VALUES) [derived]', () => {
    // HI = 100·30/200 = 15; CI = 100·45/600 = 7.5; BI = 100·45/200 = 22.5
    const r = larvalIndices({ housesInspected: 200, housesPositive: 30, containersInspected: 600, containersPositive: 45 });
    expect(r).toEqual({ house: 15, container: 7.5, breteau: 22.5, pupa: null });
  });

  it('when 90 pupae are counted in the same 200 houses, then the pupa index is 45 [derived]', () => {
    // PI = 100·90/200 = 45
    const r = larvalIndices({
      housesInspected: 200,
      housesPositive: 30,
      containersInspected: 600,
      containersPositive: 45,
      pupae: 90,
    });
    expect(r.pupa).toBe(45);
  });

  it('when positive containers outnumber houses, then the Breteau index exceeds 100 [derived]', () => {
    // 10 houses, 8 positive, 15 positive containers → BI = 100·15/10 = 150
    expect(
      larvalIndices({ housesInspected: 10, housesPositive: 8, containersInspected: 40, containersPositive: 15 }).breteau,
    ).toBe(150);
  });

  it('when nothing was inspected, then every index is null, not NaN', () => {
    expect(larvalIndices({ housesInspected: 0, housesPositive: 0, containersInspected: 0, containersPositive: 0, pupae: 0 })).toEqual({
      house: null,
      container: null,
      breteau: null,
      pupa: null,
    });
  });

  it('when houses were inspected but no water-holding container was found, then only the container index is null', () => {
    expect(larvalIndices({ housesInspected: 20, housesPositive: 0, containersInspected: 0, containersPositive: 0 })).toEqual({
      house: 0,
      container: null,
      breteau: 0,
      pupa: null,
    });
  });

  it('when positives exceed inspected or the counts contradict each other, then it throws', () => {
    const ok = { housesInspected: 10, housesPositive: 2, containersInspected: 30, containersPositive: 3 };
    expect(() => larvalIndices({ ...ok, housesPositive: 11 })).toThrow(/houses inspected/);
    expect(() => larvalIndices({ ...ok, containersPositive: 31 })).toThrow(/containers inspected/);
    expect(() => larvalIndices({ ...ok, containersPositive: 1 })).toThrow(/positive container/);
    expect(() => larvalIndices({ ...ok, housesPositive: 0 })).toThrow(/no positive house/);
    expect(() => larvalIndices({ ...ok, housesInspected: 2.5 })).toThrow();
    expect(() => larvalIndices({ ...ok, pupae: -1 })).toThrow();
  });
});

describe('aggregateLarvalIndices (sum the counts, then compute)', () => {
  const a = { housesInspected: 50, housesPositive: 20, containersInspected: 100, containersPositive: 25, pupae: 30 };
  const b = { housesInspected: 150, housesPositive: 10, containersInspected: 500, containersPositive: 20, pupae: 60 };

  it('when two surveys of a district-week are pooled, then the indices come from the summed counts [derived]', () => {
    // sums: 200 houses, 30 positive, 600 containers, 45 positive, 90 pupae → HI 15, CI 7.5, BI 22.5, PI 45.
    // (Averaging the surveys' house indices, (40 + 6.667)/2 = 23.3, would weigh 50 houses like 150.)
    expect(aggregateLarvalIndices([a, b])).toEqual({ house: 15, container: 7.5, breteau: 22.5, pupa: 45, surveys: 2, pupaSurveys: 2 });
  });

  it('when one survey did not count pupae (left out or null), then the pupa index pools the surveys that did and says how many', () => {
    const { pupae: _dropped, ...bWithoutPupae } = b;
    // Only survey a counted pupae: 30 pupae in its 50 houses → PI 60 [derived]; the other indices pool both.
    for (const other of [bWithoutPupae, { ...b, pupae: null }]) {
      const r = aggregateLarvalIndices([a, other]);
      expect(r.pupa).toBe(60);
      expect(r.pupaSurveys).toBe(1);
      expect(r.surveys).toBe(2);
      expect(r.house).toBe(15);
    }
    expect(aggregateLarvalIndices([{ ...a, pupae: null }, bWithoutPupae])).toMatchObject({ pupa: null, pupaSurveys: 0 });
    expect(larvalIndices({ ...a, pupae: null }).pupa).toBeNull();
  });

  it('when there is no survey or one survey is invalid, then it throws', () => {
    expect(() => aggregateLarvalIndices([])).toThrow();
    expect(() => aggregateLarvalIndices([a, { ...b, housesPositive: 151 }])).toThrow();
  });
});
