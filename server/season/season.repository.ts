import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type pg from 'pg';
import { from as copyFrom } from 'pg-copy-streams';
import type { DataSource, EntityManager } from 'typeorm';
import type { SeasonInputDay } from '../../shared/model';

export interface DistrictForRun {
  id: string;
  code: string;
  lat: number | null;
  profiles: { profileId: string; biofix: string | null }[];
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
    const rows: { id: string; code: string; lat: number | null; profiles: { profileId: string; biofix: string | null }[] | null }[] =
      await this.ds.query(
        `SELECT d.id, d.code, d.centroid_lat AS lat,
                json_agg(json_build_object('profileId', dp.profile_id, 'biofix', dp.biofix) ORDER BY dp.profile_id)
                  FILTER (WHERE dp.profile_id IS NOT NULL) AS profiles
           FROM districts d LEFT JOIN district_profiles dp ON dp.district_id = d.id
          GROUP BY d.id ORDER BY d.code`,
      );
    return rows.map((r) => ({ ...r, profiles: r.profiles ?? [] }));
  }

  /**
   * A fingerprint of each district's inputs for the season: weather days, case counts of the years
   * the channel reads, surveys and profiles. md5 in the database, one pass over each table.
   */
  async fingerprints(from: string, to: string, fromYear: number): Promise<Map<string, string>> {
    const rows: { id: string; fp: string }[] = await this.ds.query(
      `WITH w AS (SELECT district_id, md5(string_agg(concat_ws(':', date, tmin, tmax, rh, filled), ',' ORDER BY date)) h
                    FROM district_weather_days WHERE date BETWEEN $1 AND $2 GROUP BY district_id),
            c AS (SELECT district_id, md5(string_agg(concat_ws(':', disease_id, epi_year, epi_week, cases), ',' ORDER BY disease_id, epi_year, epi_week)) h
                    FROM case_counts WHERE epi_year >= $3 GROUP BY district_id),
            s AS (SELECT district_id, md5(string_agg(concat_ws(':', id, houses_inspected, houses_positive, containers_inspected, containers_positive, pupae), ',' ORDER BY id)) h
                    FROM larval_surveys WHERE survey_date BETWEEN ($1::date - 28) AND $2 GROUP BY district_id),
            p AS (SELECT district_id, string_agg(concat_ws(':', profile_id, biofix), ',' ORDER BY profile_id) h
                    FROM district_profiles GROUP BY district_id)
       SELECT d.id, md5(concat_ws('|', d.centroid_lat, w.h, c.h, s.h, p.h)) AS fp
         FROM districts d
         LEFT JOIN w ON w.district_id = d.id LEFT JOIN c ON c.district_id = d.id
         LEFT JOIN s ON s.district_id = d.id LEFT JOIN p ON p.district_id = d.id`,
      [from, to, fromYear],
    );
    return new Map(rows.map((r) => [r.id, r.fp]));
  }

  async runStates(): Promise<Map<string, { fingerprint: string; asOf: string }>> {
    const rows: { district_id: string; fingerprint: string; as_of: string }[] = await this.ds.query(
      `SELECT district_id, fingerprint, to_char(as_of, 'YYYY-MM-DD') AS as_of FROM district_run_state`,
    );
    return new Map(rows.map((r) => [r.district_id, { fingerprint: r.fingerprint, asOf: r.as_of }]));
  }

  async weather(districtIds: string[], from: string, to: string): Promise<Map<string, SeasonInputDay[]>> {
    const rows: { district_id: string; date: string; tmin: number | null; tmax: number | null; rh: number | null; filled: boolean }[] =
      await this.ds.query(
        `SELECT district_id, to_char(date, 'YYYY-MM-DD') AS date, tmin, tmax, rh, filled
           FROM district_weather_days WHERE district_id = ANY($1) AND date BETWEEN $2 AND $3 ORDER BY district_id, date`,
        [districtIds, from, to],
      );
    const out = new Map<string, SeasonInputDay[]>();
    for (const r of rows) {
      let list = out.get(r.district_id);
      if (!list) out.set(r.district_id, (list = []));
      list.push({ date: r.date, tmin: r.tmin, tmax: r.tmax, rh: r.rh, filled: r.filled });
    }
    return out;
  }

  async cases(districtIds: string[], fromYear: number): Promise<CaseRow[]> {
    return this.ds.query(
      `SELECT district_id AS "districtId", disease_id AS "diseaseId", epi_year AS "epiYear", epi_week AS "epiWeek", cases
         FROM case_counts WHERE district_id = ANY($1) AND epi_year >= $2 ORDER BY epi_year, epi_week`,
      [districtIds, fromYear],
    );
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
         FROM larval_surveys WHERE district_id = ANY($1) AND survey_date BETWEEN $2 AND $3`,
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

  /** Replace one district's stored season in the caller's transaction: all of it or none. */
  async replaceVectorClock(manager: EntityManager, districtId: string, from: string, rows: VectorClockRows): Promise<number> {
    await manager.query('DELETE FROM vector_clock_days WHERE district_id = $1 AND date >= $2', [districtId, from]);
    if (rows.date.length === 0) return 0;
    // COPY is PostgreSQL's bulk path: one text buffer per district instead of 14 parameter arrays
    // (their serialisation cost more than the computation). The columns are 4-byte reals (compact for
    // decades of daily rows), which cannot hold values below about 1e-38: those are flushed to zero.
    const v = (x: number | null) => (x === null ? '\\N' : Math.abs(x) < 1e-30 ? '0' : String(x));
    const b = (x: boolean) => (x ? 't' : 'f');
    const lines: string[] = new Array(rows.date.length);
    for (let i = 0; i < rows.date.length; i++) {
      lines[i] = `${districtId}\t${rows.profileId[i]}\t${rows.date[i]}\t${v(rows.degreeDays[i])}\t${v(rows.cumulativeDegreeDays[i])}\t${b(rows.complete[i])}\t${v(rows.generations[i])}\t${v(rows.eipDays[i])}\t${v(rows.survival[i])}\t${v(rows.survivalThroughEip[i])}\t${v(rows.eipShare[i])}\t${v(rows.rvc[i])}\t${v(rows.rvcLow[i])}\t${v(rows.rvcHigh[i])}\t${b(rows.seasonOpen[i])}`;
    }
    const client = (manager.queryRunner as unknown as { databaseConnection: pg.PoolClient }).databaseConnection;
    const copy = client.query(copyFrom(
      `COPY vector_clock_days (district_id, profile_id, date, degree_days, cumulative_degree_days, complete, generations,
         eip_days, survival, survival_through_eip, eip_share, rvc, rvc_low, rvc_high, season_open) FROM STDIN`,
    ));
    await pipeline(Readable.from([lines.join('\n') + '\n']), copy);
    return rows.date.length;
  }
}

export interface VectorClockRows {
  profileId: string[];
  date: string[];
  degreeDays: (number | null)[];
  cumulativeDegreeDays: number[];
  complete: boolean[];
  generations: number[];
  eipDays: (number | null)[];
  survival: (number | null)[];
  survivalThroughEip: (number | null)[];
  eipShare: (number | null)[];
  rvc: (number | null)[];
  rvcLow: (number | null)[];
  rvcHigh: (number | null)[];
  seasonOpen: boolean[];
}

export const emptyVectorClockRows = (): VectorClockRows => ({
  profileId: [], date: [], degreeDays: [], cumulativeDegreeDays: [], complete: [], generations: [], eipDays: [], survival: [],
  survivalThroughEip: [], eipShare: [], rvc: [], rvcLow: [], rvcHigh: [], seasonOpen: [],
});
