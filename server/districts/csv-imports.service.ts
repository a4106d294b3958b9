import { parse } from 'csv-parse/sync';
import { populationBody } from '../../shared/api/districts.schema';
import type { ImportProblem, ImportReport } from '../../shared/api/imports.schema';
import { stationCreateBody } from '../../shared/api/weather.schema';
import type { AppContext } from '../app-context';
import { DistrictRunStateRepository } from './district-run-state.repository';
import { recordAudit, recordAudits } from '../audit/audit.repository';
import type { Principal } from '../auth/principal';
import { HttpError } from '../http/errors';
import { capText, LIMITS } from '../http/limits';
import { recomputeDistrictSeries } from '../weather/district-series.repository';
import { refreshAssignments } from '../weather/weather-geo';
import { DistrictImportRepository } from './district-import.repository';
import { ImportRejected, MAX_LISTED_PROBLEMS, PREVIEW_ROWS } from './import-common';

export const CSV_IMPORT_MAX_BYTES = 16 * 1024 * 1024;
export const CSV_IMPORT_MAX_ROWS = 200_000;
export const STATION_COLUMNS = ['code', 'name', 'latitude', 'longitude', 'elevation', 'activeFrom', 'activeTo'] as const;
export const POPULATION_COLUMNS = ['district', 'year', 'population'] as const;

type Row = Record<string, string>;

/**
 * Read a CSV with csv-parse (quotes, a byte-order mark, CRLF) into rows keyed by the expected columns,
 * matched case-insensitively. A missing or unknown column refuses the file with a 400 naming it.
 */
function readCsv(buffer: Buffer, columns: readonly string[], optional: readonly string[]): Row[] {
  let records: string[][];
  try {
    records = parse(buffer, { bom: true, trim: true, skip_empty_lines: true, relax_column_count: true, max_record_size: LIMITS.CSV_LINE_MAX_BYTES });
  } catch (err) {
    throw new HttpError(400, 'csv_unreadable', `The file is not readable CSV: ${(err as Error).message}`, [{ path: 'file', message: 'is not readable CSV' }]);
  }
  if (records.length === 0) throw new HttpError(400, 'csv_empty', 'The file is empty: it needs a header line and data rows.', [{ path: 'file', message: 'is empty' }]);
  const header = records[0].map((h) => h.trim());
  const byLower = new Map(columns.map((c) => [c.toLowerCase(), c]));
  const fields: { path: string; message: string }[] = [];
  const mapped = header.map((h) => {
    const c = byLower.get(h.toLowerCase());
    if (!c) fields.push({ path: 'file', message: `"${h}" is not a column (expected: ${columns.join(', ')})` });
    return c ?? null;
  });
  for (const c of columns) if (!optional.includes(c) && !mapped.includes(c)) fields.push({ path: 'file', message: `the header has no "${c}" column` });
  for (const c of new Set(mapped.filter((c, i) => c && mapped.indexOf(c) !== i))) fields.push({ path: 'file', message: `the header names "${c}" more than once` });
  if (fields.length) throw new HttpError(400, 'csv_header_invalid', `The header is not ${columns.join(',')}: ${fields.map((f) => f.message).join('; ')}.`, fields);
  if (records.length - 1 > CSV_IMPORT_MAX_ROWS)
    throw new HttpError(413, 'import_too_many_items', `The file holds ${records.length - 1} rows, more than the limit of ${CSV_IMPORT_MAX_ROWS}.`,
      [{ path: 'file', message: `holds more than ${CSV_IMPORT_MAX_ROWS} rows` }], { limit: CSV_IMPORT_MAX_ROWS, count: records.length - 1 });
  return records.slice(1).map((rec) => Object.fromEntries(mapped.flatMap((c, i) => (c ? [[c, rec[i] ?? '']] : []))));
}

const num = (s: string | undefined) => (s === undefined || s === '' ? null : /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(s) ? Number(s) : NaN);

export class CsvImportsService {
  private readonly repo: DistrictImportRepository;

  constructor(private readonly ctx: AppContext) {
    this.repo = new DistrictImportRepository(ctx.ds);
  }

  /**
   * Stations from CSV (code,name,latitude,longitude,elevation,activeFrom,activeTo), each row checked with the
   * same schema as `POST /api/weather/stations`, created or updated by code; then, once for the whole file,
   * stations are re-placed in districts and the series of the districts whose sources changed recomputed.
   */
  async stations(actor: Principal, buffer: Buffer, reason: string | undefined, opts: { dryRun: boolean; skipProblems: boolean }): Promise<ImportReport> {
    const rows = readCsv(buffer, STATION_COLUMNS, ['elevation', 'activeFrom', 'activeTo']);
    const problems: ImportProblem[] = [];
    const good: { line: number; code: string; name: string; latitude: number; longitude: number; elevation: number | null; activeFrom: string | null; activeTo: string | null }[] = [];
    const seen = new Map<string, number>();
    rows.forEach((r, i) => {
      const line = i + 2;
      const code = r.code ?? '';
      const candidate = {
        code, name: r.name ?? '', latitude: num(r.latitude), longitude: num(r.longitude), elevation: num(r.elevation),
        activeFrom: r.activeFrom ? r.activeFrom : null, activeTo: r.activeTo ? r.activeTo : null,
      };
      const parsed = stationCreateBody.safeParse(candidate);
      if (!parsed.success) return problems.push({ index: line, code: code || null, rule: 'row_invalid', params: fieldOf(parsed.error.issues) });
      if (seen.has(parsed.data.code)) return problems.push({ index: line, code, rule: 'code_repeated', params: { line: seen.get(parsed.data.code)! } });
      seen.set(parsed.data.code, line);
      good.push({ line, ...parsed.data });
    });
    const existing = await this.repo.stations(this.ctx.ds.manager, good.map((g) => g.code));
    const report = this.report(opts.dryRun, rows.length, good.map((g) => existing.has(g.code)), problems,
      good.slice(0, PREVIEW_ROWS).map(({ line, ...g }) => ({ line, ...g, action: existing.has(g.code) ? 'update' : 'create' })));
    if (opts.dryRun) return report;
    if (problems.length > 0 && !opts.skipProblems) throw new ImportRejected(report, problems.length);
    if (good.length === 0) return report;
    await this.ctx.ds.transaction(async (m) => {
      const before = await this.repo.stations(m, good.map((g) => g.code));
      const ids = await this.repo.upsertStations(m, good);
      const touched = await refreshAssignments(m, this.ctx.config.WEATHER_IDW_STATIONS, this.ctx.config.WEATHER_IDW_MAX_KM);
      await recomputeDistrictSeries(m, touched, this.ctx.config.WEATHER_FILL_MAX_DAYS);
      if (touched.size) await new DistrictRunStateRepository(m).clear([...touched]);
      await recordAudits(m, good.map(({ line: _line, ...g }) => ({
        actorId: actor.userId, action: before.has(g.code) ? 'weather.station-imported-updated' : 'weather.station-imported-created',
        entity: 'weather_station', entityId: ids.get(g.code)!, before: before.get(g.code) ?? null, after: g, reason: reason ?? null,
      })));
      await recordAudit(m, {
        actorId: actor.userId, action: 'weather.station-import', entity: 'weather_station', entityId: 'import',
        after: { total: report.total, created: report.created, updated: report.updated, skipped: report.skipped, districtsRecomputed: touched.size }, reason: reason ?? null,
      });
    });
    return report;
  }

  /** Populations from CSV (district,year,population): district by code, replaced by (district, year). */
  async populations(actor: Principal, buffer: Buffer, reason: string | undefined, opts: { dryRun: boolean; skipProblems: boolean }): Promise<ImportReport> {
    const rows = readCsv(buffer, POPULATION_COLUMNS, []);
    const ids = await this.repo.districtIdsByCode([...new Set(rows.map((r) => (r.district ?? '').trim().toUpperCase()))]);
    const problems: ImportProblem[] = [];
    const good: { line: number; code: string; districtId: string; year: number; population: number }[] = [];
    const seen = new Map<string, number>();
    rows.forEach((r, i) => {
      const line = i + 2;
      const code = (r.district ?? '').trim().toUpperCase();
      const districtId = ids.get(code);
      if (!districtId) return problems.push({ index: line, code: code || null, rule: code ? 'unknown_district' : 'district_missing', params: {} });
      const parsed = populationBody.safeParse({ year: num(r.year), population: num(r.population) });
      if (!parsed.success) return problems.push({ index: line, code, rule: 'row_invalid', params: fieldOf(parsed.error.issues) });
      const key = `${districtId}|${parsed.data.year}`;
      if (seen.has(key)) return problems.push({ index: line, code, rule: 'row_repeated', params: { line: seen.get(key)! } });
      seen.set(key, line);
      good.push({ line, code, districtId, ...parsed.data });
    });
    const existing = await this.repo.populations(this.ctx.ds.manager, good);
    const report = this.report(opts.dryRun, rows.length, good.map((g) => existing.has(`${g.districtId}|${g.year}`)), problems,
      good.slice(0, PREVIEW_ROWS).map((g) => ({ line: g.line, district: g.code, year: g.year, population: g.population, action: existing.has(`${g.districtId}|${g.year}`) ? 'update' : 'create' })));
    if (opts.dryRun) return report;
    if (problems.length > 0 && !opts.skipProblems) throw new ImportRejected(report, problems.length);
    if (good.length === 0) return report;
    await this.ctx.ds.transaction(async (m) => {
      const before = await this.repo.populations(m, good);
      await this.repo.upsertPopulations(m, good);
      await recordAudits(m, good.map((g) => ({
        actorId: actor.userId, action: 'district.population-imported', entity: 'district', entityId: g.districtId,
        before: before.has(`${g.districtId}|${g.year}`) ? { year: g.year, population: before.get(`${g.districtId}|${g.year}`) } : null,
        after: { year: g.year, population: g.population }, reason: reason ?? null,
      })));
    });
    return report;
  }

  private report(dryRun: boolean, total: number, exists: boolean[], problems: ImportProblem[], preview: ImportReport['preview']): ImportReport {
    return {
      dryRun, total,
      created: exists.filter((e) => !e).length,
      updated: exists.filter((e) => e).length,
      skipped: total - exists.length,
      problems: problems.slice(0, MAX_LISTED_PROBLEMS),
      problemsNotListed: Math.max(0, problems.length - MAX_LISTED_PROBLEMS),
      preview,
    };
  }
}

/** The column a refused CSV row fails on (the client words `row_invalid` with it). */
function fieldOf(issues: readonly { path: PropertyKey[] }[]): { field: string } {
  return { field: capText(issues[0]?.path.map(String).join('.') || 'row', 64) };
}
