import type { EntityManager } from 'typeorm';
import { z } from 'zod';
import { TIERS, type DriverResult, type TierSettings } from '../../shared/tier';
import { parseRows, timestampColumn } from '../platform/rows';

/** jsonb written by Broodcast itself (validated when written): typed here, not re-validated. */
const settingsJson = z.custom<TierSettings>((v) => typeof v === 'object' && v !== null);
const driversJson = z.custom<DriverResult[]>((v) => Array.isArray(v));

const historyRow = z.object({
  id: z.number().int(),
  settings: settingsJson,
  changed_by: z.string().nullable(),
  name: z.string().nullable(),
  reason: z.string(),
  created_at: timestampColumn,
});
const storedTierRow = z.object({
  district_id: z.string(),
  code: z.string(),
  name: z.string(),
  epi_year: z.number().int(),
  epi_week: z.number().int(),
  tier: z.enum(TIERS),
  score: z.number(),
  drivers: driversJson,
});
export type StoredTierRow = z.infer<typeof storedTierRow>;

/** The SQL of the tier settings' history and dry run. */
export class TierSettingsRepository {
  constructor(private readonly manager: EntityManager) {}

  async history(): Promise<z.infer<typeof historyRow>[]> {
    return parseRows(historyRow, await this.manager.query(
      `SELECT v.id, v.settings, v.changed_by, u.display_name AS name, v.reason, v.created_at
         FROM tier_settings_versions v LEFT JOIN users u ON u.id = v.changed_by ORDER BY v.id DESC LIMIT 100`,
    ));
  }

  /** Every district's stored tier of the Ladder's newest week, by code. */
  async newestWeekTiers(): Promise<StoredTierRow[]> {
    return parseRows(storedTierRow, await this.manager.query(
      `WITH latest AS (SELECT epi_year, epi_week FROM district_tiers ORDER BY epi_year DESC, epi_week DESC LIMIT 1)
       SELECT t.district_id, d.code, d.name, t.epi_year, t.epi_week, t.tier, t.score, t.drivers
         FROM district_tiers t JOIN latest USING (epi_year, epi_week) JOIN districts d ON d.id = t.district_id
        ORDER BY d.code`,
    ));
  }
}
