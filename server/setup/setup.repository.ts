import type { EntityManager } from 'typeorm';
import { z } from 'zod';
import { parseFirst, parseRows } from '../platform/rows';

const idCode = z.object({ id: z.string(), code: z.string() });
export type DemoItem = z.infer<typeof idCode>;
const demoCounts = z.object({ districts: z.number().int(), stations: z.number().int(), users: z.number().int() });

/** All SQL of setting an installation up: its first admin and removing the demo region. */
export class SetupRepository {
  constructor(private readonly manager: EntityManager) {}

  /** Whether some active admin has chosen a password (then the first-admin link is never printed again). */
  async anAdminCanSignIn(): Promise<boolean> {
    const rows = parseRows(z.object({ ready: z.number() }), await this.manager.query(
      `SELECT 1 AS ready FROM users WHERE role = 'admin' AND active AND password_hash IS NOT NULL LIMIT 1`));
    return rows.length > 0;
  }

  /** An earlier unused invitation link of the account stops working. */
  async retireInviteLinks(userId: string): Promise<void> {
    await this.manager.query(`UPDATE one_time_tokens SET used_at = now() WHERE user_id = $1 AND purpose = 'invite' AND used_at IS NULL`, [userId]);
  }

  async demoCounts(demoEmails: string[]): Promise<z.infer<typeof demoCounts>> {
    return parseFirst(demoCounts, await this.manager.query(
      `SELECT (SELECT count(*)::int FROM districts WHERE is_demo) AS districts,
              (SELECT count(*)::int FROM weather_stations WHERE is_demo) AS stations,
              (SELECT count(*)::int FROM users WHERE active AND email = ANY($1::text[])) AS users`, [demoEmails]))!;
  }

  /** Other writers (an intake, a season run) wait for the caller's transaction, and a second removal finds nothing left. */
  async lockDistrictsAndStations(): Promise<void> {
    await this.manager.query(`LOCK TABLE districts, weather_stations IN SHARE ROW EXCLUSIVE MODE`);
  }

  async demoDistricts(): Promise<DemoItem[]> {
    return parseRows(idCode, await this.manager.query(`SELECT id, code FROM districts WHERE is_demo ORDER BY code`));
  }

  async demoStations(): Promise<DemoItem[]> {
    return parseRows(idCode, await this.manager.query(`SELECT id, code FROM weather_stations WHERE is_demo ORDER BY code`));
  }

  /** Delete the ids' rows from every base table with a uuid column of that name (with or without a foreign key). */
  async deleteKeyed(column: 'district_id' | 'station_id', ids: string[]): Promise<void> {
    if (ids.length === 0) return;
    const tables = parseRows(z.object({ table_name: z.string() }), await this.manager.query(
      `SELECT c.table_name FROM information_schema.columns c
         JOIN information_schema.tables t ON t.table_schema = c.table_schema AND t.table_name = c.table_name AND t.table_type = 'BASE TABLE'
        WHERE c.table_schema = current_schema() AND c.column_name = $1 AND c.data_type = 'uuid'
        ORDER BY c.table_name`, [column]));
    for (const { table_name } of tables)
      await this.manager.query(`DELETE FROM "${table_name.replace(/"/g, '""')}" WHERE ${column} = ANY($1::uuid[])`, [ids]);
  }

  async deleteDemoStationsAndDistricts(): Promise<void> {
    await this.manager.query(`DELETE FROM weather_stations WHERE is_demo`);
    await this.manager.query(`DELETE FROM districts WHERE is_demo`);
  }

  /** Deactivate the demo's people except `keepId` and end their sessions; returns their ids. */
  async deactivateDemoUsers(demoEmails: string[], keepId: string): Promise<string[]> {
    // TypeORM answers an UPDATE … RETURNING with [rows, affected count].
    const [rows] = z.tuple([z.array(z.object({ id: z.string() })), z.number()]).parse(await this.manager.query(
      `UPDATE users SET active = false WHERE active AND email = ANY($1::text[]) AND id <> $2 RETURNING id`, [demoEmails, keepId]));
    const ids = rows.map((u) => u.id);
    if (ids.length) await this.manager.query(`UPDATE sessions SET revoked_at = now() WHERE user_id = ANY($1::uuid[]) AND revoked_at IS NULL`, [ids]);
    return ids;
  }
}
