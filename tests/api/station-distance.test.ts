import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { refreshAssignments } from '../../server/weather/weather-geo';
import { createTestApp, type TestApp } from '../support/test-app';
import { makeDistrict, square } from '../support/factories';

// Issue 17 item 5: stations farther than WEATHER_IDW_MAX_KM (300 km, common practice) do not feed a district.
let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
}, 120_000);
afterAll(() => t.close());

const sources = (districtId: string) =>
  t.ds.query(`SELECT s.code, w.method FROM district_weather_sources w JOIN weather_stations s ON s.id = w.station_id WHERE w.district_id = $1 ORDER BY s.code`, [districtId]);

describe('the distance limit of interpolated weather', () => {
  it('when a district has no station within the limit, then it gets no interpolated sources, while a district near a station is fed by it', async () => {
    expect(t.ctx.config.WEATHER_IDW_MAX_KM).toBe(300);
    // Two districts about 1,100 km apart (10° of latitude); the only stations are near the first.
    const near = await makeDistrict(t.ds, { boundary: square(10, 20), centroidLat: 20.5, centroidLon: 10.5 });
    const far = await makeDistrict(t.ds, { boundary: square(10, 30), centroidLat: 30.5, centroidLon: 10.5 });
    await t.ds.query(
      `INSERT INTO weather_stations (code, name, latitude, longitude) VALUES ('ST-A', 'A', 20.2, 9.5), ('ST-B', 'B', 21.8, 11.8)`);
    await t.ds.transaction((m) => refreshAssignments(m, 3, t.ctx.config.WEATHER_IDW_MAX_KM));
    expect(await sources(near.id)).toEqual([{ code: 'ST-A', method: 'interpolated' }, { code: 'ST-B', method: 'interpolated' }]);
    expect(await sources(far.id)).toEqual([]);
    // Without a limit (as before) the far district would read the same faraway stations.
    await t.ds.transaction((m) => refreshAssignments(m, 3));
    expect(await sources(far.id)).toHaveLength(2);
  });
});
