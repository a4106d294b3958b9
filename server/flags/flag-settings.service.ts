import { DEFAULT_LAPSE_WEEKS, type FlagSettingsBody, type FlagSettingsDto } from '../../shared/api/flags.schema';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit.repository';
import type { Principal } from '../auth/principal';
import { FlagSettingsRepository } from './flag-settings.repository';

/** The flag settings (how long an open flag waits before it lapses), read and changed by an admin. */
export class FlagSettingsService {
  constructor(private readonly ctx: AppContext) {}

  async get(): Promise<FlagSettingsDto> {
    const row = await new FlagSettingsRepository(this.ctx.ds.manager).get();
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
      const settings = new FlagSettingsRepository(manager);
      const before = await settings.lapseWeeksForUpdate();
      await settings.save(body.lapseWeeks, p.userId);
      await recordAudit(manager, {
        actorId: p.userId, action: 'flag-settings.updated', entity: 'flag-settings', entityId: '1',
        before: { lapseWeeks: before ?? DEFAULT_LAPSE_WEEKS }, after: { lapseWeeks: body.lapseWeeks }, reason: body.reason,
      });
    });
    return this.get();
  }
}
