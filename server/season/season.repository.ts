import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type pg from 'pg';
import { from as copyFrom } from 'pg-copy-streams';
import type { DataSource, EntityManager } from 'typeorm';
import { formatIsoDate, parseIsoDate } from '../../shared/model';
import { BinaryCopyWriter } from '../db/pg-binary-copy';

export interface DistrictForRun {
  id: string;
  code: string;
  name: string;
  lat: number | null;
  profiles: { profileId: string; biofix: string | null }[];
}

/** Dense daily weather columns from `startDate` (NaN where unknown), with how many days had a row. */
export interface WeatherColumns {
  startDate: string;
  length: number;
  tmin: Float64Array;
  tmax: Float64Array;
  rh: Float64Array;
  filled: Uint8Array;
  /** Days that had a row in district_weather_days (with or without temperatures). */
  rows: number;
}

function emptyWeatherColumns(startDate: string, length: number): WeatherColumns {
  return {
    startDate, length, rows: 0,
    tmin: new Float64Array(length).fill(Number.NaN), tmax: new Float64Array(length).fill(Number.NaN),
    rh: new Float64Array(length).fill(Number.NaN), filled: new Uint8Array(length),
  };
}

/** Views (no copy) of a dense multi-year range, one per calendar year, each counting its known days as rows. */
export function weatherByYear(c: WeatherColumns): Map<number, WeatherColumns> {
  const out = new Map<number, WeatherColumns>();
  const first = parseIsoDate(c.startDate);
  let i = 0;
  while (i < c.length) {
    const year = Number(formatIsoDate(first + i).slice(0, 4));
    const end = Math.min(c.length, parseIsoDate(`${year + 1}-01-01`) - first);
    let known = 0;
    for (let k = i; k < end; k++) if (c.tmin[k] === c.tmin[k]) known++;
    out.set(year, {
      startDate: formatIsoDate(first + i), length: end - i, rows: known,
      tmin: c.tmin.subarray(i, end), tmax: c.tmax.subarray(i, end), rh: c.rh.subarray(i, end), filled: c.filled.subarray(i, end),
    });
    i = end;
  }
  return out;
}

export interface CaseRow {
  districtId: string;
  diseaseId: string;
  epiYear: number;
  epiWeek: number;
  cases: number;
}

export interface SurveyRow {
  districtId: string;
  surveyDate: string;
  housesInspected: number;
  housesPositive: number;
  containersInspected: number;
  containersPositive: number;
  pupae: number | null;
}

/** What the season run reads and writes. Reads of other features' tables are plain SQL, read-only. */
export class SeasonRepository {
  constructor(private readonly ds: DataSource) {}

  async districts(): Promise<DistrictForRun[]> {
    const rows: { id: string; code: string; name: string; lat: number | null; profiles: { profileId: string; biofix: string | null }[] | null }[] =
      await this.ds.query(
        `SELECT d.id, d.code, d.name, d.centroid_lat AS lat,
                json_agg(json_build_object('profileId', dp.profile_id, 'biofix', dp.biofix) ORDER BY dp.profile_id)
                  FILTER (WHERE dp.profile_id IS NOT NULL) AS profiles
           FROM districts d LEFT JOIN district_profiles dp ON dp.district_id = d.id
          GROUP BY d.id ORDER BY d.code`,
      );
    return rows.map((r) => ({ ...r, profiles: r.profiles ?? [] }));
  }

  /**
   * A fingerprint of each district's inputs for the season: weather days, case counts of the years
   * the channel reads, surveys and profiles. Each input row is hashed from its binary values
   * (hash_record_extended: no number is turned into text) and a district's rows are combined with
   * bit_xor and counted — the date or week is in every hashed row, so the same values on other days
   * give another fingerprint. JIT is off for this query: compiling it cost more than running it.
   */
  async fingerprints(from: string, to: string, fromYear: number): Promise<Map<string, string>> {
    const rows: { id: string; fp: string }[] = await this.ds.transaction(async (m) => {
      await m.query('SET LOCAL jit = off');
      return m.query(
        `WITH w AS (SELECT district_id, bit_xor(hash_record_extended((date, tmin, tmax, rh, filled), 0)) || ':' || count(*) h
                      FROM district_weather_days WHERE date BETWEEN $1 AND $2 GROUP BY district_id),
              c AS (SELECT district_id, bit_xor(hash_record_extended((disease_id, epi_year, epi_week, cases), 0)) || ':' || count(*) h
                      FROM case_counts WHERE epi_year >= $3 AND voided_at IS NULL GROUP BY district_id),
              k AS (SELECT district_id, bit_xor(hash_record_extended((epi_year, epi_week), 0)) || ':' || count(*) h
                      FROM case_week_closures WHERE epi_year >= $3 GROUP BY district_id),
              s AS (SELECT district_id, bit_xor(hash_record_extended((id, houses_inspected, houses_positive, containers_inspected, containers_positive, pupae), 0)) || ':' || count(*) h
                      FROM larval_surveys WHERE survey_date BETWEEN ($1::date - 28) AND $2 AND voided_at IS NULL GROUP BY district_id),
              p AS (SELECT district_id, string_agg(concat_ws(':', profile_id, biofix), ',' ORDER BY profile_id) h
                      FROM district_profiles GROUP BY district_id)
         SELECT d.id, md5(concat_ws('|', d.centroid_lat, w.h, c.h, k.h, s.h, p.h)) AS fp
           FROM districts d
           LEFT JOIN w ON w.district_id = d.id LEFT JOIN c ON c.district_id = d.id LEFT JOIN k ON k.district_id = d.id
           LEFT JOIN s ON s.district_id = d.id LEFT JOIN p ON p.district_id = d.id`,
        [from, to, fromYear],
      );
    });
    return new Map(rows.map((r) => [r.id, r.fp]));
  }

  /**
   * Station-days held as implausible (docs/weather-intake.md § Plausibility) between two dates: they are
   * left out of the district series, so the run computes without them. How many, and at which stations.
   */
  async heldWeather(from: string, to: string): Promise<{ count: number; stations: string[] }> {
    const [r]: { count: number; stations: string[] }[] = await this.ds.query(
      // Straight from the station-years of the season's calendar years (the view would unnest every year).
      `SELECT count(*)::int AS count, coalesce(array_agg(DISTINCT s.code ORDER BY s.code), '{}') AS stations
         FROM weather_station_years y
         JOIN weather_stations s ON s.id = y.station_id
        CROSS JOIN LATERAL unnest(y.flags) WITH ORDINALITY AS f(bits, i)
        WHERE y.year BETWEEN $3 AND $4 AND f.bits & 8 <> 0 AND y.tmin[f.i] IS NOT NULL
          AND make_date(y.year, 1, 1) + (f.i - 1)::int BETWEEN $1::date AND $2::date`,
      [from, to, Number(from.slice(0, 4)), Number(to.slice(0, 4))],
    );
    return r;
  }

  async runStates(): Promise<Map<string, { fingerprint: string; asOf: string }>> {
    const rows: { district_id: string; fingerprint: string; as_of: string }[] = await this.ds.query(
      `SELECT district_id, fingerprint, to_char(as_of, 'YYYY-MM-DD') AS as_of FROM district_run_state`,
    );
    return new Map(rows.map((r) => [r.district_id, { fingerprint: r.fingerprint, asOf: r.as_of }]));
  }

  /**
   * Each requested district's daily weather from `from` to `to` as dense columns (a day without a row, or
   * without Tmin or Tmax, is NaN: a gap, never zero heat). One row of arrays per district from
   * PostgreSQL, day offsets instead of date strings, so no object or date is made per day.
   */
  async weather(districtIds: string[], from: string, to: string): Promise<Map<string, WeatherColumns>> {
    // Each column comes as one bytea of big-endian binary values (int4send / float8send), which the
    // driver turns into a Buffer natively: parsing millions of numbers from array text was the run's
    // largest cost. An unknown temperature or humidity is sent as NaN.
    const rows: { district_id: string; i: Buffer; tmin: Buffer; tmax: Buffer; rh: Buffer; filled: Buffer }[] = await this.ds.query(
      `SELECT district_id,
              string_agg(int4send(date - $2::date), ''::bytea ORDER BY date) AS i,
              string_agg(float8send(coalesce(tmin, 'NaN')), ''::bytea ORDER BY date) AS tmin,
              string_agg(float8send(coalesce(tmax, 'NaN')), ''::bytea ORDER BY date) AS tmax,
              string_agg(float8send(coalesce(rh, 'NaN')), ''::bytea ORDER BY date) AS rh,
              string_agg(CASE WHEN filled THEN '\\x01'::bytea ELSE '\\x00'::bytea END, ''::bytea ORDER BY date) AS filled
         FROM district_weather_days WHERE district_id = ANY($1) AND date BETWEEN $2 AND $3 GROUP BY district_id`,
      [districtIds, from, to],
    );
    const n = parseIsoDate(to) - parseIsoDate(from) + 1;
    const out = new Map<string, WeatherColumns>();
    for (const r of rows) {
      const c = emptyWeatherColumns(from, n);
      const count = r.i.length / 4;
      c.rows = count;
      for (let k = 0; k < count; k++) {
        const i = r.i.readInt32BE(4 * k);
        const lo = r.tmin.readDoubleBE(8 * k);
        const hi = r.tmax.readDoubleBE(8 * k);
        if (lo !== lo || hi !== hi) continue;
        c.tmin[i] = lo;
        c.tmax[i] = hi;
        c.rh[i] = r.rh.readDoubleBE(8 * k);
        c.filled[i] = r.filled[k];
      }
      out.set(r.district_id, c);
    }
    for (const id of districtIds) if (!out.has(id)) out.set(id, emptyWeatherColumns(from, n)); // no row at all: every day a gap
    return out;
  }

  async cases(districtIds: string[], fromYear: number): Promise<CaseRow[]> {
    return this.ds.query(
      `SELECT district_id AS "districtId", disease_id AS "diseaseId", epi_year AS "epiYear", epi_week AS "epiWeek", cases
         FROM case_counts WHERE district_id = ANY($1) AND epi_year >= $2 AND voided_at IS NULL ORDER BY epi_year, epi_week`,
      [districtIds, fromYear],
    );
  }

  /**
   * Closed weeks by district ("year:week" keys): a closed week is complete even before its deadline. Only
   * closures made by the end of the as-of day (in the deployment's time zone) count: a run dated in the
   * past must not read a week closed later as already complete.
   */
  async closedWeeks(districtIds: string[], fromYear: number, asOf: string, timeZone: string): Promise<Map<string, Set<string>>> {
    const rows: { district_id: string; epi_year: number; epi_week: number }[] = await this.ds.query(
      `SELECT district_id, epi_year, epi_week FROM case_week_closures
        WHERE district_id = ANY($1) AND epi_year >= $2 AND closed_at < (($3::date + 1)::timestamp AT TIME ZONE $4)`,
      [districtIds, fromYear, asOf, timeZone],
    );
    const out = new Map<string, Set<string>>();
    for (const r of rows) {
      if (!out.has(r.district_id)) out.set(r.district_id, new Set());
      out.get(r.district_id)!.add(`${r.epi_year}:${r.epi_week}`);
    }
    return out;
  }

  async excludedYears(districtIds: string[]): Promise<Map<string, number[]>> {
    const rows: { district_id: string; disease_id: string; excluded_years: number[] }[] = await this.ds.query(
      `SELECT district_id, disease_id, excluded_years FROM case_channel_settings WHERE district_id = ANY($1)`,
      [districtIds],
    );
    return new Map(rows.map((r) => [`${r.district_id}:${r.disease_id}`, r.excluded_years]));
  }

  async surveys(districtIds: string[], from: string, to: string): Promise<SurveyRow[]> {
    return this.ds.query(
      `SELECT district_id AS "districtId", to_char(survey_date, 'YYYY-MM-DD') AS "surveyDate",
              houses_inspected AS "housesInspected", houses_positive AS "housesPositive",
              containers_inspected AS "containersInspected", containers_positive AS "containersPositive", pupae
         FROM larval_surveys WHERE district_id = ANY($1) AND survey_date BETWEEN $2 AND $3 AND voided_at IS NULL`,
      [districtIds, from, to],
    );
  }

  async previousTiers(districtIds: string[], epiYear: number, epiWeek: number) {
    const rows: { district_id: string; tier: string; score: number; drivers: unknown }[] = await this.ds.query(
      `SELECT DISTINCT ON (district_id) district_id, tier, score, drivers FROM district_tiers
        WHERE district_id = ANY($1) AND (epi_year, epi_week) < ($2, $3)
        ORDER BY district_id, epi_year DESC, epi_week DESC`,
      [districtIds, epiYear, epiWeek],
    );
    return new Map(rows.map((r) => [r.district_id, r]));
  }

  /**
   * Replace these districts' stored season in the caller's transaction: all of it or none. One row per
   * district and profile (arrays of days), sent in PostgreSQL's binary COPY format: no number is turned into text
   * and back, and a full run inserts 5 tuples per district instead of about 1,700.
   */
  async replaceVectorClock(manager: EntityManager, seasonYear: number, districts: { districtId: string; series: VectorClockSeries[] }[]): Promise<number> {
    await manager.query('DELETE FROM vector_clock_seasons WHERE district_id = ANY($1) AND season_year = $2', [districts.map((d) => d.districtId), seasonYear]);
    const all = districts.flatMap((d) => d.series.map((s) => ({ districtId: d.districtId, s })));
    if (all.length === 0) return 0;
    const w = new BinaryCopyWriter(all.length * all[0].s.length * 60 + 1024);
    let days = 0;
    for (const { districtId, s } of all) {
      const n = s.length;
      days += n;
      w.row(17).uuid(districtId).text(s.profileId).int4(seasonYear).date(s.startDay).int4(n)
        .float4Array(s.degreeDays, 0, n).float4Array(s.cumulativeDegreeDays, 0, n).boolArray(s.complete, 0, n)
        .float4Array(s.generations, 0, n).float4Array(s.eipDays, 0, n).float4Array(s.survival, 0, n)
        .float4Array(s.survivalThroughEip, 0, n).float4Array(s.eipShare, 0, n).float4Array(s.rvc, 0, n)
        .float4Array(s.rvcLow, 0, n).float4Array(s.rvcHigh, 0, n).boolArray(s.seasonOpen, 0, n);
    }
    const client = (manager.queryRunner as unknown as { databaseConnection: pg.PoolClient }).databaseConnection;
    const copy = client.query(copyFrom(
      `COPY vector_clock_seasons (district_id, profile_id, season_year, start_date, days, degree_days, cumulative_degree_days,
         complete, generations, eip_days, survival, survival_through_eip, eip_share, rvc, rvc_low, rvc_high, season_open)
       FROM STDIN (FORMAT binary)`,
    ));
    await pipeline(Readable.from([w.finish()]), copy);
    return days;
  }
}

/**
 * One profile's vector clock over a season, as columns (element i is day `startDay + i`; NaN is
 * unknown and is stored as a NULL element).
 */
export interface VectorClockSeries {
  profileId: string;
  /** Day number (days since 1970-01-01) of element 0. */
  startDay: number;
  length: number;
  degreeDays: Float32Array;
  cumulativeDegreeDays: Float32Array;
  complete: Uint8Array;
  generations: Float32Array;
  eipDays: Float32Array;
  survival: Float32Array;
  survivalThroughEip: Float32Array;
  eipShare: Float32Array;
  rvc: Float32Array;
  rvcLow: Float32Array;
  rvcHigh: Float32Array;
  seasonOpen: Uint8Array;
}
