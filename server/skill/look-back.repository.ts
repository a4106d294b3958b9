import type { DataSource } from 'typeorm';
import type { ReplayedWeek, CaseRevisionRow, WeatherDayVersion } from './replay';
import { LookBackWeekEntity } from './look-back-week.entity';

/** A district as the Look-back's scores group it. */
export interface LookBackDistrict {
  id: string;
  name: string;
  regionId: string | null;
  regionName: string | null;
}

/** A replayed week as the scores read it. */
export interface StoredWeek {
  districtId: string;
  epiYear: number;
  epiWeek: number;
  tier: string;
}

/** A district-week's cases summed over diseases (voided counts left out). */
export interface WeekCases {
  districtId: string;
  epiYear: number;
  epiWeek: number;
  cases: number;
}

/**
 * What the Look-back reads and writes (all its SQL). Reads of other features' tables are plain SQL,
 * read-only; the replayed weeks go to `look_back_weeks`, never to the live `district_tiers`.
 */
export class LookBackRepository {
  constructor(private readonly ds: DataSource) {}

  /** Any run still marked running died with its process (the caller holds the Look-back lock). */
  async failInterruptedRuns(): Promise<void> {
    await this.ds.query(`UPDATE look_back_runs SET status = 'failed', finished_at = now(), error = coalesce(error, 'interrupted') WHERE status = 'running'`);
  }

  /**
   * One district's weather days between two dates. District days carry no load time, so each is taken
   * as known at the end of its own date (`knownAt` null; server/skill/replay.ts): the replay cuts
   * weather by date only.
   */
  async weatherDays(districtId: string, from: string, to: string): Promise<WeatherDayVersion[]> {
    const rows: { date: string; tmin: number | null; tmax: number | null; rh: number | null; filled: boolean }[] = await this.ds.query(
      `SELECT to_char(date, 'YYYY-MM-DD') AS date, tmin, tmax, rh, filled
         FROM district_weather_days WHERE district_id = $1 AND date BETWEEN $2 AND $3 ORDER BY date`,
      [districtId, from, to],
    );
    return rows.map((r) => ({ ...r, knownAt: null }));
  }

  /**
   * Every version of the district's counts from `fromYear` on: each entry, correction and void of the
   * revision history with when it was recorded. A count without any revision (written straight to the
   * table, e.g. imported history) counts as entered when it was reported (`reported_at`) and, if voided,
   * voided at `voided_at`.
   */
  async caseRevisions(districtId: string, fromYear: number): Promise<CaseRevisionRow[]> {
    const rows: { districtId: string; diseaseId: string; epiYear: number; epiWeek: number; version: number; at: Date; kind: CaseRevisionRow['kind']; cases: number }[] =
      await this.ds.query(
        `SELECT c.district_id AS "districtId", c.disease_id AS "diseaseId", c.epi_year AS "epiYear", c.epi_week AS "epiWeek",
                r.version, r.at, r.kind, (r.new_values->>'cases')::int AS cases
           FROM case_counts c JOIN case_count_revisions r ON r.case_count_id = c.id
          WHERE c.district_id = $1 AND c.epi_year >= $2
         UNION ALL
         SELECT c.district_id, c.disease_id, c.epi_year, c.epi_week, 1, c.reported_at, 'entry', c.cases
           FROM case_counts c
          WHERE c.district_id = $1 AND c.epi_year >= $2
            AND NOT EXISTS (SELECT 1 FROM case_count_revisions r WHERE r.case_count_id = c.id)
         UNION ALL
         SELECT c.district_id, c.disease_id, c.epi_year, c.epi_week, 2, c.voided_at, 'void', c.cases
           FROM case_counts c
          WHERE c.district_id = $1 AND c.epi_year >= $2 AND c.voided_at IS NOT NULL
            AND NOT EXISTS (SELECT 1 FROM case_count_revisions r WHERE r.case_count_id = c.id)`,
        [districtId, fromYear],
      );
    return rows.map((r) => ({ ...r, at: new Date(r.at) }));
  }

  /** Replace one district's replayed weeks of a run, in one transaction: all of them or none. */
  async replaceWeeks(runId: string, districtId: string, weeks: readonly ReplayedWeek[]): Promise<number> {
    return this.ds.transaction(async (m) => {
      await m.delete(LookBackWeekEntity, { runId, districtId });
      if (weeks.length === 0) return 0;
      // In slices, so a long span stays well under PostgreSQL's 65,535 bind parameters.
      for (let i = 0; i < weeks.length; i += 500) {
        await m.insert(
          LookBackWeekEntity,
          weeks.slice(i, i + 500).map((w) => ({
            runId, districtId, epiYear: w.epiYear, epiWeek: w.epiWeek, asOf: w.asOf, tier: w.tier, score: w.score, drivers: w.drivers as object,
          })),
        );
      }
      return weeks.length;
    });
  }

  /** The districts that have replayed weeks in a run, with their region. */
  async runDistricts(runId: string): Promise<LookBackDistrict[]> {
    return this.ds.query(
      `SELECT d.id, d.name, d.region_id AS "regionId", r.name AS "regionName"
         FROM districts d LEFT JOIN regions r ON r.id = d.region_id
        WHERE EXISTS (SELECT 1 FROM look_back_weeks w WHERE w.run_id = $1 AND w.district_id = d.id)
        ORDER BY d.name`,
      [runId],
    );
  }

  async weeks(runId: string, districtIds: string[]): Promise<StoredWeek[]> {
    return this.ds.query(
      `SELECT district_id AS "districtId", epi_year AS "epiYear", epi_week AS "epiWeek", tier
         FROM look_back_weeks WHERE run_id = $1 AND district_id = ANY($2) ORDER BY epi_year, epi_week`,
      [runId, districtIds],
    );
  }

  /**
   * The outcomes: each district-week's cases as they stand now (the newest version of each count,
   * late reports and corrections included, voided counts left out), summed over diseases.
   */
  async weekCases(districtIds: string[]): Promise<WeekCases[]> {
    return this.ds.query(
      `SELECT district_id AS "districtId", epi_year AS "epiYear", epi_week AS "epiWeek", sum(cases)::int AS cases
         FROM case_counts WHERE district_id = ANY($1) AND voided_at IS NULL
        GROUP BY district_id, epi_year, epi_week ORDER BY epi_year, epi_week`,
      [districtIds],
    );
  }
}
