/**
 * The Case outlook (docs/outlook.md): per district, a negative binomial regression of weekly cases
 *
 *   y_t ~ NB(μ_t, θ),  log μ_t = β0 + β1 sin(2π w_t/W) + β2 cos(2π w_t/W) + β3 log(y_{t−1} + 1)
 *                                + β4 rvc_{t−L} + β5 eipShare_{t−L} + β6 rain_{t−L}
 *
 * (w_t the epidemiological week, W the weeks in its year, L = DRIVER_LAG_WEEKS, drivers standardised on
 * the fitting weeks), fitted with the NB2 fit of shared/stats/negative-binomial.ts. Forecasts 1–8 weeks
 * ahead: the driver lag is as long as the longest horizon, so every driver a forecast needs was already
 * observed at its origin; the autoregressive term is carried forward by simulating paths (seeded), and the
 * predictive distribution at each horizon is the mixture of NB(μ, θ) over the paths' means.
 * Evaluated by rolling origin against the seasonal null (climatology of the same weeks). Pure: no I/O.
 */
import negativeBinomialRandom from '@stdlib/random-base-negative-binomial';
import { fitNegativeBinomial } from '../stats/negative-binomial';
import { seededRandom } from '../stats/random';
import { countMean, countQuantile, crpsCount, logScore, negativeBinomialMixture, type CountDistribution } from './scores';

export const OUTLOOK_HORIZONS = 8;
/** Drivers enter 8 weeks before the week they explain: every horizon up to 8 needs only observed drivers. */
export const DRIVER_LAG_WEEKS = 8;
/** A district needs this many usable fitting weeks (two seasons) and … */
export const MIN_FIT_WEEKS = 104;
/** … this many weeks with at least one case; otherwise it gets no outlook (no pooling, docs/outlook.md). */
export const MIN_CASE_WEEKS = 10;
/** Skill is only claimed when at least this many forecasts were scored at a horizon. */
export const MIN_SCORED = 26;
/**
 * The outlook "beats the null" at a horizon only when its CRPS is at least 5 % below the null's (and its
 * log score higher): Broodcast's own margin, so a skill within the noise of a short climatology is not
 * shown as skill (on counts unrelated to anything the measured CRPS skill is about 1–2 %, docs/outlook.md).
 */
export const MIN_CRPS_SKILL = 0.05;
/** A driver is used when it is known on this share of the fitting weeks (and varies). */
const DRIVER_COVERAGE = 0.9;
/** Paths simulated per forecast (live) and per origin (evaluation). */
export const LIVE_PATHS = 1000;
export const EVALUATION_PATHS = 200;
/** The evaluation refits every this many origins (the AR state still moves every week). */
export const REFIT_EVERY = 4;
/** The null model takes the same week ± this many weeks in earlier seasons. */
export const NULL_WINDOW = 2;

export const DRIVERS = ['rvc', 'eipShare', 'rain'] as const;
export type OutlookDriver = (typeof DRIVERS)[number];

/** One epidemiological week of a district's series, consecutive, oldest first. */
export interface OutlookWeek {
  year: number;
  week: number;
  weeksInYear: number;
  /** Cases reported for the week (null: no count). */
  cases: number | null;
  /** Weekly mean relative vectorial capacity (0–1), weekly mean EIP share of the lifetime, weekly rain (mm). */
  rvc: number | null;
  eipShare: number | null;
  rain: number | null;
}

export class OutlookDataError extends Error {
  constructor(readonly code: 'too_little_data' | 'no_count_at_origin') {
    super(code);
  }
}

export interface OutlookFit {
  /** Names of the coefficients, intercept first. */
  terms: string[];
  coefficients: number[];
  standardErrors: number[];
  theta: number;
  drivers: OutlookDriver[];
  /** Standardisation of each used driver on the fitting weeks. */
  scale: Record<string, { mean: number; sd: number }>;
  rows: number;
  converged: boolean;
}

const TWO_PI = 2 * Math.PI;
const phase = (w: OutlookWeek) => (TWO_PI * (w.week - 0.5)) / w.weeksInYear;

function rowCovariates(series: readonly OutlookWeek[], t: number, prev: number, fit: Pick<OutlookFit, 'drivers' | 'scale'>): number[] | null {
  const w = series[t];
  const x = [Math.sin(phase(w)), Math.cos(phase(w)), Math.log(prev + 1)];
  for (const d of fit.drivers) {
    const v = t - DRIVER_LAG_WEEKS >= 0 ? series[t - DRIVER_LAG_WEEKS][d] : null;
    const s = fit.scale[d];
    if (v === null || !Number.isFinite(v)) return null;
    x.push((v - s.mean) / s.sd);
  }
  return x;
}

/** Fits the outlook on the weeks with index ≤ `last` (only those are known at that origin). */
export function fitOutlook(series: readonly OutlookWeek[], last = series.length - 1): OutlookFit {
  const candidates: number[] = [];
  for (let t = Math.max(1, DRIVER_LAG_WEEKS); t <= last; t++) if (series[t].cases !== null && series[t - 1].cases !== null) candidates.push(t);
  if (candidates.length < MIN_FIT_WEEKS) throw new OutlookDataError('too_little_data');
  const drivers: OutlookDriver[] = [];
  const scale: Record<string, { mean: number; sd: number }> = {};
  for (const d of DRIVERS) {
    const vals = candidates.map((t) => series[t - DRIVER_LAG_WEEKS][d]).filter((v): v is number => v !== null && Number.isFinite(v));
    if (vals.length < DRIVER_COVERAGE * candidates.length) continue;
    const mean = vals.reduce((a, b) => a + b, 0) / vals.length;
    const sd = Math.sqrt(vals.reduce((a, b) => a + (b - mean) ** 2, 0) / Math.max(1, vals.length - 1));
    if (!(sd > 1e-9)) continue;
    drivers.push(d);
    scale[d] = { mean, sd };
  }
  const y: number[] = [];
  const x: number[][] = [];
  for (const t of candidates) {
    const row = rowCovariates(series, t, series[t - 1].cases!, { drivers, scale });
    if (!row) continue;
    y.push(series[t].cases!);
    x.push(row);
  }
  if (y.length < MIN_FIT_WEEKS || y.filter((v) => v > 0).length < MIN_CASE_WEEKS) throw new OutlookDataError('too_little_data');
  const fit = fitNegativeBinomial({ y, x });
  return {
    terms: ['intercept', 'season_sin', 'season_cos', 'log_cases_last_week', ...drivers.map((d) => `${d}_lag${DRIVER_LAG_WEEKS}`)],
    coefficients: fit.coefficients, standardErrors: fit.standardErrors, theta: fit.theta, drivers, scale, rows: y.length, converged: fit.converged,
  };
}

export interface HorizonForecast {
  horizon: number;
  /** Index into the series of the week forecast (may be past the end). */
  index: number;
  distribution: CountDistribution;
}

/**
 * Forecasts 1…horizons weeks after `origin` (the last week whose count is known): `paths` paths, each
 * drawing y_{t} ~ NB(μ_t, θ) and carrying it into the next week's autoregressive term. A driver value
 * missing 8 weeks before a forecast week is taken at its fitting mean (0 once standardised).
 */
export function forecastOutlook(
  series: readonly OutlookWeek[], fit: OutlookFit, origin: number, opts: { horizons?: number; paths?: number; seed?: number; atLeast?: (h: number) => number } = {},
): HorizonForecast[] {
  const H = opts.horizons ?? OUTLOOK_HORIZONS;
  const M = opts.paths ?? LIVE_PATHS;
  const start = series[origin]?.cases;
  if (start === null || start === undefined) throw new OutlookDataError('no_count_at_origin');
  // stdlib's NB(r, p) counts failures before r successes: mean r(1 − p)/p, so r = θ, p = θ/(θ + μ).
  const draw = negativeBinomialRandom.factory({ prng: seededRandom(opts.seed ?? 1) });
  const theta = fit.theta;
  const beta = fit.coefficients;
  const prev = new Float64Array(M).fill(start);
  const out: HorizonForecast[] = [];
  for (let h = 1; h <= H; h++) {
    const t = origin + h;
    const w = weekAfter(series, t);
    const base = [Math.sin(phase(w)), Math.cos(phase(w))];
    let linDrivers = 0;
    fit.drivers.forEach((d, j) => {
      const src = t - DRIVER_LAG_WEEKS;
      const v = src >= 0 && src < series.length ? series[src][d] : null;
      const s = fit.scale[d];
      const z = v === null || !Number.isFinite(v) ? 0 : (v - s.mean) / s.sd;
      linDrivers += beta[4 + j] * z;
    });
    const fixed = beta[0] + beta[1] * base[0] + beta[2] * base[1] + linDrivers;
    const mus = new Float64Array(M);
    for (let p = 0; p < M; p++) {
      const mu = Math.exp(fixed + beta[3] * Math.log(prev[p] + 1));
      mus[p] = mu;
      prev[p] = mu > 0 ? draw(theta, theta / (theta + mu)) : 0;
    }
    out.push({ horizon: h, index: t, distribution: negativeBinomialMixture(mus, theta, opts.atLeast?.(h) ?? 0) });
  }
  return out;
}

/** The week at index t, extending the series past its end week by week. */
export function weekAfter(series: readonly OutlookWeek[], t: number): OutlookWeek {
  if (t < series.length) return series[t];
  let { year, week, weeksInYear } = series[series.length - 1];
  for (let i = series.length - 1; i < t; i++) {
    week += 1;
    if (week > weeksInYear) {
      year += 1;
      week = 1;
      // The year after a 53-week year has 52; a 52-week year is taken to be followed by 52 (close enough for a phase).
      weeksInYear = 52;
    }
  }
  return { year, week, weeksInYear, cases: null, rvc: null, eipShare: null, rain: null };
}

/**
 * The seasonal null for week index t as known at `origin`: the counts of the same week ± NULL_WINDOW in
 * earlier seasons (52 or 53 weeks back, and so on), known by the origin, as an NB with their mean and a
 * moment estimate of θ (θ = m²/(v − m), or a near-Poisson 1e6 when v ≤ m). The mean is floored at 0.05 so
 * a count after all-zero seasons keeps a finite log score (derived). Null when fewer than two seasons.
 */
export function climatologyNull(series: readonly OutlookWeek[], t: number, origin: number, atLeast = 0): CountDistribution | null {
  const vals: number[] = [];
  let seasons = 0;
  for (let k = 1; ; k++) {
    const centre = t - Math.round(52.1775 * k);
    if (centre + NULL_WINDOW < 0) break;
    let any = false;
    for (let d = -NULL_WINDOW; d <= NULL_WINDOW; d++) {
      const i = centre + d;
      if (i < 0 || i > origin || i >= series.length) continue;
      const c = series[i].cases;
      if (c === null) continue;
      vals.push(c);
      any = true;
    }
    if (any) seasons += 1;
  }
  if (seasons < 2) return null;
  const m = Math.max(0.05, vals.reduce((a, b) => a + b, 0) / vals.length);
  const v = vals.reduce((a, b) => a + (b - m) ** 2, 0) / Math.max(1, vals.length - 1);
  const theta = v > m ? (m * m) / (v - m) : 1e6;
  return negativeBinomialMixture([m], theta, atLeast);
}

export interface HorizonSkill {
  horizon: number;
  /** Forecasts scored (the same weeks for the outlook and the null). */
  scored: number;
  logScore: number | null;
  nullLogScore: number | null;
  crps: number | null;
  nullCrps: number | null;
  /** 1 − CRPS / CRPS of the null: above 0 the outlook is closer to what happened. */
  crpsSkill: number | null;
  /** Mean log score minus the null's (nats per forecast): above 0 the outlook gave what happened more probability. */
  logScoreGain: number | null;
  /** Share of weeks inside the central 80 % / 50 % predictive intervals [q10, q90] / [q25, q75]. */
  coverage80: number | null;
  coverage50: number | null;
  /** Enough forecasts scored, CRPS skill ≥ MIN_CRPS_SKILL and log-score gain > 0. */
  beatsNull: boolean;
}

export interface OutlookEvaluation {
  horizons: HorizonSkill[];
  origins: number;
  /** Origins where the fit failed (too little data so far or no convergence); they are skipped. */
  skippedOrigins: number;
  firstOrigin: { year: number; week: number } | null;
  lastOrigin: { year: number; week: number } | null;
}

/**
 * Rolling-origin evaluation: at each past week with a count, fit on the weeks known then (refitting every
 * REFIT_EVERY origins), forecast 1–8 weeks ahead and score the forecast and the seasonal null on each
 * week ahead whose count is known — log score, CRPS and interval coverage, per horizon.
 */
export function evaluateOutlook(series: readonly OutlookWeek[], opts: { paths?: number; seed?: number; refitEvery?: number; horizons?: number } = {}): OutlookEvaluation {
  const H = opts.horizons ?? OUTLOOK_HORIZONS;
  const acc = Array.from({ length: H }, () => ({ n: 0, ls: 0, nls: 0, crps: 0, ncrps: 0, in80: 0, in50: 0 }));
  let fit: OutlookFit | null = null;
  let sinceFit = Infinity;
  let origins = 0;
  let skipped = 0;
  let first: number | null = null;
  let last: number | null = null;
  const seed = opts.seed ?? 1;
  for (let o = MIN_FIT_WEEKS + DRIVER_LAG_WEEKS; o < series.length - 1; o++) {
    if (series[o].cases === null) continue;
    if (sinceFit >= (opts.refitEvery ?? REFIT_EVERY) || !fit) {
      try {
        fit = fitOutlook(series, o);
        sinceFit = 0;
      } catch {
        fit = null;
        skipped += 1;
        continue;
      }
    }
    sinceFit += 1;
    const observed = (h: number) => (o + h < series.length ? series[o + h].cases : null);
    const forecasts = forecastOutlook(series, fit, o, { horizons: Math.min(H, series.length - 1 - o), paths: opts.paths ?? EVALUATION_PATHS, seed: seed + o, atLeast: (h) => observed(h) ?? 0 });
    origins += 1;
    first ??= o;
    last = o;
    for (const f of forecasts) {
      const y = observed(f.horizon);
      if (y === null) continue;
      const nul = climatologyNull(series, f.index, o, y);
      if (!nul) continue;
      const ls = logScore(f.distribution, y);
      const nls = logScore(nul, y);
      if (!Number.isFinite(ls) || !Number.isFinite(nls)) continue;
      const a = acc[f.horizon - 1];
      a.n += 1;
      a.ls += ls;
      a.nls += nls;
      a.crps += crpsCount(f.distribution, y);
      a.ncrps += crpsCount(nul, y);
      if (y >= countQuantile(f.distribution, 0.1) && y <= countQuantile(f.distribution, 0.9)) a.in80 += 1;
      if (y >= countQuantile(f.distribution, 0.25) && y <= countQuantile(f.distribution, 0.75)) a.in50 += 1;
    }
  }
  const at = (i: number | null) => (i === null ? null : { year: series[i].year, week: series[i].week });
  return {
    origins, skippedOrigins: skipped, firstOrigin: at(first), lastOrigin: at(last),
    horizons: acc.map((a, i) => {
      if (a.n === 0) return { horizon: i + 1, scored: 0, logScore: null, nullLogScore: null, crps: null, nullCrps: null, crpsSkill: null, logScoreGain: null, coverage80: null, coverage50: null, beatsNull: false };
      const crpsSkill = a.ncrps > 0 ? 1 - a.crps / a.ncrps : null;
      const logScoreGain = (a.ls - a.nls) / a.n;
      return {
        horizon: i + 1, scored: a.n, logScore: a.ls / a.n, nullLogScore: a.nls / a.n, crps: a.crps / a.n, nullCrps: a.ncrps / a.n,
        crpsSkill, logScoreGain, coverage80: a.in80 / a.n, coverage50: a.in50 / a.n,
        beatsNull: a.n >= MIN_SCORED && crpsSkill !== null && crpsSkill >= MIN_CRPS_SKILL && logScoreGain > 0,
      };
    }),
  };
}

export const OUTLOOK_QUANTILES = { q10: 0.1, q25: 0.25, q50: 0.5, q75: 0.75, q90: 0.9 } as const;

export interface OutlookWeekForecast {
  horizon: number;
  year: number;
  week: number;
  mean: number;
  q10: number;
  q25: number;
  q50: number;
  q75: number;
  q90: number;
}

export interface DistrictOutlook {
  status: 'ok' | 'too_little_data';
  origin: { year: number; week: number; cases: number } | null;
  fit: OutlookFit | null;
  forecast: OutlookWeekForecast[];
  evaluation: OutlookEvaluation | null;
  /** The fan is drawn for horizons 1…fanHorizons: those up to the first at which the outlook does not beat the null. */
  fanHorizons: number;
}

/**
 * The outlook of one district: fit on everything known, forecast from the last week with a count, and the
 * rolling-origin skill that decides how far (if at all) the fan may be shown.
 */
export function districtOutlook(series: readonly OutlookWeek[], opts: { seed?: number; paths?: number; evaluationPaths?: number } = {}): DistrictOutlook {
  let origin = series.length - 1;
  while (origin >= 0 && series[origin].cases === null) origin--;
  const empty: DistrictOutlook = { status: 'too_little_data', origin: null, fit: null, forecast: [], evaluation: null, fanHorizons: 0 };
  if (origin < 0) return empty;
  let fit: OutlookFit;
  try {
    fit = fitOutlook(series, origin);
  } catch (err) {
    if (err instanceof OutlookDataError) return { ...empty, origin: { year: series[origin].year, week: series[origin].week, cases: series[origin].cases! } };
    throw err;
  }
  const forecasts = forecastOutlook(series, fit, origin, { paths: opts.paths ?? LIVE_PATHS, seed: opts.seed ?? 1 });
  const evaluation = evaluateOutlook(series.slice(0, origin + 1), { seed: opts.seed ?? 1, paths: opts.evaluationPaths });
  let fanHorizons = 0;
  for (const h of evaluation.horizons) {
    if (!h.beatsNull) break;
    fanHorizons = h.horizon;
  }
  return {
    status: 'ok', origin: { year: series[origin].year, week: series[origin].week, cases: series[origin].cases! }, fit, evaluation, fanHorizons,
    forecast: forecasts.map((f) => {
      const w = weekAfter(series, f.index);
      const q = (p: number) => countQuantile(f.distribution, p);
      return { horizon: f.horizon, year: w.year, week: w.week, mean: countMean(f.distribution), q10: q(0.1), q25: q(0.25), q50: q(0.5), q75: q(0.75), q90: q(0.9) };
    }),
  };
}
