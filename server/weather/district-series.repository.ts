import type { EntityManager } from 'typeorm';
import { isoOfDay } from '../../shared/weather/qc';

/** Districts recomputed per statement. */
const SERIES_BATCH = 1000;

/** Whole history: sentinels wider than any stored year (dates, so the bounds stay plain `date`s). */
export const SERIES_EVER = { from: '1000-01-01', to: '9999-12-31' } as const;

/** A district whose inputs changed on the days `from`–`to` (ISO dates, inclusive). */
export interface SeriesSpan { districtId: string; from: string; to: string }

/**
 * Recompute the whole daily series of the given districts (their sources changed: a station moved, came
 * or went). See `recomputeSeriesSpans`.
 */
export async function recomputeDistrictSeries(manager: EntityManager, districtIds: Iterable<string>, maxFillDays: number): Promise<void> {
  await recomputeSeriesSpans(manager, [...new Set(districtIds)].map((districtId) => ({ districtId, ...SERIES_EVER })), maxFillDays);
}

/**
 * Recompute districts' daily series on the days whose inputs changed (issue 17), as set SQL over all the
 * districts at once. Each day is the weighted mean of the stations that reported (weights renormalised over
 * them), rounded to 0.01; short gaps (≤ `maxFillDays`) are filled by linear interpolation between the
 * reported days either side (rain stays missing), longer ones are kept as missing days. Held station-days
 * (judged implausible, not yet confirmed or corrected) count nowhere: the day is as if the station had not
 * reported.
 *
 * A change on days a–b can alter the series from the last reported day before a to the first reported day
 * after b (the gap filling reaches across), and nowhere else; so per district that window [lo, hi] is read
 * from the stored series, its days deleted, and re-derived from the station-years covering it: one SELECT,
 * one DELETE and one INSERT … SELECT per batch of districts. The results equal the former whole-history,
 * district-by-district recompute (tests/api/district-series.test.ts holds them to a copy of it); rounding
 * is `floor(x·100 + 0.5)/100`, which is JavaScript's `Math.round` the former code used.
 */
export async function recomputeSeriesSpans(manager: EntityManager, spans: SeriesSpan[], maxFillDays: number): Promise<void> {
  const merged = new Map<string, { from: string; to: string }>();
  for (const s of spans) {
    const had = merged.get(s.districtId);
    if (!had) merged.set(s.districtId, { from: s.from, to: s.to });
    else {
      if (s.from < had.from) had.from = s.from;
      if (s.to > had.to) had.to = s.to;
    }
  }
  const all = [...merged];
  for (let i = 0; i < all.length; i += SERIES_BATCH) {
    const batch = all.slice(i, i + SERIES_BATCH);
    const windows: { id: string; lo: string; hi: string }[] = await manager.query(
      `SELECT r.id::text AS id,
              to_char(coalesce((SELECT max(d.date) FROM district_weather_days d
                                 WHERE d.district_id = r.id AND d.date < r.a AND d.station_count > 0), r.a), 'YYYY-MM-DD') AS lo,
              to_char(coalesce((SELECT min(d.date) FROM district_weather_days d
                                 WHERE d.district_id = r.id AND d.date > r.b AND d.station_count > 0), r.b), 'YYYY-MM-DD') AS hi
         FROM unnest($1::uuid[], $2::date[], $3::date[]) AS r(id, a, b)`,
      [batch.map(([id]) => id), batch.map(([, s]) => s.from), batch.map(([, s]) => s.to)],
    );
    const args = [windows.map((w) => w.id), windows.map((w) => w.lo), windows.map((w) => w.hi)];
    await manager.query(
      `DELETE FROM district_weather_days d USING unnest($1::uuid[], $2::date[], $3::date[]) AS b(id, lo, hi)
        WHERE d.district_id = b.id AND d.date BETWEEN b.lo AND b.hi`,
      args,
    );
    await manager.query(
      `WITH b AS (SELECT * FROM unnest($1::uuid[], $2::date[], $3::date[]) AS b(id, lo, hi)),
       obs AS (
         SELECT b.id, w.weight, make_date(y.year, 1, 1) + (d.i - 1)::int AS date, d.tmin, d.tmax, d.rh, d.rain
           FROM b
           JOIN district_weather_sources w ON w.district_id = b.id
           JOIN weather_station_years y ON y.station_id = w.station_id
                AND y.year BETWEEN extract(year FROM b.lo) AND extract(year FROM b.hi)
          CROSS JOIN LATERAL unnest(y.tmin, y.tmax, y.rh, y.rain, y.flags) WITH ORDINALITY AS d(tmin, tmax, rh, rain, bits, i)
          WHERE d.tmin IS NOT NULL AND d.bits & 8 = 0
            AND make_date(y.year, 1, 1) + (d.i - 1)::int BETWEEN b.lo AND b.hi),
       rep AS (
         SELECT id, date,
                floor(sum(weight * tmin) / sum(weight) * 100 + 0.5) / 100 AS tmin,
                floor(sum(weight * tmax) / sum(weight) * 100 + 0.5) / 100 AS tmax,
                floor(sum(weight * rh) FILTER (WHERE rh IS NOT NULL) / nullif(sum(weight) FILTER (WHERE rh IS NOT NULL), 0) * 100 + 0.5) / 100 AS rh,
                floor(sum(weight * rain) FILTER (WHERE rain IS NOT NULL) / nullif(sum(weight) FILTER (WHERE rain IS NOT NULL), 0) * 100 + 0.5) / 100 AS rain,
                count(*)::int AS n
           FROM obs GROUP BY id, date),
       -- Each reported day with the next one (lead): the day itself, then the days of the gap up to the next,
       -- generated from that one row. No join back to the reported days, so no plan can go quadratic.
       paired AS (
         SELECT rep.*, lead(date) OVER w AS ndate, lead(tmin) OVER w AS ntmin, lead(tmax) OVER w AS ntmax, lead(rh) OVER w AS nrh
           FROM rep WINDOW w AS (PARTITION BY id ORDER BY date))
       INSERT INTO district_weather_days (district_id, date, tmin, tmax, rh, rain, filled, station_count)
       SELECT id, date, tmin, tmax, rh, rain, false, n FROM paired
       UNION ALL
       SELECT p.id, p.date + g.k,
              CASE WHEN p.ndate - p.date - 1 <= $4 THEN floor((p.tmin + (p.ntmin - p.tmin) * (g.k::float8 / (p.ndate - p.date)::float8)) * 100 + 0.5) / 100 END,
              CASE WHEN p.ndate - p.date - 1 <= $4 THEN floor((p.tmax + (p.ntmax - p.tmax) * (g.k::float8 / (p.ndate - p.date)::float8)) * 100 + 0.5) / 100 END,
              CASE WHEN p.ndate - p.date - 1 <= $4 THEN floor((p.rh + (p.nrh - p.rh) * (g.k::float8 / (p.ndate - p.date)::float8)) * 100 + 0.5) / 100 END,
              NULL, p.ndate - p.date - 1 <= $4, 0
         FROM paired p CROSS JOIN LATERAL generate_series(1, p.ndate - p.date - 1) AS g(k)
        WHERE p.ndate - p.date > 1`,
      [...args, maxFillDays],
    );
  }
}

/**
 * The spans to recompute after station-days changed: every district drawing on a changed station, on the
 * days that station changed (`days`: first and last day number, days since 1970-01-01).
 */
export async function spansForStationDays(manager: EntityManager, days: Map<string, { first: number; last: number }>): Promise<SeriesSpan[]> {
  if (!days.size) return [];
  const rows: { district_id: string; station_id: string }[] = await manager.query(
    'SELECT district_id::text, station_id::text FROM district_weather_sources WHERE station_id = ANY($1::uuid[])',
    [[...days.keys()]],
  );
  return rows.map((r) => {
    const d = days.get(r.station_id)!;
    return { districtId: r.district_id, from: isoOfDay(d.first), to: isoOfDay(d.last) };
  });
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
