import type { DataSource } from 'typeorm';
import { DEFAULT_TIER_SETTINGS, type TierSettings } from '../../shared/tier';
import { recordAudit } from '../audit/audit.repository';
import type { Principal } from '../auth/principal';
import { TierSettingsVersionEntity } from './tier-settings-version.entity';

/** The tier weights and cut points in force (the newest version), and their history. */
export class TierSettingsService {
  constructor(private readonly ds: DataSource) {}

  async current(): Promise<{ settings: TierSettings; version: number | null }> {
    const row = await this.ds.getRepository(TierSettingsVersionEntity).findOne({ where: {}, order: { id: 'DESC' } });
    return row ? { settings: row.settings, version: row.id } : { settings: DEFAULT_TIER_SETTINGS, version: null };
  }

  async history() {
    const rows = await this.ds.getRepository(TierSettingsVersionEntity).find({ order: { id: 'DESC' }, take: 100 });
    return rows.map((r) => ({ version: r.id, settings: r.settings, changedBy: r.changedBy, reason: r.reason, createdAt: r.createdAt.toISOString() }));
  }

  async update(actor: Principal, settings: TierSettings, reason: string) {
    const before = await this.current();
    return this.ds.transaction(async (manager) => {
      const row = await manager.save(TierSettingsVersionEntity, manager.create(TierSettingsVersionEntity, { settings, reason, changedBy: actor.userId }));
      await recordAudit(manager, {
        actorId: actor.userId, action: 'tier-settings.updated', entity: 'tier-settings', entityId: String(row.id),
        before: before.settings, after: settings, reason,
      });
      return { version: row.id, settings };
    });
  }
}
