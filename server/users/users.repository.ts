import type { DataSource, EntityManager } from 'typeorm';
import { In } from 'typeorm';
import { DistrictEntity } from '../districts/district.entity';
import { RegionEntity } from '../districts/region.entity';
import { UserDistrictEntity } from './user-district.entity';
import { UserRegionEntity } from './user-region.entity';
import { UserEntity } from './user.entity';

export interface UserWithDistricts {
  user: UserEntity;
  districts: { id: string; code: string; name: string }[];
  /** The regions the user is scoped to (their session also holds every district of these). */
  regions: { id: string; code: string; name: string }[];
}

export class UsersRepository {
  constructor(private readonly ds: DataSource) {}

  findByEmail(email: string) {
    return this.ds.getRepository(UserEntity).findOneBy({ email: email.toLowerCase() });
  }

  async listWithDistricts(manager: EntityManager = this.ds.manager, ids?: string[]): Promise<UserWithDistricts[]> {
    const users = await manager.find(UserEntity, {
      where: ids ? { id: In(ids) } : {},
      order: { email: 'ASC' },
    });
    if (users.length === 0) return [];
    const links: { user_id: string; id: string; code: string; name: string }[] = await manager.query(
      `SELECT ud.user_id, d.id, d.code, d.name FROM user_districts ud JOIN districts d ON d.id = ud.district_id
        WHERE ud.user_id = ANY($1) ORDER BY d.code`,
      [users.map((u) => u.id)],
    );
    const regionLinks: { user_id: string; id: string; code: string; name: string }[] = await manager.query(
      `SELECT ur.user_id, r.id, r.code, r.name FROM user_regions ur JOIN regions r ON r.id = ur.region_id
        WHERE ur.user_id = ANY($1) ORDER BY r.code`,
      [users.map((u) => u.id)],
    );
    return users.map((user) => ({
      user,
      districts: links.filter((l) => l.user_id === user.id).map(({ id, code, name }) => ({ id, code, name })),
      regions: regionLinks.filter((l) => l.user_id === user.id).map(({ id, code, name }) => ({ id, code, name })),
    }));
  }

  async findWithDistricts(id: string, manager: EntityManager = this.ds.manager) {
    return (await this.listWithDistricts(manager, [id]))[0] ?? null;
  }

  /** Replace a user's district assignments. Unknown district ids are the caller's 400. */
  async setDistricts(manager: EntityManager, userId: string, districtIds: string[]): Promise<void> {
    await manager.delete(UserDistrictEntity, { userId });
    if (districtIds.length) await manager.insert(UserDistrictEntity, districtIds.map((districtId) => ({ userId, districtId })));
  }

  /** Replace a user's regions. Unknown region ids are the caller's 400. */
  async setRegions(manager: EntityManager, userId: string, regionIds: string[]): Promise<void> {
    await manager.delete(UserRegionEntity, { userId });
    if (regionIds.length) await manager.insert(UserRegionEntity, regionIds.map((regionId) => ({ userId, regionId })));
  }

  async countExistingRegions(manager: EntityManager, ids: string[]): Promise<number> {
    if (ids.length === 0) return 0;
    return manager.countBy(RegionEntity, { id: In(ids) });
  }

  async countExistingDistricts(manager: EntityManager, ids: string[]): Promise<number> {
    if (ids.length === 0) return 0;
    return manager.countBy(DistrictEntity, { id: In(ids) });
  }
}
