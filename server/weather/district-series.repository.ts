import type { EntityManager } from 'typeorm';
import { type DailyValue, fillGaps, isoOfDay } from '../../shared/weather/qc';

const round2 = (x: number | null) => (x === null ? null : Math.round(x * 100) / 100);

/**
 * Recompute the daily series of the given districts from their sources: each day the weighted mean of
 * the stations that reported (weights renormalised over them), then short gaps filled and long ones kept
 * as missing days. Held station-days (judged implausible, not yet confirmed or corrected) count nowhere:
 * the day is as if the station had not reported. One aggregate query and one insert per district.
 */
export async function recomputeDistrictSeries(manager: EntityManager, districtIds: Iterable<string>, maxFillDays: number): Promise<void> {
  for (const districtId of districtIds) {
    const rows: { day: number; tmin: number; tmax: number; rh: number | null; rain: number | null; n: number }[] = await manager.query(
      `SELECT (o.date - DATE '1970-01-01') AS day,
              sum(w.weight * o.tmin) / sum(w.weight) AS tmin,
              sum(w.weight * o.tmax) / sum(w.weight) AS tmax,
              sum(w.weight * o.rh) FILTER (WHERE o.rh IS NOT NULL) / nullif(sum(w.weight) FILTER (WHERE o.rh IS NOT NULL), 0) AS rh,
              sum(w.weight * o.rain) FILTER (WHERE o.rain IS NOT NULL) / nullif(sum(w.weight) FILTER (WHERE o.rain IS NOT NULL), 0) AS rain,
              count(*)::int AS n
         FROM district_weather_sources w
         JOIN weather_observations o ON o.station_id = w.station_id AND NOT ('held' = ANY(o.flags))
        WHERE w.district_id = $1
        GROUP BY o.date ORDER BY o.date`,
      [districtId],
    );
    const reported: DailyValue[] = rows.map((r) => ({
      day: r.day, tmin: round2(r.tmin), tmax: round2(r.tmax), rh: round2(r.rh), rain: round2(r.rain), stationCount: r.n,
    }));
    const series = fillGaps(reported, maxFillDays);
    await manager.query('DELETE FROM district_weather_days WHERE district_id = $1', [districtId]);
    if (series.length)
      await manager.query(
        `INSERT INTO district_weather_days (district_id, date, tmin, tmax, rh, rain, filled, station_count)
         SELECT $1, * FROM unnest($2::date[], $3::float8[], $4::float8[], $5::float8[], $6::float8[], $7::bool[], $8::int[])`,
        [
          districtId,
          series.map((d) => isoOfDay(d.day)),
          series.map((d) => d.tmin),
          series.map((d) => d.tmax),
          series.map((d) => d.rh),
          series.map((d) => d.rain),
          series.map((d) => d.filled),
          series.map((d) => d.stationCount),
        ],
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
