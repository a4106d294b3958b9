/**
 * Replay of past seasons, without I/O: what a district's tier would have been each week with only the
 * data known then (docs/skill.md). It feeds the live season run's own computation
 * (server/season/district-season.ts) with inputs cut at each week's as-of date, so the replayed tier
 * is the tier the run would have shown that week, not a re-fit.
 *
 * "Known then" means: weather days up to the as-of date whose value was loaded by the end of that day
 * (and, where a day has several versions, the newest version loaded by then); case counts as their
 * revision history stood at the end of the as-of day (the newest entry or correction recorded by then;
 * a count voided by then is dropped; a count first reported later does not exist yet).
 */
import { epiWeek, epiWeekEnd, formatIsoDate, parseIsoDate, type EpiWeekSystem } from '../../shared/model';
import type { TierSettings } from '../../shared/tier';
import { CHANNEL_LOOKBACK_YEARS } from '../cases/case-signals';
import { computeDistrictSeason } from '../season/district-season';
import { type CaseRow, type DistrictForRun, type SurveyRow, type WeatherColumns, weatherByYear } from '../season/season.repository';

/** One version of a count: an entry, a correction or a void, with when it was recorded. */
export interface CaseRevisionRow {
  districtId: string;
  diseaseId: string;
  epiYear: number;
  epiWeek: number;
  version: number;
  at: Date;
  kind: 'entry' | 'correction' | 'void';
  cases: number;
}

/** One version of a district's weather day, with when it was loaded (null: unknown, taken as known on its date). */
export interface WeatherDayVersion {
  date: string;
  knownAt: Date | null;
  tmin: number | null;
  tmax: number | null;
  rh: number | null;
  filled: boolean;
}

/** The end of an ISO day as an instant (UTC; the deployment's time zone shifts it by hours at most). */
export const endOfDay = (iso: string) => new Date((parseIsoDate(iso) + 1) * 86_400_000);

/** The counts as their revision history stood at `cutoff`: newest version recorded by then, voids dropped. */
export function casesKnownAt(revisions: readonly CaseRevisionRow[], cutoff: Date): CaseRow[] {
  const newest = new Map<string, CaseRevisionRow>();
  for (const r of revisions) {
    if (r.at.getTime() > cutoff.getTime()) continue;
    const k = `${r.districtId}|${r.diseaseId}|${r.epiYear}|${r.epiWeek}`;
    const seen = newest.get(k);
    if (!seen || r.version > seen.version) newest.set(k, r);
  }
  return [...newest.values()]
    .filter((r) => r.kind !== 'void')
    .map((r) => ({ districtId: r.districtId, diseaseId: r.diseaseId, epiYear: r.epiYear, epiWeek: r.epiWeek, cases: r.cases }))
    .sort((a, b) => a.epiYear - b.epiYear || a.epiWeek - b.epiWeek);
}

/**
 * Dense weather columns from `from` to `to` as known at `cutoff` (the layout SeasonRepository.weather
 * returns): a day loaded later, or later than `to`, is a gap (NaN); of several versions the newest
 * loaded by the cutoff wins.
 */
export function weatherKnownAt(versions: readonly WeatherDayVersion[], from: string, to: string, cutoff: Date): WeatherColumns {
  const start = parseIsoDate(from);
  const length = Math.max(0, parseIsoDate(to) - start + 1);
  const c: WeatherColumns = {
    startDate: from, length, rows: 0,
    tmin: new Float64Array(length).fill(Number.NaN), tmax: new Float64Array(length).fill(Number.NaN),
    rh: new Float64Array(length).fill(Number.NaN), filled: new Uint8Array(length),
  };
  // Called once per replayed week over years of days: dates outside the range are skipped by string
  // comparison (ISO dates sort as text) and each kept date is parsed once (parsing was the replay's largest cost).
  const cutoffMs = cutoff.getTime();
  const chosen = new Map<number, WeatherDayVersion>();
  const chosenAt = new Map<number, number>();
  for (const v of versions) {
    if (v.date < from || v.date > to) continue;
    const day = parseIsoDate(v.date);
    const i = day - start;
    if (i < 0 || i >= length) continue;
    const knownAt = v.knownAt ? v.knownAt.getTime() : (day + 1) * 86_400_000; // unknown load time: the end of its own day
    if (knownAt > cutoffMs) continue;
    const seen = chosenAt.get(i);
    if (seen === undefined || seen <= knownAt) {
      chosen.set(i, v);
      chosenAt.set(i, knownAt);
    }
  }
  for (const [i, v] of chosen) {
    c.rows += 1;
    if (v.tmin === null || v.tmax === null) continue;
    c.tmin[i] = v.tmin;
    c.tmax[i] = v.tmax;
    c.rh[i] = v.rh ?? Number.NaN;
    c.filled[i] = v.filled ? 1 : 0;
  }
  return c;
}

export interface ReplayDistrictInput {
  district: DistrictForRun;
  /** Epidemiological weeks to replay, in order. */
  weeks: readonly { year: number; week: number }[];
  weather: readonly WeatherDayVersion[];
  caseRevisions: readonly CaseRevisionRow[];
  /** Surveys carry no load time: only those dated in the 28 days up to each as-of date are used. */
  surveys: readonly SurveyRow[];
  excludedYears: Map<string, number[]>;
  settings: TierSettings;
  epiSystem: EpiWeekSystem;
  channelMethod: 'geometric' | 'quartile' | 'mean-2sd';
  cusum: { k: number; h: number };
}

export interface ReplayedWeek {
  epiYear: number;
  epiWeek: number;
  asOf: string;
  tier: string;
  score: number;
  confidence: string;
  leadingDriver: string | null;
  drivers: unknown;
  casesThisWeek: number | null;
  channelZone: 'below' | 'within' | 'above' | null;
  latestWeather: string | null;
}

const PRIOR_SEASONS = 3; // as the season run: "generations against the usual" reads three earlier seasons

/** Replays one district week by week. Throws on that district's bad data; the caller records it and goes on. */
export function replayDistrict(input: ReplayDistrictInput): ReplayedWeek[] {
  const out: ReplayedWeek[] = [];
  for (const w of input.weeks) {
    const asOf = epiWeekEnd(w.year, w.week, input.epiSystem);
    const cutoff = endOfDay(asOf);
    const seasonYear = Number(asOf.slice(0, 4));
    const weather = weatherKnownAt(input.weather, `${seasonYear}-01-01`, asOf, cutoff);
    const prior = weatherKnownAt(input.weather, `${seasonYear - PRIOR_SEASONS}-01-01`, `${seasonYear - 1}-12-31`, cutoff);
    const fromYear = seasonYear - CHANNEL_LOOKBACK_YEARS;
    const cases = casesKnownAt(input.caseRevisions, cutoff).filter((c) => c.epiYear >= fromYear);
    const surveyFrom = formatIsoDate(parseIsoDate(asOf) - 28);
    const surveys = input.surveys.filter((s) => s.surveyDate >= surveyFrom && s.surveyDate <= asOf);
    const result = computeDistrictSeason({
      district: input.district, asOf, seasonYear, weather, priorWeather: weatherByYear(prior), cases,
      excludedYears: input.excludedYears, surveys, settings: input.settings, epiSystem: input.epiSystem,
      channelMethod: input.channelMethod, cusum: input.cusum,
    });
    const week = epiWeek(asOf, input.epiSystem);
    out.push({
      epiYear: week.year, epiWeek: week.week, asOf, tier: result.tier.tier, score: result.tier.score,
      confidence: result.tier.confidence, leadingDriver: result.tier.leadingDriver ?? null, drivers: result.tier.drivers,
      casesThisWeek: result.casesThisWeek, channelZone: result.channelZone, latestWeather: result.latestWeather,
    });
  }
  return out;
}
