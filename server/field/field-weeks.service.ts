import type { EntityManager } from 'typeorm';
import type { AwaitingFieldWeeksResponse, FieldWeekDaysBody, FieldWeekDto, FieldWeekProposalBody, FieldWeekProposalRecord, SendBackFieldWeekBody } from '../../shared/api/field.schema';
import { formatIsoDate, parseIsoDate } from '../../shared/model/dates';
import { ladderOrderPlan, proposeFieldWeek } from '../../shared/field/propose';
import { workNeededFor } from '../../shared/field/work-kinds';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit.repository';
import { type Principal, seesAllDistricts } from '../auth/principal';
import { languageHeaders } from '../bulletins/bulletin-texts';
import { todayIn } from '../cases/case-weeks';
import { badRequest, conflict, notFound } from '../http/errors';
import { languageOr } from '../i18n';
import { enqueueMail } from '../outbox/outbox.repository';
import { isUniqueViolation } from '../platform/database-errors';
import { FieldTeamsRepository, type TeamRecord } from './field-teams.repository';
import { FieldWeekEntity } from './field-week.entity';
import { fieldWeekMail, type MemberPlan } from './field-week.mails';
import { FieldWeeksRepository } from './field-weeks.repository';

/** Field work is planned Monday to Friday (Broodcast's choice; a team's district-days fit in these five). */
export const WORKING_DAYS = 5;
/** Travel limit from a team's base when the officer names none (straight-line km between centroids). */
export const DEFAULT_TRAVEL_KM = 150;

const addDays = (iso: string, n: number) => formatIsoDate(parseIsoDate(iso) + n);

export const workingDaysOf = (monday: string) => Array.from({ length: WORKING_DAYS }, (_, i) => addDays(monday, i));

/** The Monday after `today` (the coming week). */
export function comingMonday(today: string): string {
  const dow = new Date(`${today}T00:00:00Z`).getUTCDay(); // 0 = Sunday
  return addDays(today, ((8 - dow) % 7) || 7);
}

/** The Field week (issue 19): propose with the solver, edit, publish. */
export class FieldWeeksService {
  constructor(private readonly ctx: AppContext) {}

  /**
   * Propose the week from the current Ladder and teams and store it as the week's draft (the solver's days
   * replace the draft's days). A published week is not proposed again (409).
   */
  async propose(p: Principal, body: FieldWeekProposalBody): Promise<FieldWeekDto> {
    const weekStart = body.weekStart ?? comingMonday(todayIn(this.ctx.config.TIMEZONE));
    const maxTravelKm = body.maxTravelKm ?? DEFAULT_TRAVEL_KM;
    // Two officers proposing a new week at once: the second meets the unique week and gets a 409, not a 500.
    return this.ctx.ds.transaction(async (manager) => {
      const existing = await manager.findOne(FieldWeekEntity, { where: { weekStart }, lock: { mode: 'pessimistic_write' } });
      if (existing?.status === 'published') throw conflict('week_published', 'This week is already published.', { weekStart });
      if (existing?.status === 'awaiting_approval') throw conflict('week_awaiting_approval', 'This week is waiting for a supervisor\'s approval.', { weekStart });
      const repo = new FieldWeeksRepository(manager);
      const { districts, ladderWeek } = await repo.ladder();
      const teams = await new FieldTeamsRepository(manager).list({ activeOnly: true });
      const input = {
        districts, days: workingDaysOf(weekStart), maxTravelKm,
        teams: teams.map((t) => ({ id: t.id, name: t.name, baseDistrictId: t.baseDistrict.id, kinds: t.kinds, daysPerWeek: t.daysPerWeek })),
      };
      const proposal = proposeFieldWeek(input);
      const byId = new Map(districts.map((d) => [d.id, d]));
      const record: FieldWeekProposalRecord = {
        ladderWeek, maxTravelKm, visitWeight: proposal.visitWeight, coveredRisk: proposal.coveredRisk,
        ladderOrderRisk: ladderOrderPlan(input).coveredRisk, totalRisk: proposal.totalRisk,
        districts: proposal.districts.map((d) => ({
          districtId: d.districtId, code: byId.get(d.districtId)!.code, name: byId.get(d.districtId)!.name, rank: d.rank, tier: d.tier,
          risk: d.risk, daysNeeded: d.daysNeeded, daysProposed: d.daysPlanned, workNeeded: d.workNeeded, reason: d.reason,
        })),
      };
      const week = existing
        ? { ...existing, proposal: record, edited: false }
        : manager.create(FieldWeekEntity, { weekStart, status: 'draft', proposal: record, edited: false, createdBy: p.userId });
      const saved = await manager.save(FieldWeekEntity, week);
      await repo.replaceDays(saved.id, proposal.assignments);
      await recordAudit(manager, {
        actorId: p.userId, action: 'field-week.proposed', entity: 'field_week', entityId: saved.id,
        after: { weekStart, maxTravelKm, days: proposal.assignments.length, coveredRisk: proposal.coveredRisk, ladderOrderRisk: record.ladderOrderRisk },
      });
      return this.present(manager, saved, teams, p);
    }).catch((err: unknown) => {
      if (isUniqueViolation(err)) throw conflict('week_busy', 'Another proposal for this week was saved at the same moment; try again.', { weekStart });
      throw err;
    });
  }

  /** The week starting `weekStart` (the coming one by default), or null; a community worker sees only their teams' days. */
  async get(p: Principal, weekStart?: string): Promise<{ week: FieldWeekDto | null }> {
    const start = weekStart ?? comingMonday(todayIn(this.ctx.config.TIMEZONE));
    const week = await this.ctx.ds.manager.findOneBy(FieldWeekEntity, { weekStart: start });
    if (!week) return { week: null };
    // A draft is the planners' business; team members see the week once it is published.
    if (!seesAllDistricts(p) && week.status !== 'published') return { week: null };
    const teams = await new FieldTeamsRepository(this.ctx.ds.manager).list();
    return { week: await this.present(this.ctx.ds.manager, week, teams, p) };
  }

  /** Replace the draft's days with the officer's edit (checked: known teams and districts, the week's working days, capacity). */
  async saveDays(p: Principal, id: string, body: FieldWeekDaysBody): Promise<FieldWeekDto> {
    return this.ctx.ds.transaction(async (manager) => {
      const week = await manager.findOne(FieldWeekEntity, { where: { id }, lock: { mode: 'pessimistic_write' } });
      if (!week) throw notFound('The Field week');
      refuseUnlessDraft(week);
      const teams = await new FieldTeamsRepository(manager).list();
      const teamById = new Map(teams.map((t) => [t.id, t]));
      const repo = new FieldWeeksRepository(manager);
      const districts = await repo.districtRefs([...new Set(body.days.map((d) => d.districtId))]);
      const working = new Set(workingDaysOf(week.weekStart));
      const problems: { path: string; message: string }[] = [];
      const used = new Map<string, number>();
      body.days.forEach((d, i) => {
        const team = teamById.get(d.teamId);
        if (!team) problems.push({ path: `days.${i}.teamId`, message: 'is not a known team' });
        if (!districts.has(d.districtId)) problems.push({ path: `days.${i}.districtId`, message: 'is not a known district' });
        if (!working.has(d.day)) problems.push({ path: `days.${i}.day`, message: 'is not a working day of this week' });
        if (team) {
          const n = (used.get(team.id) ?? 0) + 1;
          used.set(team.id, n);
          if (n > team.daysPerWeek) problems.push({ path: `days.${i}.teamId`, message: `gives the team more than its ${team.daysPerWeek} district-days` });
        }
      });
      if (problems.length) throw badRequest('invalid_plan', 'The plan has days that cannot be kept.', problems);
      await repo.replaceDays(id, body.days);
      week.edited = true;
      const saved = await manager.save(FieldWeekEntity, week);
      await recordAudit(manager, { actorId: p.userId, action: 'field-week.edited', entity: 'field_week', entityId: id, after: { days: body.days } });
      return this.present(manager, saved, teams, p);
    });
  }

  /**
   * Publish the week. When the field settings require approval, the week goes to the supervisors' queue
   * instead (status `awaiting_approval`, nobody mailed yet); otherwise each member of a team with days
   * gets their days by mail, in their language, through the outbox.
   */
  async publish(p: Principal, id: string): Promise<FieldWeekDto> {
    return this.ctx.ds.transaction(async (manager) => {
      const week = await manager.findOne(FieldWeekEntity, { where: { id }, lock: { mode: 'pessimistic_write' } });
      if (!week) throw notFound('The Field week');
      refuseUnlessDraft(week);
      const teams = await new FieldTeamsRepository(manager).list();
      if (await approvalRequired(manager)) {
        week.status = 'awaiting_approval';
        week.submittedAt = new Date();
        week.submittedBy = p.userId;
        const saved = await manager.save(FieldWeekEntity, week);
        await recordAudit(manager, {
          actorId: p.userId, action: 'field-week.submitted', entity: 'field_week', entityId: id,
          before: { status: 'draft' }, after: { weekStart: week.weekStart, status: 'awaiting_approval' },
        });
        return this.present(manager, saved, teams, p);
      }
      return this.release(manager, week, teams, p, 'field-week.published');
    });
  }

  /** The supervisor approves a week waiting for approval: it is published and the members are mailed. */
  async approve(p: Principal, id: string): Promise<FieldWeekDto> {
    return this.ctx.ds.transaction(async (manager) => {
      const week = await manager.findOne(FieldWeekEntity, { where: { id }, lock: { mode: 'pessimistic_write' } });
      if (!week) throw notFound('The Field week');
      if (week.status !== 'awaiting_approval') throw conflict('week_not_awaiting', 'This week is not waiting for approval.', { weekStart: week.weekStart, status: week.status });
      week.reviewedAt = new Date();
      week.reviewedBy = p.userId;
      week.reviewReason = null;
      const teams = await new FieldTeamsRepository(manager).list();
      return this.release(manager, week, teams, p, 'field-week.approved');
    });
  }

  /** The supervisor sends a week back to the officer with a reason: it is a draft again, nobody is mailed. */
  async sendBack(p: Principal, id: string, body: SendBackFieldWeekBody): Promise<FieldWeekDto> {
    return this.ctx.ds.transaction(async (manager) => {
      const week = await manager.findOne(FieldWeekEntity, { where: { id }, lock: { mode: 'pessimistic_write' } });
      if (!week) throw notFound('The Field week');
      if (week.status !== 'awaiting_approval') throw conflict('week_not_awaiting', 'This week is not waiting for approval.', { weekStart: week.weekStart, status: week.status });
      week.status = 'draft';
      week.reviewedAt = new Date();
      week.reviewedBy = p.userId;
      week.reviewReason = body.reason;
      const saved = await manager.save(FieldWeekEntity, week);
      await recordAudit(manager, {
        actorId: p.userId, action: 'field-week.sent-back', entity: 'field_week', entityId: id,
        before: { status: 'awaiting_approval' }, after: { status: 'draft' }, reason: body.reason,
      });
      return this.present(manager, saved, await new FieldTeamsRepository(manager).list(), p);
    });
  }

  /** The supervisors' queue: weeks waiting for approval, oldest first. */
  async awaiting(): Promise<AwaitingFieldWeeksResponse> {
    const rows: { id: string; week_start: string; submitted_at: Date | null; submitted_by: string | null; days: number; teams: number }[] = await this.ctx.ds.query(
      `SELECT w.id, to_char(w.week_start, 'YYYY-MM-DD') AS week_start, w.submitted_at, u.display_name AS submitted_by,
              (SELECT count(*)::int FROM field_week_days d WHERE d.field_week_id = w.id) AS days,
              (SELECT count(DISTINCT d.team_id)::int FROM field_week_days d WHERE d.field_week_id = w.id) AS teams
         FROM field_weeks w LEFT JOIN users u ON u.id = w.submitted_by
        WHERE w.status = 'awaiting_approval' ORDER BY w.week_start, w.id`,
    );
    return {
      weeks: rows.map((r) => ({
        id: r.id, weekStart: r.week_start, submittedAt: r.submitted_at ? new Date(r.submitted_at).toISOString() : null,
        submittedBy: r.submitted_by, days: r.days, teams: r.teams,
      })),
    };
  }

  /** Publish `week` and mail each member of a team with days their days, in their language (one transaction with the caller's). */
  private async release(manager: EntityManager, week: FieldWeekEntity, teams: TeamRecord[], p: Principal, action: string): Promise<FieldWeekDto> {
    const id = week.id;
    const repo = new FieldWeeksRepository(manager);
    const days = await repo.days(id);
    const districts = await repo.districtRefs([...new Set(days.map((d) => d.districtId))]);
    const workOf = new Map(week.proposal.districts.map((d) => [d.districtId, d.workNeeded]));
    const working = workingDaysOf(week.weekStart);
    const plans = new Map<string, { email: string; language: string; plans: MemberPlan[] }>();
    for (const team of teams) {
      const own = days.filter((d) => d.teamId === team.id);
      if (own.length === 0) continue;
      const plan: MemberPlan = {
        team: team.name, base: team.baseDistrict.name,
        days: working.map((day) => {
          const d = own.find((x) => x.day === day);
          if (!d) return { day, district: null };
          const ref = districts.get(d.districtId)!;
          // A district added after the proposal has no reason stored: it gets the general work.
          return { day, district: { name: ref.name, code: ref.code, work: workOf.get(d.districtId) ?? workNeededFor(null) } };
        }),
      };
      for (const m of team.members) {
        const entry = plans.get(m.id) ?? { email: team.memberEmails.get(m.id)!, language: m.language, plans: [] };
        entry.plans.push(plan);
        plans.set(m.id, entry);
      }
    }
    const mailed = await enqueueMail(manager, this.ctx.config, [...plans.entries()].map(([userId, m]) => {
      const language = languageOr(m.language);
      const mail = fieldWeekMail({ language, start: working[0], end: working[working.length - 1], teams: m.plans, publishedBy: p.displayName });
      return { kind: 'field-week' as const, to: m.email, userId, ...mail, headers: languageHeaders(language) };
    }));
    const before = week.status;
    week.status = 'published';
    week.publishedAt = new Date();
    week.publishedBy = p.userId;
    const saved = await manager.save(FieldWeekEntity, week);
    await recordAudit(manager, {
      actorId: p.userId, action, entity: 'field_week', entityId: id,
      before: { status: before }, after: { weekStart: week.weekStart, status: 'published', days: days.length, mailed },
    });
    return { ...(await this.present(manager, saved, teams, p)), mailed };
  }

  private async present(manager: EntityManager, week: FieldWeekEntity, teams: TeamRecord[], p: Principal): Promise<FieldWeekDto> {
    const mine = seesAllDistricts(p) ? teams : teams.filter((t) => t.members.some((m) => m.id === p.userId));
    const days = await new FieldWeeksRepository(manager).days(week.id, seesAllDistricts(p) ? undefined : mine.map((t) => t.id));
    const names = await peopleNames(manager, [week.submittedBy, week.reviewedBy]);
    return {
      ...week.proposal,
      // A community worker sees why their own districts are in or out, not the whole region's ranking.
      districts: seesAllDistricts(p) ? week.proposal.districts : week.proposal.districts.filter((d) => p.districtIds.includes(d.districtId) || days.some((x) => x.districtId === d.districtId)),
      id: week.id,
      weekStart: week.weekStart,
      workingDays: workingDaysOf(week.weekStart),
      status: week.status,
      edited: week.edited,
      teams: mine.map((t) => ({ id: t.id, name: t.name, baseDistrict: t.baseDistrict, kinds: t.kinds, daysPerWeek: t.daysPerWeek })),
      days,
      publishedAt: week.publishedAt ? new Date(week.publishedAt).toISOString() : null,
      submittedAt: week.submittedAt ? new Date(week.submittedAt).toISOString() : null,
      submittedBy: week.submittedBy ? names.get(week.submittedBy) ?? null : null,
      review: week.reviewedAt
        ? { decision: week.reviewReason === null ? 'approved' : 'sent_back', by: week.reviewedBy ? names.get(week.reviewedBy) ?? null : null, at: new Date(week.reviewedAt).toISOString(), reason: week.reviewReason }
        : null,
    };
  }
}

/** A week the officer may still change or publish: a draft (409 naming its state otherwise). */
function refuseUnlessDraft(week: FieldWeekEntity) {
  if (week.status === 'published') throw conflict('week_published', 'This week is already published.', { weekStart: week.weekStart });
  if (week.status === 'awaiting_approval') throw conflict('week_awaiting_approval', 'This week is waiting for a supervisor\'s approval.', { weekStart: week.weekStart });
}

/** Whether the field settings require a supervisor's approval before a week is published (off when never set). */
async function approvalRequired(manager: EntityManager): Promise<boolean> {
  const [row]: { approval_required: boolean }[] = await manager.query(`SELECT approval_required FROM field_settings WHERE id = 1`);
  return row?.approval_required ?? false;
}

async function peopleNames(manager: EntityManager, ids: (string | null)[]): Promise<Map<string, string>> {
  const wanted = ids.filter((x): x is string => x !== null);
  if (wanted.length === 0) return new Map();
  const rows: { id: string; display_name: string }[] = await manager.query(`SELECT id, display_name FROM users WHERE id = ANY($1)`, [wanted]);
  return new Map(rows.map((r) => [r.id, r.display_name]));
}
