import type { EntityManager } from 'typeorm';
import { LarvalSurveyEntity } from '../cases/larval-survey.entity';
import { FieldRecordEntity } from './field-record.entity';

export type FieldRecordRow = FieldRecordEntity & { districtCode: string; districtName: string; submitterName: string | null };

export interface RecordFilter {
  districtIds?: string[] | null;
  from?: string;
  /** exclusive */
  to?: string;
  submittedBy?: string;
  limit: number;
}

/** All SQL of the Field log. */
export class FieldRecordsRepository {
  constructor(private readonly manager: EntityManager) {}

  /** INSERT … ON CONFLICT DO NOTHING: two submissions of the same id at once still store one record. */
  async insertOnce(values: Omit<FieldRecordEntity, 'district' | 'submitter'>): Promise<boolean> {
    const inserted = await this.manager.createQueryBuilder().insert().into(FieldRecordEntity).values(values).orIgnore().returning(['id']).execute();
    return (inserted.raw as unknown[]).length > 0;
  }

  async list(filter: RecordFilter): Promise<FieldRecordRow[]> {
    const q = this.manager
      .createQueryBuilder(FieldRecordEntity, 'r')
      .innerJoin('r.district', 'd')
      .leftJoin('r.submitter', 'u')
      .addSelect(['d.code', 'd.name', 'u.displayName'])
      .orderBy('r.workDate', 'DESC')
      .addOrderBy('r.submittedAt', 'DESC')
      .take(filter.limit);
    if (filter.districtIds) q.andWhere('r.districtId IN (:...ids)', { ids: filter.districtIds.length ? filter.districtIds : ['00000000-0000-0000-0000-000000000000'] });
    if (filter.from) q.andWhere('r.workDate >= :from', { from: filter.from });
    if (filter.to) q.andWhere('r.workDate < :to', { to: filter.to });
    if (filter.submittedBy) q.andWhere('r.submittedBy = :by', { by: filter.submittedBy });
    const rows = await q.getMany();
    return rows.map((r) => ({
      ...r,
      districtCode: r.district!.code,
      districtName: r.district!.name,
      submitterName: r.submitter?.displayName ?? null,
    }));
  }

  async one(id: string): Promise<FieldRecordRow | null> {
    const rows = await this.manager
      .createQueryBuilder(FieldRecordEntity, 'r')
      .innerJoin('r.district', 'd')
      .leftJoin('r.submitter', 'u')
      .addSelect(['d.code', 'd.name', 'u.displayName'])
      .where('r.id = :id', { id })
      .getMany();
    const r = rows[0];
    return r ? { ...r, districtCode: r.district!.code, districtName: r.district!.name, submitterName: r.submitter?.displayName ?? null } : null;
  }

  /** The district's surveys that count (not voided) between two dates, inclusive. */
  async surveys(districtId: string, from: string, to: string): Promise<LarvalSurveyEntity[]> {
    return this.manager
      .createQueryBuilder(LarvalSurveyEntity, 's')
      .where('s.districtId = :districtId', { districtId })
      .andWhere('s.voidedAt IS NULL')
      .andWhere('s.surveyDate BETWEEN :from AND :to', { from, to })
      .getMany();
  }

  /** The newest work date per district (the Ladder's "last visited"). */
  async lastVisited(): Promise<Map<string, string>> {
    const rows: { district_id: string; last: string }[] = await this.manager.query(
      `SELECT district_id, to_char(max(work_date), 'YYYY-MM-DD') AS last FROM field_records GROUP BY district_id`,
    );
    return new Map(rows.map((r) => [r.district_id, r.last]));
  }
}
