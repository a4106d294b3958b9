import type { DataSource, EntityManager } from 'typeorm';
import { In } from 'typeorm';
import { DistrictPopulationEntity } from './district-population.entity';
import { DistrictEntity } from './district.entity';

export interface DistrictWithPopulations {
  district: DistrictEntity;
  populations: { year: number; population: number }[];
  /** The vector–pathogen profiles assigned to the district (they tell which diseases are its own). */
  profileIds: string[];
}

export class DistrictsRepository {
  constructor(private readonly ds: DataSource) {}

  /** Districts with their populations in two queries (never one per district). */
  async list(ids?: string[], manager: EntityManager = this.ds.manager): Promise<DistrictWithPopulations[]> {
    const districts = await manager.find(DistrictEntity, {
      where: ids ? { id: In(ids) } : {},
      order: { code: 'ASC' },
      select: { id: true, code: true, name: true, isDemo: true, regionId: true, centroidLat: true, centroidLon: true, createdAt: true },
    });
    const hasBoundary: { id: string }[] = districts.length
      ? await manager.query('SELECT id FROM districts WHERE boundary IS NOT NULL AND id = ANY($1)', [districts.map((d) => d.id)])
      : [];
    const withBoundary = new Set(hasBoundary.map((r) => r.id));
    const pops = districts.length
      ? await manager.find(DistrictPopulationEntity, { where: { districtId: In(districts.map((d) => d.id)) }, order: { year: 'ASC' } })
      : [];
    const profiles: { district_id: string; profile_id: string }[] = districts.length
      ? await manager.query('SELECT district_id, profile_id FROM district_profiles WHERE district_id = ANY($1) ORDER BY profile_id', [districts.map((d) => d.id)])
      : [];
    return districts.map((district) => {
      district.boundary = withBoundary.has(district.id) ? ({} as DistrictEntity['boundary']) : null;
      return {
        district,
        profileIds: profiles.filter((p) => p.district_id === district.id).map((p) => p.profile_id),
        populations: pops.filter((p) => p.districtId === district.id).map(({ year, population }) => ({ year, population })),
      };
    });
  }

  async find(id: string, manager: EntityManager = this.ds.manager) {
    return (await this.list([id], manager))[0] ?? null;
  }

  /** The boundaries the map draws: the display geometry simplified at import where there is one, else the full one. */
  async boundaries(ids?: string[]): Promise<{ id: string; code: string; name: string; boundary: DistrictEntity['boundary'] }[]> {
    return this.ds.query(
      `SELECT id, code, name, COALESCE(display_boundary, boundary) AS boundary FROM districts
        WHERE ($1::uuid[] IS NULL OR id = ANY($1::uuid[])) ORDER BY code`,
      [ids ?? null],
    );
  }
}
