import { describe, expect, it } from 'vitest';
import { booleanPointInPolygon, centroid } from '@turf/turf';
import { buildDemoRegion, DEMO_USERS } from '../../sample/demo-region';
import { buildDemoStations, STATION_SUFFIXES } from '../../sample/demo-stations';

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

  it('when the demo stations are built, then each code names the district it stands in and each name fits its ground and elevation', () => {
    // Issue 21: HVS-06 stood in HV-05 and a "Harbour" stood at 1,022 m. The invented geography now agrees with itself.
    const region = buildDemoRegion();
    const stations = buildDemoStations();
    expect(stations.map((s) => s.code)).toEqual(['HVS-01', 'HVS-01B', 'HVS-02', 'HVS-03', 'HVS-04', 'HVS-05', 'HVS-07', 'HVS-08', 'HVS-09', 'HVS-10', 'HVS-12']);
    for (const s of stations) {
      const district = region.find((d) => d.code === `HV-${s.code.slice(4, 6)}`)!;
      expect(district.zone).toBe(s.zone);
      expect(booleanPointInPolygon([s.longitude, s.latitude], district.boundary as never), `${s.code} inside ${district.code}`).toBe(true);
      expect(s.name.startsWith(`${district.name} `)).toBe(true);
      expect(STATION_SUFFIXES[s.zone]).toContain(s.name.slice(district.name.length + 1));
      // Sea-level names stay low; highland names stay high (the zones' elevation bands, invented).
      if (s.zone === 'coast') expect(s.elevation).toBeLessThan(100);
      if (s.zone === 'highlands') expect(s.elevation).toBeGreaterThan(1500);
    }
    expect(new Set(stations.map((s) => s.name)).size).toBe(stations.length);
  });
});
