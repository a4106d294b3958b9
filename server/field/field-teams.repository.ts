import type { EntityManager } from 'typeorm';
import type { FieldTeamDto } from '../../shared/api/field.schema';
import type { WorkKind } from '../../shared/field/work-kinds';

interface TeamRow {
  id: string;
  name: string;
  kinds: WorkKind[];
  days_per_week: number;
  updated_at: Date;
  retired_at: Date | null;
  base_id: string;
  base_code: string;
  base_name: string;
  members: { id: string; displayName: string; role: string; language: string; email: string }[];
}

export interface TeamRecord extends FieldTeamDto {
  /** For mailing the plan; not sent to the client. */
  memberEmails: Map<string, string>;
}

/** All SQL of field teams. */
export class FieldTeamsRepository {
  constructor(private readonly manager: EntityManager) {}

  /** Teams with their base and members, by name; `ids` or `memberId` narrows the list. */
  async list(filter: { ids?: string[]; memberId?: string; activeOnly?: boolean } = {}): Promise<TeamRecord[]> {
    const rows: TeamRow[] = await this.manager.query(
      `SELECT t.id, t.name, t.kinds, t.days_per_week, t.updated_at, t.retired_at, d.id AS base_id, d.code AS base_code, d.name AS base_name,
              coalesce((SELECT json_agg(json_build_object('id', u.id, 'displayName', u.display_name, 'role', u.role,
                                                          'language', u.language, 'email', u.email) ORDER BY u.display_name, u.id)
                          FROM field_team_members m JOIN users u ON u.id = m.user_id WHERE m.team_id = t.id), '[]') AS members
         FROM field_teams t JOIN districts d ON d.id = t.base_district_id
        WHERE ($1::uuid[] IS NULL OR t.id = ANY($1))
          AND ($2::uuid IS NULL OR EXISTS (SELECT 1 FROM field_team_members m WHERE m.team_id = t.id AND m.user_id = $2))
          AND (NOT $3::boolean OR t.retired_at IS NULL)
        ORDER BY t.retired_at IS NOT NULL, t.name`,
      [filter.ids ?? null, filter.memberId ?? null, filter.activeOnly ?? false],
    );
    return rows.map((r) => ({
      id: r.id,
      name: r.name,
      baseDistrict: { id: r.base_id, code: r.base_code, name: r.base_name },
      members: r.members.map(({ id, displayName, role, language }) => ({ id, displayName, role, language })),
      kinds: r.kinds,
      daysPerWeek: r.days_per_week,
      updatedAt: new Date(r.updated_at).toISOString(),
      retiredAt: r.retired_at ? new Date(r.retired_at).toISOString() : null,
      memberEmails: new Map(r.members.map((m) => [m.id, m.email])),
    }));
  }

  /** The users among `ids` that may be on a team: active officers and community workers. */
  async eligibleMembers(ids: string[]): Promise<Set<string>> {
    if (ids.length === 0) return new Set();
    const rows: { id: string }[] = await this.manager.query(
      `SELECT id FROM users WHERE id = ANY($1) AND active AND role IN ('officer', 'worker')`, [ids],
    );
    return new Set(rows.map((r) => r.id));
  }

  /** Everyone who may be put on a team: active officers and community workers, by name. */
  async candidates(): Promise<{ id: string; displayName: string; role: string }[]> {
    return this.manager.query(
      `SELECT id, display_name AS "displayName", role FROM users WHERE active AND role IN ('officer', 'worker') ORDER BY display_name, id LIMIT 5000`,
    );
  }

  async replaceMembers(teamId: string, memberIds: string[]): Promise<void> {
    await this.manager.query(`DELETE FROM field_team_members WHERE team_id = $1`, [teamId]);
    if (memberIds.length) {
      await this.manager.query(
        `INSERT INTO field_team_members (team_id, user_id) SELECT $1, unnest($2::uuid[])`, [teamId, memberIds],
      );
    }
  }
}

export const presentTeam = ({ memberEmails: _emails, ...team }: TeamRecord): FieldTeamDto => team;
