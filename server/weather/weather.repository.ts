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
      `SELECT row_number, station, date, "column", value, severity, rule, reason, params FROM weather_upload_issues
        WHERE upload_id = $1 ORDER BY row_number NULLS FIRST, id OFFSET $2 LIMIT $3`,
      [uploadId, offset, limit],
    );
  }

  /**
   * The values stored now for these station codes and days (a report line's station and date), by
   * `code|date`; days without a value are left out.
   */
  async storedDays(keys: { code: string; date: string }[]): Promise<Map<string, { tmin: number; tmax: number; rh: number | null; rain: number | null; held: boolean }>> {
    const out = new Map<string, { tmin: number; tmax: number; rh: number | null; rain: number | null; held: boolean }>();
    if (!keys.length) return out;
    const rows: { code: string; date: string; tmin: number; tmax: number; rh: number | null; rain: number | null; bits: number }[] = await this.ds.query(
      `SELECT k.code, to_char(k.date, 'YYYY-MM-DD') AS date, y.tmin[k.i] AS tmin, y.tmax[k.i] AS tmax, y.rh[k.i] AS rh, y.rain[k.i] AS rain,
              y.flags[k.i] AS bits
         FROM (SELECT u.code, u.date, extract(year FROM u.date)::int AS yr,
                      (u.date - make_date(extract(year FROM u.date)::int, 1, 1)) + 1 AS i
                 FROM unnest($1::text[], $2::date[]) AS u(code, date)) k
         JOIN weather_stations s ON s.code = k.code
         JOIN weather_station_years y ON y.station_id = s.id AND y.year = k.yr
        WHERE y.tmin[k.i] IS NOT NULL`,
      [keys.map((k) => k.code), keys.map((k) => k.date)],
    );
    for (const r of rows) out.set(`${r.code}|${r.date}`, { tmin: r.tmin, tmax: r.tmax, rh: r.rh, rain: r.rain, held: (r.bits & 8) !== 0 });
    return out;
  }

  /** Held station-days (at most `limit`, newest first) with the report lines of the intake that wrote them, and their count. */
  async held(limit: number) {
    const [{ total }] = await this.ds.query(`SELECT count(*)::int AS total FROM weather_observations WHERE 'held' = ANY(flags)`);
    const rows = await this.ds.query(
      `SELECT o.station_id, s.code AS station, to_char(o.date, 'YYYY-MM-DD') AS date, o.tmin, o.tmax, o.rh, o.rain, o.upload_id,
              coalesce((SELECT json_agg(json_build_object('rule', i.rule, 'column', i."column", 'params', i.params) ORDER BY i.id)
                          FROM weather_upload_issues i
                         WHERE i.upload_id = o.upload_id AND i.severity = 'held' AND i.station = s.code AND i.date = to_char(o.date, 'YYYY-MM-DD')), '[]') AS reasons
         FROM weather_observations o JOIN weather_stations s ON s.id = o.station_id
        WHERE 'held' = ANY(o.flags) ORDER BY o.date DESC, s.code LIMIT $1`,
      [limit],
    );
    return { total: total as number, rows };
  }

  /** Open conflicts (a hand correction standing against newer values), oldest first, with the values stored now. */
  openConflicts(limit: number) {
    return this.ds.query(
      `SELECT c.id::text AS id, c.station_id, s.code AS station, to_char(c.date, 'YYYY-MM-DD') AS date, c.tmin, c.tmax, c.rh, c.rain,
              c.upload_id, u.source, c.created_at,
              o.tmin AS cur_tmin, o.tmax AS cur_tmax, o.rh AS cur_rh, o.rain AS cur_rain
         FROM weather_observation_conflicts c
         JOIN weather_stations s ON s.id = c.station_id
         LEFT JOIN weather_uploads u ON u.id = c.upload_id
         LEFT JOIN LATERAL (SELECT y.tmin[i] AS tmin, y.tmax[i] AS tmax, y.rh[i] AS rh, y.rain[i] AS rain
                              FROM weather_station_years y,
                                   LATERAL (SELECT (c.date - make_date(extract(year FROM c.date)::int, 1, 1)) + 1 AS i) k
                             WHERE y.station_id = c.station_id AND y.year = extract(year FROM c.date)::int) o ON true
        WHERE c.resolved_at IS NULL ORDER BY c.created_at, c.id LIMIT $1`,
      [limit],
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
