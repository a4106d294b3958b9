import { epiWeek, epiWeekEnd, formatIsoDate, parseIsoDate } from '../../shared/model';
import type { AppContext } from '../app-context';
import { conflict, notFound } from '../http/errors';
import { withAdvisoryLock } from '../../jobs/advisory-lock';
import { computeDistrictSeason, type DistrictSeasonResult } from './district-season';
import { DistrictRunStateEntity } from './district-run-state.entity';
import { DistrictTierEntity } from './district-tier.entity';
import { type DistrictForRun, SeasonRepository, weatherByYear } from './season.repository';
import { SeasonRunEntity } from './season-run.entity';
import { TierSettingsService } from './tier-settings.service';
import { CHANNEL_LOOKBACK_YEARS } from '../cases/case-signals';
import { changedDriver, tierRank } from '../../shared/tier';
import { raiseSeasonFlags } from '../flags/flags.service';
import type { RunWarning } from '../../shared/api/problems.schema';
import { reasonOf } from '../http/problem-reason';

export const SEASON_RUN_LOCK = 'season-run';
const BATCH = 25;

type PreviousTier = { district_id: string; tier: string; score: number; drivers: unknown };
const PRIOR_SEASONS = 3;

const todayIn = (timeZone: string) => new Intl.DateTimeFormat('en-CA', { timeZone }).format(new Date());

export interface RunOptions {
  kind: 'nightly' | 'manual';
  full?: boolean;
  requestedBy?: string | null;
  /** The day to compute up to; default today in the deployment's time zone. */
  asOf?: string;
  /** For drills: stop with an error after this many districts. */
  failAfter?: number;
  /**
   * For fault-injection tests: called before each district is computed ('compute') and before its
   * results are written ('write'); a throw there is that district's failure, as a fault in its data would be.
   */
  districtHook?: (stage: 'compute' | 'write', districtId: string) => void;
  /** For tests: keep at most this many warnings instead of WARNINGS_KEPT. */
  warningCap?: number;
}

/** At most this many warnings are stored with a run; the rest are counted (`warningsTotal`). */
export const WARNINGS_KEPT = 1000;

type Computed = { district: DistrictForRun; result: DistrictSeasonResult; before: PreviousTier | undefined };

/**
 * The season run: for every district and profile, the vector clock from the biofix to today, then the
 * week's tier. Incremental by default (districts whose input fingerprint changed); each district's
 * results are replaced in one transaction; a run that dies is marked failed by the next one, which
 * then does the districts the dead run left undone (their fingerprints were never written).
 */
export class SeasonRunService {
  private readonly repo: SeasonRepository;
  private readonly settings: TierSettingsService;

  constructor(private readonly ctx: AppContext) {
    this.repo = new SeasonRepository(ctx.ds);
    this.settings = new TierSettingsService(ctx.ds);
  }

  /** Run now under the advisory lock; returns the finished run, or null when another process holds the lock. */
  async runLocked(opts: RunOptions): Promise<SeasonRunEntity | null> {
    const { ran, result } = await withAdvisoryLock(this.ctx.ds, SEASON_RUN_LOCK, async () => {
      const run = await this.begin(opts);
      return this.execute(run, opts);
    });
    return ran ? result! : null;
  }

  /**
   * Start a run for the API: takes the lock, records the run, answers at once and goes on in the
   * background. A second request while one runs gets 409.
   */
  async start(opts: RunOptions): Promise<SeasonRunEntity> {
    let resolveStarted!: (run: SeasonRunEntity) => void;
    let rejectStarted!: (err: unknown) => void;
    const started = new Promise<SeasonRunEntity>((res, rej) => { resolveStarted = res; rejectStarted = rej; });
    void withAdvisoryLock(this.ctx.ds, SEASON_RUN_LOCK, async () => {
      const run = await this.begin(opts);
      resolveStarted({ ...run });
      await this.execute(run, opts);
    })
      .then(({ ran }) => { if (!ran) rejectStarted(conflict('run_in_progress', 'A season run is already in progress.')); })
      .catch((err) => { rejectStarted(err); this.ctx.logger.error({ err: (err as Error).message }, 'season run failed'); });
    return started;
  }

  async list(limit = 50) {
    return this.ctx.ds.getRepository(SeasonRunEntity).find({ order: { startedAt: 'DESC' }, take: limit });
  }

  async get(id: string) {
    const run = await this.ctx.ds.getRepository(SeasonRunEntity).findOneBy({ id });
    if (!run) throw notFound('The season run');
    return run;
  }

  /** Record the run (the lock is held). Any other run still marked running died with its process. */
  private async begin(opts: RunOptions): Promise<SeasonRunEntity> {
    const runs = this.ctx.ds.getRepository(SeasonRunEntity);
    await this.ctx.ds.query(
      `UPDATE season_runs SET status = 'failed', finished_at = now(),
              error = coalesce(error, 'interrupted')
        WHERE status = 'running'`,
    );
    return runs.save(runs.create({
      kind: opts.kind, full: opts.full ?? false, status: 'running', requestedBy: opts.requestedBy ?? null,
      startedAt: new Date(), finishedAt: null, asOf: opts.asOf ?? todayIn(this.ctx.config.TIMEZONE),
      districtsTotal: 0, districtsDone: 0, districtsSkipped: 0, rowsWritten: 0, warnings: [], warningsTotal: 0, error: null,
    }));
  }

  private async execute(run: SeasonRunEntity, opts: RunOptions): Promise<SeasonRunEntity> {
    const runs = this.ctx.ds.getRepository(SeasonRunEntity);
    const cap = opts.warningCap ?? WARNINGS_KEPT;
    try {
      const { settings } = await this.settings.current();
      const asOf = run.asOf;
      const seasonYear = Number(asOf.slice(0, 4));
      const seasonStart = `${seasonYear}-01-01`;
      const week = epiWeek(asOf, this.ctx.config.EPI_WEEK_SYSTEM);
      const caseFromYear = seasonYear - CHANNEL_LOOKBACK_YEARS;
      const districts = await this.repo.districts();
      const fingerprints = await this.repo.fingerprints(seasonStart, asOf, caseFromYear);
      const states = await this.repo.runStates();
      const todo = run.full
        ? districts
        : districts.filter((d) => {
            const s = states.get(d.id);
            return !s || s.asOf !== asOf || s.fingerprint !== fingerprints.get(d.id);
          });
      // Held weather (implausible values waiting for a person) is left out of the series: say so on the run.
      // Never a reason for the run to fail.
      try {
        const held = await this.repo.heldWeather(seasonStart, asOf);
        if (held.count > 0)
          run.warnings.push({
            code: 'weather_held',
            params: { count: held.count, stations: held.stations.slice(0, 10).join(', ') + (held.stations.length > 10 ? ', …' : '') },
          });
      } catch (err) {
        this.ctx.logger.warn({ run: run.id, err: (err as Error).message }, 'season run: could not count held weather');
      }
      run.districtsTotal = todo.length;
      run.districtsSkipped = districts.length - todo.length;
      await runs.update(run.id, { districtsTotal: run.districtsTotal, districtsSkipped: run.districtsSkipped });

      // Pipelined: while a batch's transaction is in PostgreSQL, the next batch is read and computed
      // (on two cores the model and the database work at the same time). At most one write is in flight.
      let inflight: Promise<void> | null = null;
      let computed = 0;
      let stop: Error | null = null;
      for (let i = 0; i < todo.length && !stop; i += BATCH) {
        const batch = todo.slice(i, i + BATCH);
        const ids = batch.map((d) => d.id);
        const [weather, prior, cases, excluded, surveys, previous, closed] = await Promise.all([
          this.repo.weather(ids, seasonStart, asOf),
          this.repo.weather(ids, `${seasonYear - PRIOR_SEASONS}-01-01`, `${seasonYear - 1}-12-31`),
          this.repo.cases(ids, caseFromYear),
          this.repo.excludedYears(ids),
          this.repo.surveys(ids, isoMinusDays(asOf, 28), asOf),
          this.repo.previousTiers(ids, week.year, week.week),
          this.repo.closedWeeks(ids, seasonYear - 1, asOf, this.ctx.config.TIMEZONE),
        ]);
        const casesOf = groupBy(cases, (c) => c.districtId);
        const surveysOf = groupBy(surveys, (s) => s.districtId);
        const results: Computed[] = [];
        for (const district of batch) {
          if (opts.failAfter !== undefined && computed >= opts.failAfter) {
            stop = new DrillStop();
            break;
          }
          computed++;
          // One district's bad data (a value the model refuses, an unknown profile) is that district's
          // failure, recorded as a warning; the others go on (issue 14, "isolation").
          try {
            opts.districtHook?.('compute', district.id);
            const result = computeDistrictSeason({
              district, asOf, seasonYear, weather: weather.get(district.id)!, priorWeather: weatherByYear(prior.get(district.id)!),
              cases: casesOf.get(district.id) ?? [], excludedYears: excluded,
              closedWeeks: closed.get(district.id) ?? new Set(), deadlineDays: this.ctx.config.CASE_REPORT_DEADLINE_DAYS,
              surveys: surveysOf.get(district.id) ?? [], settings,
              epiSystem: this.ctx.config.EPI_WEEK_SYSTEM, channelMethod: this.ctx.config.CHANNEL_METHOD,
              cusum: { k: this.ctx.config.CUSUM_K, h: this.ctx.config.CUSUM_H },
            });
            results.push({ district, result, before: previous.get(district.id) });
          } catch (err) {
            this.districtFailed(run, district, 'compute', err);
          }
        }
        if (inflight) await inflight;
        if (results.length === 0) {
          if (stop) break;
          continue;
        }
        inflight = this.writeIsolated(run, { seasonYear, asOf, week, fingerprints }, results, opts).then(async () => {
          await runs.update(run.id, { districtsDone: run.districtsDone, rowsWritten: run.rowsWritten, warnings: capWarnings(run.warnings, cap), warningsTotal: run.warnings.length });
        });
        // A failed write is reported by the next await; keep Node from calling it unhandled meanwhile.
        inflight.catch(() => undefined);
      }
      if (inflight) await inflight;
      if (stop) throw stop;
      run.status = 'succeeded';
      run.finishedAt = new Date();
      run.warningsTotal = run.warnings.length;
      run.warnings = capWarnings(run.warnings, cap);
      await runs.update(run.id, { status: run.status, finishedAt: run.finishedAt, warnings: run.warnings, warningsTotal: run.warningsTotal });
      this.ctx.logger.info({ run: run.id, done: run.districtsDone, failed: failedCount(run.warnings), skipped: run.districtsSkipped, rows: run.rowsWritten }, 'season run finished');
      return run;
    } catch (err) {
      run.status = 'failed';
      run.finishedAt = new Date();
      // A code the screen words (the English text stays in the log).
      run.error = err instanceof DrillStop ? 'drill_stopped' : reasonOf(err).code;
      run.warningsTotal = run.warnings.length;
      run.warnings = capWarnings(run.warnings, cap);
      await runs.update(run.id, {
        status: 'failed', finishedAt: run.finishedAt, error: run.error, districtsDone: run.districtsDone,
        rowsWritten: run.rowsWritten, warnings: run.warnings, warningsTotal: run.warningsTotal,
      }).catch(() => undefined);
      this.ctx.logger.error({ run: run.id, err: (err as Error).message }, 'season run failed');
      return run;
    }
  }

  /** Record one district's failure on the run (a code and parameters) and log the full error. */
  private districtFailed(run: SeasonRunEntity, district: DistrictForRun, stage: 'compute' | 'write', err: unknown) {
    const reason = reasonOf(err);
    run.warnings.push({ code: 'district_failed', districtId: district.id, districtName: district.name, params: { stage }, reason });
    this.ctx.logger.warn({ run: run.id, district: district.code, stage, reason, err: (err as Error)?.message }, 'season run: district failed, others go on');
  }

  /**
   * Write a batch; when its transaction fails, write its districts one by one so that only the
   * district whose results PostgreSQL refuses is left out (its old results and fingerprint stay, so
   * the next run tries it again).
   */
  private async writeIsolated(
    run: SeasonRunEntity, at: Parameters<SeasonRunService['writeBatch']>[1], results: Computed[], opts: RunOptions,
  ): Promise<void> {
    const ok: Computed[] = [];
    for (const r of results) {
      try {
        opts.districtHook?.('write', r.district.id);
        ok.push(r);
      } catch (err) {
        this.districtFailed(run, r.district, 'write', err);
      }
    }
    if (ok.length === 0) return;
    try {
      await this.writeBatch(run, at, ok);
    } catch (err) {
      if (ok.length === 1) return this.districtFailed(run, ok[0].district, 'write', err);
      for (const r of ok) {
        try {
          await this.writeBatch(run, at, [r]);
        } catch (e) {
          this.districtFailed(run, r.district, 'write', e);
        }
      }
    }
  }

  /**
   * One transaction per batch: each district's stored season (all profiles), its tier and its
   * fingerprint land together with the batch's others — a district is never half-written, and a
   * failure leaves the whole batch's old results and fingerprints in place for the next run.
   */
  private async writeBatch(
    run: SeasonRunEntity,
    at: { seasonYear: number; asOf: string; week: { year: number; week: number }; fingerprints: Map<string, string> },
    results: Computed[],
  ): Promise<void> {
    const written = await this.ctx.ds.transaction(async (manager) => {
      // Derived data, recomputable: the commit need not wait for the WAL flush. Atomicity is
      // unchanged; a crash can only lose the newest commits, whose fingerprints go with them,
      // so the next run redoes those districts.
      await manager.query('SET LOCAL synchronous_commit = off');
      const n = await this.repo.replaceVectorClock(manager, at.seasonYear, results.map((r) => ({ districtId: r.district.id, series: r.result.series })));
      const computedAt = new Date();
      await manager.upsert(DistrictTierEntity, results.map(({ district, result, before }) => ({
        districtId: district.id, epiYear: at.week.year, epiWeek: at.week.week, runId: run.id, computedAt, asOf: at.asOf,
        score: result.tier.score, tier: result.tier.tier, tierLow: minTier(result.tierLow.tier, result.tierHigh.tier),
        tierHigh: maxTier(result.tierLow.tier, result.tierHigh.tier), confidence: result.tier.confidence,
        drivers: result.tier.drivers, notes: result.tier.notes, leadingDriver: result.tier.leadingDriver,
        changedDriver: changedDriver(result.tier.drivers, (before?.drivers as never) ?? null),
        profileId: result.profileId, casesThisWeek: result.casesThisWeek, channelZone: result.channelZone,
        casesEpiYear: result.casesWeek?.year ?? null, casesEpiWeek: result.casesWeek?.week ?? null, casesDiseaseIds: result.casesDiseaseIds,
        latestWeather: result.latestWeather,
      })), ['districtId', 'epiYear', 'epiWeek']);
      for (const { district, result, before } of results) {
        await raiseSeasonFlags(manager, {
          runId: run.id, districtId: district.id, epiYear: at.week.year, epiWeek: at.week.week, tier: result.tier,
          previousTier: before?.tier ?? null, previousDrivers: (before?.drivers as never) ?? null, channelZone: result.channelZone,
        });
      }
      await manager.upsert(DistrictRunStateEntity, results.map(({ district }) => ({
        districtId: district.id, seasonYear: at.seasonYear, asOf: at.asOf, fingerprint: at.fingerprints.get(district.id) ?? '', runId: run.id,
      })), ['districtId']);
      return n;
    });
    run.districtsDone += results.length;
    run.rowsWritten += written;
    for (const { district, result } of results) {
      run.warnings.push(...result.warnings.map((w) => ({ ...w, districtId: district.id, districtName: district.name })));
    }
  }
}

class DrillStop extends Error {
  constructor() {
    super('drill: stopped part-way');
  }
}

/**
 * At most `cap` warnings are kept, failed districts first (so none is cut unless more than `cap`
 * districts failed). The run keeps the total, and the Season runs screen says how many were not listed.
 */
function capWarnings(warnings: RunWarning[], cap: number): RunWarning[] {
  if (warnings.length <= cap) return warnings;
  return [...warnings.filter((w) => w.code === 'district_failed'), ...warnings.filter((w) => w.code !== 'district_failed')].slice(0, cap);
}

export const failedCount = (warnings: RunWarning[]) => warnings.filter((w) => w.code === 'district_failed').length;

const minTier = (a: string, b: string) => (tierRank(a as never) <= tierRank(b as never) ? a : b);
const maxTier = (a: string, b: string) => (tierRank(a as never) >= tierRank(b as never) ? a : b);
const isoMinusDays = (iso: string, days: number) => formatIsoDate(parseIsoDate(iso) - days);
function groupBy<T>(xs: T[], key: (x: T) => string): Map<string, T[]> {
  const out = new Map<string, T[]>();
  for (const x of xs) {
    const k = key(x);
    const list = out.get(k);
    if (list) list.push(x);
    else out.set(k, [x]);
  }
  return out;
}

/**
 * At start: when no tier exists yet (a fresh installation), compute the tiers of the last `weeks`
 * epidemiological weeks first (each as of its last day), so the Ladder has a "since last week" and the
 * District file a tier history; then the usual incremental run for today.
 */
export async function startupRuns(ctx: AppContext, weeks = 8) {
  const service = new SeasonRunService(ctx);
  const [{ n }] = await ctx.ds.query('SELECT count(*)::int AS n FROM district_tiers');
  if (n === 0) {
    const today = todayIn(ctx.config.TIMEZONE);
    for (let k = weeks; k >= 1; k--) {
      const w = epiWeek(isoMinusDays(today, 7 * k), ctx.config.EPI_WEEK_SYSTEM);
      await service.runLocked({ kind: 'manual', full: true, asOf: epiWeekEnd(w.year, w.week, ctx.config.EPI_WEEK_SYSTEM) });
    }
  }
  return service.runLocked({ kind: 'manual' });
}

/** For tests and the demo: one full run now, waiting for it. */
export function runSeasonNow(ctx: AppContext, opts: Partial<RunOptions> = {}) {
  return new SeasonRunService(ctx).runLocked({ kind: 'manual', full: true, ...opts });
}
