import type { EntityManager } from 'typeorm';
import { type DailyValue, fillGaps, isoOfDay } from '../../shared/weather/qc';

/**
 * The district series as the first implementation computed them (district by district: one aggregate over
 * all of a district's history, gaps filled in TypeScript with `fillGaps`), kept here verbatim as the
 * expectation the set-based recompute (server/weather/district-series.repository.ts) must match. Reads only.
 */
export async function referenceSeries(manager: EntityManager, districtIds: string[], maxFillDays: number) {
  const round2 = (x: number | null) => (x === null ? null : Math.round(x * 100) / 100);
  const rows: { district_id: string; day: number; tmin: number; tmax: number; rh: number | null; rain: number | null; n: number }[] = await manager.query(
    `SELECT w.district_id, (o.date - DATE '1970-01-01') AS day,
            sum(w.weight * o.tmin) / sum(w.weight) AS tmin,
            sum(w.weight * o.tmax) / sum(w.weight) AS tmax,
            sum(w.weight * o.rh) FILTER (WHERE o.rh IS NOT NULL) / nullif(sum(w.weight) FILTER (WHERE o.rh IS NOT NULL), 0) AS rh,
            sum(w.weight * o.rain) FILTER (WHERE o.rain IS NOT NULL) / nullif(sum(w.weight) FILTER (WHERE o.rain IS NOT NULL), 0) AS rain,
            count(*)::int AS n
       FROM district_weather_sources w
       JOIN weather_observations o ON o.station_id = w.station_id AND NOT ('held' = ANY(o.flags))
      WHERE w.district_id = ANY($1::uuid[])
      GROUP BY w.district_id, o.date ORDER BY w.district_id, o.date`,
    [districtIds],
  );
  const byDistrict = new Map<string, DailyValue[]>();
  for (const r of rows) {
    let list = byDistrict.get(r.district_id);
    if (!list) byDistrict.set(r.district_id, (list = []));
    list.push({ day: r.day, tmin: round2(r.tmin), tmax: round2(r.tmax), rh: round2(r.rh), rain: round2(r.rain), stationCount: r.n });
  }
  const out: SeriesRow[] = [];
  for (const id of [...districtIds].sort())
    for (const d of fillGaps(byDistrict.get(id) ?? [], maxFillDays))
      out.push({ district_id: id, date: isoOfDay(d.day), tmin: d.tmin, tmax: d.tmax, rh: d.rh, rain: d.rain, filled: d.filled, station_count: d.stationCount });
  return out;
}

export interface SeriesRow { district_id: string; date: string; tmin: number | null; tmax: number | null; rh: number | null; rain: number | null; filled: boolean; station_count: number }

/** The stored series of these districts, in the same shape and order as `referenceSeries`. */
export async function storedSeries(manager: Pick<EntityManager, 'query'>, districtIds: string[]): Promise<SeriesRow[]> {
  return manager.query(
    `SELECT district_id::text, to_char(date, 'YYYY-MM-DD') AS date, tmin, tmax, rh, rain, filled, station_count
       FROM district_weather_days WHERE district_id = ANY($1::uuid[]) ORDER BY district_id::text, date`,
    [districtIds],
  );
}
