import { randomUUID } from 'node:crypto';
import bcrypt from 'bcryptjs';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import type { PolygonGeometry } from '../../shared/api/districts.schema';
import type { Role } from '../../shared/roles';
import { DistrictPopulationEntity } from '../../server/districts/district-population.entity';
import { DistrictEntity } from '../../server/districts/district.entity';
import { UserDistrictEntity } from '../../server/users/user-district.entity';
import { UserEntity } from '../../server/users/user.entity';

let seq = 0;
const next = () => `${Date.now().toString(36)}${(++seq).toString(36)}`;

export const square = (lon: number, lat: number, size = 1): PolygonGeometry => ({
  type: 'Polygon',
  coordinates: [[[lon, lat], [lon + size, lat], [lon + size, lat + size], [lon, lat + size], [lon, lat]]],
});

export async function makeDistrict(ds: DataSource, overrides: Partial<DistrictEntity> = {}) {
  const n = next();
  const district = await ds.getRepository(DistrictEntity).save({
    code: `T-${n.toUpperCase().slice(-8)}`,
    name: `Test district ${n}`,
    isDemo: false,
    boundary: square(10, 20),
    centroidLat: 20.5,
    centroidLon: 10.5,
    ...overrides,
  });
  await ds.getRepository(DistrictPopulationEntity).insert({ districtId: district.id, year: 2026, population: 100_000 });
  return district;
}

export const TEST_PASSWORD = 'a-test-password-42';
const testHash = bcrypt.hashSync(TEST_PASSWORD, 4);

export async function makeUser(
  ds: DataSource,
  opts: { role: Role; districtIds?: string[]; active?: boolean; email?: string; password?: string | null } = { role: 'officer' },
) {
  const user = await ds.getRepository(UserEntity).save({
    email: opts.email ?? `${opts.role}-${next()}@test.example`,
    displayName: `Test ${opts.role}`,
    role: opts.role,
    passwordHash: opts.password === null ? null : opts.password ? bcrypt.hashSync(opts.password, 4) : testHash,
    active: opts.active ?? true,
  });
  if (opts.districtIds?.length)
    await ds.getRepository(UserDistrictEntity).insert(opts.districtIds.map((districtId) => ({ userId: user.id, districtId })));
  return user;
}

/** A supertest agent holding the session cookie of the given user. */
export async function signedInAgent(app: Parameters<typeof request.agent>[0], email: string, password = TEST_PASSWORD) {
  const agent = request.agent(app);
  const res = await agent.post('/api/auth/sign-in').send({ email, password });
  if (res.status !== 200) throw new Error(`sign-in failed for ${email}: ${res.status} ${JSON.stringify(res.body)}`);
  return agent;
}

export async function countRows(ds: DataSource, ...tables: string[]): Promise<Record<string, number>> {
  const out: Record<string, number> = {};
  for (const t of tables) out[t] = Number((await ds.query(`SELECT count(*)::int AS n FROM "${t}"`))[0].n);
  return out;
}

export const ALL_TABLES = ['users', 'user_districts', 'districts', 'district_populations', 'sessions', 'one_time_tokens', 'audit_events'];

export const randomId = () => randomUUID();
