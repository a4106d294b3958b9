import type { z } from 'zod';
import { epiWeek } from '../../shared/model/epi-week';
import type { surveyBody } from '../../shared/api/surveys.schema';
import { aggregateLarvalIndices } from '../../shared/signals';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit.repository';
import { assertAssigned, assertDistrictVisible, type Principal } from '../auth/principal';
import { DistrictEntity } from '../districts/district.entity';
import { badRequest, conflict, notFound } from '../http/errors';
import { todayIn, weekKey } from './case-weeks';
import { LarvalSurveyEntity } from './larval-survey.entity';
import { presentSurvey, surveyCounts } from './larval-surveys.presenter';

const districtRefOf = (d: DistrictEntity) => ({ id: d.id, code: d.code, name: d.name });

export class LarvalSurveysService {
  constructor(private readonly ctx: AppContext) {}

  /**
   * Record a survey. The id is the browser's: the first submission answers `created: true` (201), a
   * repeat of the same id answers the survey already stored (200) and writes nothing.
   */
  async submit(actor: Principal, body: z.infer<typeof surveyBody>) {
    assertAssigned(actor, body.districtId);
    const today = todayIn(this.ctx.config.TIMEZONE);
    if (body.date > today) throw badRequest('invalid_date', 'The survey date is in the future.', [{ path: 'date', message: 'cannot be in the future' }]);
    return this.ctx.ds.transaction(async (manager) => {
      const district = await manager.findOne(DistrictEntity, { where: { id: body.districtId }, select: { id: true, code: true, name: true } });
      if (!district) throw badRequest('unknown_district', 'The district does not exist.', [{ path: 'districtId', message: 'is not a known district' }]);
      const w = epiWeek(body.date, this.ctx.config.EPI_WEEK_SYSTEM);
      // INSERT … ON CONFLICT DO NOTHING: two submissions of the same id at once still store one survey.
      const inserted = await manager
        .createQueryBuilder()
        .insert()
        .into(LarvalSurveyEntity)
        .values({
          id: body.id, districtId: body.districtId, locality: body.locality, surveyDate: body.date, epiYear: w.year, epiWeek: w.week,
          housesInspected: body.housesInspected, housesPositive: body.housesPositive, containersInspected: body.containersInspected,
          containersPositive: body.containersPositive, pupae: body.pupae ?? null, containerTypes: [...new Set(body.containerTypes)],
          notes: body.notes ?? null, submittedBy: actor.userId, submittedAt: new Date(),
        })
        .orIgnore()
        .returning(['id'])
        .execute();
      const created = (inserted.raw as unknown[]).length > 0;
      const survey = (await manager.findOneBy(LarvalSurveyEntity, { id: body.id }))!;
      if (!created) {
        // The same id from another district is not a resubmission: refuse rather than show someone else's survey.
        if (survey.districtId !== body.districtId) throw conflict('survey_id_taken', 'Another survey already has this id.');
        assertAssigned(actor, survey.districtId);
        return { created, survey: presentSurvey(survey, districtRefOf(district)) };
      }
      await recordAudit(manager, {
        actorId: actor.userId, action: 'larval-survey.submitted', entity: 'larval_survey', entityId: survey.id,
        after: { districtId: survey.districtId, locality: survey.locality, date: survey.surveyDate, ...surveyCounts(survey) },
      });
      return { created, survey: presentSurvey(survey, districtRefOf(district)) };
    });
  }

  /**
   * Void a survey entered in error (the roles that may enter one, in their own districts): it stays in
   * the list and the audit trail, and stops counting in the indices, the District file and the season run.
   */
  async voidSurvey(actor: Principal, id: string, reason: string) {
    return this.ctx.ds.transaction(async (manager) => {
      const survey = await manager.findOne(LarvalSurveyEntity, { where: { id }, lock: { mode: 'pessimistic_write' } });
      if (!survey) throw notFound('The survey');
      assertAssigned(actor, survey.districtId);
      if (survey.voidedAt) throw conflict('already_voided', 'This survey is already voided.');
      const voidedAt = new Date();
      await manager.update(LarvalSurveyEntity, { id }, { voidedAt, voidedBy: actor.userId, voidReason: reason });
      await recordAudit(manager, {
        actorId: actor.userId, action: 'larval-survey.voided', entity: 'larval_survey', entityId: id,
        before: { districtId: survey.districtId, locality: survey.locality, date: survey.surveyDate, ...surveyCounts(survey) },
        after: { voided: true }, reason,
      });
      const district = (await manager.findOne(DistrictEntity, { where: { id: survey.districtId }, select: { id: true, code: true, name: true } }))!;
      return presentSurvey({ ...survey, voidedAt, voidedBy: actor.userId, voidReason: reason }, districtRefOf(district));
    });
  }

  /** A district's recent surveys with their indices, and the indices pooled per epidemiological week. */
  async listForDistrict(p: Principal, districtId: string) {
    assertDistrictVisible(p, districtId);
    const district = await this.ctx.ds.manager.findOne(DistrictEntity, { where: { id: districtId }, select: { id: true, code: true, name: true } });
    if (!district) throw notFound('The district');
    const surveys = await this.ctx.ds.manager.find(LarvalSurveyEntity, {
      where: { districtId }, order: { surveyDate: 'DESC', submittedAt: 'DESC' }, take: 200,
    });
    const byWeek = new Map<number, LarvalSurveyEntity[]>();
    // A voided survey is listed (marked) but counts in no week's indices.
    for (const s of surveys.filter((x) => x.voidedAt === null)) {
      const k = weekKey(s.epiYear, s.epiWeek);
      byWeek.set(k, [...(byWeek.get(k) ?? []), s]);
    }
    return {
      district: districtRefOf(district),
      surveys: surveys.map((s) => presentSurvey(s, districtRefOf(district))),
      weeks: [...byWeek.entries()]
        .sort(([a], [b]) => b - a)
        .map(([, group]) => {
          const { house, container, breteau, pupa, pupaSurveys } = aggregateLarvalIndices(group.map(surveyCounts));
          return {
            year: group[0].epiYear,
            week: group[0].epiWeek,
            surveys: group.length,
            pupaSurveys,
            houses: group.reduce((a, s) => a + s.housesInspected, 0),
            indices: { house, container, breteau, pupa },
          };
        }),
    };
  }
}
