import type { DataSource } from 'typeorm';

export interface BoardRowRecord {
  district_id: string;
  code: string;
  name: string;
  is_demo: boolean;
  region_id: string | null;
  region_code: string | null;
  region_name: string | null;
  epi_year: number | null;
  epi_week: number | null;
  as_of: string | null;
  computed_at: Date | null;
  tier: string | null;
  tier_low: string | null;
  tier_high: string | null;
  score: number | null;
  confidence: string | null;
  leading_driver: string | null;
  changed_driver: string | null;
  cases_this_week: number | null;
  cases_epi_year: number | null;
  cases_epi_week: number | null;
  cases_diseases: { code: string; name: string }[] | null;
  channel_zone: string | null;
  latest_weather: string | null;
  profile_id: string | null;
  prev_tier: string | null;
  prev_score: number | null;
}

export class BoardRepository {
  constructor(private readonly ds: DataSource) {}

  /**
   * The board cache's key: changes whenever a run writes tiers, a district is added, renamed, recoded or
   * moves region, a district's profile assignment changes (issue 21), or a region changes. The districts
   * and assignments enter as a sum of row hashes (order-free, no sort), so the query stays one small scan.
   */
  async version(): Promise<string> {
    const [row] = await this.ds.query(
      `SELECT (SELECT coalesce(max(computed_at)::text, '') FROM district_tiers) || '|' ||
              (SELECT count(*)::text || ':' || coalesce(max(created_at)::text, '') || ':' ||
                      coalesce(sum(hashtext(id::text || code || name || is_demo::text || coalesce(region_id::text, '')))::text, '0')
                 FROM districts) || '|' ||
              (SELECT count(*)::text || ':' ||
                      coalesce(sum(hashtext(district_id::text || profile_id || coalesce(biofix::text, '') || coalesce(assigned_at::text, '')))::text, '0')
                 FROM district_profiles) || '|' ||
              (SELECT md5(coalesce(string_agg(id::text || code || name, ',' ORDER BY id), '')) FROM regions) AS v`,
    );
    return row.v;
  }

  /** Every district with its tier of the newest week that has tiers, and the tier of the week before. */
  async rows(): Promise<BoardRowRecord[]> {
    return this.ds.query(
      `WITH latest AS (SELECT epi_year, epi_week FROM district_tiers ORDER BY epi_year DESC, epi_week DESC LIMIT 1)
       SELECT d.id AS district_id, d.code, d.name, d.is_demo, r.id AS region_id, r.code AS region_code, r.name AS region_name, t.epi_year, t.epi_week, to_char(t.as_of, 'YYYY-MM-DD') AS as_of,
              t.computed_at, t.tier, t.tier_low, t.tier_high, t.score, t.confidence, t.leading_driver, t.changed_driver,
              t.cases_this_week, t.cases_epi_year, t.cases_epi_week,
              (SELECT json_agg(json_build_object('code', x.code, 'name', x.name) ORDER BY x.name) FROM diseases x
                WHERE x.id = ANY(t.cases_disease_ids)) AS cases_diseases,
              t.channel_zone, to_char(t.latest_weather, 'YYYY-MM-DD') AS latest_weather, t.profile_id,
              p.tier AS prev_tier, p.score AS prev_score
         FROM districts d
         LEFT JOIN regions r ON r.id = d.region_id
         LEFT JOIN latest ON true
         LEFT JOIN district_tiers t ON t.district_id = d.id AND t.epi_year = latest.epi_year AND t.epi_week = latest.epi_week
         LEFT JOIN LATERAL (
           SELECT tier, score FROM district_tiers p
            WHERE p.district_id = d.id AND (p.epi_year, p.epi_week) < (latest.epi_year, latest.epi_week)
            ORDER BY p.epi_year DESC, p.epi_week DESC LIMIT 1) p ON true`,
    );
  }
}
