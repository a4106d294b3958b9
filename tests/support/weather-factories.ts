import type { DataSource } from 'typeorm';
import { WeatherStationEntity } from '../../server/weather/weather-station.entity';
import { refreshAssignments } from '../../server/weather/weather-geo';
import { recomputeDistrictSeries } from '../../server/weather/district-series.repository';

let seq = 0;

/** A station (placed in its district, and district sources refreshed, as the API would do). */
export async function makeStation(ds: DataSource, overrides: Partial<WeatherStationEntity> = {}) {
  seq++;
  const station = await ds.getRepository(WeatherStationEntity).save({
    code: `ST-${Date.now().toString(36).toUpperCase()}${seq}`,
    name: `Test station ${seq}`,
    latitude: 20.5,
    longitude: 10.5,
    elevation: 100,
    activeFrom: null,
    activeTo: null,
    isDemo: false,
    districtId: null,
    ...overrides,
  });
  await ds.transaction(async (m) => recomputeDistrictSeries(m, await refreshAssignments(m, 3), 3));
  return station;
}

export const WEATHER_TABLES = ['weather_observations', 'weather_observation_revisions', 'district_weather_days', 'audit_events'];

/** A CSV body: the header, then one line per row. */
export const csv = (header: string, rows: (string | number)[][]) => [header, ...rows.map((r) => r.join(','))].join('\n') + '\n';

/** Days from a start date, YYYY-MM-DD. */
export const dayAfter = (start: string, n: number) => new Date(Date.parse(start) + n * 86_400_000).toISOString().slice(0, 10);
