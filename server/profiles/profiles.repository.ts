import { z } from 'zod';
import { parseRows } from '../platform/rows';
import type { DataSource, EntityManager } from 'typeorm';
import { ProfileVariantEntity } from './profile-variant.entity';

export interface AssignmentRow {
  districtId: string;
  profileId: string;
  biofix: string | null;
}

/** The profile library's stored part (local variants) and the districts' profile assignments. */
export class ProfilesRepository {
  constructor(private readonly ds: DataSource) {}

  /** A district's assigned profiles with their biofix (month-day or null), by profile id. */
  async biofixes(districtId: string): Promise<{ profile_id: string; biofix: string | null }[]> {
    return parseRows(z.object({ profile_id: z.string(), biofix: z.string().nullable() }), await this.ds.query(
      'SELECT profile_id, biofix FROM district_profiles WHERE district_id = $1 ORDER BY profile_id', [districtId]));
  }

  variants(m: EntityManager = this.ds.manager): Promise<ProfileVariantEntity[]> {
    return m.find(ProfileVariantEntity, { order: { id: 'ASC' } });
  }

  variantExists(m: EntityManager, id: string): Promise<boolean> {
    return m.existsBy(ProfileVariantEntity, { id });
  }

  async insertVariant(m: EntityManager, row: Omit<ProfileVariantEntity, 'createdAt'>): Promise<ProfileVariantEntity> {
    return m.save(ProfileVariantEntity, m.create(ProfileVariantEntity, row));
  }

  /** The ids among `ids` that name no district. */
  async missingDistricts(m: EntityManager, ids: string[]): Promise<string[]> {
    const rows: { id: string }[] = await m.query(
      `SELECT x.id FROM unnest($1::uuid[]) AS x(id) WHERE NOT EXISTS (SELECT 1 FROM districts d WHERE d.id = x.id)`,
      [ids],
    );
    return rows.map((r) => r.id);
  }

  /** The current assignments of these districts, locked for the change. */
  async assignments(m: EntityManager, districtIds: string[]): Promise<AssignmentRow[]> {
    return m.query(
      `SELECT district_id AS "districtId", profile_id AS "profileId", biofix FROM district_profiles
        WHERE district_id = ANY($1::uuid[]) ORDER BY district_id, profile_id FOR UPDATE`,
      [districtIds],
    );
  }

  /**
   * Replace the assignment of every listed district with the given profiles, set-based. The season run's
   * input fingerprint hashes district_profiles (server/season/season.repository.ts `fingerprints`), so a
   * changed assignment makes the next run recompute the district.
   */
  async replaceAssignments(
    m: EntityManager, districtIds: string[], profiles: { profileId: string; biofix: string | null }[], actorId: string,
  ): Promise<void> {
    await m.query(`DELETE FROM district_profiles WHERE district_id = ANY($1::uuid[])`, [districtIds]);
    if (profiles.length === 0) return;
    await m.query(
      `INSERT INTO district_profiles (district_id, profile_id, biofix, assigned_by, assigned_at)
       SELECT d.id, p.profile_id, p.biofix, $4::uuid, now()
         FROM unnest($1::uuid[]) AS d(id)
         CROSS JOIN unnest($2::text[], $3::text[]) AS p(profile_id, biofix)`,
      [districtIds, profiles.map((p) => p.profileId), profiles.map((p) => p.biofix), actorId],
    );
  }

  /** A district's assignment with who made it (for the District file). */
  async districtAssignment(districtId: string) {
    const rows: { profileId: string; biofix: string | null; assignedAt: Date | null; assignedBy: string | null; assignedByName: string | null }[] =
      await this.ds.query(
        `SELECT dp.profile_id AS "profileId", dp.biofix, dp.assigned_at AS "assignedAt", dp.assigned_by AS "assignedBy",
                u.display_name AS "assignedByName"
           FROM district_profiles dp LEFT JOIN users u ON u.id = dp.assigned_by
          WHERE dp.district_id = $1 ORDER BY dp.profile_id`,
        [districtId],
      );
    return rows;
  }
}
