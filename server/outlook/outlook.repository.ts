import type { DataSource } from 'typeorm';

/** All SQL of the Case outlook (docs/outlook.md). */
export class OutlookRepository {
  constructor(private readonly ds: DataSource) {}

  async district(id: string): Promise<{ id: string; lat: number | null } | undefined> {
    const [row] = await this.ds.query(`SELECT id, centroid_lat AS lat FROM districts WHERE id = $1`, [id]);
    return row;
  }

  /** The diseases with counts in the district, most cases first. */
  async diseasesWithCounts(districtId: string): Promise<{ id: string; name: string; profileIds: string[]; total: number }[]> {
    return this.ds.query(
      `SELECT d.id, d.name, d.profile_ids AS "profileIds", sum(c.cases)::int AS total
         FROM case_counts c JOIN diseases d ON d.id = c.disease_id
        WHERE c.district_id = $1 AND c.voided_at IS NULL
        GROUP BY d.id, d.name, d.profile_ids ORDER BY total DESC, d.name`,
      [districtId],
    );
  }

  async disease(id: string): Promise<{ id: string; name: string; profileIds: string[] } | undefined> {
    const [row] = await this.ds.query(`SELECT id, name, profile_ids AS "profileIds" FROM diseases WHERE id = $1`, [id]);
    return row;
  }

  async profiles(districtId: string): Promise<{ profileId: string; biofix: string | null }[]> {
    return this.ds.query(`SELECT profile_id AS "profileId", biofix FROM district_profiles WHERE district_id = $1 ORDER BY profile_id`, [districtId]);
  }

  /** Weekly counts (not voided) of one disease from `fromYear` on, with a fingerprint of the ledger for the cache. */
  async counts(districtId: string, diseaseId: string, fromYear: number): Promise<{ year: number; week: number; cases: number }[]> {
    return this.ds.query(
      `SELECT epi_year AS year, epi_week AS week, cases FROM case_counts
        WHERE district_id = $1 AND disease_id = $2 AND epi_year >= $3 AND voided_at IS NULL ORDER BY epi_year, epi_week`,
      [districtId, diseaseId, fromYear],
    );
  }

  /** A fingerprint of the district's counts and weather: a change anywhere in them makes a new outlook. */
  async fingerprint(districtId: string, diseaseId: string): Promise<string> {
    const [row] = await this.ds.query(
      `SELECT (SELECT concat(count(*), ':', coalesce(sum(cases), 0), ':', coalesce(max(updated_at)::text, ''), ':', coalesce(max(voided_at)::text, ''))
                 FROM case_counts WHERE district_id = $1 AND disease_id = $2) AS c,
              (SELECT concat(count(*), ':', coalesce(max(date)::text, ''), ':', coalesce(sum(coalesce(tmin, 0) + coalesce(tmax, 0) + coalesce(rain, 0)), 0))
                 FROM district_weather_days WHERE district_id = $1) AS w,
              (SELECT string_agg(profile_id || '@' || coalesce(biofix, ''), ',' ORDER BY profile_id) FROM district_profiles WHERE district_id = $1) AS p`,
      [districtId, diseaseId],
    );
    return `${row.c}|${row.w}|${row.p ?? ''}`;
  }

  /** Daily rain (mm; null unknown) from `from` to `to`. */
  async rain(districtId: string, from: string, to: string): Promise<{ date: string; rain: number | null }[]> {
    return this.ds.query(
      `SELECT to_char(date, 'YYYY-MM-DD') AS date, rain FROM district_weather_days WHERE district_id = $1 AND date BETWEEN $2 AND $3 ORDER BY date`,
      [districtId, from, to],
    );
  }
}
