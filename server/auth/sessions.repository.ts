import type { DataSource, EntityManager } from 'typeorm';
import type { Role } from '../../shared/roles';
import type { Principal } from './principal';
import { SessionEntity } from './session.entity';

export class SessionsRepository {
  constructor(private readonly ds: DataSource) {}

  async create(userId: string, expiresAt: Date): Promise<SessionEntity> {
    return this.ds.getRepository(SessionEntity).save({ userId, expiresAt, revokedAt: null });
  }

  async revoke(sessionId: string): Promise<void> {
    await this.ds.query('UPDATE sessions SET revoked_at = now() WHERE id = $1 AND revoked_at IS NULL', [sessionId]);
  }

  /** Every open session of a user ends: after a password reset, a role change or deactivation. */
  async revokeAllOf(manager: EntityManager, userId: string): Promise<void> {
    await manager.query('UPDATE sessions SET revoked_at = now() WHERE user_id = $1 AND revoked_at IS NULL', [userId]);
  }

  /** The principal of a live session in one query, or null when revoked, expired or deactivated. */
  async findPrincipal(sessionId: string, userId: string): Promise<Principal | null> {
    const rows: { id: string; email: string; display_name: string; role: Role; district_ids: string[]; region_ids: string[] }[] =
      await this.ds.query(
        // The user's own districts and every district of the regions they are scoped to (issue 17).
        `SELECT u.id, u.email, u.display_name, u.role,
                ARRAY(SELECT ud.district_id FROM user_districts ud WHERE ud.user_id = u.id
                      UNION
                      SELECT d.id FROM user_regions ur JOIN districts d ON d.region_id = ur.region_id WHERE ur.user_id = u.id) AS district_ids,
                ARRAY(SELECT ur.region_id FROM user_regions ur WHERE ur.user_id = u.id) AS region_ids
           FROM sessions s
           JOIN users u ON u.id = s.user_id
          WHERE s.id = $1 AND s.user_id = $2 AND s.revoked_at IS NULL AND s.expires_at > now() AND u.active`,
        [sessionId, userId],
      );
    const row = rows[0];
    if (!row) return null;
    return {
      userId: row.id,
      sessionId,
      email: row.email,
      displayName: row.display_name,
      role: row.role,
      districtIds: row.district_ids,
      regionIds: row.region_ids,
    };
  }
}
