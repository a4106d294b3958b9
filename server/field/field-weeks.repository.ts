import type { EntityManager } from 'typeorm';
import type { DriverId, Tier } from '../../shared/tier/tier-settings';
import type { ProposalDistrict } from '../../shared/field/propose';
import { BoardRepository } from '../board/board.repository';
import { presentBoard } from '../board/board.presenter';

export interface LadderInput extends ProposalDistrict {
  code: string;
}

/** All SQL of the Field week. */
export class FieldWeeksRepository {
  constructor(private readonly manager: EntityManager) {}

  /**
   * The current Ladder as the proposal needs it: rank, tier and score of the newest week with tiers, the
   * leading driver, the centroid and the newest population (taken as the population at risk).
   */
  async ladder(): Promise<{ districts: LadderInput[]; ladderWeek: { year: number; week: number } | null }> {
    const records = await new BoardRepository(this.manager.dataSource).rows();
    const board = presentBoard(records);
    const rankOf = new Map(board.rows.map((r) => [r.districtId, r.rank]));
    const extra: { id: string; centroid_lat: number | null; centroid_lon: number | null; population: number | null }[] = await this.manager.query(
      `SELECT d.id, d.centroid_lat, d.centroid_lon,
              (SELECT p.population FROM district_populations p WHERE p.district_id = d.id ORDER BY p.year DESC LIMIT 1) AS population
         FROM districts d`,
    );
    const byId = new Map(extra.map((e) => [e.id, e]));
    const districts = records.map((r): LadderInput => {
      const e = byId.get(r.district_id);
      return {
        id: r.district_id, code: r.code, name: r.name, rank: rankOf.get(r.district_id) ?? Number.MAX_SAFE_INTEGER,
        tier: (r.tier as Tier | null) ?? null, score: r.score, population: e?.population ?? null,
        lat: e?.centroid_lat ?? null, lon: e?.centroid_lon ?? null, leadingDriver: (r.leading_driver as DriverId | null) ?? null,
      };
    });
    return { districts, ladderWeek: board.epiYear !== null && board.epiWeek !== null ? { year: board.epiYear, week: board.epiWeek } : null };
  }

  async days(fieldWeekId: string, teamIds?: string[]): Promise<{ teamId: string; districtId: string; day: string }[]> {
    const rows: { team_id: string; district_id: string; day: string }[] = await this.manager.query(
      `SELECT team_id, district_id, to_char(day, 'YYYY-MM-DD') AS day FROM field_week_days
        WHERE field_week_id = $1 AND ($2::uuid[] IS NULL OR team_id = ANY($2)) ORDER BY team_id, day`,
      [fieldWeekId, teamIds ?? null],
    );
    return rows.map((r) => ({ teamId: r.team_id, districtId: r.district_id, day: r.day }));
  }

  async replaceDays(fieldWeekId: string, days: { teamId: string; districtId: string; day: string }[]): Promise<void> {
    await this.manager.query(`DELETE FROM field_week_days WHERE field_week_id = $1`, [fieldWeekId]);
    if (days.length) {
      await this.manager.query(
        `INSERT INTO field_week_days (field_week_id, team_id, district_id, day)
         SELECT $1, t, d, x::date FROM unnest($2::uuid[], $3::uuid[], $4::text[]) AS u(t, d, x)`,
        [fieldWeekId, days.map((d) => d.teamId), days.map((d) => d.districtId), days.map((d) => d.day)],
      );
    }
  }

  async districtRefs(ids: string[]): Promise<Map<string, { id: string; code: string; name: string }>> {
    const rows: { id: string; code: string; name: string }[] = ids.length
      ? await this.manager.query(`SELECT id, code, name FROM districts WHERE id = ANY($1)`, [ids])
      : [];
    return new Map(rows.map((r) => [r.id, r]));
  }
}
