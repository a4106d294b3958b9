/**
 * One district's season, computed without I/O: the vector clock of each of its profiles, then the
 * tier inputs (docs/tier.md) and the tier with low / central / high variants.
 */
import { computeSeason, epiWeek, type EpiWeekSystem, getProfile, type SeasonDay, type SeasonInputDay, weeksInYear } from '../../shared/model';
import { aggregateLarvalIndices, c2, channelZone, endemicChannel } from '../../shared/signals';
import { computeTier, type TierInputs, type TierResult, type TierSettings } from '../../shared/tier';
import type { CaseRow, DistrictForRun, SurveyRow, VectorClockRows } from './season.repository';

export interface DistrictSeasonInput {
  district: DistrictForRun;
  asOf: string;
  seasonYear: number;
  weather: SeasonInputDay[];
  /** Weather of earlier seasons (for "generations against the usual"), by year. */
  priorWeather: Map<number, SeasonInputDay[]>;
  cases: CaseRow[];
  excludedYears: Map<string, number[]>;
  surveys: SurveyRow[];
  settings: TierSettings;
  epiSystem: EpiWeekSystem;
  channelMethod: 'geometric' | 'quartile' | 'mean-2sd';
}

export interface DistrictSeasonResult {
  rows: VectorClockRows;
  tier: TierResult;
  tierLow: TierResult;
  tierHigh: TierResult;
  profileId: string | null;
  casesThisWeek: number | null;
  channelZone: 'below' | 'within' | 'above' | null;
  latestWeather: string | null;
  warnings: { code: string; message: string }[];
}

const mean = (xs: number[]) => (xs.length ? xs.reduce((a, b) => a + b, 0) / xs.length : null);
const lastN = <T>(xs: T[], n: number) => xs.slice(Math.max(0, xs.length - n));
const daysBetween = (a: string, b: string) => Math.round((Date.parse(b) - Date.parse(a)) / 86_400_000);
const biofixFor = (monthDay: string | null, year: number) => (monthDay ? `${year}-${monthDay}` : undefined);

function seasonOf(district: DistrictForRun, profileId: string, biofix: string | null, year: number, days: SeasonInputDay[]): SeasonDay[] {
  if (days.length === 0 || district.lat === null) return [];
  return computeSeason(getProfile(profileId), { lat: district.lat, biofix: biofixFor(biofix, year) }, days);
}

/** Generations by this day of the year, this season ÷ the mean of earlier seasons (null without them). */
function generationsRatio(input: DistrictSeasonInput, profileId: string, biofix: string | null, current: SeasonDay[]): number | null {
  const now = current[current.length - 1];
  if (!now) return null;
  const md = input.asOf.slice(5);
  const prior: number[] = [];
  for (const [year, days] of input.priorWeather) {
    const upTo = days.filter((d) => d.date.slice(5) <= md);
    const s = seasonOf(input.district, profileId, biofix, year, upTo);
    if (s.length > 300 || s.length > current.length * 0.9) prior.push(s[s.length - 1].generations);
  }
  const usual = mean(prior);
  return usual && usual > 0 ? now.generations / usual : null;
}

function caseInputs(input: DistrictSeasonInput) {
  const now = epiWeek(input.asOf, input.epiSystem);
  const byDisease = new Map<string, Map<string, number>>();
  let latest: { year: number; week: number } | null = null;
  for (const r of input.cases) {
    let m = byDisease.get(r.diseaseId);
    if (!m) byDisease.set(r.diseaseId, (m = new Map()));
    m.set(`${r.epiYear}:${r.epiWeek}`, r.cases);
    const beforeNow = r.epiYear < now.year || (r.epiYear === now.year && r.epiWeek <= now.week);
    if (beforeNow && (!latest || r.epiYear > latest.year || (r.epiYear === latest.year && r.epiWeek > latest.week)))
      latest = { year: r.epiYear, week: r.epiWeek };
  }
  if (!latest) return { zone: null, aberrationAlarm: null, growthRatio: null, cases: null, ageWeeks: null };
  const ageWeeks = latest.year === now.year ? now.week - latest.week : now.week + weeksInYear(latest.year, input.epiSystem) - latest.week;
  let best: { rank: number; zone: 'below' | 'within' | 'above' | null; alarm: boolean | null; growth: number | null } | null = null;
  let total = 0;
  for (const [diseaseId, counts] of byDisease) {
    const x = counts.get(`${latest.year}:${latest.week}`);
    if (x === undefined) continue;
    total += x;
    const excluded = input.excludedYears.get(`${input.district.id}:${diseaseId}`) ?? [];
    const history: number[] = [];
    for (let y = latest.year - 1; y >= latest.year - 7 && history.length < 7; y--) {
      const h = counts.get(`${y}:${latest.week}`);
      if (h !== undefined && !excluded.includes(y)) history.push(h);
    }
    const zone = history.length >= 2 ? channelZone(x, endemicChannel(input.channelMethod, history)) : null;
    // The reported weeks in order, up to the latest (a week nobody reported is left out, not read as zero).
    const series = [...counts.entries()]
      .map(([k, v]) => ({ k: k.split(':').map(Number), v }))
      .filter(({ k }) => k[0] < latest!.year || (k[0] === latest!.year && k[1] <= latest!.week))
      .sort((a, b) => a.k[0] - b.k[0] || a.k[1] - b.k[1])
      .map((e) => e.v);
    const recent = lastN(series, 20);
    const alarms = recent.length >= 10 ? c2(recent).alarm : [];
    const alarm = alarms.length ? alarms[alarms.length - 1] : null;
    const prev = recent.length >= 2 ? recent[recent.length - 2] : null;
    const growth = prev !== null && prev > 0 ? x / prev : null;
    const rank = (zone === 'above' ? 4 : zone === 'within' ? 2 : 0) + (alarm ? 2 : 0) + Math.min(1, Math.max(0, (growth ?? 1) - 1));
    if (!best || rank > best.rank) best = { rank, zone, alarm, growth };
  }
  return {
    zone: best?.zone ?? null,
    aberrationAlarm: best?.alarm ?? null,
    growthRatio: best?.growth ?? null,
    cases: total,
    ageWeeks: latest.year === now.year && latest.week === now.week ? 0 : ageWeeks,
  };
}

export function computeDistrictSeason(input: DistrictSeasonInput, rows: VectorClockRows): DistrictSeasonResult {
  const warnings: DistrictSeasonResult['warnings'] = [];
  const { district } = input;
  if (district.profiles.length === 0) warnings.push({ code: 'no_profiles', message: `${district.code}: no vector profile assigned.` });
  if (input.weather.length === 0) warnings.push({ code: 'missing_weather', message: `${district.code}: no weather this season.` });
  if (district.lat === null) warnings.push({ code: 'no_position', message: `${district.code}: no boundary, so no latitude for day length.` });

  type Candidate = { profileId: string; rvc: number | null; rvcLow: number | null; rvcHigh: number | null; last: SeasonDay; biofix: string | null; days: SeasonDay[] };
  const candidates: Candidate[] = [];
  for (const { profileId, biofix } of district.profiles) {
    const days = seasonOf(district, profileId, biofix, input.seasonYear, input.weather);
    for (const d of days) {
      rows.profileId.push(profileId);
      rows.date.push(d.date);
      rows.degreeDays.push(d.degreeDays);
      rows.cumulativeDegreeDays.push(d.cumulativeDegreeDays);
      rows.complete.push(d.complete);
      rows.generations.push(d.generations);
      rows.eipDays.push(d.eipDays);
      rows.survival.push(d.survival);
      rows.survivalThroughEip.push(d.survivalThroughEip);
      rows.eipShare.push(d.eipShareInLifetime);
      rows.rvc.push(d.relativeVectorialCapacity);
      rows.rvcLow.push(d.ranges?.relativeVectorialCapacity.low ?? null);
      rows.rvcHigh.push(d.ranges?.relativeVectorialCapacity.high ?? null);
      rows.seasonOpen.push(d.seasonOpen);
    }
    if (days.length === 0) continue;
    const recent = lastN(days, 14);
    const pick = (f: (d: SeasonDay) => number | null | undefined) => mean(recent.map(f).filter((v): v is number => typeof v === 'number'));
    candidates.push({
      profileId, biofix, days, last: days[days.length - 1],
      rvc: pick((d) => d.relativeVectorialCapacity),
      rvcLow: pick((d) => d.ranges?.relativeVectorialCapacity.low ?? d.relativeVectorialCapacity),
      rvcHigh: pick((d) => d.ranges?.relativeVectorialCapacity.high ?? d.relativeVectorialCapacity),
    });
  }
  // The profile most favoured by this season's weather drives the climate and vector clock drivers.
  const primary = candidates.sort((a, b) => (b.rvc ?? -1) - (a.rvc ?? -1))[0] ?? null;
  const larval = input.surveys.length ? aggregateLarvalIndices(input.surveys as never) : null;
  const cases = caseInputs(input);
  const latestWeather = [...input.weather].reverse().find((d) => d.tmin !== null && d.tmax !== null)?.date ?? null;

  const genRatio = primary ? generationsRatio(input, primary.profileId, primary.biofix, primary.days) : null;
  const build = (variant: 'central' | 'low' | 'high'): TierInputs => {
    const share = primary?.last.eipShareInLifetime ?? null;
    const shareRange = primary?.last.ranges?.eipShareInLifetime;
    return {
      climate: {
        rvc14: primary ? (variant === 'low' ? primary.rvcLow : variant === 'high' ? primary.rvcHigh : primary.rvc) : null,
        seasonOpen: primary ? primary.last.seasonOpen : null,
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
  if (tier.confidence !== 'ok') warnings.push({ code: `tier_${tier.confidence}`, message: `${district.code}: ${tier.notes.join(' ')}` });
  return {
    rows,
    tier,
    tierLow: computeTier(build('low'), input.settings),
    tierHigh: computeTier(build('high'), input.settings),
    profileId: primary?.profileId ?? null,
    casesThisWeek: cases.cases,
    channelZone: cases.zone,
    latestWeather,
    warnings,
  };
}
