import { centroid } from '@turf/turf';
import type { DataSource } from 'typeorm';
import { hashPassword } from '../server/auth/passwords';
import { DistrictPopulationEntity } from '../server/districts/district-population.entity';
import { DistrictEntity } from '../server/districts/district.entity';
import { UserDistrictEntity } from '../server/users/user-district.entity';
import { UserEntity } from '../server/users/user.entity';
import { DistrictProfileEntity } from '../server/season/district-profile.entity';
import { loadDemoCases } from './demo-cases';
import { buildDemoRegion, DEMO_PASSWORD, DEMO_USERS } from './demo-region';
import { seedDemoWeather } from './demo-weather';
import { seedDemoSubscriptions } from '../server/bulletins/subscriptions.service';

/**
 * Load the invented Halvern Region and its demo users into an empty database, in one transaction.
 * Refused in production: the demo accounts and their shared password must never exist there.
 */
export async function seedDemoIfEmpty(ds: DataSource, opts: { nodeEnv: string; bcryptCost: number }): Promise<boolean> {
  if (opts.nodeEnv === 'production') throw new Error('The demo region and its users are never created in production.');
  if ((await ds.getRepository(UserEntity).count()) > 0 || (await ds.getRepository(DistrictEntity).count()) > 0) return false;
  const region = buildDemoRegion();
  const passwordHash = await hashPassword(DEMO_PASSWORD, opts.bcryptCost);
  await ds.transaction(async (manager) => {
    const byCode = new Map<string, string>();
    for (const d of region) {
      const [lon, lat] = centroid(d.boundary as never).geometry.coordinates;
      const saved = await manager.save(DistrictEntity, manager.create(DistrictEntity, {
        code: d.code, name: d.name, isDemo: true, boundary: d.boundary, centroidLat: lat, centroidLon: lon,
      }));
      byCode.set(d.code, saved.id);
      await manager.insert(DistrictPopulationEntity, d.populations.map((p) => ({ districtId: saved.id, ...p })));
      await manager.insert(DistrictProfileEntity, d.profiles.map((profileId) => ({ districtId: saved.id, profileId, biofix: null })));
    }
    for (const u of DEMO_USERS) {
      const user = await manager.save(UserEntity, manager.create(UserEntity, {
        email: u.email, displayName: u.displayName, role: u.role, passwordHash, active: true,
      }));
      if (u.districtCodes.length)
        await manager.insert(UserDistrictEntity, u.districtCodes.map((c) => ({ userId: user.id, districtId: byCode.get(c)! })));
    }
    await loadDemoCases(manager, byCode);
    await seedDemoWeather(manager);
    await seedDemoSubscriptions(manager);
  });
  return true;
}
