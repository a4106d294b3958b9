import type { Response } from 'express';
import type { EntityManager } from 'typeorm';
import type {
  ConfirmBody, ConflictDto, CorrectionBody, DistrictWeatherSource, HeldDayDto, IssueDto, ResolveConflictBody, StationCreateBody, StationUpdateBody, UploadDto, VoidDayBody,
} from '../../shared/api/weather.schema';
import { fromCelsius, fromMillimetres, type RainUnit, type TemperatureUnit, toCelsius, toMillimetres } from '../../shared/units';
import { csvCell } from '../../shared/csv';
import { issueValueUnit } from '../../shared/weather/qc';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit.repository';
import { assertDistrictVisible, type Principal, seesAllDistricts } from '../auth/principal';
import { DistrictEntity } from '../districts/district.entity';
import { badRequest, conflict, forbidden, notFound, unprocessable } from '../http/errors';
import { recomputeDistrictSeries, recomputeSeriesSpans } from './district-series.repository';
import {
  FLAG_BITS, flagNames, readStationYears, stationYearKey, uploadIndex, writeStationYearFlags, writeStationYears, yearStartDay,
} from './station-years.repository';
import { WeatherObservationRevisionEntity } from './weather-observation-revision.entity';
import { refreshAssignments } from './weather-geo';
import { recordsSource, WeatherIntakeService } from './weather-intake.service';
import { WeatherStationEntity } from './weather-station.entity';
import { WeatherUploadEntity } from './weather-upload.entity';
import { presentStation, presentUpload } from './weather.presenter';
import { WeatherRepository } from './weather.repository';
import { isUniqueViolation } from '../platform/database-errors';

const today = () => new Date().toISOString().slice(0, 10);
const daysBefore = (iso: string, n: number) => new Date(Date.parse(iso) - n * 86_400_000).toISOString().slice(0, 10);

const nanToNull = (v: number) => (Number.isNaN(v) ? null : v);
/** A YYYY-MM-DD text that names a real day (report lines keep a rejected row's date as it was written). */
const isRealDate = (s: string) => {
  if (!/^\d{4}-\d{2}-\d{2}$/.test(s)) return false;
  const t = Date.parse(`${s}T00:00:00Z`);
  return Number.isFinite(t) && new Date(t).toISOString().slice(0, 10) === s && Number(s.slice(0, 4)) >= 1900 && Number(s.slice(0, 4)) <= 2100;
};

export class WeatherService {
  readonly intake: WeatherIntakeService;
  private readonly repo: WeatherRepository;

  constructor(private readonly ctx: AppContext) {
    this.intake = new WeatherIntakeService(ctx);
    this.repo = new WeatherRepository(ctx.ds);
  }

  // ---- stations
  async stations(p: Principal) {
    const rows = await this.repo.stations(seesAllDistricts(p) ? undefined : p.districtIds);
    return { stations: rows.map(presentStation) };
  }

  private async visibleStation(p: Principal, id: string) {
    const row = await this.repo.station(id);
    if (!row) throw notFound('The station');
    if (!seesAllDistricts(p) && !(await this.repo.stationFeeds(id, p.districtIds))) throw forbidden('This station does not feed your district.');
    return row;
  }

  async createStation(actor: Principal, body: StationCreateBody) {
    try {
      const id = await this.ctx.ds.transaction(async (manager) => {
        const saved = await manager.save(WeatherStationEntity, manager.create(WeatherStationEntity, { ...body, isDemo: false, districtId: null }));
        await this.afterStationChange(manager);
        await recordAudit(manager, { actorId: actor.userId, action: 'weather.station-created', entity: 'weather_station', entityId: saved.id, after: body });
        return saved.id;
      });
      return presentStation((await this.repo.station(id))!);
    } catch (err) {
      if (isUniqueViolation(err)) throw conflict('code_taken', 'Another station already has this code.');
      throw err;
    }
  }

  async updateStation(actor: Principal, id: string, body: StationUpdateBody) {
    await this.ctx.ds.transaction(async (manager) => {
      const current = await manager.findOneBy(WeatherStationEntity, { id });
      if (!current) throw notFound('The station');
      const next = { ...current, ...body };
      if (next.activeFrom && next.activeTo && next.activeFrom > next.activeTo)
        throw badRequest('invalid_input', 'The last active date is before the first.', [{ path: 'activeTo', message: 'must not be before the first active date' }]);
      await manager.update(WeatherStationEntity, { id }, body);
      await this.afterStationChange(manager);
      const { name, latitude, longitude, elevation, activeFrom, activeTo } = current;
      await recordAudit(manager, {
        actorId: actor.userId, action: 'weather.station-updated', entity: 'weather_station', entityId: id,
        before: { name, latitude, longitude, elevation, activeFrom, activeTo }, after: body,
      });
    });
    return presentStation((await this.repo.station(id))!);
  }

  /** A station moved, appeared or changed: re-place stations in districts and recompute the districts concerned. */
  private async afterStationChange(manager: Parameters<typeof refreshAssignments>[0]) {
    const touched = await refreshAssignments(manager, this.ctx.config.WEATHER_IDW_STATIONS, this.ctx.config.WEATHER_IDW_MAX_KM);
    await recomputeDistrictSeries(manager, touched, this.ctx.config.WEATHER_FILL_MAX_DAYS);
  }

  async stationDays(p: Principal, id: string, range: { from?: string; to?: string }) {
    const station = await this.visibleStation(p, id);
    const to = range.to ?? station.last_date ?? today();
    const from = range.from ?? daysBefore(to, 365);
    const rows = await this.repo.observations(id, from, to);
    return {
      station: presentStation(station),
      days: rows.map((r: any) => ({
        date: r.date, tmin: r.tmin, tmax: r.tmax, rh: r.rh, rain: r.rain, flags: r.flags, uploadId: r.upload_id, revisions: r.revisions,
      })),
    };
  }

  async revisions(id: string, date?: string) {
    if (!(await this.repo.station(id))) throw notFound('The station');
    const rows = await this.repo.revisions(id, date);
    return {
      revisions: rows.map((r: any) => ({
        date: r.date, tmin: r.tmin, tmax: r.tmax, rh: r.rh, rain: r.rain, flags: r.flags,
        previousUploadId: r.previous_upload_id, replacedByUploadId: r.replaced_by_upload_id, replacedBy: r.replaced_by,
        replacedAt: new Date(r.replaced_at).toISOString(),
        kind: r.kind, reason: r.reason,
      })),
    };
  }

  // ---- uploads
  async acceptFile(actor: Principal, file: Express.Multer.File | undefined, form: { tempUnit: 'C' | 'F'; rainUnit: 'mm' | 'in' }, wait: boolean) {
    if (!file)
      throw badRequest('no_file', 'Choose a CSV file to upload.', [{ path: 'file', message: 'is required (a CSV file)' }]);
    (file as Express.Multer.File & { taken?: boolean }).taken = true; // from here on, runFile deletes it
    const upload = await this.intake.start({
      source: 'upload', fileName: file.originalname.slice(0, 200), tempUnit: form.tempUnit, rainUnit: form.rainUnit,
      bytesTotal: file.size, actorId: actor.userId,
    });
    // Without ?wait the answer still waits for the header to be read, so a file refused for its form
    // (binary, empty, a wrong header, a first line past the limit) is a 422 at once; a refusal found
    // later is the upload's status (refused, with the reason), which the Intake screen follows.
    let headerRead!: () => void;
    const started = new Promise<void>((resolve) => (headerRead = resolve));
    const done = this.intake.runFile(upload, file.path, headerRead);
    if (wait) await done;
    else {
      done.catch((err) => this.ctx.logger.error({ err }, 'weather upload crashed'));
      await Promise.race([done, started]);
    }
    const result = await this.upload(upload.id);
    if (result.status === 'refused') throw refusal(result);
    return result;
  }

  async uploads() {
    await this.intake.sweepStale();
    const list = await this.ctx.ds.getRepository(WeatherUploadEntity).find({ order: { createdAt: 'DESC' }, take: 50 });
    const counts = await this.repo.issueCounts(list.map((u) => u.id));
    return { uploads: list.map((u) => presentUpload(u, counts.get(u.id) ?? 0)) };
  }

  /** A feed pull's upload; an answer refused as a whole is a 422 with its reason, as for a file. */
  async pulled(id: string) {
    const result = await this.upload(id);
    if (result.status === 'refused') throw refusal(result);
    return result;
  }

  /** One intake's state. Reading it also marks failed an intake whose process died (see sweepStale). */
  async upload(id: string) {
    await this.intake.sweepStale();
    const u = await this.ctx.ds.getRepository(WeatherUploadEntity).findOneBy({ id });
    if (!u) throw notFound('The upload');
    return presentUpload(u, (await this.repo.issueCounts([id])).get(id) ?? 0);
  }

  async issues(id: string, offset: number, limit: number): Promise<{ total: number; issues: IssueDto[] }> {
    const u = await this.upload(id);
    const rows = await this.repo.issuesPage(id, offset, limit);
    // Every value stored now for the lines' station-days, so Correct starts from the whole row (issue 21).
    const keys = new Map<string, { code: string; date: string }>();
    for (const r of rows as { station: string | null; date: string | null }[])
      if (r.station && r.date && isRealDate(r.date)) keys.set(`${r.station}|${r.date}`, { code: r.station, date: r.date });
    const stored = await this.repo.storedDays([...keys.values()]);
    return {
      total: u.issueCount,
      issues: rows.map((r: any) => ({
        rowNumber: r.row_number, station: r.station, date: r.date, column: r.column, value: r.value, severity: r.severity, rule: r.rule, reason: r.reason,
        params: r.params ?? null, stored: stored.get(`${r.station}|${r.date}`) ?? null,
      })),
    };
  }

  /**
   * The row report as a CSV download, streamed page by page; every cell spreadsheet-safe. Temperatures
   * and rain are given in the units asked for (SI by default), named in the header.
   */
  async issuesCsv(id: string, res: Response, units: IssueUnits = { temperature: 'C', rain: 'mm' }) {
    const u = await this.upload(id);
    res.status(200);
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="intake-report-${u.id.slice(0, 8)}.csv"`);
    res.write(['row', 'station', 'date', 'column', `value (°${units.temperature}; ${units.rain})`, 'outcome', 'rule', 'reason'].map(csvCell).join(',') + '\n');
    let after = '0';
    for (;;) {
      const rows = await this.repo.issues(id, after, 5000);
      if (!rows.length) break;
      let chunk = '';
      for (const r of rows)
        chunk += [r.row_number, r.station, r.date, r.column, issueValueIn(r, u, units), r.severity, r.rule, r.reason].map(csvCell).join(',') + '\n';
      if (!res.write(chunk)) await new Promise((resolve) => res.once('drain', resolve));
      after = rows[rows.length - 1].id;
    }
    res.end();
  }

  /**
   * Void one station-day entered in error: its values move to the revisions (kind 'void', with the
   * reason), the day becomes a gap, and the district series it feeds are recomputed, so it counts
   * nowhere (District file, season run inputs; their fingerprints change). One transaction with its audit.
   */
  async voidDay(actor: Principal, body: VoidDayBody) {
    return this.ctx.ds.transaction(async (manager) => {
      const [found]: { id: string }[] = await manager.query('SELECT id FROM weather_stations WHERE code = $1', [body.station]);
      if (!found) throw badRequest('unknown_station', 'No station has this code.', [{ path: 'station', message: 'is not a known station' }]);
      const stationId = found.id;
      const year = Number(body.date.slice(0, 4));
      // Serialise with intakes writing this station-year.
      await manager.query('SELECT 1 FROM weather_station_years WHERE station_id = $1 AND year = $2 FOR UPDATE', [stationId, year]);
      const y = (await readStationYears(manager, [{ stationId: stationId, year }])).get(stationYearKey(stationId, year));
      const i = Date.parse(`${body.date}T00:00:00Z`) / 86_400_000 - yearStartDay(year);
      if (!y || !(i >= 0 && i < y.tmin.length) || Number.isNaN(y.tmin[i]))
        throw badRequest('no_value', 'The station has no value on this day.', [{ path: 'date', message: 'has no value at this station' }]);
      const old = { tmin: y.tmin[i], tmax: y.tmax[i], rh: nanToNull(y.rh[i]), rain: nanToNull(y.rain[i]), flags: flagNames(y.flags[i]) };
      const previousUploadId = y.uploadIx[i] > 0 ? y.uploads[y.uploadIx[i] - 1] : null;
      await manager.insert(WeatherObservationRevisionEntity, {
        stationId: stationId, date: body.date, ...old, previousUploadId, replacedByUploadId: null, replacedBy: actor.userId, kind: 'void', reason: body.reason,
      });
      y.tmin[i] = Number.NaN;
      y.tmax[i] = Number.NaN;
      y.rh[i] = Number.NaN;
      y.rain[i] = Number.NaN;
      y.flags[i] = 0;
      y.uploadIx[i] = 0;
      await writeStationYears(manager, [y]);
      const fed = await this.recomputeFedBy(manager, stationId, body.date);
      await recordAudit(manager, {
        actorId: actor.userId, action: 'weather-day.voided', entity: 'weather_station', entityId: stationId,
        before: { date: body.date, ...old, uploadId: previousUploadId }, after: { voided: true, districtsRecomputed: fed }, reason: body.reason,
      });
      return { stationId: stationId, date: body.date, voided: { ...old, reason: body.reason }, districtsRecomputed: fed };
    });
  }

  // ---- held days (docs/weather-intake.md § Plausibility)
  async held(limit = 500): Promise<{ total: number; held: HeldDayDto[] }> {
    const { total, rows } = await this.repo.held(limit);
    return {
      total,
      held: rows.map((r: any) => ({
        stationId: r.station_id, station: r.station, date: r.date, tmin: r.tmin, tmax: r.tmax, rh: r.rh, rain: r.rain, uploadId: r.upload_id,
        reasons: r.reasons,
      })),
    };
  }

  /**
   * A person confirms a held station-day as true: the held bit goes, the districts it feeds are recomputed
   * (so it counts in the series, the fingerprints and the next season run), with the reason in the audit.
   */
  async confirm(actor: Principal, body: ConfirmBody) {
    return this.ctx.ds.transaction(async (manager) => {
      const { stationId, y, i } = await this.lockedDay(manager, body.station, body.date);
      if ((y.flags[i] & FLAG_BITS.held) === 0)
        throw badRequest('not_held', 'This station-day is not held.', [{ path: 'date', message: 'is not held at this station' }]);
      y.flags[i] &= ~FLAG_BITS.held;
      await writeStationYearFlags(manager, [y]);
      const districts = await this.recomputeFedBy(manager, stationId, body.date);
      await recordAudit(manager, {
        actorId: actor.userId, action: 'weather-day.confirmed', entity: 'weather_station', entityId: stationId,
        before: { date: body.date, held: true, tmin: y.tmin[i], tmax: y.tmax[i], rh: nanToNull(y.rh[i]), rain: nanToNull(y.rain[i]) },
        after: { held: false, districtsRecomputed: districts }, reason: body.reason,
      });
      return { stationId, date: body.date, districtsRecomputed: districts };
    });
  }

  // ---- conflicts: hand corrections win (docs/weather-intake.md § Hand corrections win)
  async conflicts(limit = 500): Promise<{ conflicts: ConflictDto[] }> {
    const rows = await this.repo.openConflicts(limit);
    return {
      conflicts: rows.map((r: any) => ({
        id: r.id, stationId: r.station_id, station: r.station, date: r.date,
        current: r.cur_tmin === null ? null : { tmin: r.cur_tmin, tmax: r.cur_tmax, rh: r.cur_rh, rain: r.cur_rain },
        incoming: { tmin: r.tmin, tmax: r.tmax, rh: r.rh, rain: r.rain },
        uploadId: r.upload_id, source: r.source ?? 'feed', createdAt: new Date(r.created_at).toISOString(),
      })),
    };
  }

  /**
   * Resolve an open conflict. keep: the hand correction stays (and keeps winning over later pulls).
   * take: the incoming values replace it; the corrected values go to the revisions, the day's flags are
   * cleared (the values were checked when they came in), and the districts it feeds are recomputed.
   */
  async resolveConflict(actor: Principal, id: string, body: ResolveConflictBody) {
    return this.ctx.ds.transaction(async (manager) => {
      const [c]: { station_id: string; code: string; date: string; tmin: number; tmax: number; rh: number | null; rain: number | null; upload_id: string; resolved_at: Date | null }[] =
        await manager.query(
          `SELECT c.station_id, s.code, to_char(c.date, 'YYYY-MM-DD') AS date, c.tmin, c.tmax, c.rh, c.rain, c.upload_id, c.resolved_at
             FROM weather_observation_conflicts c JOIN weather_stations s ON s.id = c.station_id WHERE c.id = $1 FOR UPDATE OF c`,
          [id],
        );
      if (!c) throw notFound('The conflict');
      if (c.resolved_at) throw conflict('conflict_resolved', 'This conflict was already resolved.');
      let districts = 0;
      let before: Record<string, unknown> | null = null;
      if (body.choice === 'take') {
        const { stationId, y, i } = await this.lockedDay(manager, c.code, c.date);
        before = { tmin: y.tmin[i], tmax: y.tmax[i], rh: nanToNull(y.rh[i]), rain: nanToNull(y.rain[i]), flags: flagNames(y.flags[i]) };
        await manager.insert(WeatherObservationRevisionEntity, {
          stationId, date: c.date, tmin: y.tmin[i], tmax: y.tmax[i], rh: nanToNull(y.rh[i]), rain: nanToNull(y.rain[i]), flags: flagNames(y.flags[i]),
          previousUploadId: y.uploadIx[i] > 0 ? y.uploads[y.uploadIx[i] - 1] : null, replacedByUploadId: c.upload_id, replacedBy: actor.userId,
          kind: 'replaced', reason: body.reason,
        });
        y.tmin[i] = c.tmin;
        y.tmax[i] = c.tmax;
        y.rh[i] = c.rh ?? Number.NaN;
        y.rain[i] = c.rain ?? Number.NaN;
        y.flags[i] = 0;
        y.uploadIx[i] = uploadIndex(y, c.upload_id);
        await writeStationYears(manager, [y]);
        districts = await this.recomputeFedBy(manager, stationId, c.date);
      }
      await manager.query(
        `UPDATE weather_observation_conflicts SET resolved_at = now(), resolved_by = $2, choice = $3, reason = $4 WHERE id = $1`,
        [id, actor.userId, body.choice, body.reason],
      );
      await recordAudit(manager, {
        actorId: actor.userId, action: 'weather-conflict.resolved', entity: 'weather_station', entityId: c.station_id,
        before: { conflict: id, date: c.date, current: before, incoming: { tmin: c.tmin, tmax: c.tmax, rh: c.rh, rain: c.rain } },
        after: { choice: body.choice, districtsRecomputed: districts }, reason: body.reason,
      });
      return { id, choice: body.choice, districtsRecomputed: districts };
    });
  }

  /** A station-day's stored year, locked against intakes (400 naming the field when there is no such station or value). */
  private async lockedDay(manager: EntityManager, code: string, date: string) {
    const [found]: { id: string }[] = await manager.query('SELECT id FROM weather_stations WHERE code = $1', [code]);
    if (!found) throw badRequest('unknown_station', 'No station has this code.', [{ path: 'station', message: 'is not a known station' }]);
    const stationId = found.id;
    const year = Number(date.slice(0, 4));
    await manager.query('SELECT 1 FROM weather_station_years WHERE station_id = $1 AND year = $2 FOR UPDATE', [stationId, year]);
    const y = (await readStationYears(manager, [{ stationId, year }])).get(stationYearKey(stationId, year));
    const i = Date.parse(`${date}T00:00:00Z`) / 86_400_000 - yearStartDay(year);
    if (!y || !(i >= 0 && i < y.tmin.length) || Number.isNaN(y.tmin[i]))
      throw badRequest('no_value', 'The station has no value on this day.', [{ path: 'date', message: 'has no value at this station' }]);
    return { stationId, y, i };
  }

  /** Recompute the series of every district this station feeds, around the one day that changed; how many. */
  private async recomputeFedBy(manager: EntityManager, stationId: string, date: string): Promise<number> {
    const fed: { district_id: string }[] = await manager.query('SELECT DISTINCT district_id FROM district_weather_sources WHERE station_id = $1', [stationId]);
    await recomputeSeriesSpans(manager, fed.map((r) => ({ districtId: r.district_id, from: date, to: date })), this.ctx.config.WEATHER_FILL_MAX_DAYS);
    return fed.length;
  }

  /** One corrected day: a one-row intake through the same checks; a rejected row is a 400 with the reasons. */
  async correct(actor: Principal, body: CorrectionBody) {
    const s = (v: number | null | undefined) => (v === null || v === undefined ? '' : String(v));
    const header = ['station', 'date', 'tmin', 'tmax', 'rh', 'dewpoint', 'rain'];
    const rows = [[body.station, body.date, s(body.tmin), s(body.tmax), s(body.rh), s(body.dewpoint), s(body.rain)]];
    // A refused correction writes nothing: the row checks run first, before any upload is recorded.
    const refused = await this.intake.rowIssues(header, rows, { tempUnit: body.tempUnit, rainUnit: body.rainUnit });
    if (refused.length > 0) throw rowRejected(refused);
    const upload = await this.intake.start({
      source: 'correction', fileName: null, tempUnit: body.tempUnit, rainUnit: body.rainUnit, bytesTotal: 0, actorId: actor.userId,
    });
    await this.intake.run(upload, recordsSource(header, rows));
    const result = await this.upload(upload.id);
    if (result.status === 'failed' || result.status === 'refused') throw badRequest('correction_failed', result.message ?? 'The correction could not be saved.');
    if (result.rowsRejected > 0) throw rowRejected((await this.issues(upload.id, 0, 50)).issues);
    return result;
  }

  // ---- district series
  async districtSeries(p: Principal, districtId: string, range: { from?: string; to?: string }) {
    assertDistrictVisible(p, districtId);
    const district = await this.ctx.ds.getRepository(DistrictEntity).findOne({
      where: { id: districtId }, select: { id: true, code: true, name: true, isDemo: true },
    });
    if (!district) throw notFound('The district');
    const srcRows = await this.repo.sources(districtId);
    const stations = srcRows.map((r: any) => ({ id: r.id, code: r.code, name: r.name, distanceKm: Math.round(r.distance_km * 10) / 10, weight: Math.round(r.weight * 1000) / 1000 }));
    const source: DistrictWeatherSource = !srcRows.length
      ? { kind: 'none', stations: [] }
      : srcRows[0].method === 'inside' ? { kind: 'stations', stations } : { kind: 'interpolated', stations };
    const [{ last }] = await this.ctx.ds.query(`SELECT to_char(max(date), 'YYYY-MM-DD') AS last FROM district_weather_days WHERE district_id = $1`, [districtId]);
    const to = range.to ?? last ?? today();
    const from = range.from ?? daysBefore(to, 365);
    const rows = await this.repo.seriesDays(districtId, from, to);
    const days = rows.map((r: any) => ({
      date: r.date, tmin: r.tmin, tmax: r.tmax, rh: r.rh, rain: r.rain, filled: r.filled,
      missing: r.tmin === null || r.tmax === null, stationCount: r.station_count,
    }));
    return {
      district: { id: district.id, code: district.code, name: district.name, isDemo: district.isDemo },
      source,
      summary: {
        days: days.length, filled: days.filter((d: { filled: boolean }) => d.filled).length,
        missing: days.filter((d: { missing: boolean }) => d.missing).length,
        first: days[0]?.date ?? null, last: days[days.length - 1]?.date ?? null,
      },
      days,
    };
  }
}

export interface IssueUnits {
  temperature: TemperatureUnit;
  rain: RainUnit;
}

const round2 = (x: number) => Math.round(x * 100) / 100;

/** A weather file refused as a whole: 422 with the reason's code, its values and the upload's id. */
const refusal = (u: UploadDto) =>
  unprocessable(u.reasonCode ?? 'file_refused', u.message ?? 'The file was refused.', { ...(u.reasonParams ?? {}), uploadId: u.id });

const rowRejected = (issues: { column: string; reason: string }[]) =>
  badRequest('row_rejected', `The corrected row was not accepted: ${issues.map((i) => i.reason).join(' ')}`,
    issues.map((i) => ({ path: i.column, message: i.reason })));

/**
 * One report value in the units asked for (issueValueUnit says which units it is in). Text that is not
 * a number (a bad number, a whole row) and columns without a unit are left as they are.
 */
export function issueValueIn(
  issue: { column: string; value: string | null; severity: string },
  upload: { tempUnit: TemperatureUnit; rainUnit: RainUnit },
  units: IssueUnits,
): string | null {
  const text = issue.value?.trim() ?? '';
  if (issue.value === null || text === '' || !Number.isFinite(Number(text))) return issue.value;
  const x = Number(text);
  const from = issueValueUnit(issue, upload);
  if (from?.kind === 'temperature') {
    return from.unit === units.temperature ? issue.value : String(round2(fromCelsius(toCelsius(x, from.unit), units.temperature)));
  }
  if (from?.kind === 'rain') {
    return from.unit === units.rain ? issue.value : String(round2(fromMillimetres(toMillimetres(x, from.unit), units.rain)));
  }
  return issue.value;
}
