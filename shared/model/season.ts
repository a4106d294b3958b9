import type { Profile } from './profile.schema';
import { compileProfile, traitsFromTable, EIP_MAX_DAYS, EIP_MIN_SURVIVAL, TRAIT_COUNT, T_A, T_EIP_RATE, T_GONO_RATE, T_P, T_PN, T_SHARE, T_VC, type CompiledProfile, type EipNotCompleted } from './traits';
import { degreeDaysFast } from './degree-days';
import { dayLengthFromParts, declinationTable } from './day-length';
import { dateParts, dayNumber, formatIsoDate, isLeapYear, parseIsoDate } from './dates';
import { saturationVapourPressure } from './humidity';

/**
 * The season computation (vector clock per day), in two shapes:
 * - `computeSeasonColumns`: typed arrays in, preallocated typed arrays out, no per-day objects — the
 *   batch path (nightly run, benchmark). Missing values are NaN.
 * - `computeSeason`: one object per day in and out (nulls for missing values); it wraps the columns.
 *
 * Per day i (see docs/model.md for sources):
 *  - degree-days by the profile's method and cutoff; the double methods take day i+1's Tmin and, on the
 *    last day or before a gap, today's Tmin (`nextTminFallback`);
 *  - cumulative degree-days from the biofix; a gap adds nothing and sets `complete` to 0 from that day;
 *  - generations completed = floor(cumulative / K) and days to the next one at the trailing mean of the
 *    daily degree-days (over the known days of the profile's recent window);
 *  - the EIP is NaN where it is not completed (no development at that temperature, or fewer than 1 in
 *    100 infected mosquitoes would live through it, or over a year), the reason in `eipState`;
 *  - the traits (gonotrophic cycle, biting rate, survival p, EIP n, pⁿ, relative vectorial capacity,
 *    share of the EIP completed within the expected life 1/(−ln p)) at the trailing mean of the daily
 *    mean temperature (Tmin + Tmax)/2 over the recent window, read from the profile's trait table
 *    (0.005 °C grid, linear interpolation, within about 1e-6 of the exact functions);
 *  - the season window (diapause profiles) from day length and the trailing mean temperature with
 *    hysteresis; while it is closed the relative vectorial capacity is 0 (diapausing females do not
 *    seek hosts); the thermal traits are still reported.
 */

export interface SeasonOptions {
  /** Latitude, degrees north (−90…90). */
  lat: number;
  /** Biofix date YYYY-MM-DD; default: the profile's month-day in the year of the first day. */
  biofix?: string;
  /** Compute day length even when the profile has no season window (default false in columns, true in objects). */
  dayLength?: boolean;
}

export interface SeasonColumnsInput {
  /** Date of index 0, YYYY-MM-DD; the days are consecutive. */
  startDate: string;
  tmin: Float64Array;
  tmax: Float64Array;
  /** Relative humidity %, NaN where unknown. */
  rh?: Float64Array | null;
  /** 1 where the intake filled the day. */
  filled?: Uint8Array | null;
  /** Number of days to compute (default tmin.length). */
  length?: number;
}

const FLOAT_COLUMNS = [
  'degreeDays',
  'cumulativeDegreeDays',
  'generations',
  'generationsLow',
  'generationsHigh',
  'daysToNextGeneration',
  'daysToNextGenerationLow',
  'daysToNextGenerationHigh',
  'meanTemperature',
  'gonotrophicCycleDays',
  'gonotrophicCycleDaysLow',
  'gonotrophicCycleDaysHigh',
  'bitingRate',
  'survival',
  'eipDays',
  'eipDaysLow',
  'eipDaysHigh',
  'survivalThroughEip',
  'survivalThroughEipLow',
  'survivalThroughEipHigh',
  'relativeVectorialCapacity',
  'relativeVectorialCapacityLow',
  'relativeVectorialCapacityHigh',
  'eipShareInLifetime',
  'eipShareInLifetimeLow',
  'eipShareInLifetimeHigh',
  'dayLengthHours',
  'vapourPressureDeficit',
] as const;
const BYTE_COLUMNS = ['complete', 'sinceBiofix', 'nextTminFallback', 'seasonOpen', 'filled', 'eipState'] as const;

export type SeasonColumns = { length: number; capacity: number } & Record<(typeof FLOAT_COLUMNS)[number], Float64Array> &
  Record<(typeof BYTE_COLUMNS)[number], Uint8Array>;

/**
 * Preallocate output columns for up to `capacity` days (one buffer, views per column). The Low / High
 * columns are the smaller and larger of the two results from the slow and fast ends of the profile's
 * ranged parameters (so xLow ≤ xHigh always; a long-EIP end gives the high eipDays and the low
 * relative vectorial capacity). Without ranges they equal the central column.
 */
export function createSeasonColumns(capacity: number): SeasonColumns {
  const buf = new ArrayBuffer(capacity * (8 * FLOAT_COLUMNS.length + BYTE_COLUMNS.length));
  let off = 0;
  const f = (): Float64Array => {
    const a = new Float64Array(buf, off, capacity);
    off += 8 * capacity;
    return a;
  };
  const b = (): Uint8Array => {
    const a = new Uint8Array(buf, off, capacity);
    off += capacity;
    return a;
  };
  // One object literal with every column, so the object keeps one fixed shape (fast property access).
  const cols: SeasonColumns = {
    length: 0,
    capacity,
    degreeDays: f(),
    cumulativeDegreeDays: f(),
    generations: f(),
    generationsLow: f(),
    generationsHigh: f(),
    daysToNextGeneration: f(),
    daysToNextGenerationLow: f(),
    daysToNextGenerationHigh: f(),
    meanTemperature: f(),
    gonotrophicCycleDays: f(),
    gonotrophicCycleDaysLow: f(),
    gonotrophicCycleDaysHigh: f(),
    bitingRate: f(),
    survival: f(),
    eipDays: f(),
    eipDaysLow: f(),
    eipDaysHigh: f(),
    survivalThroughEip: f(),
    survivalThroughEipLow: f(),
    survivalThroughEipHigh: f(),
    relativeVectorialCapacity: f(),
    relativeVectorialCapacityLow: f(),
    relativeVectorialCapacityHigh: f(),
    eipShareInLifetime: f(),
    eipShareInLifetimeLow: f(),
    eipShareInLifetimeHigh: f(),
    dayLengthHours: f(),
    vapourPressureDeficit: f(),
    complete: b(),
    sinceBiofix: b(),
    nextTminFallback: b(),
    seasonOpen: b(),
    filled: b(),
    eipState: b(),
  };
  return cols;
}

/** Default biofix of a profile in a given year, YYYY-MM-DD (29 February falls back to 28 in common years). */
export function defaultBiofix(profile: Profile, year: number): string {
  const [m, d] = profile.biofix.monthDay.split('-').map(Number);
  const day = m === 2 && d === 29 && !isLeapYear(year) ? 28 : d;
  return formatIsoDate(dayNumber(year, m, day));
}

/**
 * Season computation over typed arrays. Writes into `out` (allocated when not given) and returns it.
 * No allocation per day.
 */
export function computeSeasonColumns(
  profileOrCompiled: Profile | CompiledProfile,
  options: SeasonOptions,
  input: SeasonColumnsInput,
  out?: SeasonColumns,
): SeasonColumns {
  const cp: CompiledProfile = 'optimum' in profileOrCompiled ? profileOrCompiled : compileProfile(profileOrCompiled);
  const n = input.length ?? input.tmin.length;
  if (input.tmax.length < n || input.tmin.length < n) throw new RangeError('tmin and tmax must hold `length` days');
  const lat = options.lat;
  if (!Number.isFinite(lat) || lat < -90 || lat > 90) throw new RangeError('latitude must be within −90…90');
  const o = out ?? createSeasonColumns(n);
  if (o.capacity < n) throw new RangeError(`output columns hold ${o.capacity} days, ${n} needed`);
  o.length = n;
  // Columns as locals: one property lookup per call, none per day.
  const cDegreeDays = o.degreeDays;
  const cMeanTemperature = o.meanTemperature;
  const cBitingRate = o.bitingRate;
  const cComplete = o.complete;
  const cCumulativeDegreeDays = o.cumulativeDegreeDays;
  const cDayLengthHours = o.dayLengthHours;
  const cDaysToNextGeneration = o.daysToNextGeneration;
  const cDaysToNextGenerationHigh = o.daysToNextGenerationHigh;
  const cDaysToNextGenerationLow = o.daysToNextGenerationLow;
  const cEipDays = o.eipDays;
  const cEipDaysHigh = o.eipDaysHigh;
  const cEipDaysLow = o.eipDaysLow;
  const cEipState = o.eipState;
  const cEipShareInLifetime = o.eipShareInLifetime;
  const cEipShareInLifetimeHigh = o.eipShareInLifetimeHigh;
  const cEipShareInLifetimeLow = o.eipShareInLifetimeLow;
  const cFilled = o.filled;
  const cGenerations = o.generations;
  const cGenerationsHigh = o.generationsHigh;
  const cGenerationsLow = o.generationsLow;
  const cGonotrophicCycleDays = o.gonotrophicCycleDays;
  const cGonotrophicCycleDaysHigh = o.gonotrophicCycleDaysHigh;
  const cGonotrophicCycleDaysLow = o.gonotrophicCycleDaysLow;
  const cNextTminFallback = o.nextTminFallback;
  const cRelativeVectorialCapacity = o.relativeVectorialCapacity;
  const cRelativeVectorialCapacityHigh = o.relativeVectorialCapacityHigh;
  const cRelativeVectorialCapacityLow = o.relativeVectorialCapacityLow;
  const cSeasonOpen = o.seasonOpen;
  const cSinceBiofix = o.sinceBiofix;
  const cSurvival = o.survival;
  const cSurvivalThroughEip = o.survivalThroughEip;
  const cSurvivalThroughEipHigh = o.survivalThroughEipHigh;
  const cSurvivalThroughEipLow = o.survivalThroughEipLow;
  const cVapourPressureDeficit = o.vapourPressureDeficit;

  const startDay = parseIsoDate(input.startDate);
  const biofixDay = options.biofix === undefined ? parseIsoDate(defaultBiofix(cp.profile, dateParts(startDay).year)) : parseIsoDate(options.biofix);
  const biofixIndex = biofixDay - startDay;

  const { tmin, tmax } = input;
  const rh = input.rh ?? null;
  const filled = input.filled ?? null;
  const method = cp.methodCode;
  const cutoff = cp.cutoffCode;
  const lower = cp.lower;
  const upper = cp.upper;
  const isDouble = cp.isDouble;
  const k0 = cp.degreeDaysPerGeneration[0];
  const k1 = cp.degreeDaysPerGeneration[1];
  const k2 = cp.degreeDaysPerGeneration[2];
  const ranges = k0 !== k2;
  const traitRanges = cp.hasTraitRanges;
  const win = cp.window;
  const wantDayLength = win !== null || options.dayLength === true;
  const W = cp.recentWindowDays;

  // Day length parts (Forsythe et al. 1995): per call sin p, sin L, cos L; per day-of-year the declination.
  const decl = declinationTable(0.39795);
  const sinP = Math.sin(((win !== null ? win.definitionDeg : 0.8333) * Math.PI) / 180);
  const sinLat = Math.sin((lat * Math.PI) / 180);
  const cosLat = Math.cos((lat * Math.PI) / 180);
  // Day-of-year walker for day length.
  let { year } = dateParts(startDay);
  let doy = startDay - dayNumber(year, 1, 1) + 1;
  let yearLen = isLeapYear(year) ? 366 : 365;

  let sumT = 0;
  let cntT = 0;
  let sumDD = 0;
  let cntDD = 0;
  let cum = 0;
  let complete = 1;
  let warm = false;

  for (let i = 0; i < n; i++) {
    const lo = tmin[i];
    const hi = tmax[i];
    const tmean = (lo + hi) / 2; // NaN on a gap
    const nextTmin = i + 1 < n ? tmin[i + 1] : Number.NaN;
    const dd = degreeDaysFast(method, cutoff, lower, upper, lo, hi, nextTmin);
    cDegreeDays[i] = dd;
    cNextTminFallback[i] = isDouble && dd === dd && nextTmin !== nextTmin ? 1 : 0;
    cFilled[i] = filled !== null && filled[i] ? 1 : 0;
    cVapourPressureDeficit[i] = rh !== null && tmean === tmean ? saturationVapourPressure(tmean) * (1 - rh[i] / 100) : Number.NaN;

    // Trailing windows (known days only).
    if (tmean === tmean) {
      sumT += tmean;
      cntT++;
    }
    if (dd === dd) {
      sumDD += dd;
      cntDD++;
    }
    // The day leaving the window: its mean is recomputed from the inputs (no extra buffer).
    if (i >= W) {
      const j = i - W;
      const m = (tmin[j] + tmax[j]) / 2;
      if (m === m) {
        sumT -= m;
        cntT--;
      }
      const dj = cDegreeDays[j];
      if (dj === dj) {
        sumDD -= dj;
        cntDD--;
      }
    }
    const tbar = cntT > 0 ? sumT / cntT : Number.NaN;
    const ddbar = cntDD > 0 ? sumDD / cntDD : Number.NaN;
    cMeanTemperature[i] = tbar;

    // Accumulation from the biofix.
    const since = i >= biofixIndex;
    cSinceBiofix[i] = since ? 1 : 0;
    if (since) {
      if (dd === dd) cum += dd;
      else complete = 0;
    }
    cCumulativeDegreeDays[i] = since ? cum : 0;
    cComplete[i] = complete;

    // Generations.
    const g1 = Math.floor(cum / k1);
    cGenerations[i] = g1;
    cDaysToNextGeneration[i] = ddbar > 0 ? (k1 * (g1 + 1) - cum) / ddbar : Number.NaN;
    if (ranges) {
      const g0 = Math.floor(cum / k0);
      const g2 = Math.floor(cum / k2);
      cGenerationsLow[i] = g0 < g2 ? g0 : g2;
      cGenerationsHigh[i] = g0 < g2 ? g2 : g0;
      const d0 = ddbar > 0 ? (k0 * (g0 + 1) - cum) / ddbar : Number.NaN;
      const d2 = ddbar > 0 ? (k2 * (g2 + 1) - cum) / ddbar : Number.NaN;
      cDaysToNextGenerationLow[i] = Math.min(d0, d2);
      cDaysToNextGenerationHigh[i] = Math.max(d0, d2);
    } else {
      cGenerationsLow[i] = g1;
      cGenerationsHigh[i] = g1;
      cDaysToNextGenerationLow[i] = cDaysToNextGeneration[i];
      cDaysToNextGenerationHigh[i] = cDaysToNextGeneration[i];
    }

    // Day length and season window.
    let open = 1;
    if (wantDayLength) {
      const dl = dayLengthFromParts(sinP, sinLat, cosLat, decl[2 * doy], decl[2 * doy + 1]);
      cDayLengthHours[i] = dl;
      if (win !== null) {
        if (tbar === tbar) {
          if (warm) {
            if (tbar < win.closeMeanTemperature) warm = false;
          } else if (tbar >= win.openMeanTemperature) warm = true;
        }
        open = warm && dl >= win.criticalPhotoperiod ? 1 : 0;
      }
    } else {
      cDayLengthHours[i] = Number.NaN;
    }
    cSeasonOpen[i] = open;
    if (++doy > yearLen) {
      doy = 1;
      year++;
      yearLen = isLeapYear(year) ? 366 : 365;
    }

    // Traits at the trailing mean temperature (from the profile's trait table; see traits.ts).
    if (tbar === tbar) {
      traitsFromTable(cp, tbar, 1, S1);
      cBitingRate[i] = S1[T_A];
      cSurvival[i] = S1[T_P];
      const u1 = S1[T_GONO_RATE] > 0 ? 1 / S1[T_GONO_RATE] : Number.NaN;
      // An EIP that is not completed (no development, or beyond the life of the mosquito or a season;
      // see eipCompletion in traits.ts) is NaN, its reason in eipState.
      const st1 = eipStateCode(S1[T_EIP_RATE], S1[T_PN]);
      const n1 = st1 === 0 ? 1 / S1[T_EIP_RATE] : Number.NaN;
      cEipState[i] = st1;
      const vc1 = open ? S1[T_VC] : 0;
      cGonotrophicCycleDays[i] = u1;
      cEipDays[i] = n1;
      cSurvivalThroughEip[i] = S1[T_PN];
      cRelativeVectorialCapacity[i] = vc1;
      cEipShareInLifetime[i] = S1[T_SHARE];
      if (traitRanges) {
        traitsFromTable(cp, tbar, 0, S0);
        traitsFromTable(cp, tbar, 2, S2);
        // Rates: the larger rate is the shorter duration.
        const g0 = S0[T_GONO_RATE];
        const g2 = S2[T_GONO_RATE];
        const gHi = g0 > g2 ? g0 : g2;
        const gLo = g0 > g2 ? g2 : g0;
        cGonotrophicCycleDaysLow[i] = gHi > 0 ? 1 / gHi : Number.NaN;
        cGonotrophicCycleDaysHigh[i] = gLo > 0 ? 1 / gLo : Number.NaN;
        // The shorter EIP is the low end; an end that is not completed is NaN (the other end may be).
        const d0 = eipStateCode(S0[T_EIP_RATE], S0[T_PN]) === 0 ? 1 / S0[T_EIP_RATE] : Number.NaN;
        const d2 = eipStateCode(S2[T_EIP_RATE], S2[T_PN]) === 0 ? 1 / S2[T_EIP_RATE] : Number.NaN;
        cEipDaysLow[i] = d0 === d0 && d2 === d2 ? (d0 < d2 ? d0 : d2) : d0 === d0 ? d0 : d2;
        cEipDaysHigh[i] = d0 === d0 && d2 === d2 ? (d0 < d2 ? d2 : d0) : Number.NaN;
        cSurvivalThroughEipLow[i] = S0[T_PN] < S2[T_PN] ? S0[T_PN] : S2[T_PN];
        cSurvivalThroughEipHigh[i] = S0[T_PN] < S2[T_PN] ? S2[T_PN] : S0[T_PN];
        cRelativeVectorialCapacityLow[i] = open ? (S0[T_VC] < S2[T_VC] ? S0[T_VC] : S2[T_VC]) : 0;
        cRelativeVectorialCapacityHigh[i] = open ? (S0[T_VC] < S2[T_VC] ? S2[T_VC] : S0[T_VC]) : 0;
        cEipShareInLifetimeLow[i] = S0[T_SHARE] < S2[T_SHARE] ? S0[T_SHARE] : S2[T_SHARE];
        cEipShareInLifetimeHigh[i] = S0[T_SHARE] < S2[T_SHARE] ? S2[T_SHARE] : S0[T_SHARE];
      } else {
        cGonotrophicCycleDaysLow[i] = cGonotrophicCycleDaysHigh[i] = u1;
        cEipDaysLow[i] = cEipDaysHigh[i] = n1;
        cSurvivalThroughEipLow[i] = cSurvivalThroughEipHigh[i] = S1[T_PN];
        cRelativeVectorialCapacityLow[i] = cRelativeVectorialCapacityHigh[i] = vc1;
        cEipShareInLifetimeLow[i] = cEipShareInLifetimeHigh[i] = S1[T_SHARE];
      }
    } else {
      cSurvival[i] = cBitingRate[i] = Number.NaN;
      cGonotrophicCycleDays[i] = cGonotrophicCycleDaysLow[i] = cGonotrophicCycleDaysHigh[i] = Number.NaN;
      cEipDays[i] = cEipDaysLow[i] = cEipDaysHigh[i] = Number.NaN;
      cEipState[i] = 0;
      cSurvivalThroughEip[i] = cSurvivalThroughEipLow[i] = cSurvivalThroughEipHigh[i] = Number.NaN;
      cRelativeVectorialCapacity[i] = cRelativeVectorialCapacityLow[i] = cRelativeVectorialCapacityHigh[i] = Number.NaN;
      cEipShareInLifetime[i] = cEipShareInLifetimeLow[i] = cEipShareInLifetimeHigh[i] = Number.NaN;
    }
  }
  return o;
}

/** eipState code from the tabulated EIP rate (per day) and pⁿ: 0 completes, 1 no development, 2 beyond the lifetime or a season. */
function eipStateCode(rate: number, pn: number): number {
  if (!(rate > 0)) return 1;
  return rate * EIP_MAX_DAYS < 1 || !(pn >= EIP_MIN_SURVIVAL) ? 2 : 0;
}

const EIP_STATE_NAMES: readonly (EipNotCompleted | null)[] = [null, 'no-development', 'beyond-lifetime'];

/** Scratch rows for the three variants (module level: no per-day allocation). */
const S0 = new Float64Array(TRAIT_COUNT);
const S1 = new Float64Array(TRAIT_COUNT);
const S2 = new Float64Array(TRAIT_COUNT);

// ---------------------------------------------------------------------------------------------
// Object API

export interface SeasonInputDay {
  date: string;
  tmin: number | null;
  tmax: number | null;
  rh?: number | null;
  /** Set by the weather intake when it filled the day. */
  filled?: boolean;
}

export interface Range {
  low: number | null;
  high: number | null;
}

export interface SeasonDay {
  date: string;
  tmin: number | null;
  tmax: number | null;
  rh: number | null;
  filled: boolean;
  /** Null on a gap (never read as zero heat). */
  degreeDays: number | null;
  /** True when a double method used today's Tmin for tomorrow's (last day or before a gap). */
  nextTminFallback: boolean;
  cumulativeDegreeDays: number;
  /** False from the first gap since the biofix on: the total is then a lower bound. */
  complete: boolean;
  sinceBiofix: boolean;
  generations: number;
  daysToNextGeneration: number | null;
  /** Trailing mean of the daily mean temperature over the profile's recent window. */
  meanTemperature: number | null;
  gonotrophicCycleDays: number | null;
  bitingRate: number | null;
  survival: number | null;
  /** Null when unknown (no temperature) or not completed (then eipNotCompleted says why). */
  eipDays: number | null;
  /** Why the EIP is not completed: 'no-development' (outside the pathogen's thermal limits) or 'beyond-lifetime' (fewer than 1 in 100 infected mosquitoes would live through it, or longer than a year); null otherwise. */
  eipNotCompleted: EipNotCompleted | null;
  survivalThroughEip: number | null;
  relativeVectorialCapacity: number | null;
  eipShareInLifetime: number | null;
  dayLengthHours: number | null;
  seasonOpen: boolean;
  /** hPa, from the day's mean temperature and RH; null without RH. */
  vapourPressureDeficit: number | null;
  /** Present when the profile gives ranges: the smaller and larger result of its slow and fast ends. */
  ranges?: {
    generations: Range;
    daysToNextGeneration: Range;
    gonotrophicCycleDays: Range;
    eipDays: Range;
    survivalThroughEip: Range;
    relativeVectorialCapacity: Range;
    eipShareInLifetime: Range;
  };
}

const num = (x: number | null | undefined): number => (x === null || x === undefined ? Number.NaN : x);
const orNull = (x: number): number | null => (x === x ? x : null);

/**
 * Season computation, one object per day. `days` must be consecutive calendar days in order
 * (a missing day is given as a day with null temperatures, not left out). Throws RangeError otherwise.
 */
export function computeSeason(profile: Profile, options: SeasonOptions, days: readonly SeasonInputDay[]): SeasonDay[] {
  const n = days.length;
  if (n === 0) return [];
  const start = parseIsoDate(days[0].date);
  const tmin = new Float64Array(n);
  const tmax = new Float64Array(n);
  const rh = new Float64Array(n);
  const filled = new Uint8Array(n);
  for (let i = 0; i < n; i++) {
    const d = days[i];
    if (parseIsoDate(d.date) !== start + i) throw new RangeError(`day ${i + 1} (${d.date}) is not the day after ${days[i - 1]?.date ?? ''}`);
    tmin[i] = num(d.tmin);
    tmax[i] = num(d.tmax);
    rh[i] = num(d.rh);
    filled[i] = d.filled ? 1 : 0;
    if (Number.isNaN(tmin[i]) !== Number.isNaN(tmax[i])) {
      // Half a day is no day: treat it as a gap.
      tmin[i] = tmax[i] = Number.NaN;
    }
  }
  const c = computeSeasonColumns(profile, { dayLength: true, ...options }, { startDate: days[0].date, tmin, tmax, rh, filled });
  const withRanges = compileProfile(profile).hasRanges;
  const out: SeasonDay[] = new Array(n);
  for (let i = 0; i < n; i++) {
    const d = days[i];
    const day: SeasonDay = {
      date: d.date,
      tmin: d.tmin ?? null,
      tmax: d.tmax ?? null,
      rh: d.rh ?? null,
      filled: c.filled[i] === 1,
      degreeDays: orNull(c.degreeDays[i]),
      nextTminFallback: c.nextTminFallback[i] === 1,
      cumulativeDegreeDays: c.cumulativeDegreeDays[i],
      complete: c.complete[i] === 1,
      sinceBiofix: c.sinceBiofix[i] === 1,
      generations: c.generations[i],
      daysToNextGeneration: orNull(c.daysToNextGeneration[i]),
      meanTemperature: orNull(c.meanTemperature[i]),
      gonotrophicCycleDays: orNull(c.gonotrophicCycleDays[i]),
      bitingRate: orNull(c.bitingRate[i]),
      survival: orNull(c.survival[i]),
      eipDays: orNull(c.eipDays[i]),
      eipNotCompleted: EIP_STATE_NAMES[c.eipState[i]],
      survivalThroughEip: orNull(c.survivalThroughEip[i]),
      relativeVectorialCapacity: orNull(c.relativeVectorialCapacity[i]),
      eipShareInLifetime: orNull(c.eipShareInLifetime[i]),
      dayLengthHours: orNull(c.dayLengthHours[i]),
      seasonOpen: c.seasonOpen[i] === 1,
      vapourPressureDeficit: orNull(c.vapourPressureDeficit[i]),
    };
    if (withRanges) {
      const r = (lo: Float64Array, hi: Float64Array): Range => ({ low: orNull(lo[i]), high: orNull(hi[i]) });
      day.ranges = {
        generations: r(c.generationsLow, c.generationsHigh),
        daysToNextGeneration: r(c.daysToNextGenerationLow, c.daysToNextGenerationHigh),
        gonotrophicCycleDays: r(c.gonotrophicCycleDaysLow, c.gonotrophicCycleDaysHigh),
        eipDays: r(c.eipDaysLow, c.eipDaysHigh),
        survivalThroughEip: r(c.survivalThroughEipLow, c.survivalThroughEipHigh),
        relativeVectorialCapacity: r(c.relativeVectorialCapacityLow, c.relativeVectorialCapacityHigh),
        eipShareInLifetime: r(c.eipShareInLifetimeLow, c.eipShareInLifetimeHigh),
      };
    }
    out[i] = day;
  }
  return out;
}
