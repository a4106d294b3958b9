/**
 * One district's season, computed without I/O: the vector clock of each of its profiles, then the
 * tier inputs (docs/tier.md) and the tier with low / central / high variants.
 */
import {
  computeSeasonColumns, createSeasonColumns, epiWeek, formatIsoDate, isLeapYear, parseIsoDate, type EpiWeekSystem, getProfile, findProfile, type SeasonColumns, type SeasonColumnsInput,
  weeksInYear,
} from '../../shared/model';
import { aggregateLarvalIndices } from '../../shared/signals';
import { buildSignals } from '../cases/case-signals';
import { firstOpenWeek, isOpenWeek } from '../cases/case-weeks';
import { DataProblem } from '../http/problem-reason';
import { computeTier, type TierInputs, type TierResult, type TierSettings } from '../../shared/tier';
import type { CaseRow, DistrictForRun, SurveyRow, VectorClockSeries, WeatherColumns } from './season.repository';

export interface DistrictSeasonInput {
  district: DistrictForRun;
  asOf: string;
  seasonYear: number;
  /** This season's daily weather from 1 January to the as-of date, dense (NaN where unknown). */
  weather: WeatherColumns;
  /** Weather of earlier seasons (for "generations against the usual"), by year, each from 1 January. */
  priorWeather: Map<number, WeatherColumns>;
  cases: CaseRow[];
  excludedYears: Map<string, number[]>;
  /** The district's closed weeks ("year:week"); with `deadlineDays` they tell open weeks from complete ones. */
  closedWeeks?: ReadonlySet<string>;
  /** CASE_REPORT_DEADLINE_DAYS (default 3). */
  deadlineDays?: number;
  surveys: SurveyRow[];
  settings: TierSettings;
  epiSystem: EpiWeekSystem;
  channelMethod: 'geometric' | 'quartile' | 'mean-2sd';
  cusum: { k: number; h: number };
}

export interface DistrictSeasonResult {
  /** The vector clock of each profile over the season (copied out of the shared scratch columns). */
  series: VectorClockSeries[];
  tier: TierResult;
  tierLow: TierResult;
  tierHigh: TierResult;
  profileId: string | null;
  /** Cases of the newest complete week (`casesWeek`), summed over the diseases reported in it (`casesDiseaseIds`). */
  casesThisWeek: number | null;
  casesWeek: { year: number; week: number } | null;
  casesDiseaseIds: string[] | null;
  channelZone: 'below' | 'within' | 'above' | null;
  latestWeather: string | null;
  /** Codes with parameters; the Season runs screen words them (`warning.<code>`). */
  warnings: { code: string; params?: Record<string, string | number | null> }[];
}

const mean = (xs: number[]) => (xs.length ? xs.reduce((a, b) => a + b, 0) / xs.length : null);
const daysBetween = (a: string, b: string) => parseIsoDate(b) - parseIsoDate(a);
// An assigned 02-29 biofix falls back to 28 February in common years, as a profile's default does.
const biofixFor = (monthDay: string | null, year: number) =>
  monthDay ? `${year}-${monthDay === '02-29' && !isLeapYear(year) ? '02-28' : monthDay}` : undefined;
const orNull = (x: number) => (Number.isNaN(x) ? null : x);

// One output buffer per process, reused for every district and profile (the season run is sequential).
let scratch: SeasonColumns | null = null;
function columnsFor(profileId: string, lat: number, biofix: string | undefined, input: SeasonColumnsInput): SeasonColumns {
  const n = input.length ?? input.tmin.length;
  if (!scratch || scratch.capacity < n) scratch = createSeasonColumns(Math.max(n, 400));
  return computeSeasonColumns(getProfile(profileId), { lat, biofix }, input, scratch);
}

/** Generations by this day of the year, this season ÷ the mean of earlier seasons (null without them). */
function generationsRatio(input: DistrictSeasonInput, profileId: string, biofix: string | null, now: number): number | null {
  if (input.district.lat === null) return null;
  const md = input.asOf.slice(5);
  const prior: number[] = [];
  for (const [year, days] of input.priorWeather) {
    if (days.rows < 300) continue; // an earlier season needs most of its days to be "usual"
    const upTo = daysBetween(days.startDate, `${year}-${md === '02-29' && !isLeapYear(year) ? '02-28' : md}`) + 1;
    const c = columnsFor(profileId, input.district.lat, biofixFor(biofix, year), { ...days, length: Math.min(upTo, days.length) });
    prior.push(c.generations[c.length - 1]);
  }
  const usual = mean(prior);
  return usual && usual > 0 ? now / usual : null;
}

/** Weekly counts by disease and epidemiological year, as the case ledger's signals take them. */
function countsByDisease(cases: CaseRow[]): Map<string, Map<number, (number | null)[]>> {
  const out = new Map<string, Map<number, (number | null)[]>>();
  for (const r of cases) {
    let years = out.get(r.diseaseId);
    if (!years) out.set(r.diseaseId, (years = new Map()));
    let weeks = years.get(r.epiYear);
    if (!weeks) years.set(r.epiYear, (weeks = []));
    weeks[r.epiWeek - 1] = r.cases;
  }
  return out;
}

/**
 * The case driver's inputs: the newest reported complete week up to the as-of week (an open week —
 * reporting deadline not passed, not closed — holds a partial count and is never read as complete), and for each disease its
 * channel zone, C2 alarm and growth from the case ledger's own signals (server/cases/case-signals.ts),
 * so the tier reads the same figures as the district cases page. The disease with the strongest signal wins.
 */
function caseInputs(input: DistrictSeasonInput) {
  const now = epiWeek(input.asOf, input.epiSystem);
  const deadlineDays = input.deadlineDays ?? 3;
  const closed = input.closedWeeks ?? new Set<string>();
  const open = (year: number, week: number) => isOpenWeek(year, week, input.epiSystem, deadlineDays, input.asOf, closed.has(`${year}:${week}`));
  let latest: { year: number; week: number } | null = null;
  for (const r of input.cases) {
    const beforeNow = r.epiYear < now.year || (r.epiYear === now.year && r.epiWeek <= now.week);
    if (beforeNow && !open(r.epiYear, r.epiWeek) && (!latest || r.epiYear > latest.year || (r.epiYear === latest.year && r.epiWeek > latest.week)))
      latest = { year: r.epiYear, week: r.epiWeek };
  }
  if (!latest) return { zone: null, aberrationAlarm: null, growthRatio: null, cases: null, ageWeeks: null, week: null, diseaseIds: null };
  const closedThisYear = new Set([...closed].filter((k) => k.startsWith(`${latest!.year}:`)).map((k) => Number(k.split(':')[1])));
  const openFrom = firstOpenWeek(latest.year, latest.week, input.epiSystem, deadlineDays, input.asOf, closedThisYear);
  const ageWeeks = latest.year === now.year ? now.week - latest.week : now.week + weeksInYear(latest.year, input.epiSystem) - latest.week;
  let best: { rank: number; zone: 'below' | 'within' | 'above' | null; alarm: boolean | null; growth: number | null } | null = null;
  let total = 0;
  const diseaseIds: string[] = [];
  for (const [diseaseId, counts] of countsByDisease(input.cases)) {
    const x = counts.get(latest.year)?.[latest.week - 1];
    if (x === undefined || x === null) continue;
    total += x;
    diseaseIds.push(diseaseId);
    const week = buildSignals({
      year: latest.year, lastWeek: latest.week, weeksInTargetYear: weeksInYear(latest.year, input.epiSystem), counts,
      excludedYears: input.excludedYears.get(`${input.district.id}:${diseaseId}`) ?? [], method: input.channelMethod,
      cusum: input.cusum, population: null, openFrom,
    }).weeks[latest.week - 1];
    const { zone } = week;
    const alarm = week.c2.alarm;
    const growth = week.growth.ratio;
    const rank = (zone === 'above' ? 4 : zone === 'within' ? 2 : 0) + (alarm ? 2 : 0) + Math.min(1, Math.max(0, (growth ?? 1) - 1));
    if (!best || rank > best.rank) best = { rank, zone, alarm, growth };
  }
  return {
    zone: best?.zone ?? null,
    aberrationAlarm: best?.alarm ?? null,
    growthRatio: best?.growth ?? null,
    cases: total,
    // Weeks still open are not yet due: the count's age is measured from the newest week that could be complete.
    ageWeeks: Math.max(0, (latest.year === now.year && latest.week === now.week ? 0 : ageWeeks) - openWeeksBefore(now, open, input.epiSystem)),
    week: latest,
    diseaseIds: diseaseIds.sort(),
  };
}

/** How many weeks, counting back from `now`, are still open (at most 12). */
function openWeeksBefore(now: { year: number; week: number }, open: (year: number, week: number) => boolean, system: EpiWeekSystem) {
  let { year, week } = now;
  let n = 0;
  while (n < 12 && open(year, week)) {
    n++;
    week -= 1;
    if (week === 0) {
      year -= 1;
      week = weeksInYear(year, system);
    }
  }
  return n;
}

export function computeDistrictSeason(input: DistrictSeasonInput): DistrictSeasonResult {
  const series: VectorClockSeries[] = [];
  const warnings: DistrictSeasonResult['warnings'] = [];
  const { district } = input;
  if (district.profiles.length === 0) warnings.push({ code: 'no_profiles' });
  if (input.weather.rows === 0) warnings.push({ code: 'missing_weather' });
  if (district.lat === null) warnings.push({ code: 'no_position' });
  // A stored profile the model does not know is this district's fault, named as such (not a bare RangeError).
  for (const { profileId } of district.profiles) if (!findProfile(profileId)) throw new DataProblem('unknown_profile', { profileId });

  type Candidate = { profileId: string; biofix: string | null; rvc: number | null; rvcLow: number | null; rvcHigh: number | null;
    seasonOpen: boolean; eipShare: number | null; eipShareLow: number | null; eipShareHigh: number | null; generations: number };
  const candidates: Candidate[] = [];
  const weatherCols = input.weather;
  for (const { profileId, biofix } of district.profiles) {
    if (input.weather.rows === 0 || district.lat === null) continue;
    const c = columnsFor(profileId, district.lat, biofixFor(biofix, input.seasonYear), weatherCols);
    const n = c.length;
    const f32 = (col: Float64Array) => Float32Array.from(col.subarray(0, n));
    series.push({
      profileId, startDay: parseIsoDate(weatherCols.startDate), length: n,
      degreeDays: f32(c.degreeDays), cumulativeDegreeDays: f32(c.cumulativeDegreeDays), complete: c.complete.slice(0, n),
      generations: f32(c.generations), eipDays: f32(c.eipDays), survival: f32(c.survival), survivalThroughEip: f32(c.survivalThroughEip),
      eipShare: f32(c.eipShareInLifetime), rvc: f32(c.relativeVectorialCapacity), rvcLow: f32(c.relativeVectorialCapacityLow),
      rvcHigh: f32(c.relativeVectorialCapacityHigh), seasonOpen: c.seasonOpen.slice(0, n),
    });
    const recent = (col: Float64Array) => mean([...col.subarray(Math.max(0, n - 14), n)].filter((v) => !Number.isNaN(v)));
    candidates.push({
      profileId, biofix,
      rvc: recent(c.relativeVectorialCapacity), rvcLow: recent(c.relativeVectorialCapacityLow), rvcHigh: recent(c.relativeVectorialCapacityHigh),
      seasonOpen: c.seasonOpen[n - 1] === 1,
      eipShare: orNull(c.eipShareInLifetime[n - 1]), eipShareLow: orNull(c.eipShareInLifetimeLow[n - 1]), eipShareHigh: orNull(c.eipShareInLifetimeHigh[n - 1]),
      generations: c.generations[n - 1],
    });
  }
  // The profile most favoured by this season's weather drives the climate and vector clock drivers.
  const primary = candidates.sort((a, b) => (b.rvc ?? -1) - (a.rvc ?? -1))[0] ?? null;
  const larval = input.surveys.length ? aggregateLarvalIndices(input.surveys as never) : null;
  const cases = caseInputs(input);
  let latestWeather: string | null = null;
  for (let i = input.weather.length - 1; i >= 0; i--) {
    if (input.weather.tmin[i] === input.weather.tmin[i]) {
      latestWeather = formatIsoDate(parseIsoDate(input.weather.startDate) + i);
      break;
    }
  }

  const genRatio = primary ? generationsRatio(input, primary.profileId, primary.biofix, primary.generations) : null;
  const build = (variant: 'central' | 'low' | 'high'): TierInputs => {
    const share = primary?.eipShare ?? null;
    const shareRange = primary ? { low: primary.eipShareLow, high: primary.eipShareHigh } : null;
    return {
      climate: {
        rvc14: primary ? (variant === 'low' ? primary.rvcLow : variant === 'high' ? primary.rvcHigh : primary.rvc) : null,
        seasonOpen: primary ? primary.seasonOpen : null,
      },
      vectorClock: {
        eipShare: variant === 'low' ? (shareRange?.low ?? share) : variant === 'high' ? (shareRange?.high ?? share) : share,
        generationsRatio: genRatio,
      },
      larval: { breteau: larval?.breteau ?? null, house: larval?.house ?? null },
      cases: { zone: cases.zone, aberrationAlarm: cases.aberrationAlarm, growthRatio: cases.growthRatio, cases: cases.cases },
      weatherAgeDays: latestWeather ? daysBetween(latestWeather, input.asOf) : null,
      caseAgeWeeks: cases.ageWeeks,
    };
  };
  const central = build('central');
  const tier = computeTier(central, input.settings);
  if (tier.confidence !== 'ok') warnings.push({ code: `tier_${tier.confidence}` });
  return {
    series,
    tier,
    tierLow: computeTier(build('low'), input.settings),
    tierHigh: computeTier(build('high'), input.settings),
    profileId: primary?.profileId ?? null,
    casesThisWeek: cases.cases,
    casesWeek: cases.week,
    casesDiseaseIds: cases.diseaseIds,
    channelZone: cases.zone,
    latestWeather,
    warnings,
  };
}
