import { DEFAULT_LAPSE_WEEKS, type FlagSettingsBody, type FlagSettingsDto } from '../../shared/api/flags.schema';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit.repository';
import type { Principal } from '../auth/principal';

/** The flag settings (how long an open flag waits before it lapses), read and changed by an admin. */
export class FlagSettingsService {
  constructor(private readonly ctx: AppContext) {}

  async get(): Promise<FlagSettingsDto> {
    const [row] = await this.ctx.ds.query(
      `SELECT s.lapse_weeks, s.updated_at, s.updated_by, u.display_name FROM flag_settings s LEFT JOIN users u ON u.id = s.updated_by WHERE s.id = 1`,
    );
    return row
      ? {
          lapseWeeks: row.lapse_weeks,
          updatedAt: row.updated_at ? new Date(row.updated_at).toISOString() : null,
          updatedBy: row.updated_by ? { id: row.updated_by, displayName: row.display_name ?? '' } : null,
        }
      : { lapseWeeks: DEFAULT_LAPSE_WEEKS, updatedAt: null, updatedBy: null };
  }

  /** One row, written with the audit event (before, after, reason) in one transaction. */
  async update(p: Principal, body: FlagSettingsBody): Promise<FlagSettingsDto> {
    await this.ctx.ds.transaction(async (manager) => {
      const [before] = await manager.query(`SELECT lapse_weeks FROM flag_settings WHERE id = 1 FOR UPDATE`);
      await manager.query(
        `INSERT INTO flag_settings (id, lapse_weeks, updated_by, updated_at) VALUES (1, $1, $2, now())
         ON CONFLICT (id) DO UPDATE SET lapse_weeks = EXCLUDED.lapse_weeks, updated_by = EXCLUDED.updated_by, updated_at = EXCLUDED.updated_at`,
        [body.lapseWeeks, p.userId],
      );
      await recordAudit(manager, {
        actorId: p.userId, action: 'flag-settings.updated', entity: 'flag-settings', entityId: '1',
        before: { lapseWeeks: before?.lapse_weeks ?? DEFAULT_LAPSE_WEEKS }, after: { lapseWeeks: body.lapseWeeks }, reason: body.reason,
      });
    });
    return this.get();
  }
}
