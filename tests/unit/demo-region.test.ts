import { describe, expect, it } from 'vitest';
import { booleanPointInPolygon, centroid } from '@turf/turf';
import { buildDemoRegion, DEMO_USERS } from '../../sample/demo-region';

describe('the invented demo region', () => {
  it('when built twice from the seed, then it is the same twelve districts between 24° and 34° N', () => {
    const a = buildDemoRegion();
    expect(a).toEqual(buildDemoRegion());
    expect(a).toHaveLength(12);
    for (const d of a) {
      for (const [, lat] of d.boundary.coordinates[0] as number[][]) {
        expect(lat).toBeGreaterThanOrEqual(24);
        expect(lat).toBeLessThanOrEqual(34);
      }
      expect(booleanPointInPolygon(centroid(d.boundary as never), d.boundary as never)).toBe(true);
    }
    expect(new Set(a.map((d) => d.zone))).toEqual(new Set(['coast', 'valley', 'plateau', 'highlands']));
  });

  it('when the demo users are listed, then there is one per role', () => {
    expect(new Set(DEMO_USERS.map((u) => u.role)).size).toBe(5);
  });
});
