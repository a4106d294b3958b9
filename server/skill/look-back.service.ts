/**
 * The Look-back (docs/skill.md): replays past seasons district by district with only the data known on
 * each week's last day (server/skill/replay.ts), stores the replayed weeks apart from the live tiers,
 * and scores them against what happened (shared/skill/report.ts).
 */
import { epiWeekEnd, formatIsoDate, parseIsoDate, weeksInYear } from '../../shared/model';
import type { RunWarning } from '../../shared/api/problems.schema';
import type { LookBackScoresQuery, LookBackScoresResponse, SkillGroupDto, StartLookBackBody } from '../../shared/api/look-back.schema';
import { LOOK_BACK_LEADS } from '../../shared/api/look-back.schema';
import { skillReport, type DistrictSkillInput, type SeasonCounts } from '../../shared/skill';
import { tierRank, type Tier } from '../../shared/tier';
import { withAdvisoryLock } from '../platform/locks';
import type { AppContext } from '../app-context';
import { CHANNEL_LOOKBACK_YEARS } from '../cases/case-signals';
import { badRequest, conflict, notFound } from '../http/errors';
import { reasonOf } from '../http/problem-reason';
import { SeasonRepository, type DistrictForRun } from '../season/season.repository';
import { TierSettingsService } from '../season/tier-settings.service';
import { LookBackRepository, type LookBackDistrict } from './look-back.repository';
import { LookBackRunEntity } from './look-back-run.entity';
import { replayDistrict } from './replay';

export const LOOK_BACK_LOCK = 'look-back';
const PRIOR_SEASONS = 3; // the replay reads three seasons of weather before each season (as the season run)

const todayIn = (timeZone: string) => new Intl.DateTimeFormat('en-CA', { timeZone }).format(new Date());

export interface LookBackOptions extends StartLookBackBody {
  requestedBy: string | null;
  /** The last day that may be replayed; default today in the deployment's time zone. */
  today?: string;
  /** Only these districts (service-level, for tests and the demo check); default every district. */
  districtIds?: readonly string[];
  /** For fault-injection tests: a throw here is that district's failure, as bad data would be. */
  districtHook?: (districtId: string) => void;
}

export class LookBackService {
  private readonly repo: LookBackRepository;
  private readonly seasons: SeasonRepository;
  private readonly settings: TierSettingsService;

  constructor(private readonly ctx: AppContext) {
    this.repo = new LookBackRepository(ctx.ds);
    this.seasons = new SeasonRepository(ctx.ds);
    this.settings = new TierSettingsService(ctx.ds);
  }

  /** The epidemiological weeks of the span that have ended by `today`, in order. */
  weeksOf(fromYear: number, toYear: number, today: string): { year: number; week: number }[] {
    const system = this.ctx.config.EPI_WEEK_SYSTEM;
    const out: { year: number; week: number }[] = [];
    for (let year = fromYear; year <= toYear; year++)
      for (let week = 1; week <= weeksInYear(year, system); week++) if (epiWeekEnd(year, week, system) <= today) out.push({ year, week });
    return out;
  }

  /**
   * Start a Look-back: records the run, answers at once and goes on in the background under an
   * advisory lock (one Look-back at a time across processes; a second request gets 409).
   */
  async start(opts: LookBackOptions): Promise<LookBackRunEntity> {
    const today = opts.today ?? todayIn(this.ctx.config.TIMEZONE);
    if (this.weeksOf(opts.fromYear, opts.fromYear, today).length === 0)
      throw badRequest('look_back_future', 'The Look-back replays past seasons only.', [{ path: 'fromYear', message: 'has no finished week yet' }]);
    let resolveStarted!: (run: LookBackRunEntity) => void;
    let rejectStarted!: (err: unknown) => void;
    const started = new Promise<LookBackRunEntity>((res, rej) => { resolveStarted = res; rejectStarted = rej; });
    void withAdvisoryLock(this.ctx.ds, LOOK_BACK_LOCK, async () => {
      const run = await this.begin(opts);
      resolveStarted({ ...run });
      await this.execute(run, { ...opts, today });
    })
      .then(({ ran }) => { if (!ran) rejectStarted(conflict('look_back_in_progress', 'A Look-back is already in progress.')); })
      .catch((err) => { rejectStarted(err); this.ctx.logger.error({ err: (err as Error).message }, 'look-back failed'); });
    return started;
  }

  /** For tests: run a Look-back now under the lock and wait for it (null when another holds the lock). */
  async runNow(opts: LookBackOptions): Promise<LookBackRunEntity | null> {
    const today = opts.today ?? todayIn(this.ctx.config.TIMEZONE);
    const { ran, result } = await withAdvisoryLock(this.ctx.ds, LOOK_BACK_LOCK, async () => this.execute(await this.begin(opts), { ...opts, today }));
    return ran ? result! : null;
  }

  async list(limit = 50) {
    return this.ctx.ds.getRepository(LookBackRunEntity).find({ order: { startedAt: 'DESC' }, take: limit });
  }

  async get(id: string) {
    const run = await this.ctx.ds.getRepository(LookBackRunEntity).findOneBy({ id });
    if (!run) throw notFound('The Look-back');
    return run;
  }

  /** Record the run (the lock is held). Any other run still marked running died with its process. */
  private async begin(opts: LookBackOptions): Promise<LookBackRunEntity> {
    const runs = this.ctx.ds.getRepository(LookBackRunEntity);
    await new LookBackRepository(this.ctx.ds).failInterruptedRuns();
    return runs.save(runs.create({
      fromYear: opts.fromYear, toYear: opts.toYear, status: 'running', requestedBy: opts.requestedBy, startedAt: new Date(), finishedAt: null,
      districtsTotal: 0, districtsDone: 0, weeksWritten: 0, warnings: [], error: null,
    }));
  }

  private async execute(run: LookBackRunEntity, opts: LookBackOptions & { today: string }): Promise<LookBackRunEntity> {
    const runs = this.ctx.ds.getRepository(LookBackRunEntity);
    const config = this.ctx.config;
    try {
      // Today's tier settings: the replay shows what the current rule would have said then (docs/skill.md).
      const { settings } = await this.settings.current();
      const weeks = this.weeksOf(run.fromYear, run.toYear, opts.today);
      const lastAsOf = epiWeekEnd(weeks.at(-1)!.year, weeks.at(-1)!.week, config.EPI_WEEK_SYSTEM);
      const firstAsOf = epiWeekEnd(weeks[0]!.year, weeks[0]!.week, config.EPI_WEEK_SYSTEM);
      const weatherFrom = `${Number(firstAsOf.slice(0, 4)) - PRIOR_SEASONS}-01-01`;
      const casesFrom = Number(firstAsOf.slice(0, 4)) - CHANNEL_LOOKBACK_YEARS;
      const surveysFrom = formatIsoDate(parseIsoDate(firstAsOf) - 28);
      const districts = (await this.seasons.districts()).filter((d) => !opts.districtIds || opts.districtIds.includes(d.id));
      run.districtsTotal = districts.length;
      await runs.update(run.id, { districtsTotal: run.districtsTotal });
      for (const district of districts) {
        // One district's bad data is that district's failure, recorded as a warning; the others go on.
        try {
          opts.districtHook?.(district.id);
          const [weather, caseRevisions, surveys, excludedYears] = await Promise.all([
            this.repo.weatherDays(district.id, weatherFrom, lastAsOf),
            this.repo.caseRevisions(district.id, casesFrom),
            this.seasons.surveys([district.id], surveysFrom, lastAsOf),
            this.seasons.excludedYears([district.id]),
          ]);
          const replayed = replayDistrict({
            district, weeks, weather, caseRevisions, surveys, excludedYears, settings, epiSystem: config.EPI_WEEK_SYSTEM,
            channelMethod: config.CHANNEL_METHOD, cusum: { k: config.CUSUM_K, h: config.CUSUM_H },
          });
          run.weeksWritten += await this.repo.replaceWeeks(run.id, district.id, replayed);
        } catch (err) {
          this.districtFailed(run, district, err);
        }
        run.districtsDone += 1;
        await runs.update(run.id, { districtsDone: run.districtsDone, weeksWritten: run.weeksWritten, warnings: capWarnings(run.warnings) });
      }
      run.status = 'succeeded';
      run.finishedAt = new Date();
      run.warnings = capWarnings(run.warnings);
      await runs.update(run.id, { status: run.status, finishedAt: run.finishedAt, warnings: run.warnings });
      this.ctx.logger.info({ run: run.id, done: run.districtsDone, weeks: run.weeksWritten, failed: failedCount(run.warnings) }, 'look-back finished');
      return run;
    } catch (err) {
      run.status = 'failed';
      run.finishedAt = new Date();
      run.error = reasonOf(err).code;
      run.warnings = capWarnings(run.warnings);
      await runs.update(run.id, { status: 'failed', finishedAt: run.finishedAt, error: run.error, warnings: run.warnings }).catch(() => undefined);
      this.ctx.logger.error({ run: run.id, err: (err as Error).message }, 'look-back failed');
      return run;
    }
  }

  private districtFailed(run: LookBackRunEntity, district: DistrictForRun, err: unknown) {
    const reason = reasonOf(err);
    run.warnings.push({ code: 'district_failed', districtId: district.id, districtName: district.name, params: { stage: 'replay' }, reason });
    this.ctx.logger.warn({ run: run.id, district: district.code, reason, err: (err as Error)?.message }, 'look-back: district failed, others go on');
  }

  /**
   * The scores of a run: the replayed tier (a warning from `warnAt` up) against events `lead` weeks
   * later, beside the null models on the same weeks, overall, by region or by district.
   */
  async scores(runId: string, q: LookBackScoresQuery): Promise<LookBackScoresResponse> {
    await this.get(runId);
    let districts = await this.repo.runDistricts(runId);
    if (q.districtId) {
      districts = districts.filter((d) => d.id === q.districtId);
      if (districts.length === 0) throw notFound('The district in this Look-back');
    }
    const ids = districts.map((d) => d.id);
    const [weeks, cases] = await Promise.all([this.repo.weeks(runId, ids), this.repo.weekCases(ids)]);
    const inputs = new Map<string, DistrictSkillInput>(districts.map((d) => [d.id, skillInput(d.id, cases.filter((c) => c.districtId === d.id), weeks.filter((w) => w.districtId === d.id))]));
    const leads = q.lead ? [q.lead] : [...LOOK_BACK_LEADS];
    const event = { method: this.ctx.config.CHANNEL_METHOD, line: 'upper' as const };
    const options = { leads, level: tierRank(q.warnAt), event };
    const groups: SkillGroupDto[] = [];
    if (q.level === 'district') {
      const report = skillReport([...inputs.values()], options);
      for (const d of districts) {
        const r = report.districts.find((x) => x.district === d.id)!;
        groups.push({ level: 'district', id: d.id, name: d.name, districts: 1, leads: r.leads, leadTimes: r.leadTimes });
      }
    } else {
      const byGroup = new Map<string | null, LookBackDistrict[]>();
      for (const d of districts) {
        const key = q.level === 'region' ? d.regionId : null;
        byGroup.set(key, [...(byGroup.get(key) ?? []), d]);
      }
      for (const [key, members] of byGroup) {
        const report = skillReport(members.map((d) => inputs.get(d.id)!), options);
        groups.push({
          level: q.level, id: key, name: q.level === 'region' ? (members[0]!.regionName ?? null) : null, districts: members.length,
          leads: report.overall, leadTimes: report.leadTimes,
        });
      }
      if (groups.length === 0 && q.level === 'overall') {
        const report = skillReport([], options);
        groups.push({ level: 'overall', id: null, name: null, districts: 0, leads: report.overall, leadTimes: [] });
      }
    }
    return { runId, warnAt: q.warnAt, event, groups };
  }
}

/**
 * One district's input to the pure report: seasons are epidemiological years (week w at index w − 1,
 * 53 slots; a week without a count is null), every year with counts or replayed weeks, so the event
 * threshold of a season is built from all its other seasons (leave-one-season-out).
 */
function skillInput(
  districtId: string,
  cases: readonly { epiYear: number; epiWeek: number; cases: number }[],
  weeks: readonly { epiYear: number; epiWeek: number; tier: string }[],
): DistrictSkillInput {
  const years = [...new Set([...cases.map((c) => c.epiYear), ...weeks.map((w) => w.epiYear)])].sort((a, b) => a - b);
  const seasons: SeasonCounts[] = years.map((y) => {
    const counts: (number | null)[] = Array.from({ length: 53 }, () => null);
    for (const c of cases) if (c.epiYear === y) counts[c.epiWeek - 1] = c.cases;
    return { season: String(y), counts };
  });
  const tierRanks = new Map<string, (number | null)[]>();
  for (const w of weeks) {
    const key = String(w.epiYear);
    if (!tierRanks.has(key)) tierRanks.set(key, Array.from({ length: 53 }, () => null));
    tierRanks.get(key)![w.epiWeek - 1] = tierRank(w.tier as Tier);
  }
  return { district: districtId, seasons, tierRanks };
}

/** At most 1,000 warnings are kept; failed districts first, so none of them is ever cut. */
function capWarnings(warnings: RunWarning[]): RunWarning[] {
  if (warnings.length <= 1000) return warnings;
  return [...warnings.filter((w) => w.code === 'district_failed'), ...warnings.filter((w) => w.code !== 'district_failed')].slice(0, 1000);
}

export const failedCount = (warnings: RunWarning[]) => warnings.filter((w) => w.code === 'district_failed').length;
