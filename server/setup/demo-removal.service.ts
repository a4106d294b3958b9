import type { EntityManager } from 'typeorm';
import type { DemoRemovedResponse, DemoSummaryResponse } from '../../shared/api/demo.schema';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit.repository';
import type { Principal } from '../auth/principal';
import { conflict } from '../http/errors';
import { DEMO_USERS } from '../../sample/demo-region';

const DEMO_EMAILS = DEMO_USERS.map((u) => u.email);

/**
 * Removing the invented demo region from a running installation (issue 17): its districts (with everything
 * hanging from them: boundaries, populations, series, counts, surveys, tiers, flags, bulletins, subscriptions —
 * the foreign keys cascade) and its stations (with their weather) are deleted; its people are deactivated and
 * their sessions ended rather than deleted, so the audit trail keeps naming who did what. The admin who
 * removes it is never deactivated, even when it is the demo's own admin account. One transaction, audited.
 */
export class DemoRemovalService {
  constructor(private readonly ctx: AppContext) {}

  async summary(): Promise<DemoSummaryResponse> {
    const [row] = await this.ctx.ds.query(
      `SELECT (SELECT count(*)::int FROM districts WHERE is_demo) AS districts,
              (SELECT count(*)::int FROM weather_stations WHERE is_demo) AS stations,
              (SELECT count(*)::int FROM users WHERE active AND email = ANY($1::text[])) AS users`, [DEMO_EMAILS]);
    return row;
  }

  private async deleteKeyed(manager: EntityManager, column: 'district_id' | 'station_id', ids: string[]) {
    if (ids.length === 0) return;
    const tables: { table_name: string }[] = await manager.query(
      `SELECT c.table_name FROM information_schema.columns c
         JOIN information_schema.tables t ON t.table_schema = c.table_schema AND t.table_name = c.table_name AND t.table_type = 'BASE TABLE'
        WHERE c.table_schema = current_schema() AND c.column_name = $1 AND c.data_type = 'uuid'
        ORDER BY c.table_name`, [column]);
    for (const { table_name } of tables)
      await manager.query(`DELETE FROM "${table_name.replace(/"/g, '""')}" WHERE ${column} = ANY($1::uuid[])`, [ids]);
  }

  async remove(p: Principal, reason: string): Promise<DemoRemovedResponse> {
    return this.ctx.ds.transaction(async (manager) => {
      // Other writers (an intake, a season run) wait for this, and a second removal finds nothing left.
      await manager.query(`LOCK TABLE districts, weather_stations IN SHARE ROW EXCLUSIVE MODE`);
      const districts: { id: string; code: string }[] = await manager.query(`SELECT id, code FROM districts WHERE is_demo ORDER BY code`);
      const stations: { id: string; code: string }[] = await manager.query(`SELECT id, code FROM weather_stations WHERE is_demo ORDER BY code`);
      if (districts.length === 0 && stations.length === 0)
        throw conflict('no_demo_data', 'There is no demo data left to remove.');
      // Most rows hang from a district or station by a cascading foreign key; some stored results (tiers, for
      // one) are keyed by district_id / station_id without one, so every base table with such a column is
      // cleared of the demo's ids first — nothing of the demo is left behind as an orphan.
      await this.deleteKeyed(manager, 'station_id', stations.map((x) => x.id));
      await this.deleteKeyed(manager, 'district_id', districts.map((x) => x.id));
      await manager.query(`DELETE FROM weather_stations WHERE is_demo`);
      await manager.query(`DELETE FROM districts WHERE is_demo`);
      // TypeORM answers an UPDATE … RETURNING with [rows, affected count].
      const [users]: [{ id: string }[], number] = await manager.query(
        `UPDATE users SET active = false WHERE active AND email = ANY($1::text[]) AND id <> $2 RETURNING id`, [DEMO_EMAILS, p.userId]);
      if (users.length) await manager.query(`UPDATE sessions SET revoked_at = now() WHERE user_id = ANY($1::uuid[]) AND revoked_at IS NULL`, [users.map((u) => u.id)]);
      await recordAudit(manager, {
        actorId: p.userId, action: 'demo.removed', entity: 'installation', entityId: 'demo',
        before: { districts: districts.map((d) => d.code), stations: stations.map((s) => s.code) },
        after: { usersDeactivated: users.map((u) => u.id) },
        reason,
      });
      return { districts: districts.length, stations: stations.length, usersDeactivated: users.length };
    });
  }
}
