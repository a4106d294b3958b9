import type { DataSource, EntityManager } from 'typeorm';
import type { StationRow } from './weather.presenter';

const STATION_SELECT = `
  SELECT s.id, s.code, s.name, s.latitude, s.longitude, s.elevation,
         to_char(s.active_from, 'YYYY-MM-DD') AS active_from, to_char(s.active_to, 'YYYY-MM-DD') AS active_to, s.is_demo,
         s.district_id, d.code AS district_code, d.name AS district_name,
         to_char(o.last_date, 'YYYY-MM-DD') AS last_date, coalesce(o.days, 0)::int AS days
    FROM weather_stations s
    LEFT JOIN districts d ON d.id = s.district_id
    LEFT JOIN LATERAL (SELECT max(date) AS last_date, count(*) AS days FROM weather_observations WHERE station_id = s.id) o ON true`;

/** Reads of the weather feature (writes happen in the intake and station services, inside their transactions). */
export class WeatherRepository {
  constructor(private readonly ds: DataSource) {}

  /** Stations; with `districtIds`, only those feeding these districts (inside or by interpolation). */
  stations(districtIds?: string[], manager: EntityManager = this.ds.manager): Promise<StationRow[]> {
    return districtIds
      ? manager.query(`${STATION_SELECT} WHERE s.id IN (SELECT station_id FROM district_weather_sources WHERE district_id = ANY($1::uuid[])) ORDER BY s.code`, [districtIds])
      : manager.query(`${STATION_SELECT} ORDER BY s.code`);
  }

  async station(id: string, manager: EntityManager = this.ds.manager): Promise<StationRow | null> {
    return (await manager.query(`${STATION_SELECT} WHERE s.id = $1`, [id]))[0] ?? null;
  }

  async stationFeeds(stationId: string, districtIds: string[]): Promise<boolean> {
    const rows = await this.ds.query('SELECT 1 FROM district_weather_sources WHERE station_id = $1 AND district_id = ANY($2::uuid[]) LIMIT 1', [stationId, districtIds]);
    return rows.length > 0;
  }

  observations(stationId: string, from: string, to: string) {
    return this.ds.query(
      `SELECT to_char(o.date, 'YYYY-MM-DD') AS date, o.tmin, o.tmax, o.rh, o.rain, o.flags, o.upload_id,
              (SELECT count(*)::int FROM weather_observation_revisions r WHERE r.station_id = o.station_id AND r.date = o.date) AS revisions
         FROM weather_observations o WHERE o.station_id = $1 AND o.date BETWEEN $2 AND $3 ORDER BY o.date`,
      [stationId, from, to],
    );
  }

  revisions(stationId: string, date?: string) {
    return this.ds.query(
      `SELECT to_char(date, 'YYYY-MM-DD') AS date, tmin, tmax, rh, rain, flags, previous_upload_id, replaced_by_upload_id, replaced_by, replaced_at,
              kind, reason
         FROM weather_observation_revisions WHERE station_id = $1 AND ($2::date IS NULL OR date = $2::date) ORDER BY date DESC, id DESC LIMIT 1000`,
      [stationId, date ?? null],
    );
  }

  async issueCounts(uploadIds: string[]): Promise<Map<string, number>> {
    if (!uploadIds.length) return new Map();
    const rows: { upload_id: string; n: number }[] = await this.ds.query(
      'SELECT upload_id, count(*)::int AS n FROM weather_upload_issues WHERE upload_id = ANY($1::uuid[]) GROUP BY upload_id',
      [uploadIds],
    );
    return new Map(rows.map((r) => [r.upload_id, r.n]));
  }

  issues(uploadId: string, afterId: string, limit: number) {
    return this.ds.query(
      `SELECT id, row_number, station, date, "column", value, severity, rule, reason FROM weather_upload_issues
        WHERE upload_id = $1 AND id > $2::bigint ORDER BY id LIMIT $3`,
      [uploadId, afterId, limit],
    );
  }

  issuesPage(uploadId: string, offset: number, limit: number) {
    return this.ds.query(
      `SELECT row_number, station, date, "column", value, severity, rule, reason FROM weather_upload_issues
        WHERE upload_id = $1 ORDER BY row_number NULLS FIRST, id OFFSET $2 LIMIT $3`,
      [uploadId, offset, limit],
    );
  }

  sources(districtId: string) {
    return this.ds.query(
      `SELECT w.method, w.distance_km, w.weight, s.id, s.code, s.name FROM district_weather_sources w
         JOIN weather_stations s ON s.id = w.station_id WHERE w.district_id = $1 ORDER BY w.weight DESC, s.code`,
      [districtId],
    );
  }

  seriesDays(districtId: string, from: string, to: string) {
    return this.ds.query(
      `SELECT to_char(date, 'YYYY-MM-DD') AS date, tmin, tmax, rh, rain, filled, station_count FROM district_weather_days
        WHERE district_id = $1 AND date BETWEEN $2 AND $3 ORDER BY date`,
      [districtId, from, to],
    );
  }
}
