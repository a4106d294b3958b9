import { around } from 'geokdbush';
import KDBush from 'kdbush';
import type { FeatureCollection, Geometry } from 'geojson';
import { feature as topoFeature } from 'topojson-client';
import { topology as toTopology } from 'topojson-server';
import { presimplify, quantile, simplify } from 'topojson-simplify';
import type { Topology } from 'topojson-specification';
import { DISTRICT_CODE_PATTERN, polygonGeometry, type PolygonGeometry } from '../../shared/api/districts.schema';
import type { DistrictImportFields, DistrictImportReport, ImportProblem } from '../../shared/api/imports.schema';
import type { AppContext } from '../app-context';
import { DistrictRunStateRepository } from './district-run-state.repository';
import { recordAudit, recordAudits } from '../audit/audit.repository';
import type { Principal } from '../auth/principal';
import { HttpError } from '../http/errors';
import { capText } from '../http/limits';
import { recomputeDistrictSeries } from '../weather/district-series.repository';
import { refreshAssignments } from '../weather/weather-geo';
import { checkValidity, FAR_FLOOR_KM } from './boundary-checks';
import { DistrictImportRepository, type DistrictUpsert } from './district-import.repository';
import { ImportRejected, MAX_LISTED_PROBLEMS, PREVIEW_ROWS } from './import-common';

/** The largest district file accepted (a national county file as GeoJSON is ~10–30 MB). */
export const DISTRICT_IMPORT_MAX_BYTES = 64 * 1024 * 1024;
/** Most features in one file (issue 17 asks for 5,000 at national scale; twice that for headroom). */
export const DISTRICT_IMPORT_MAX_FEATURES = 10_000;
/** Share of the points the display geometry keeps (topology-preserving Visvalingam by topojson-simplify). */
export const DISPLAY_KEEP_SHARE = 0.25;
/** Decimals kept in display coordinates: 5 decimals is about 1 m, far below what a map shows. */
const DISPLAY_DECIMALS = 5;

const REGION_CODE = /^[A-Z0-9-]{1,32}$/;

interface ReadFeature {
  index: number;
  code: string;
  name: string;
  regionCode: string | null;
  regionName: string | null;
  population: number | null;
  geometry: PolygonGeometry;
  centre: [number, number];
  display: PolygonGeometry | null;
}

/** A property of a feature, with `id` also read from the feature's own id (TopoJSON and GeoJSON keep codes there). */
function prop(f: { id?: string | number; properties?: Record<string, unknown> | null }, name: string): unknown {
  const v = f.properties?.[name];
  if (v !== undefined && v !== null) return v;
  return name === 'id' ? f.id : undefined;
}
const text = (v: unknown) => (typeof v === 'string' ? v.trim() : typeof v === 'number' && Number.isFinite(v) ? String(v) : '');

/** Parse the file as JSON and give the features (a TopoJSON topology is turned into GeoJSON with topojson-client). */
export function readFeatureFile(buffer: Buffer, objectName?: string): { features: FeatureCollection['features']; topology: Topology; objectKey: string } {
  let json: unknown;
  try {
    json = JSON.parse(buffer.toString('utf8').replace(/^\uFEFF/, ''));
  } catch {
    throw new HttpError(400, 'import_not_json', 'The file is not JSON: send a GeoJSON FeatureCollection or a TopoJSON topology.', [{ path: 'file', message: 'is not JSON' }]);
  }
  const obj = json as { type?: string; objects?: Record<string, unknown>; features?: unknown };
  if (obj?.type === 'Topology' && obj.objects && typeof obj.objects === 'object') {
    const names = Object.keys(obj.objects);
    const key = objectName ?? names[0];
    if (!key || !(key in obj.objects))
      throw new HttpError(400, 'import_object_missing', `The topology has no object "${objectName ?? ''}" (it has: ${names.join(', ')}).`,
        [{ path: 'objectName', message: `must be one of: ${names.join(', ')}` }], { objects: names.join(', ') });
    const topology = obj as unknown as Topology;
    const fc = topoFeature(topology, topology.objects[key]) as unknown as FeatureCollection;
    if (fc.type !== 'FeatureCollection')
      throw new HttpError(400, 'import_not_collection', `The object "${key}" is not a collection of features.`, [{ path: 'file', message: 'is not a GeometryCollection' }]);
    return { features: fc.features, topology, objectKey: key };
  }
  if (obj?.type === 'FeatureCollection' && Array.isArray(obj.features)) {
    const features = obj.features as FeatureCollection['features'];
    // A topology of the file, so the display geometry is simplified without opening gaps between neighbours.
    const valid = features.filter((f) => f && typeof f === 'object' && (f.geometry?.type === 'Polygon' || f.geometry?.type === 'MultiPolygon'));
    return { features, topology: toTopology({ districts: { type: 'FeatureCollection', features: valid } as never }) as Topology, objectKey: 'districts' };
  }
  throw new HttpError(400, 'import_not_geojson', 'The file is neither a GeoJSON FeatureCollection nor a TopoJSON topology.', [{ path: 'file', message: 'is not a FeatureCollection or Topology' }]);
}

const roundCoords = (g: PolygonGeometry): PolygonGeometry => {
  const k = 10 ** DISPLAY_DECIMALS;
  const r = (ring: number[][]) => ring.map(([x, y]) => [Math.round(x * k) / k, Math.round(y * k) / k]);
  return g.type === 'Polygon'
    ? { type: 'Polygon', coordinates: g.coordinates.map(r) }
    : { type: 'MultiPolygon', coordinates: g.coordinates.map((p) => p.map(r)) };
};
const ringsOk = (g: Geometry | null | undefined): g is PolygonGeometry =>
  !!g && (g.type === 'Polygon' ? g.coordinates.length > 0 && g.coordinates.every((r) => r.length >= 4)
    : g.type === 'MultiPolygon' ? g.coordinates.length > 0 && g.coordinates.every((p) => p.length > 0 && p.every((r) => r.length >= 4)) : false);

/**
 * The display geometry of each feature, keyed by its index in the object: the topology simplified with
 * topojson-simplify (shared borders are simplified once, so neighbours keep touching), coordinates rounded.
 * A feature whose simplified rings collapse (< 4 positions) gets no display geometry: the map uses the full one.
 */
export function displayGeometries(topology: Topology, objectKey: string): (PolygonGeometry | null)[] {
  // The typings disagree on the properties' type parameter between the three packages; the data is the same.
  const pre = presimplify(structuredClone(topology) as never) as unknown as Topology;
  const simplified = simplify(pre as never, quantile(pre as never, DISPLAY_KEEP_SHARE)) as unknown as Topology;
  const fc = topoFeature(simplified, simplified.objects[objectKey]) as unknown as FeatureCollection;
  return fc.features.map((f) => (ringsOk(f.geometry) ? roundCoords(f.geometry) : null));
}

export class DistrictImportService {
  private readonly repo: DistrictImportRepository;

  constructor(private readonly ctx: AppContext) {
    this.repo = new DistrictImportRepository(ctx.ds);
  }

  /**
   * Read, check and (unless a dry run) write a district file, all or nothing. Districts are matched by code:
   * an existing code is updated (name, boundary, region, population), a new one created. Regions named by
   * the parent fields are created or renamed by code. Stations are then re-placed and the series of the
   * districts whose sources changed recomputed, in the same transaction.
   */
  async import(actor: Principal, buffer: Buffer, fields: DistrictImportFields, opts: { dryRun: boolean; skipProblems: boolean }): Promise<DistrictImportReport> {
    // Milliseconds per stage, logged at the end (bench/national.bench.ts reads them from the log).
    const stages: Record<string, number> = {};
    let mark = performance.now();
    const stage = (name: string) => {
      const now = performance.now();
      stages[name] = Math.round(now - mark);
      mark = now;
    };
    const { features, topology, objectKey } = readFeatureFile(buffer, fields.objectName);
    stage('parse');
    if (features.length > DISTRICT_IMPORT_MAX_FEATURES)
      throw new HttpError(413, 'import_too_many_items', `The file holds ${features.length} features, more than the limit of ${DISTRICT_IMPORT_MAX_FEATURES}.`,
        [{ path: 'file', message: `holds more than ${DISTRICT_IMPORT_MAX_FEATURES} features` }], { limit: DISTRICT_IMPORT_MAX_FEATURES, count: features.length });

    const problems: ImportProblem[] = [];
    // A problem is a rule code with parameters; the client words it in the person's language (never English here).
    const problem = (index: number, code: string | null, rule: string, params: ImportProblem['params'] = {}) =>
      problems.push({ index, code: code === null ? null : capText(code, 64), rule, params });
    const properties = new Set<string>();
    const read: ReadFeature[] = [];
    const seen = new Map<string, number>();

    // Display geometry follows the topology's own order: in a GeoJSON file only the polygon features are in it.
    const display = displayGeometries(topology, objectKey);
    stage('simplify');
    let displayAt = 0;
    features.forEach((f, index) => {
      const isPolygon = !!f && typeof f === 'object' && (f.geometry?.type === 'Polygon' || f.geometry?.type === 'MultiPolygon');
      const simplified = isPolygon ? display[displayAt++] ?? null : null;
      if (!f || typeof f !== 'object' || f.type !== 'Feature') return problem(index, null, 'not_a_feature');
      for (const k of Object.keys(f.properties ?? {})) if (properties.size < 200) properties.add(k);
      const code = text(prop(f as never, fields.codeProperty)).toUpperCase();
      if (!code) return problem(index, null, 'code_missing', { property: capText(fields.codeProperty, 64) });
      if (!DISTRICT_CODE_PATTERN.test(code)) return problem(index, code, 'code_invalid');
      if (seen.has(code)) return problem(index, code, 'code_repeated', { feature: seen.get(code)! });
      seen.set(code, index);
      const name = text(prop(f as never, fields.nameProperty));
      if (!name) return problem(index, code, 'name_missing', { property: capText(fields.nameProperty, 64) });
      if (name.length > 120) return problem(index, code, 'name_too_long', { max: 120 });
      let regionCode: string | null = null;
      let regionName: string | null = null;
      if (fields.parentCodeProperty) {
        regionCode = text(prop(f as never, fields.parentCodeProperty)).toUpperCase();
        if (!regionCode) return problem(index, code, 'region_missing', { property: capText(fields.parentCodeProperty ?? '', 64) });
        if (!REGION_CODE.test(regionCode)) return problem(index, code, 'region_code_invalid');
        regionName = fields.parentNameProperty ? text(prop(f as never, fields.parentNameProperty)).slice(0, 120) || null : null;
      }
      let population: number | null = null;
      if (fields.populationProperty) {
        const raw = prop(f as never, fields.populationProperty);
        const n = typeof raw === 'number' ? raw : typeof raw === 'string' && /^\s*\d+\s*$/.test(raw) ? Number(raw) : NaN;
        if (!Number.isInteger(n) || n < 0 || n > 2_000_000_000) return problem(index, code, 'population_invalid', { property: capText(fields.populationProperty ?? '', 64) });
        population = n;
      }
      const shape = polygonGeometry.safeParse(f.geometry);
      if (!shape.success) return problem(index, code, 'geometry_invalid');
      try {
        const checked = checkValidity(shape.data);
        read.push({ index, code, name, regionCode, regionName, population, geometry: checked.geometry, centre: checked.centre, display: simplified });
      } catch (err) {
        if (err instanceof HttpError) return problem(index, code, err.code, wordParams(err.params));
        throw err;
      }
    });

    stage('checks');
    // Coordinates swapped (latitude, longitude): the centre lies far from every other district but would lie
    // among them once swapped. Compared with the file's other features and the districts already stored.
    const stored = await this.repo.centres(read.map((r) => r.code));
    const refs = [...read.map((r) => ({ code: r.code, lon: r.centre[0], lat: r.centre[1] })), ...stored];
    if (refs.length > 1) {
      const index = new KDBush(refs.length);
      for (const r of refs) index.add(r.lon, r.lat);
      index.finish();
      const swappedBad = new Set<string>();
      for (const r of read) {
        const [lon, lat] = r.centre;
        const near = around(index, lon, lat, 1, FAR_FLOOR_KM, (i: number) => refs[i].code !== r.code);
        if (near.length > 0 || Math.abs(lon) > 90) continue;
        const swapped = around(index, lat, lon, 1, FAR_FLOOR_KM, (i: number) => refs[i].code !== r.code);
        if (swapped.length > 0) {
          swappedBad.add(r.code);
          problem(r.index, r.code, 'boundary_coordinates_swapped', { limitKm: FAR_FLOOR_KM });
        }
      }
      if (swappedBad.size) read.splice(0, read.length, ...read.filter((r) => !swappedBad.has(r.code)));
    }
    problems.sort((a, b) => a.index - b.index);

    const existing = await this.repo.existingCodes(read.map((r) => r.code));
    const regionCodes = [...new Set(read.flatMap((r) => (r.regionCode ? [r.regionCode] : [])))];
    const existingRegions = await this.repo.existingRegionCodes(regionCodes);
    const report: DistrictImportReport = {
      dryRun: opts.dryRun,
      total: features.length,
      created: read.filter((r) => !existing.has(r.code)).length,
      updated: read.filter((r) => existing.has(r.code)).length,
      skipped: features.length - read.length,
      problems: problems.slice(0, MAX_LISTED_PROBLEMS),
      problemsNotListed: Math.max(0, problems.length - MAX_LISTED_PROBLEMS),
      regions: { created: regionCodes.filter((c) => !existingRegions.has(c)).length, updated: regionCodes.filter((c) => existingRegions.has(c)).length },
      properties: [...properties].sort(),
      preview: read.slice(0, PREVIEW_ROWS).map((r) => ({
        index: r.index, code: r.code, name: r.name, region: r.regionCode, regionName: r.regionName, population: r.population,
        geometry: r.geometry.type, action: existing.has(r.code) ? 'update' : 'create',
      })),
    };
    stage('plausibility');
    const logStages = () => this.ctx.logger.info({ stagesMs: stages, features: features.length, dryRun: opts.dryRun }, 'district import stages');
    if (opts.dryRun) {
      logStages();
      return report;
    }
    if (problems.length > 0 && !opts.skipProblems) throw new ImportRejected(report, problems.length);
    if (read.length === 0) return report;

    await this.ctx.ds.transaction(async (m) => {
      const regionIds = await this.repo.upsertRegions(m, regionCodes.map((code) => ({
        code, name: read.find((r) => r.regionCode === code && r.regionName)?.regionName ?? code,
      })));
      const rows: DistrictUpsert[] = read.map((r) => ({
        code: r.code, name: r.name, boundary: r.geometry, display: r.display, lon: r.centre[0], lat: r.centre[1],
        regionId: r.regionCode ? regionIds.get(r.regionCode)! : null,
      }));
      const before = await this.repo.snapshot(m, read.map((r) => r.code));
      const ids = await this.repo.upsertDistricts(m, rows);
      stage('writeDistricts');
      if (fields.populationProperty && fields.populationYear !== undefined) {
        const year = fields.populationYear;
        await this.repo.upsertPopulations(m, read.filter((r) => r.population !== null).map((r) => ({ districtId: ids.get(r.code)!, year, population: r.population! })));
      }
      // Stations are re-placed in the new boundaries; the changed districts' series are recomputed and their
      // run state cleared, as for one boundary (DistrictsService.setBoundary).
      const touched = await refreshAssignments(m, this.ctx.config.WEATHER_IDW_STATIONS, this.ctx.config.WEATHER_IDW_MAX_KM);
      stage('stationAssignment');
      await recomputeDistrictSeries(m, touched, this.ctx.config.WEATHER_FILL_MAX_DAYS);
      stage('series');
      await new DistrictRunStateRepository(m).clear([...ids.values()]);
      await recordAudits(m, read.map((r) => ({
        actorId: actor.userId, action: existing.has(r.code) ? 'district.imported-updated' : 'district.imported-created',
        entity: 'district', entityId: ids.get(r.code)!, before: before.get(r.code) ?? null,
        after: { code: r.code, name: r.name, region: r.regionCode, population: r.population, populationYear: r.population === null ? null : fields.populationYear ?? null, geometry: r.geometry.type },
        reason: fields.reason ?? null,
      })));
      await recordAudit(m, {
        actorId: actor.userId, action: 'district.import', entity: 'district', entityId: 'import',
        after: { total: report.total, created: report.created, updated: report.updated, skipped: report.skipped, regions: report.regions, fields: { ...fields, reason: undefined } },
        reason: fields.reason ?? null,
      });
      stage('audit');
    });
    stage('commit');
    logStages();
    return report;
  }
}

/** An error's parameters as an import problem's (strings and numbers only; anything else is left out). */
function wordParams(params: Record<string, unknown> | undefined): ImportProblem['params'] {
  const out: ImportProblem['params'] = {};
  for (const [k, v] of Object.entries(params ?? {})) if (typeof v === 'string' || typeof v === 'number') out[k] = v;
  return out;
}
