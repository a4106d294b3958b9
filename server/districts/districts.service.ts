import type { z } from 'zod';
import type { boundaryBody, districtCreateBody, districtUpdateBody, PolygonGeometry, PopulationBody } from '../../shared/api/districts.schema';
import type { AppContext } from '../app-context';
import { DistrictRunStateRepository } from './district-run-state.repository';
import { recordAudit } from '../audit/audit.repository';
import { assertDistrictVisible, type Principal, seesAllDistricts } from '../auth/principal';
import { conflict, notFound } from '../http/errors';
import { recomputeDistrictSeries } from '../weather/district-series.repository';
import { refreshAssignments } from '../weather/weather-geo';
import { checkPlausibility, checkValidity, type Reference } from './boundary-checks';
import { presentDistrict } from './district.presenter';
import { DistrictPopulationEntity } from './district-population.entity';
import { DistrictEntity } from './district.entity';
import { DistrictsRepository } from './districts.repository';
import { isUniqueViolation } from '../platform/database-errors';
import { RegionsRepository } from './regions.repository';


export class DistrictsService {
  private readonly districts: DistrictsRepository;

  constructor(private readonly ctx: AppContext) {
    this.districts = new DistrictsRepository(ctx.ds);
  }

  async list(p: Principal) {
    const rows = await this.districts.list(seesAllDistricts(p) ? undefined : p.districtIds);
    return { districts: rows.map(presentDistrict) };
  }

  /** The regions with their district counts (names and codes are not secret: every signed-in user may read them). */
  async regions() {
    return { regions: await new RegionsRepository(this.ctx.ds).list() };
  }

  async get(p: Principal, id: string) {
    assertDistrictVisible(p, id);
    const row = await this.districts.find(id);
    if (!row) throw notFound('The district');
    return presentDistrict(row);
  }

  /** The boundaries as one GeoJSON FeatureCollection, for the region map. */
  async boundaries(p: Principal) {
    const rows = await this.districts.boundaries(seesAllDistricts(p) ? undefined : p.districtIds);
    return {
      type: 'FeatureCollection' as const,
      features: rows.filter((r) => r.boundary).map((r) => ({
        type: 'Feature' as const,
        id: r.id,
        properties: { id: r.id, code: r.code, name: r.name },
        geometry: r.boundary,
      })),
    };
  }

  async create(actor: Principal, body: z.infer<typeof districtCreateBody>) {
    try {
      const id = await this.ctx.ds.transaction(async (manager) => {
        const district = await manager.save(DistrictEntity, manager.create(DistrictEntity, { ...body, isDemo: false, boundary: null }));
        await recordAudit(manager, { actorId: actor.userId, action: 'district.created', entity: 'district', entityId: district.id, after: body });
        return district.id;
      });
      return presentDistrict((await this.districts.find(id))!);
    } catch (err) {
      if (isUniqueViolation(err)) throw conflict('code_taken', 'Another district already has this code.');
      throw err;
    }
  }

  async update(actor: Principal, id: string, body: z.infer<typeof districtUpdateBody>) {
    try {
      await this.ctx.ds.transaction(async (manager) => {
        const current = await manager.findOne(DistrictEntity, { where: { id }, select: { id: true, code: true, name: true } });
        if (!current) throw notFound('The district');
        await manager.update(DistrictEntity, { id }, body);
        await recordAudit(manager, {
          actorId: actor.userId, action: 'district.updated', entity: 'district', entityId: id,
          before: { code: current.code, name: current.name }, after: body,
        });
      });
    } catch (err) {
      if (isUniqueViolation(err)) throw conflict('code_taken', 'Another district already has this code.');
      throw err;
    }
    return presentDistrict((await this.districts.find(id))!);
  }

  async setPopulation(actor: Principal, id: string, body: PopulationBody) {
    await this.ctx.ds.transaction(async (manager) => {
      if (!(await manager.existsBy(DistrictEntity, { id }))) throw notFound('The district');
      const before = await manager.findOneBy(DistrictPopulationEntity, { districtId: id, year: body.year });
      await manager.upsert(DistrictPopulationEntity, { districtId: id, ...body }, ['districtId', 'year']);
      await recordAudit(manager, {
        actorId: actor.userId, action: 'district.population-set', entity: 'district', entityId: id,
        before: before ? { year: before.year, population: before.population } : null, after: body,
      });
    });
    return presentDistrict((await this.districts.find(id))!);
  }

  /**
   * Store a boundary after the checks of ./boundary-checks.ts (validity refused with a code, rings
   * rewound to the right-hand rule, an implausible place refused unless `confirm`), then, in the same
   * transaction, re-place the stations in districts and recompute the weather series of every district
   * whose sources changed; the season run sees their new inputs (its fingerprint covers the series and
   * the centroid), and their run state is cleared so the next run recomputes them.
   */
  async setBoundary(actor: Principal, id: string, body: z.infer<typeof boundaryBody>, opts: { confirm?: boolean } = {}) {
    const submitted: PolygonGeometry = body.type === 'Feature' ? body.geometry : body;
    const { geometry, centre, orientationFixed } = checkValidity(submitted);
    await this.ctx.ds.transaction(async (manager) => {
      const current = await manager.findOne(DistrictEntity, { where: { id }, select: { id: true, code: true, centroidLat: true, centroidLon: true } });
      if (!current) throw notFound('The district');
      const others = await new DistrictRunStateRepository(manager).otherCentroids(id);
      const refs: Reference[] = others.length
        ? others
        : current.centroidLat !== null && current.centroidLon !== null
          ? [{ code: current.code, lat: current.centroidLat, lon: current.centroidLon }]
          : [];
      if (!opts.confirm) checkPlausibility(centre, refs);
      await manager.update(DistrictEntity, { id }, { boundary: geometry, centroidLon: centre[0], centroidLat: centre[1] });
      const touched = await refreshAssignments(manager, this.ctx.config.WEATHER_IDW_STATIONS, this.ctx.config.WEATHER_IDW_MAX_KM);
      touched.add(id);
      await recomputeDistrictSeries(manager, touched, this.ctx.config.WEATHER_FILL_MAX_DAYS);
      await new DistrictRunStateRepository(manager).clear([...touched]);
      await recordAudit(manager, {
        actorId: actor.userId, action: 'district.boundary-set', entity: 'district', entityId: id,
        after: { type: geometry.type, centroid: centre, orientationFixed, confirmed: opts.confirm === true, districtsRecomputed: touched.size },
      });
    });
    return presentDistrict((await this.districts.find(id))!);
  }
}
