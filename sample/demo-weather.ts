/**
 * Invented daily weather for the demo stations, reproducible from the seed: for any station and date
 * the same values on every machine (so the seeded year and the fake feed's recent days agree).
 * A seasonal sine per zone — warm humid coast, river valley, temperate plateau, cool highlands — peaking
 * in late July, a regional run of weather shared by all stations (slow sines), and a little seeded noise
 * per station. The summer is warm enough for the vectors of each zone; the plateau and highlands winters
 * are cold enough for diapause. Nothing here is real.
 */
import type { EntityManager } from 'typeorm';
import { recomputeDistrictSeries } from '../server/weather/district-series.repository';
import { refreshAssignments } from '../server/weather/weather-geo';
import { emptyStationYear, type StationYear, stationYearKey, writeStationYears } from '../server/weather/station-years.repository';
import { dayOfIsoDate, isoOfDay } from '../shared/weather/qc';
import { DEMO_SEED, type DemoZone } from './demo-region';
import { buildDemoStations, type DemoStation } from './demo-stations';
import { seededRandom } from './random';

/** The seeded weather starts here and runs to yesterday (a year and more). */
export const DEMO_WEATHER_START = '2025-07-01';

interface ZoneClimate { mean: number; amplitude: number; range: number; rh: number; rhSwing: number; wetDays: number; rainMean: number }
const CLIMATE: Record<DemoZone, ZoneClimate> = {
  coast: { mean: 25, amplitude: 4.5, range: 7, rh: 78, rhSwing: 8, wetDays: 0.35, rainMean: 9 },
  valley: { mean: 22, amplitude: 7.5, range: 12, rh: 62, rhSwing: 12, wetDays: 0.25, rainMean: 7 },
  plateau: { mean: 13, amplitude: 11, range: 12, rh: 58, rhSwing: 10, wetDays: 0.22, rainMean: 5 },
  highlands: { mean: 7, amplitude: 9.5, range: 10, rh: 66, rhSwing: 10, wetDays: 0.3, rainMean: 6 },
};

export interface DemoDay { station: string; date: string; tmin: number; tmax: number; rh: number; rain: number }

const r1 = (x: number) => Math.round(x * 10) / 10;

/** One station's day. Deterministic in (seed, station, date). */
export function demoWeatherDay(station: DemoStation, day: number, seed = DEMO_SEED): DemoDay {
  const c = CLIMATE[station.zone];
  const random = seededRandom((seed ^ Math.imul(station.index + 1, 0x9e3779b1) ^ Math.imul(day, 0x85ebca6b)) >>> 0);
  const season = Math.sin((2 * Math.PI * (day - dayOfIsoDate('2000-04-20'))) / 365.25); // +1 near 20 July
  const regional = 1.8 * Math.sin(day / 3.7) + 1.2 * Math.sin(day / 8.3 + 1) + 0.8 * Math.sin(day / 17.9 + 2);
  const lapse = -0.0065 * (station.elevation - (station.zone === 'coast' ? 30 : station.zone === 'valley' ? 220 : station.zone === 'plateau' ? 900 : 2000));
  const mean = c.mean + c.amplitude * season + regional + lapse + (random() - 0.5) * 1.2;
  const range = c.range * (0.75 + random() * 0.5);
  const wet = random() < c.wetDays * (station.zone === 'coast' || station.zone === 'valley' ? 1 + 0.6 * season : 1 - 0.2 * season);
  const rain = wet ? r1(-Math.log(1 - random()) * c.rainMean) : 0;
  const rh = Math.min(98, Math.max(15, c.rh + c.rhSwing * season * (station.zone === 'plateau' ? -1 : 1) + (wet ? 8 : 0) + (random() - 0.5) * 8));
  return { station: station.code, date: isoOfDay(day), tmin: r1(mean - range / 2), tmax: r1(mean + range / 2), rh: r1(rh), rain };
}

/** Every demo station's days from `from` to `to` (YYYY-MM-DD, inclusive). */
export function demoWeather(from: string, to: string, stations = buildDemoStations()): DemoDay[] {
  const out: DemoDay[] = [];
  for (const s of stations) for (let d = dayOfIsoDate(from); d <= dayOfIsoDate(to); d++) out.push(demoWeatherDay(s, d));
  return out;
}

export const yesterday = () => isoOfDay(Math.floor(Date.now() / 86_400_000) - 1);

/** Load the demo stations and their weather, then place them in districts and derive the district series. */
export async function seedDemoWeather(manager: EntityManager, opts: { fillMaxDays?: number; idwStations?: number } = {}): Promise<void> {
  const stations = buildDemoStations();
  const ids: { id: string; code: string }[] = await manager.query(
    `INSERT INTO weather_stations (code, name, latitude, longitude, elevation, active_from, is_demo)
     SELECT *, true FROM unnest($1::text[], $2::text[], $3::float8[], $4::float8[], $5::float8[], $6::date[]) RETURNING id, code`,
    [stations.map((s) => s.code), stations.map((s) => s.name), stations.map((s) => s.latitude), stations.map((s) => s.longitude),
      stations.map((s) => s.elevation), stations.map((s) => s.activeFrom)],
  );
  const idOf = new Map(ids.map((r) => [r.code, r.id]));
  const years = new Map<string, StationYear>();
  for (const d of demoWeather(DEMO_WEATHER_START, yesterday(), stations)) {
    const stationId = idOf.get(d.station)!;
    const year = +d.date.slice(0, 4);
    const key = stationYearKey(stationId, year);
    let y = years.get(key);
    if (!y) years.set(key, (y = emptyStationYear(stationId, year)));
    const i = dayOfIsoDate(d.date) - y.start;
    y.tmin[i] = d.tmin;
    y.tmax[i] = d.tmax;
    y.rh[i] = d.rh ?? Number.NaN;
    y.rain[i] = d.rain ?? Number.NaN;
  }
  await writeStationYears(manager, [...years.values()]);
  const touched = await refreshAssignments(manager, opts.idwStations ?? 3);
  await recomputeDistrictSeries(manager, touched, opts.fillMaxDays ?? 3);
}
