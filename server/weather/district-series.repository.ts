import type { EntityManager } from 'typeorm';
import { type DailyValue, fillGaps, isoOfDay } from '../../shared/weather/qc';

const round2 = (x: number | null) => (x === null ? null : Math.round(x * 100) / 100);

/** Districts recomputed per statement: one aggregate, one delete and one insert for each batch. */
const SERIES_BATCH = 100;

/**
 * Recompute the daily series of the given districts from their sources: each day the weighted mean of
 * the stations that reported (weights renormalised over them), then short gaps filled and long ones kept
 * as missing days. Held station-days (judged implausible, not yet confirmed or corrected) count nowhere:
 * the day is as if the station had not reported. Set-based (issue 17): per batch of districts one
 * aggregate query, one delete and one insert, so a national import or a station change touching thousands
 * of districts costs tens of statements, not two per district. The gap filling stays in TypeScript
 * (`fillGaps`, shared with the tests).
 */
export async function recomputeDistrictSeries(manager: EntityManager, districtIds: Iterable<string>, maxFillDays: number): Promise<void> {
  const ids = [...new Set(districtIds)];
  for (let i = 0; i < ids.length; i += SERIES_BATCH) {
    const batch = ids.slice(i, i + SERIES_BATCH);
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
      [batch],
    );
    const byDistrict = new Map<string, DailyValue[]>();
    for (const r of rows) {
      let list = byDistrict.get(r.district_id);
      if (!list) byDistrict.set(r.district_id, (list = []));
      list.push({ day: r.day, tmin: round2(r.tmin), tmax: round2(r.tmax), rh: round2(r.rh), rain: round2(r.rain), stationCount: r.n });
    }
    const cols = { id: [] as string[], date: [] as string[], tmin: [] as (number | null)[], tmax: [] as (number | null)[], rh: [] as (number | null)[], rain: [] as (number | null)[], filled: [] as boolean[], n: [] as number[] };
    for (const [districtId, reported] of byDistrict) {
      for (const d of fillGaps(reported, maxFillDays)) {
        cols.id.push(districtId); cols.date.push(isoOfDay(d.day)); cols.tmin.push(d.tmin); cols.tmax.push(d.tmax);
        cols.rh.push(d.rh); cols.rain.push(d.rain); cols.filled.push(d.filled); cols.n.push(d.stationCount);
      }
    }
    await manager.query('DELETE FROM district_weather_days WHERE district_id = ANY($1::uuid[])', [batch]);
    if (cols.id.length)
      await manager.query(
        `INSERT INTO district_weather_days (district_id, date, tmin, tmax, rh, rain, filled, station_count)
         SELECT * FROM unnest($1::uuid[], $2::date[], $3::float8[], $4::float8[], $5::float8[], $6::float8[], $7::bool[], $8::int[])`,
        [cols.id, cols.date, cols.tmin, cols.tmax, cols.rh, cols.rain, cols.filled, cols.n],
      );
  }
}

/** Districts whose series draws on any of these stations. */
export async function districtsUsingStations(manager: EntityManager, stationIds: string[]): Promise<string[]> {
  if (!stationIds.length) return [];
  const rows: { district_id: string }[] = await manager.query(
    'SELECT DISTINCT district_id FROM district_weather_sources WHERE station_id = ANY($1::uuid[])',
    [stationIds],
  );
  return rows.map((r) => r.district_id);
}
