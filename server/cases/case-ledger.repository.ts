import type { DataSource, EntityManager } from 'typeorm';
import { In } from 'typeorm';
import { DistrictEntity } from '../districts/district.entity';
import { CaseChannelSettingEntity } from './case-channel-setting.entity';
import { CaseCountRevisionEntity } from './case-count-revision.entity';
import { CaseCountEntity } from './case-count.entity';
import { CaseDistrictSettingEntity } from './case-district-setting.entity';
import { CaseWeekClosureEntity } from './case-week-closure.entity';
import { DiseaseEntity } from './disease.entity';

/** Reads and writes of the Case ledger's tables. Writes take the caller's transaction manager. */
export class CaseLedgerRepository {
  constructor(private readonly ds: DataSource) {}

  diseases(manager: EntityManager = this.ds.manager) {
    return manager.find(DiseaseEntity, { order: { name: 'ASC' } });
  }

  findDisease(id: string, manager: EntityManager = this.ds.manager) {
    return manager.findOneBy(DiseaseEntity, { id });
  }

  districts(ids: string[] | undefined, manager: EntityManager = this.ds.manager) {
    return manager.find(DistrictEntity, {
      where: ids ? { id: In(ids) } : {},
      select: { id: true, code: true, name: true, createdAt: true },
      order: { code: 'ASC' },
    });
  }

  /** The first day each district reports from: its setting, else the day it was created. */
  async activeFrom(districts: DistrictEntity[], manager: EntityManager = this.ds.manager): Promise<Map<string, string>> {
    const settings = districts.length
      ? await manager.find(CaseDistrictSettingEntity, { where: { districtId: In(districts.map((d) => d.id)) } })
      : [];
    const byId = new Map(settings.map((s) => [s.districtId, s.activeFrom]));
    return new Map(districts.map((d) => [d.id, byId.get(d.id) ?? d.createdAt.toISOString().slice(0, 10)]));
  }

  findCount(key: { districtId: string; diseaseId: string; epiYear: number; epiWeek: number }, manager: EntityManager, lock = false) {
    return manager.findOne(CaseCountEntity, { where: key, ...(lock ? { lock: { mode: 'pessimistic_write' as const } } : {}) });
  }

  findCountById(id: string, manager: EntityManager = this.ds.manager) {
    return manager.findOneBy(CaseCountEntity, { id });
  }

  /** Counts of the districts and disease between two week keys (year·100 + week), inclusive. */
  countsBetween(districtIds: string[], diseaseId: string, fromKey: number, toKey: number, manager: EntityManager = this.ds.manager) {
    if (districtIds.length === 0) return Promise.resolve([] as CaseCountEntity[]);
    // Voided counts come too (the grid shows them marked); whoever counts skips `voidedAt !== null`.
    return manager
      .createQueryBuilder(CaseCountEntity, 'c')
      .where('c.district_id = ANY(:districtIds)', { districtIds })
      .andWhere('c.disease_id = :diseaseId', { diseaseId })
      .andWhere('c.epi_year * 100 + c.epi_week BETWEEN :fromKey AND :toKey', { fromKey, toKey })
      .getMany();
  }

  /** Every count of one district (any disease) between two week keys: for the completeness figure. */
  async reportsBetween(districtIds: string[], fromKey: number, toKey: number, manager: EntityManager = this.ds.manager) {
    if (districtIds.length === 0) return [] as { district_id: string; epi_year: number; epi_week: number; on_time: boolean }[];
    return manager.query(
      `SELECT district_id, epi_year, epi_week, bool_or(NOT late) AS on_time FROM case_counts
        WHERE district_id = ANY($1) AND epi_year * 100 + epi_week BETWEEN $2 AND $3 AND voided_at IS NULL
        GROUP BY district_id, epi_year, epi_week`,
      [districtIds, fromKey, toKey],
    ) as Promise<{ district_id: string; epi_year: number; epi_week: number; on_time: boolean }[]>;
  }

  closuresBetween(districtIds: string[], fromKey: number, toKey: number, manager: EntityManager = this.ds.manager) {
    if (districtIds.length === 0) return Promise.resolve([] as CaseWeekClosureEntity[]);
    return manager
      .createQueryBuilder(CaseWeekClosureEntity, 'w')
      .where('w.district_id = ANY(:districtIds)', { districtIds })
      .andWhere('w.epi_year * 100 + w.epi_week BETWEEN :fromKey AND :toKey', { fromKey, toKey })
      .getMany();
  }

  isClosed(districtId: string, epiYear: number, epiWeek: number, manager: EntityManager) {
    return manager.existsBy(CaseWeekClosureEntity, { districtId, epiYear, epiWeek });
  }

  revisions(caseCountId: string, manager: EntityManager = this.ds.manager) {
    return manager.query(
      `SELECT r.version, r.at, r.kind, r.source, r.old_values, r.new_values, r.reason, u.id AS actor_id, u.display_name
         FROM case_count_revisions r LEFT JOIN users u ON u.id = r.actor_id
        WHERE r.case_count_id = $1 ORDER BY r.version`,
      [caseCountId],
    ) as Promise<{
      version: number; at: Date; kind: 'entry' | 'correction' | 'void'; source: string; old_values: CaseCountRevisionEntity['oldValues'];
      new_values: CaseCountRevisionEntity['newValues']; reason: string | null; actor_id: string | null; display_name: string | null;
    }[]>;
  }

  async excludedYears(districtId: string, diseaseId: string, manager: EntityManager = this.ds.manager) {
    return (await manager.findOneBy(CaseChannelSettingEntity, { districtId, diseaseId }))?.excludedYears ?? [];
  }

  populations(districtId: string, manager: EntityManager = this.ds.manager) {
    return manager.query('SELECT year, population FROM district_populations WHERE district_id = $1 ORDER BY year', [districtId]) as Promise<
      { year: number; population: number }[]
    >;
  }
}
