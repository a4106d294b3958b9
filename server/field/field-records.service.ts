import type { z } from 'zod';
import type { fieldRecordBody, fieldRecordsQuery } from '../../shared/api/field-records.schema';
import { BEFORE_AFTER_RULE } from '../../shared/field/field-records';
import { formatIsoDate, parseIsoDate } from '../../shared/model/dates';
import { aggregateLarvalIndices } from '../../shared/signals';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit.repository';
import { assertAssigned, assertDistrictVisible, seesAllDistricts, type Principal } from '../auth/principal';
import { todayIn } from '../cases/case-weeks';
import { surveyCounts } from '../cases/larval-surveys.presenter';
import { DistrictEntity } from '../districts/district.entity';
import { badRequest, conflict, notFound } from '../http/errors';
import { FieldRecordsRepository } from './field-records.repository';
import { presentFieldRecord } from './field-records.presenter';

const addDays = (iso: string, n: number) => formatIsoDate(parseIsoDate(iso) + n);

/** The Field log (issue 19, items 3 and 4): pieces of field work, and what the larval surveys showed around them. */
export class FieldRecordsService {
  constructor(private readonly ctx: AppContext) {}

  /**
   * Record a piece of work. The id is the browser's (the surveys' offline queue sends it): the first
   * submission answers `created: true` (201), a repeat of the same id answers the stored record (200) and
   * writes nothing.
   */
  async submit(actor: Principal, body: z.infer<typeof fieldRecordBody>) {
    assertAssigned(actor, body.districtId);
    const today = todayIn(this.ctx.config.TIMEZONE);
    if (body.date > today) throw badRequest('invalid_date', 'The work date is in the future.', [{ path: 'date', message: 'cannot be in the future' }]);
    return this.ctx.ds.transaction(async (manager) => {
      const repo = new FieldRecordsRepository(manager);
      const district = await manager.findOne(DistrictEntity, { where: { id: body.districtId }, select: { id: true } });
      if (!district) throw badRequest('unknown_district', 'The district does not exist.', [{ path: 'districtId', message: 'is not a known district' }]);
      const created = await repo.insertOnce({
        id: body.id, districtId: body.districtId, locality: body.locality, workDate: body.date, kind: body.kind,
        housesVisited: body.housesVisited ?? null, containers: body.containers ?? null, areaM2: body.areaM2 ?? null,
        product: body.product || null, amount: body.amount ?? null, amountUnit: body.amount == null ? null : (body.amountUnit ?? null),
        notes: body.notes || null, submittedBy: actor.userId, submittedAt: new Date(),
      });
      const record = (await repo.one(body.id))!;
      if (!created) {
        // The same id from another district is not a resubmission: refuse rather than show someone else's record.
        if (record.districtId !== body.districtId) throw conflict('record_id_taken', 'Another record already has this id.');
        return { created, record: presentFieldRecord(record) };
      }
      await recordAudit(manager, {
        actorId: actor.userId, action: 'field-record.submitted', entity: 'field_record', entityId: record.id,
        after: { districtId: record.districtId, locality: record.locality, date: record.workDate, kind: record.kind },
      });
      return { created, record: presentFieldRecord(record) };
    });
  }

  /** Records of a week (7 days from `weekStart`) or the newest ones; district-scoped roles see their own districts only. */
  async list(p: Principal, query: z.infer<typeof fieldRecordsQuery>) {
    if (query.districtId) assertDistrictVisible(p, query.districtId);
    const districtIds = query.districtId ? [query.districtId] : seesAllDistricts(p) ? null : p.districtIds;
    const rows = await new FieldRecordsRepository(this.ctx.ds.manager).list({
      districtIds,
      from: query.weekStart,
      to: query.weekStart ? addDays(query.weekStart, 7) : undefined,
      submittedBy: query.mine === 'true' ? p.userId : undefined,
      limit: query.weekStart ? 2000 : 100,
    });
    return { records: rows.map(presentFieldRecord) };
  }

  /**
   * The District file's timeline: each piece of work with the pooled larval indices of the surveys before
   * and after it (BEFORE_AFTER_RULE, derived). `comparable` is false when a side has too few surveys.
   */
  async districtTimeline(p: Principal, districtId: string) {
    assertDistrictVisible(p, districtId);
    const district = await this.ctx.ds.manager.findOne(DistrictEntity, { where: { id: districtId }, select: { id: true, code: true, name: true } });
    if (!district) throw notFound('The district');
    const repo = new FieldRecordsRepository(this.ctx.ds.manager);
    const rows = await repo.list({ districtIds: [districtId], limit: 100 });
    const { WINDOW_DAYS, MIN_SURVEYS_PER_SIDE } = BEFORE_AFTER_RULE;
    const pool = (surveys: Awaited<ReturnType<FieldRecordsRepository['surveys']>>) => {
      // No survey on a side: nothing to pool (aggregateLarvalIndices refuses an empty list), so no index.
      if (surveys.length === 0) return { surveys: 0, indices: { house: null, container: null, breteau: null, pupa: null } };
      const { house, container, breteau, pupa } = aggregateLarvalIndices(surveys.map(surveyCounts));
      return { surveys: surveys.length, indices: { house, container, breteau, pupa } };
    };
    const records = [];
    for (const r of rows) {
      const before = pool(await repo.surveys(districtId, addDays(r.workDate, -WINDOW_DAYS), addDays(r.workDate, -1)));
      const after = pool(await repo.surveys(districtId, addDays(r.workDate, 1), addDays(r.workDate, WINDOW_DAYS)));
      records.push({
        ...presentFieldRecord(r),
        before,
        after,
        comparable: before.surveys >= MIN_SURVEYS_PER_SIDE && after.surveys >= MIN_SURVEYS_PER_SIDE,
      });
    }
    return {
      district: { id: district.id, code: district.code, name: district.name },
      rule: { windowDays: WINDOW_DAYS, minSurveysPerSide: MIN_SURVEYS_PER_SIDE },
      records,
    };
  }
}
