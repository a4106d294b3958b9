import type { DataSource, EntityManager } from 'typeorm';
import type { PolygonGeometry } from '../../shared/api/districts.schema';

export interface DistrictUpsert {
  code: string;
  name: string;
  boundary: PolygonGeometry;
  display: PolygonGeometry | null;
  lon: number;
  lat: number;
  regionId: string | null;
}

/** Rows per statement: bounds one statement's parameters and memory (geometries are large). */
const CHUNK = 500;
const chunks = <T>(xs: T[], n = CHUNK) => Array.from({ length: Math.ceil(xs.length / n) }, (_, i) => xs.slice(i * n, i * n + n));

/** All SQL of the imports: set-based (unnest), a statement per chunk of rows, never one per row. */
export class DistrictImportRepository {
  constructor(private readonly ds: DataSource) {}

  /** Centres of the stored districts with a boundary, other than these codes (the plausibility references). */
  centres(exceptCodes: string[]): Promise<{ code: string; lon: number; lat: number }[]> {
    return this.ds.query(
      `SELECT code, centroid_lon AS lon, centroid_lat AS lat FROM districts
        WHERE boundary IS NOT NULL AND centroid_lat IS NOT NULL AND centroid_lon IS NOT NULL AND NOT (code = ANY($1::text[]))`,
      [exceptCodes],
    );
  }

  async existingCodes(codes: string[], m: EntityManager = this.ds.manager): Promise<Set<string>> {
    const rows: { code: string }[] = await m.query('SELECT code FROM districts WHERE code = ANY($1::text[])', [codes]);
    return new Set(rows.map((r) => r.code));
  }

  async existingRegionCodes(codes: string[]): Promise<Set<string>> {
    const rows: { code: string }[] = await this.ds.query('SELECT code FROM regions WHERE code = ANY($1::text[])', [codes]);
    return new Set(rows.map((r) => r.code));
  }

  /** Create or rename regions by code; gives code → id. */
  async upsertRegions(m: EntityManager, regions: { code: string; name: string }[]): Promise<Map<string, string>> {
    if (regions.length === 0) return new Map();
    const rows: { id: string; code: string }[] = await m.query(
      `INSERT INTO regions (code, name) SELECT * FROM unnest($1::text[], $2::text[])
       ON CONFLICT (code) DO UPDATE SET name = EXCLUDED.name RETURNING id, code`,
      [regions.map((r) => r.code), regions.map((r) => r.name)],
    );
    return new Map(rows.map((r) => [r.code, r.id]));
  }

  /** What the audit keeps as "before" for districts that exist. */
  async snapshot(m: EntityManager, codes: string[]): Promise<Map<string, object>> {
    const rows: { code: string; name: string; region: string | null; has_boundary: boolean }[] = await m.query(
      `SELECT d.code, d.name, r.code AS region, d.boundary IS NOT NULL AS has_boundary
         FROM districts d LEFT JOIN regions r ON r.id = d.region_id WHERE d.code = ANY($1::text[])`,
      [codes],
    );
    return new Map(rows.map((r) => [r.code, { code: r.code, name: r.name, region: r.region, hasBoundary: r.has_boundary }]));
  }

  /**
   * Insert or update districts by code. A district keeps its region when the file names none.
   * Gives code → id for every row.
   */
  async upsertDistricts(m: EntityManager, rows: DistrictUpsert[]): Promise<Map<string, string>> {
    const ids = new Map<string, string>();
    for (const part of chunks(rows)) {
      const out: { id: string; code: string }[] = await m.query(
        `INSERT INTO districts (code, name, boundary, display_boundary, centroid_lon, centroid_lat, region_id, is_demo)
         SELECT code, name, boundary, display, lon, lat, region_id, false
           FROM unnest($1::text[], $2::text[], $3::jsonb[], $4::jsonb[], $5::float8[], $6::float8[], $7::uuid[])
                AS v(code, name, boundary, display, lon, lat, region_id)
         ON CONFLICT (code) DO UPDATE SET
           name = EXCLUDED.name, boundary = EXCLUDED.boundary, display_boundary = EXCLUDED.display_boundary,
           centroid_lon = EXCLUDED.centroid_lon, centroid_lat = EXCLUDED.centroid_lat,
           region_id = COALESCE(EXCLUDED.region_id, districts.region_id)
         RETURNING id, code`,
        [
          part.map((r) => r.code), part.map((r) => r.name),
          part.map((r) => JSON.stringify(r.boundary)), part.map((r) => (r.display ? JSON.stringify(r.display) : null)),
          part.map((r) => r.lon), part.map((r) => r.lat), part.map((r) => r.regionId),
        ],
      );
      for (const r of out) ids.set(r.code, r.id);
    }
    return ids;
  }

  /** Insert or replace populations by (district, year). */
  async upsertPopulations(m: EntityManager, rows: { districtId: string; year: number; population: number }[]): Promise<void> {
    for (const part of chunks(rows, 5000))
      await m.query(
        `INSERT INTO district_populations (district_id, year, population)
         SELECT * FROM unnest($1::uuid[], $2::int[], $3::int[])
         ON CONFLICT (district_id, year) DO UPDATE SET population = EXCLUDED.population`,
        [part.map((r) => r.districtId), part.map((r) => r.year), part.map((r) => r.population)],
      );
  }

  /** Populations as they stand for these (district, year) pairs (the audit's "before"). */
  async populations(m: EntityManager, rows: { districtId: string; year: number }[]): Promise<Map<string, number>> {
    const out: { district_id: string; year: number; population: number }[] = await m.query(
      `SELECT p.district_id, p.year, p.population FROM district_populations p
         JOIN unnest($1::uuid[], $2::int[]) AS v(district_id, year) ON v.district_id = p.district_id AND v.year = p.year`,
      [rows.map((r) => r.districtId), rows.map((r) => r.year)],
    );
    return new Map(out.map((r) => [`${r.district_id}|${r.year}`, r.population]));
  }

  /** District codes (upper-case) → ids. */
  async districtIdsByCode(codes: string[]): Promise<Map<string, string>> {
    const rows: { id: string; code: string }[] = await this.ds.query('SELECT id, upper(code) AS code FROM districts WHERE upper(code) = ANY($1::text[])', [codes]);
    return new Map(rows.map((r) => [r.code, r.id]));
  }

  /** Stations by code as they stand (the audit's "before"). */
  async stations(m: EntityManager, codes: string[]): Promise<Map<string, object>> {
    const rows: { code: string; name: string; latitude: number; longitude: number; elevation: number | null; active_from: string | null; active_to: string | null }[] =
      await m.query(
        `SELECT code, name, latitude, longitude, elevation, to_char(active_from, 'YYYY-MM-DD') AS active_from, to_char(active_to, 'YYYY-MM-DD') AS active_to
           FROM weather_stations WHERE code = ANY($1::text[])`,
        [codes],
      );
    return new Map(rows.map((r) => [r.code, { name: r.name, latitude: r.latitude, longitude: r.longitude, elevation: r.elevation, activeFrom: r.active_from, activeTo: r.active_to }]));
  }

  /** Insert or update stations by code; gives code → id. */
  async upsertStations(m: EntityManager, rows: { code: string; name: string; latitude: number; longitude: number; elevation: number | null; activeFrom: string | null; activeTo: string | null }[]): Promise<Map<string, string>> {
    const ids = new Map<string, string>();
    for (const part of chunks(rows, 5000)) {
      const out: { id: string; code: string }[] = await m.query(
        `INSERT INTO weather_stations (code, name, latitude, longitude, elevation, active_from, active_to, is_demo)
         SELECT code, name, lat, lon, elev, af, at, false
           FROM unnest($1::text[], $2::text[], $3::float8[], $4::float8[], $5::float8[], $6::date[], $7::date[]) AS v(code, name, lat, lon, elev, af, at)
         ON CONFLICT (code) DO UPDATE SET name = EXCLUDED.name, latitude = EXCLUDED.latitude, longitude = EXCLUDED.longitude,
           elevation = EXCLUDED.elevation, active_from = EXCLUDED.active_from, active_to = EXCLUDED.active_to
         RETURNING id, code`,
        [part.map((r) => r.code), part.map((r) => r.name), part.map((r) => r.latitude), part.map((r) => r.longitude),
          part.map((r) => r.elevation), part.map((r) => r.activeFrom), part.map((r) => r.activeTo)],
      );
      for (const r of out) ids.set(r.code, r.id);
    }
    return ids;
  }
}
