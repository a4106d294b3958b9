/**
 * The Case outlook of a district (docs/outlook.md): gathers the weekly series (counts, and the weekly
 * vector clock and rain that drive it), runs the pure model (shared/outlook) and presents it. Computed on
 * demand and kept in memory per district, disease and week, keyed by a fingerprint of the district's counts,
 * weather and profiles, so a correction or a new weather day makes a new outlook.
 */
import type { DistrictOutlookResponse, OutlookQuery } from '../../shared/api/outlook.schema';
import { computeSeasonColumns, epiWeek, epiWeekEnd, epiWeekStart, findProfile, formatIsoDate, getProfile, parseIsoDate, weeksInYear } from '../../shared/model';
import { districtOutlook, type DistrictOutlook, type OutlookWeek } from '../../shared/outlook';
import type { AppContext } from '../app-context';
import { assertDistrictVisible, type Principal } from '../auth/principal';
import { todayIn } from '../cases/case-weeks';
import { badRequest, notFound } from '../http/errors';
import { SeasonRepository } from '../season/season.repository';
import { OutlookRepository } from './outlook.repository';

/** Seasons of counts the outlook reads at most (the oldest first week it fits on). */
export const OUTLOOK_SEASONS = 10;
const CACHE_MAX = 500;
const RECENT_WEEKS = 16;

export class OutlookService {
  private readonly repo: OutlookRepository;
  private readonly seasons: SeasonRepository;
  private readonly cache = new Map<string, { model: DistrictOutlook; profileId: string | null; series: OutlookWeek[] }>();

  constructor(private readonly ctx: AppContext) {
    this.repo = new OutlookRepository(ctx.ds);
    this.seasons = new SeasonRepository(ctx.ds);
  }

  async outlook(p: Principal, districtId: string, q: OutlookQuery, today = todayIn(this.ctx.config.TIMEZONE)): Promise<DistrictOutlookResponse> {
    assertDistrictVisible(p, districtId);
    const district = await this.repo.district(districtId);
    if (!district) throw notFound('The district');
    const withCounts = await this.repo.diseasesWithCounts(districtId);
    const diseases = withCounts.map((d) => ({ id: d.id, name: d.name }));
    let disease = q.disease ? await this.repo.disease(q.disease) : withCounts[0];
    if (q.disease && !disease) throw badRequest('unknown_disease', 'The disease was not found.', [{ path: 'disease', message: 'is not a known disease' }]);
    const computedAt = new Date().toISOString();
    const empty = { districtId, diseases, origin: null, fanHorizons: 0, forecast: [], recent: [], skill: null, model: null, computedAt };
    if (!disease) return { ...empty, disease: null, status: 'no_cases' };
    disease = { id: disease.id, name: disease.name, profileIds: disease.profileIds };
    const system = this.ctx.config.EPI_WEEK_SYSTEM;
    // The last finished week: a week not yet over has a partial count and is never an origin.
    let last: { year: number; week: number } = epiWeek(today, system);
    if (epiWeekEnd(last.year, last.week, system) > today) last = previousWeek(last, system);
    const fingerprint = await this.repo.fingerprint(districtId, disease.id);
    const key = `${districtId}|${disease.id}|${last.year}-${last.week}|${fingerprint}`;
    let entry = this.cache.get(key);
    if (!entry) {
      try {
        entry = await this.compute(districtId, district.lat, disease, last);
      } catch (err) {
        // One district's failed fit is a warning, never a failure of the page or of other districts.
        this.ctx.logger.warn({ district: districtId, disease: disease.id, err: (err as Error).message }, 'outlook: fit failed');
        return { ...empty, disease: { id: disease.id, name: disease.name }, status: 'failed' };
      }
      if (this.cache.size >= CACHE_MAX) this.cache.delete(this.cache.keys().next().value!);
      this.cache.set(key, entry);
    }
    return present(districtId, { id: disease.id, name: disease.name }, diseases, entry, system, computedAt);
  }

  /** The weekly series and the model, from stored counts and weather. */
  private async compute(districtId: string, lat: number | null, disease: { id: string; profileIds: string[] }, last: { year: number; week: number }) {
    const system = this.ctx.config.EPI_WEEK_SYSTEM;
    const counts = await this.repo.counts(districtId, disease.id, last.year - OUTLOOK_SEASONS + 1);
    if (counts.length === 0) return { model: districtOutlook([]), profileId: null, series: [] };
    const firstYear = counts[0].year;
    const weeks: { year: number; week: number; n: number }[] = [];
    for (let y = firstYear; y <= last.year; y++) {
      const n = weeksInYear(y, system);
      for (let w = 1; w <= n && (y < last.year || w <= last.week); w++) weeks.push({ year: y, week: w, n });
    }
    const byWeek = new Map(counts.map((c) => [`${c.year}-${c.week}`, c.cases]));
    const from = epiWeekStart(weeks[0].year, weeks[0].week, system);
    const to = epiWeekEnd(last.year, last.week, system);
    const start = parseIsoDate(from);
    const days = parseIsoDate(to) - start + 1;
    const rvc = new Float64Array(days).fill(Number.NaN);
    const eip = new Float64Array(days).fill(Number.NaN);
    const rain = new Float64Array(days).fill(Number.NaN);
    for (const r of await this.repo.rain(districtId, from, to)) if (r.rain !== null) rain[parseIsoDate(r.date) - start] = r.rain;
    // The vector clock of the disease's vector (a profile of the disease assigned to the district, else the
    // district's first profile), computed from stored weather year by year as the season run does.
    const profiles = (await this.repo.profiles(districtId)).filter((x) => findProfile(x.profileId));
    const chosen = profiles.find((x) => disease.profileIds.includes(x.profileId)) ?? profiles[0] ?? null;
    if (chosen && lat !== null) {
      for (let y = Number(from.slice(0, 4)); y <= Number(to.slice(0, 4)); y++) {
        const weather = (await this.seasons.weather([districtId], `${y}-01-01`, `${y}-12-31`)).get(districtId);
        if (!weather || weather.rows === 0) continue;
        const c = computeSeasonColumns(getProfile(chosen.profileId), { lat, biofix: chosen.biofix ? `${y}-${chosen.biofix}` : undefined }, weather);
        const off = parseIsoDate(`${y}-01-01`) - start;
        for (let i = 0; i < c.length; i++) {
          const d = off + i;
          if (d < 0 || d >= days) continue;
          rvc[d] = c.relativeVectorialCapacity[i];
          eip[d] = c.eipShareInLifetime[i];
        }
      }
    }
    const series: OutlookWeek[] = weeks.map((w) => {
      const s = parseIsoDate(epiWeekStart(w.year, w.week, system)) - start;
      return {
        year: w.year, week: w.week, weeksInYear: w.n, cases: byWeek.get(`${w.year}-${w.week}`) ?? null,
        rvc: weekMean(rvc, s), eipShare: weekMean(eip, s), rain: weekSum(rain, s),
      };
    });
    return { model: districtOutlook(series), profileId: chosen?.profileId ?? null, series };
  }
}

/** Mean of a week's known days (at least 4 of 7), else null. */
function weekMean(a: Float64Array, s: number): number | null {
  let sum = 0;
  let n = 0;
  for (let i = s; i < s + 7; i++) if (i >= 0 && i < a.length && Number.isFinite(a[i])) { sum += a[i]; n++; }
  return n >= 4 ? sum / n : null;
}

/** A week's rain: the sum over its known days scaled to 7 days (at least 5 of 7 known), else null. */
function weekSum(a: Float64Array, s: number): number | null {
  let sum = 0;
  let n = 0;
  for (let i = s; i < s + 7; i++) if (i >= 0 && i < a.length && Number.isFinite(a[i])) { sum += a[i]; n++; }
  return n >= 5 ? (sum * 7) / n : null;
}

function previousWeek(w: { year: number; week: number }, system: 'mmwr' | 'iso') {
  return w.week > 1 ? { year: w.year, week: w.week - 1 } : { year: w.year - 1, week: weeksInYear(w.year - 1, system) };
}

function weekRef(year: number, week: number, system: 'mmwr' | 'iso') {
  const weekStart = epiWeekStart(year, week, system);
  return { year, week, weekStart, weekEnd: formatIsoDate(parseIsoDate(weekStart) + 6) };
}

const round3 = (x: number | null) => (x === null || !Number.isFinite(x) ? null : Math.round(x * 1000) / 1000);

function present(
  districtId: string, disease: { id: string; name: string }, diseases: { id: string; name: string }[],
  entry: { model: DistrictOutlook; profileId: string | null; series: OutlookWeek[] }, system: 'mmwr' | 'iso', computedAt: string,
): DistrictOutlookResponse {
  const { model, series } = entry;
  const originIndex = model.origin ? series.findIndex((w) => w.year === model.origin!.year && w.week === model.origin!.week) : -1;
  const recent = originIndex < 0 ? [] : series.slice(Math.max(0, originIndex - RECENT_WEEKS + 1), originIndex + 1).map((w) => ({ ...weekRef(w.year, w.week, system), cases: w.cases }));
  return {
    districtId, disease, diseases, status: model.status, computedAt,
    origin: model.origin ? { ...weekRef(model.origin.year, model.origin.week, system), cases: model.origin.cases } : null,
    fanHorizons: model.fanHorizons,
    // Only the weeks ahead at which the outlook beat the seasonal null leave the server.
    forecast: model.forecast.filter((f) => f.horizon <= model.fanHorizons).map((f) => ({ ...weekRef(f.year, f.week, system), horizon: f.horizon, mean: Math.round(f.mean * 10) / 10, q10: f.q10, q25: f.q25, q50: f.q50, q75: f.q75, q90: f.q90 })),
    recent,
    skill: model.evaluation
      ? {
          origins: model.evaluation.origins, firstOrigin: model.evaluation.firstOrigin, lastOrigin: model.evaluation.lastOrigin,
          horizons: model.evaluation.horizons.map((h) => ({
            horizon: h.horizon, scored: h.scored, beatsNull: h.beatsNull,
            logScore: round3(h.logScore), nullLogScore: round3(h.nullLogScore), crps: round3(h.crps), nullCrps: round3(h.nullCrps),
            crpsSkill: round3(h.crpsSkill), logScoreGain: round3(h.logScoreGain), coverage80: round3(h.coverage80), coverage50: round3(h.coverage50),
          })),
        }
      : null,
    model: model.fit
      ? { terms: model.fit.terms, coefficients: model.fit.coefficients.map((c) => Math.round(c * 1e4) / 1e4), theta: Math.round(model.fit.theta * 1e3) / 1e3, drivers: model.fit.drivers, weeks: model.fit.rows, profileId: entry.profileId }
      : null,
  };
}
