import type { DataSource } from 'typeorm';
import type { TierSettingsPreviewResponse } from '../../shared/api/tier-settings.schema';
import { computeTier, DEFAULT_TIER_SETTINGS, type DriverResult, type Tier, type TierInputs, type TierSettings } from '../../shared/tier';
import { recordAudit } from '../audit/audit.repository';
import type { Principal } from '../auth/principal';
import { TierSettingsVersionEntity } from './tier-settings-version.entity';
import { TierSettingsRepository } from './tier-settings.repository';

const num = (x: unknown): number | null => (typeof x === 'number' && Number.isFinite(x) ? x : null);
const bool = (x: unknown): boolean | null => (typeof x === 'boolean' ? x : null);

/**
 * The tier's inputs as the season run stored them in each driver's detail (the central estimate). The ages
 * of the newest weather and counts are not stored with the drivers; they only set the confidence, never the
 * tier, so the preview leaves them out.
 */
export function inputsFromDrivers(drivers: DriverResult[]): TierInputs {
  const d = (id: DriverResult['id']) => (Array.isArray(drivers) ? drivers.find((x) => x.id === id)?.detail : undefined) ?? {};
  const zone = d('cases').zone;
  return {
    climate: { rvc14: num(d('climate').rvc14), seasonOpen: bool(d('climate').seasonOpen) },
    vectorClock: { eipShare: num(d('vectorClock').eipShare), generationsRatio: num(d('vectorClock').generationsRatio) },
    larval: { breteau: num(d('larval').breteau), house: num(d('larval').house) },
    cases: {
      zone: zone === 'below' || zone === 'within' || zone === 'above' ? zone : null,
      aberrationAlarm: bool(d('cases').aberrationAlarm), growthRatio: num(d('cases').growthRatio), cases: num(d('cases').cases),
    },
    weatherAgeDays: 0,
    caseAgeWeeks: 0,
  };
}

/** The tier weights and cut points in force (the newest version), their history, and a dry run of a change. */
export class TierSettingsService {
  constructor(private readonly ds: DataSource) {}

  async current(): Promise<{ settings: TierSettings; version: number | null }> {
    const row = await this.ds.getRepository(TierSettingsVersionEntity).findOne({ where: {}, order: { id: 'DESC' } });
    return row ? { settings: row.settings, version: row.id } : { settings: DEFAULT_TIER_SETTINGS, version: null };
  }

  async history() {
    const rows = await new TierSettingsRepository(this.ds.manager).history();
    return rows.map((r) => ({
      version: r.id, settings: r.settings, changedBy: r.changed_by, changedByName: r.name, reason: r.reason, createdAt: new Date(r.created_at).toISOString(),
    }));
  }

  /**
   * The dry run: this week's stored tier inputs (the Ladder's newest week) recomputed with `settings`, and
   * the districts whose tier would change. It only reads; the season run applies a saved version.
   */
  async preview(settings: TierSettings): Promise<TierSettingsPreviewResponse> {
    const rows = await new TierSettingsRepository(this.ds.manager).newestWeekTiers();
    const changes: TierSettingsPreviewResponse['changes'] = [];
    for (const r of rows) {
      const next = computeTier(inputsFromDrivers(r.drivers), settings);
      if (next.tier !== r.tier)
        changes.push({ districtId: r.district_id, code: r.code, name: r.name, from: r.tier, to: next.tier, scoreFrom: Math.round(r.score * 10_000) / 10_000, scoreTo: next.score });
    }
    return { epiYear: rows[0]?.epi_year ?? null, epiWeek: rows[0]?.epi_week ?? null, districts: rows.length, changes };
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
