import type { DataSource, EntityManager } from 'typeorm';

export interface RegionRow {
  id: string;
  code: string;
  name: string;
  districtCount: number;
}

/** Regions and the districts they hold (all SQL of regions lives here). */
export class RegionsRepository {
  constructor(private readonly ds: DataSource) {}

  list(m: EntityManager = this.ds.manager): Promise<RegionRow[]> {
    return m.query(
      `SELECT r.id, r.code, r.name, count(d.id)::int AS "districtCount"
         FROM regions r LEFT JOIN districts d ON d.region_id = r.id
        GROUP BY r.id ORDER BY r.code`,
    );
  }

  /** Region codes (compared upper-case) → ids; codes not found are left out. */
  async idsByCode(m: EntityManager, codes: string[]): Promise<Map<string, string>> {
    const rows: { id: string; code: string }[] = await m.query(
      'SELECT id, code FROM regions WHERE upper(code) = ANY($1::text[])', [codes.map((c) => c.toUpperCase())]);
    return new Map(rows.map((r) => [r.code.toUpperCase(), r.id]));
  }

  /** Every district of these regions, in code order. */
  async districtIdsOf(m: EntityManager, regionIds: string[]): Promise<string[]> {
    const rows: { id: string }[] = await m.query('SELECT id FROM districts WHERE region_id = ANY($1::uuid[]) ORDER BY code', [regionIds]);
    return rows.map((r) => r.id);
  }
}
