import type { EntityManager } from 'typeorm';
import { z } from 'zod';
import { parseFirst, timestampColumn } from '../platform/rows';

const settingsRow = z.object({
  lapse_weeks: z.number().int(),
  updated_at: timestampColumn.nullable(),
  updated_by: z.string().nullable(),
  display_name: z.string().nullable(),
});
export type FlagSettingsRow = z.infer<typeof settingsRow>;

/** All SQL of the flag settings (one row, id 1). */
export class FlagSettingsRepository {
  constructor(private readonly manager: EntityManager) {}

  async get(): Promise<FlagSettingsRow | null> {
    return parseFirst(settingsRow, await this.manager.query(
      `SELECT s.lapse_weeks, s.updated_at, s.updated_by, u.display_name FROM flag_settings s LEFT JOIN users u ON u.id = s.updated_by WHERE s.id = 1`,
    ));
  }

  /** The stored lapse, locking the row for the caller's transaction; null when never set. */
  async lapseWeeksForUpdate(): Promise<number | null> {
    const row = parseFirst(z.object({ lapse_weeks: z.number().int() }), await this.manager.query(`SELECT lapse_weeks FROM flag_settings WHERE id = 1 FOR UPDATE`));
    return row ? row.lapse_weeks : null;
  }

  async save(lapseWeeks: number, userId: string): Promise<void> {
    await this.manager.query(
      `INSERT INTO flag_settings (id, lapse_weeks, updated_by, updated_at) VALUES (1, $1, $2, now())
       ON CONFLICT (id) DO UPDATE SET lapse_weeks = EXCLUDED.lapse_weeks, updated_by = EXCLUDED.updated_by, updated_at = EXCLUDED.updated_at`,
      [lapseWeeks, userId],
    );
  }
}
