import { doublingFitSeriesSchema, growthInputSchema, nonNegativeNumberSchema } from './schemas';

/** Growth from one week to the next. Both null when the earlier week is zero (no ratio exists). */
export interface WeekGrowth {
  /** current / previous. */
  ratio: number | null;
  /** (ratio − 1) · 100: +50 means half again as many cases as the week before. */
  percent: number | null;
  /** ln 2 / ln(ratio) in weeks, only where the ratio is above 1; null otherwise. */
  doublingWeeks: number | null;
}

/**
 * Doubling time in weeks for a constant weekly ratio r: ln 2 / ln r, defined only where r > 1
 * (exponential growth; common practice). Null for r ≤ 1: no growth, no doubling.
 */
export function doublingTime(ratio: number): number | null {
  const r = nonNegativeNumberSchema.parse(ratio);
  return r > 1 ? Math.LN2 / Math.log(r) : null;
}

/** Week-on-week growth from `previous` to `current` (counts or rates). */
export function weekOnWeekGrowth(previous: number, current: number): WeekGrowth {
  const p = growthInputSchema.parse({ previous, current });
  if (p.previous === 0) return { ratio: null, percent: null, doublingWeeks: null };
  const ratio = p.current / p.previous;
  return { ratio, percent: (ratio - 1) * 100, doublingWeeks: doublingTime(ratio) };
}

/** Week-on-week growth along a series: entry t compares week t with week t − 1; entry 0 is all null. */
export function growthSeries(series: readonly number[]): WeekGrowth[] {
  const s = nonNegativeNumberSchema.array().parse(series);
  return s.map((x, t) =>
    t === 0 ? { ratio: null, percent: null, doublingWeeks: null } : weekOnWeekGrowth(s[t - 1], x),
  );
}

/** Weekly growth estimated from a short log-linear fit. */
export interface FittedGrowth {
  /** Least-squares slope of ln(count) on the week index, per week. */
  slope: number;
  /** e^slope: the fitted weekly ratio. */
  ratio: number;
  /** ln 2 / slope where the slope is positive; null otherwise. */
  doublingWeeks: number | null;
}

/**
 * Growth from an ordinary least-squares fit of ln(count) on the week index 0 … n − 1, over the few
 * weeks given (the caller picks the window, 3 to 6 weeks is typical). A fit smooths the noise of a
 * single week-on-week ratio; doubling time = ln 2 / slope. Every count must be above zero (the log
 * of zero does not exist); a window with a zero week gets no fit here.
 */
export function logLinearGrowth(counts: readonly number[]): FittedGrowth {
  const y = doublingFitSeriesSchema.parse(counts).map(Math.log);
  const n = y.length;
  const xBar = (n - 1) / 2;
  const yBar = y.reduce((a, b) => a + b, 0) / n;
  let sxy = 0;
  let sxx = 0;
  y.forEach((yi, i) => {
    sxy += (i - xBar) * (yi - yBar);
    sxx += (i - xBar) * (i - xBar);
  });
  const slope = sxy / sxx;
  return { slope, ratio: Math.exp(slope), doublingWeeks: slope > 0 ? Math.LN2 / slope : null };
}
