import type { EntityManager } from 'typeorm';
import type { z } from 'zod';
import {
  weekProblem,
  type ChannelSettingsBody,
  type CloseWeekBody,
  type ReopenWeekBody,
  type diseaseCreateBody,
  type caseCountBody,
  type countQuery,
  type districtCasesQuery,
  type gridQuery,
} from '../../shared/api/cases.schema';
import { weeksInYear } from '../../shared/model/epi-week';
import { PROFILE_IDS } from '../../shared/model/profiles';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit.repository';
import { assertAssigned, assertDistrictVisible, type Principal, seesAllDistricts } from '../auth/principal';
import type { DistrictEntity } from '../districts/district.entity';
import { badRequest, conflict, notFound } from '../http/errors';
import { CaseChannelSettingEntity } from './case-channel-setting.entity';
import type { CountValues } from './case-count-revision.entity';
import { CaseCountRevisionEntity } from './case-count-revision.entity';
import { CaseCountEntity } from './case-count.entity';
import { CaseLedgerRepository } from './case-ledger.repository';
import { completenessOf, presentCount, presentDisease, presentRevision } from './case-ledger.presenter';
import { buildSignals, CHANNEL_LOOKBACK_YEARS } from './case-signals';
import { currentWeek, deadlineOf, firstOpenWeek, isDue, isOpenWeek, todayIn, weekKey, weekRef, weeksEndingWith } from './case-weeks';
import { CaseWeekClosureEntity } from './case-week-closure.entity';
import { DiseaseEntity } from './disease.entity';
import { isUniqueViolation } from '../platform/database-errors';
import { mayIn } from '../../shared/permissions';


/** The new values of one count as an entry or upload gives them; `undefined` keeps what is recorded. */
export interface CountInput {
  cases: number;
  confirmed?: number | null;
  probable?: number | null;
  ageBands?: Record<string, number | undefined> | null;
}

export interface WriteOptions {
  reason?: string;
  source: 'form' | 'grid' | 'upload';
  today: string;
}

export type WriteOutcome = { outcome: 'created' | 'corrected' | 'unchanged'; count: CaseCountEntity; closed: boolean };

/** Age bands with the empty ones left out and the keys in order, so two equal splits compare equal. */
function normaliseBands(bands: Record<string, number | undefined> | null | undefined): Record<string, number> | null {
  if (!bands) return null;
  const entries = Object.entries(bands).filter((e): e is [string, number] => typeof e[1] === 'number').sort(([a], [b]) => a.localeCompare(b));
  return entries.length ? Object.fromEntries(entries) : null;
}

const valuesOf = (c: CaseCountEntity): CountValues => ({
  cases: c.cases, confirmed: c.confirmed, probable: c.probable, ageBands: normaliseBands(c.ageBands),
});
const sameValues = (a: CountValues, b: CountValues) => JSON.stringify(a) === JSON.stringify(b);

export class CaseLedgerService {
  readonly repo: CaseLedgerRepository;

  constructor(private readonly ctx: AppContext) {
    this.repo = new CaseLedgerRepository(ctx.ds);
  }

  get system() {
    return this.ctx.config.EPI_WEEK_SYSTEM;
  }

  today() {
    return todayIn(this.ctx.config.TIMEZONE);
  }

  settings() {
    const today = this.today();
    const c = this.ctx.config;
    return {
      epiWeekSystem: c.EPI_WEEK_SYSTEM,
      channelMethod: c.CHANNEL_METHOD,
      cusum: { k: c.CUSUM_K, h: c.CUSUM_H },
      deadlineDays: c.CASE_REPORT_DEADLINE_DAYS,
      today,
      currentWeek: currentWeek(c.EPI_WEEK_SYSTEM, today),
    };
  }

  // ---- diseases ----

  async listDiseases() {
    return { diseases: (await this.repo.diseases()).map(presentDisease) };
  }

  async createDisease(actor: Principal, body: z.infer<typeof diseaseCreateBody>) {
    const unknown = body.profileIds.filter((id) => !PROFILE_IDS.includes(id));
    if (unknown.length)
      throw badRequest('unknown_profile', 'A profile id is not one of the season model’s profiles.', [
        { path: 'profileIds', message: `holds unknown profile ids: ${unknown.join(', ')} (known: ${PROFILE_IDS.join(', ')})` },
      ]);
    try {
      const disease = await this.ctx.ds.transaction(async (manager) => {
        const saved = await manager.save(DiseaseEntity, manager.create(DiseaseEntity, { ...body, profileIds: [...new Set(body.profileIds)] }));
        await recordAudit(manager, { actorId: actor.userId, action: 'disease.created', entity: 'disease', entityId: saved.id, after: body });
        return saved;
      });
      return presentDisease(disease);
    } catch (err) {
      if (isUniqueViolation(err)) throw conflict('code_taken', 'Another disease already has this code.');
      throw err;
    }
  }

  private async diseaseOr404(id: string, manager?: EntityManager) {
    const disease = await this.repo.findDisease(id, manager);
    if (!disease) throw badRequest('unknown_disease', 'The disease does not exist.', [{ path: 'diseaseId', message: 'is not a known disease' }]);
    return disease;
  }

  private async districtOr404(id: string, manager?: EntityManager) {
    const [district] = await this.repo.districts([id], manager);
    if (!district) throw notFound('The district');
    return district;
  }

  // ---- entering and correcting ----

  /**
   * Enter or correct one count inside the caller's transaction. A count that exists and differs is a
   * correction and needs a reason; a closed week changes only with a reason. Writes the revision and the
   * audit event beside the count. Throws HttpError 400 naming the field when the input is refused.
   */
  async writeCount(
    manager: EntityManager,
    actor: Principal,
    district: DistrictEntity,
    activeFrom: string,
    disease: DiseaseEntity,
    key: { year: number; week: number },
    input: CountInput,
    opts: WriteOptions,
  ): Promise<WriteOutcome> {
    assertAssigned(actor, district.id);
    const problem = weekProblem(key.year, key.week, this.system, opts.today, activeFrom);
    if (problem) throw badRequest('invalid_week', `Week ${key.week} of ${key.year} ${problem.message}.`, [problem]);
    const where = { districtId: district.id, diseaseId: disease.id, epiYear: key.year, epiWeek: key.week };
    const existing = await this.repo.findCount(where, manager, true);
    const closed = await this.repo.isClosed(district.id, key.year, key.week, manager);
    const next: CountValues = {
      cases: input.cases,
      confirmed: input.confirmed === undefined ? existing?.confirmed ?? null : input.confirmed,
      probable: input.probable === undefined ? existing?.probable ?? null : input.probable,
      ageBands: input.ageBands === undefined ? normaliseBands(existing?.ageBands) : normaliseBands(input.ageBands),
    };
    if ((next.confirmed ?? 0) + (next.probable ?? 0) > next.cases)
      throw badRequest('invalid_split', 'Confirmed and probable cases together exceed the cases.', [
        { path: 'cases', message: `is below the confirmed and probable cases on record (${(next.confirmed ?? 0) + (next.probable ?? 0)})` },
      ]);
    const ageTotal = Object.values(next.ageBands ?? {}).reduce((a, n) => a + n, 0);
    if (ageTotal > next.cases)
      throw badRequest('invalid_split', 'The age bands add up to more than the cases.', [{ path: 'ageBands', message: 'add up to more than the cases' }]);

    const reason = opts.reason?.trim() || undefined;
    const now = new Date();
    if (!existing) {
      if (closed && !reason)
        throw badRequest('reason_required', `Week ${key.week} of ${key.year} is closed: a late count needs a reason.`, [
          { path: 'reason', message: 'is required: the week is closed' },
        ]);
      const late = closed || opts.today > deadlineOf(key.year, key.week, this.system, this.ctx.config.CASE_REPORT_DEADLINE_DAYS);
      let count: CaseCountEntity;
      try {
        count = await manager.save(CaseCountEntity, manager.create(CaseCountEntity, {
          ...where, ...next, version: 1, reportedAt: now, reportedBy: actor.userId, late, updatedAt: now,
        }));
      } catch (err) {
        if (isUniqueViolation(err)) throw conflict('count_exists', 'Somebody entered this count at the same moment. Reload and correct it if needed.');
        throw err;
      }
      await manager.insert(CaseCountRevisionEntity, {
        caseCountId: count.id, version: 1, actorId: actor.userId, kind: 'entry', source: opts.source, oldValues: null, newValues: next, reason: reason ?? null,
      });
      await recordAudit(manager, {
        actorId: actor.userId, action: 'case-count.entered', entity: 'case_count', entityId: count.id,
        after: { districtId: district.id, diseaseId: disease.id, year: key.year, week: key.week, ...next, late }, reason,
      });
      return { outcome: 'created', count, closed };
    }

    const before = valuesOf(existing);
    if (existing.voidedAt) return this.reenterVoided(manager, actor, existing, before, next, closed, reason, opts.source);
    if (sameValues(before, next)) return { outcome: 'unchanged', count: existing, closed };
    if (!reason)
      throw badRequest('reason_required', `The count already holds ${before.cases}${closed ? ' and the week is closed' : ''}: a correction needs a reason.`, [
        { path: 'reason', message: `is required: the count already holds ${before.cases} cases (a correction never overwrites silently)` },
      ]);
    const version = existing.version + 1;
    await manager.update(CaseCountEntity, { id: existing.id }, { ...next, version, updatedAt: now });
    await manager.insert(CaseCountRevisionEntity, {
      caseCountId: existing.id, version, actorId: actor.userId, kind: 'correction', source: opts.source, oldValues: before, newValues: next, reason,
    });
    await recordAudit(manager, {
      actorId: actor.userId, action: 'case-count.corrected', entity: 'case_count', entityId: existing.id,
      before, after: { ...next, version, closedWeek: closed }, reason,
    });
    const count = (await this.repo.findCountById(existing.id, manager))!;
    return { outcome: 'corrected', count, closed };
  }

  /**
   * A count entered again after it was voided: it counts again with the new values (a correction that
   * clears the void; a closed week still needs a reason, as a late entry would).
   */
  private async reenterVoided(
    manager: EntityManager, actor: Principal, existing: CaseCountEntity, before: CountValues, next: CountValues, closed: boolean,
    reason: string | undefined, source: string,
  ): Promise<WriteOutcome> {
    if (closed && !reason)
      throw badRequest('reason_required', `Week ${existing.epiWeek} of ${existing.epiYear} is closed: a late count needs a reason.`, [
        { path: 'reason', message: 'is required: the week is closed' },
      ]);
    const version = existing.version + 1;
    await manager.update(CaseCountEntity, { id: existing.id }, { ...next, version, updatedAt: new Date(), voidedAt: null, voidedBy: null, voidReason: null });
    await manager.insert(CaseCountRevisionEntity, {
      caseCountId: existing.id, version, actorId: actor.userId, kind: 'correction', source, oldValues: before, newValues: next, reason: reason ?? null,
    });
    await recordAudit(manager, {
      actorId: actor.userId, action: 'case-count.corrected', entity: 'case_count', entityId: existing.id,
      before: { ...before, voided: true }, after: { ...next, version, closedWeek: closed }, reason,
    });
    return { outcome: 'corrected', count: (await this.repo.findCountById(existing.id, manager))!, closed };
  }

  /**
   * Void a count entered in error (an epidemiologist of the district): it stays readable in the grid and
   * its revision history (a `void` revision with the reason), and counts nowhere — channel, signals, tier,
   * District file, bulletin, completeness.
   */
  async voidCount(actor: Principal, countId: string, reason: string) {
    const count = await this.ctx.ds.transaction(async (manager) => {
      const existing = await manager.findOne(CaseCountEntity, { where: { id: countId }, lock: { mode: 'pessimistic_write' } });
      if (!existing) throw notFound('The count');
      assertAssigned(actor, existing.districtId);
      if (existing.voidedAt) throw conflict('already_voided', 'This count is already voided.');
      const values = valuesOf(existing);
      const version = existing.version + 1;
      await manager.update(CaseCountEntity, { id: existing.id }, { version, updatedAt: new Date(), voidedAt: new Date(), voidedBy: actor.userId, voidReason: reason });
      await manager.insert(CaseCountRevisionEntity, {
        caseCountId: existing.id, version, actorId: actor.userId, kind: 'void', source: 'grid', oldValues: values, newValues: values, reason,
      });
      await recordAudit(manager, {
        actorId: actor.userId, action: 'case-count.voided', entity: 'case_count', entityId: existing.id,
        before: { districtId: existing.districtId, diseaseId: existing.diseaseId, year: existing.epiYear, week: existing.epiWeek, ...values },
        after: { voided: true, version }, reason,
      });
      return (await this.repo.findCountById(existing.id, manager))!;
    });
    return { count: presentCount(count) };
  }

  async putCount(actor: Principal, districtId: string, body: z.infer<typeof caseCountBody>) {
    assertAssigned(actor, districtId);
    const today = this.today();
    const result = await this.ctx.ds.transaction(async (manager) => {
      const district = await this.districtOr404(districtId, manager);
      const disease = await this.diseaseOr404(body.diseaseId, manager);
      const activeFrom = (await this.repo.activeFrom([district], manager)).get(district.id)!;
      return this.writeCount(manager, actor, district, activeFrom, disease, { year: body.year, week: body.week }, body, {
        reason: body.reason, source: body.source, today,
      });
    });
    return { outcome: result.outcome, count: presentCount(result.count), closed: result.closed };
  }

  /**
   * The stored count of one district, disease and week (voided ones included, marked), so the entry form
   * starts a correction from every recorded field — total, confirmed, probable, age bands — and changes
   * only what the person changes.
   */
  async storedCount(p: Principal, districtId: string, query: z.infer<typeof countQuery>) {
    assertDistrictVisible(p, districtId);
    await this.districtOr404(districtId);
    const count = await this.repo.findCount(
      { districtId, diseaseId: query.diseaseId, epiYear: query.year, epiWeek: query.week }, this.ctx.ds.manager,
    );
    return { count: count ? presentCount(count) : null };
  }

  // ---- revisions ----

  async revisions(actor: Principal, countId: string) {
    const count = await this.repo.findCountById(countId);
    if (!count) throw notFound('The count');
    // Line-level history of a district: admin and supervisor read all, an epidemiologist their own districts.
    assertAssigned(actor, count.districtId);
    return { count: presentCount(count), revisions: (await this.repo.revisions(count.id)).map(presentRevision) };
  }

  // ---- closing a week ----

  async closeWeek(actor: Principal, districtId: string, body: CloseWeekBody) {
    assertAssigned(actor, districtId);
    const today = this.today();
    return this.ctx.ds.transaction(async (manager) => {
      const district = await this.districtOr404(districtId, manager);
      const activeFrom = (await this.repo.activeFrom([district], manager)).get(district.id)!;
      const problem = weekProblem(body.year, body.week, this.system, today, activeFrom);
      if (problem) throw badRequest('invalid_week', `Week ${body.week} of ${body.year} ${problem.message}.`, [problem]);
      const ref = weekRef(body.year, body.week, this.system);
      if (ref.end >= today)
        throw badRequest('week_not_over', `Week ${body.week} of ${body.year} runs until ${ref.end}: close it once it is over.`, [
          { path: 'week', message: `has not ended yet (it runs until ${ref.end})` },
        ]);
      const existing = await manager.findOneBy(CaseWeekClosureEntity, { districtId, epiYear: body.year, epiWeek: body.week });
      if (existing)
        return { districtId, year: body.year, week: body.week, closedAt: existing.closedAt.toISOString(), alreadyClosed: true };
      const closedAt = new Date();
      await manager.insert(CaseWeekClosureEntity, { districtId, epiYear: body.year, epiWeek: body.week, closedAt, closedBy: actor.userId });
      await recordAudit(manager, {
        actorId: actor.userId, action: 'case-week.closed', entity: 'case_week', entityId: `${districtId}:${body.year}-${body.week}`,
        after: { districtId, year: body.year, week: body.week },
      });
      return { districtId, year: body.year, week: body.week, closedAt: closedAt.toISOString(), alreadyClosed: false };
    });
  }

  /**
   * Undoes a closing (the same roles that may close: the district's epidemiologist, a supervisor). The
   * week's counts are kept; only the lock goes, and the audit trail keeps who closed it, when, and why it
   * was reopened. A week that is not closed is answered with `reopened: false` and nothing is written.
   */
  async reopenWeek(actor: Principal, districtId: string, body: ReopenWeekBody) {
    assertAssigned(actor, districtId);
    return this.ctx.ds.transaction(async (manager) => {
      await this.districtOr404(districtId, manager);
      const existing = await manager.findOneBy(CaseWeekClosureEntity, { districtId, epiYear: body.year, epiWeek: body.week });
      if (!existing) return { districtId, year: body.year, week: body.week, reopened: false };
      await manager.delete(CaseWeekClosureEntity, { districtId, epiYear: body.year, epiWeek: body.week });
      await recordAudit(manager, {
        actorId: actor.userId, action: 'case-week.reopened', entity: 'case_week', entityId: `${districtId}:${body.year}-${body.week}`,
        before: { districtId, year: body.year, week: body.week, closedAt: existing.closedAt.toISOString(), closedBy: existing.closedBy },
        after: null, reason: body.reason,
      });
      return { districtId, year: body.year, week: body.week, reopened: true };
    });
  }

  // ---- epidemic years left out of the channel ----

  async setChannelSettings(actor: Principal, districtId: string, body: ChannelSettingsBody) {
    assertAssigned(actor, districtId);
    const years = [...new Set(body.excludedYears)].sort((a, b) => a - b);
    await this.ctx.ds.transaction(async (manager) => {
      await this.districtOr404(districtId, manager);
      await this.diseaseOr404(body.diseaseId, manager);
      const before = await manager.findOneBy(CaseChannelSettingEntity, { districtId, diseaseId: body.diseaseId });
      await manager.upsert(
        CaseChannelSettingEntity,
        { districtId, diseaseId: body.diseaseId, excludedYears: years, updatedAt: new Date(), updatedBy: actor.userId },
        ['districtId', 'diseaseId'],
      );
      await recordAudit(manager, {
        actorId: actor.userId, action: 'case-channel.settings-set', entity: 'case_channel_setting', entityId: `${districtId}:${body.diseaseId}`,
        before: before ? { excludedYears: before.excludedYears } : null, after: { excludedYears: years },
      });
    });
    return { districtId, diseaseId: body.diseaseId, excludedYears: years };
  }

  // ---- reading ----

  /** Completeness per district over the given weeks: reports due, received, and received on time. */
  private async completeness(districtIds: string[], weeks: { year: number; week: number }[], today: string) {
    const deadline = this.ctx.config.CASE_REPORT_DEADLINE_DAYS;
    const due = weeks.filter((w) => isDue(w.year, w.week, this.system, deadline, today));
    const out = new Map<string, ReturnType<typeof completenessOf>>();
    if (due.length === 0) {
      for (const id of districtIds) out.set(id, completenessOf(0, 0, 0));
      return out;
    }
    const keys = due.map((w) => weekKey(w.year, w.week));
    const rows = await this.repo.reportsBetween(districtIds, Math.min(...keys), Math.max(...keys));
    const dueKeys = new Set(keys);
    for (const id of districtIds) {
      const mine = rows.filter((r) => r.district_id === id && dueKeys.has(weekKey(r.epi_year, r.epi_week)));
      out.set(id, completenessOf(due.length, mine.length, mine.filter((r) => r.on_time).length));
    }
    return out;
  }

  async grid(p: Principal, query: z.infer<typeof gridQuery>) {
    const disease = await this.diseaseOr404(query.diseaseId);
    const today = this.today();
    const weeks = weeksEndingWith(currentWeek(this.system, today), query.weeks, this.system);
    const scopeIds = p.role === 'epidemiologist' && query.scope === 'mine' ? p.districtIds : seesAllDistricts(p) ? undefined : p.districtIds;
    const districts = await this.repo.districts(scopeIds);
    const ids = districts.map((d) => d.id);
    const fromKey = weekKey(weeks[0].year, weeks[0].week);
    const toKey = weekKey(weeks.at(-1)!.year, weeks.at(-1)!.week);
    const [counts, closures, completeness] = await Promise.all([
      this.repo.countsBetween(ids, disease.id, fromKey, toKey),
      this.repo.closuresBetween(ids, fromKey, toKey),
      this.completeness(ids, weeks, today),
    ]);
    const countAt = new Map(counts.map((c) => [`${c.districtId}:${weekKey(c.epiYear, c.epiWeek)}`, c]));
    const closedAt = new Set(closures.map((c) => `${c.districtId}:${weekKey(c.epiYear, c.epiWeek)}`));
    return {
      disease: presentDisease(disease),
      weeks,
      rows: districts.map((d) => ({
        district: { id: d.id, code: d.code, name: d.name },
        editable: mayIn(p.role, 'cases.enter', p.districtIds.includes(d.id)),
        completeness: completeness.get(d.id)!,
        cells: weeks.map((w) => {
          const key = `${d.id}:${weekKey(w.year, w.week)}`;
          const c = countAt.get(key);
          const closed = closedAt.has(key);
          const open = isOpenWeek(w.year, w.week, this.system, this.ctx.config.CASE_REPORT_DEADLINE_DAYS, today, closed);
          return { year: w.year, week: w.week, count: c ? presentCount(c) : null, closed, open };
        }),
      })),
    };
  }

  async signals(p: Principal, districtId: string, query: z.infer<typeof districtCasesQuery>) {
    assertDistrictVisible(p, districtId);
    const district = await this.districtOr404(districtId);
    const disease = await this.diseaseOr404(query.diseaseId);
    const today = this.today();
    const now = currentWeek(this.system, today);
    const year = query.year ?? now.year;
    if (year > now.year)
      throw badRequest('future_season', `The ${year} season has not started yet.`, [{ path: 'year', message: 'is in the future' }]);
    const n = weeksInYear(year, this.system);
    const lastWeek = year === now.year ? now.week : n;
    const firstYear = year - CHANNEL_LOOKBACK_YEARS;
    const [counts, closures, excludedYears, populations] = await Promise.all([
      this.repo.countsBetween([district.id], disease.id, weekKey(firstYear, 1), weekKey(year, 53)),
      this.repo.closuresBetween([district.id], weekKey(year, 1), weekKey(year, 53)),
      this.repo.excludedYears(district.id, disease.id),
      this.repo.populations(district.id),
    ]);
    const byYear = new Map<number, (number | null)[]>();
    const rowsThisYear = new Map<number, CaseCountEntity>();
    for (const c of counts) {
      if (c.voidedAt) {
        // A voided count keeps its row (and history link) but counts in no signal.
        if (c.epiYear === year) rowsThisYear.set(c.epiWeek, c);
        continue;
      }
      if (!byYear.has(c.epiYear)) byYear.set(c.epiYear, Array.from({ length: weeksInYear(c.epiYear, this.system) }, () => null));
      byYear.get(c.epiYear)![c.epiWeek - 1] = c.cases;
      if (c.epiYear === year) rowsThisYear.set(c.epiWeek, c);
    }
    const population =
      populations.find((x) => x.year === year)?.population ??
      [...populations].reverse().find((x) => x.year < year)?.population ??
      populations.find((x) => x.year > year)?.population ??
      null;
    const closed = new Set(closures.map((c) => c.epiWeek));
    const openFrom = firstOpenWeek(year, lastWeek, this.system, this.ctx.config.CASE_REPORT_DEADLINE_DAYS, today, closed);
    const result = buildSignals({
      year, lastWeek, weeksInTargetYear: n, counts: byYear, excludedYears, method: this.ctx.config.CHANNEL_METHOD,
      cusum: { k: this.ctx.config.CUSUM_K, h: this.ctx.config.CUSUM_H }, population, openFrom,
    });
    const seasonWeeks = Array.from({ length: lastWeek }, (_, i) => ({ year, week: i + 1 }));
    const completeness = (await this.completeness([district.id], seasonWeeks, today)).get(district.id)!;
    const priorYears = [...byYear.keys()].filter((y) => y < year).sort((a, b) => b - a).slice(0, 7).sort((a, b) => a - b);
    const notes = [...result.notes];
    if (population === null) notes.push({ code: 'no-population', params: {} });
    const assigned = p.districtIds.includes(district.id);
    return {
      district: { id: district.id, code: district.code, name: district.name },
      disease: presentDisease(disease),
      year,
      channelMethod: this.ctx.config.CHANNEL_METHOD,
      epiWeekSystem: this.system,
      priorSeasons: priorYears.map((y) => ({ year: y, weeks: Array.from({ length: n }, (_, i) => byYear.get(y)![i] ?? (i === 52 ? byYear.get(y)![51] ?? null : null)) })),
      seasonsUsed: result.seasonsUsed,
      excludedYears,
      population,
      fittedGrowth: result.fittedGrowth,
      lastCompleteWeek: result.lastCompleteWeek || null,
      deadlineDays: this.ctx.config.CASE_REPORT_DEADLINE_DAYS,
      completeness,
      notes,
      canEnter: mayIn(p.role, 'cases.enter', assigned),
      canReadHistory: mayIn(p.role, 'cases.readHistory', assigned),
      canClose: mayIn(p.role, 'cases.closeWeek', assigned),
      weeks: result.weeks.map((w) => {
        const row = rowsThisYear.get(w.week);
        return {
          ...w,
          start: weekRef(year, w.week, this.system).start,
          countId: row?.id ?? null,
          voided: row?.voidedAt != null,
          late: row?.late ?? false,
          closed: closed.has(w.week),
          deadline: deadlineOf(year, w.week, this.system, this.ctx.config.CASE_REPORT_DEADLINE_DAYS),
        };
      }),
    };
  }
}

