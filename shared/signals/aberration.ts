import { mean, sampleSd } from './descriptive';
import {
  aberrationMethodSchema,
  DEFAULT_SD_FLOOR,
  sdFloorSchema,
  seriesSchema,
  type AberrationMethod,
} from './schemas';

/**
 * Aberration tests C1, C2 and C3 after Hutwagner, Thompson, Seeman & Treadwell 2003, J. Urban Health
 * 80(Suppl 1):i89–i96. Weekly units here; the paper's unit is the day, the arithmetic is the same.
 */

/** Per-week statistic and alarm, one entry per week of the input; `null` until the baseline is complete. */
export interface SignalSeries {
  statistic: (number | null)[];
  alarm: (boolean | null)[];
}

export interface AberrationOptions {
  /**
   * Smallest SD divided by, in the series' unit (default {@link DEFAULT_SD_FLOOR}). The SD used is
   * max(sample SD, sdFloor), so a flat baseline never divides by zero (docs/signals.md, "Zero SD").
   */
  sdFloor?: number;
}

/** Weeks in the C1 / C2 baseline. */
export const BASELINE_WEEKS = 7;
/** Weeks left out between the C2 baseline and the current week. */
export const C2_GAP_WEEKS = 2;
/** C1 and C2 alarm when the statistic exceeds this many SDs. */
export const C1_C2_ALARM = 3;
/** C3 alarms when its sum exceeds this. */
export const C3_ALARM = 2;

/** Mean, SD and alarm threshold (in counts) of one baseline. */
export interface BaselineSummary {
  mean: number;
  /** Sample SD of the baseline (divisor n − 1). */
  sd: number;
  /** SD actually divided by: max(sd, sdFloor). */
  sdUsed: number;
  /** The count above which C1 / C2 alarm: mean + 3·sdUsed. */
  threshold: number;
}

/** Summary of a baseline of at least two weeks, with the zero-SD rule applied. */
export function summariseBaseline(baseline: readonly number[], sdFloor = DEFAULT_SD_FLOOR): BaselineSummary {
  const values = seriesSchema.min(2).parse(baseline);
  const floor = sdFloorSchema.parse(sdFloor);
  const m = mean(values);
  const sd = sampleSd(values);
  const sdUsed = Math.max(sd, floor);
  return { mean: m, sd, sdUsed, threshold: m + C1_C2_ALARM * sdUsed };
}

/**
 * (x_t − mean)/SD over the 7 weeks ending `lag` weeks before t; null while those weeks are not all
 * in the series. lag 1 is C1 (the 7 preceding weeks), lag 3 is C2 (a 2-week gap).
 */
function standardisedAgainstBaseline(series: readonly number[], lag: number, sdFloor: number): (number | null)[] {
  return series.map((x, t) => {
    const end = t - lag; // last baseline week, inclusive
    const start = end - BASELINE_WEEKS + 1;
    if (start < 0) return null;
    const baseline = series.slice(start, end + 1);
    const sdUsed = Math.max(sampleSd(baseline), sdFloor);
    return (x - mean(baseline)) / sdUsed;
  });
}

function parseCommon(series: readonly number[], options: AberrationOptions): { s: number[]; floor: number } {
  return {
    s: seriesSchema.parse(series),
    floor: sdFloorSchema.parse(options.sdFloor ?? DEFAULT_SD_FLOOR),
  };
}

const withAlarm = (statistic: (number | null)[], limit: number): SignalSeries => ({
  statistic,
  alarm: statistic.map((v) => (v === null ? null : v > limit)),
});

/** C1: baseline = the 7 weeks before the current one; alarm when the statistic exceeds 3. */
export function c1(series: readonly number[], options: AberrationOptions = {}): SignalSeries {
  const { s, floor } = parseCommon(series, options);
  return withAlarm(standardisedAgainstBaseline(s, 1, floor), C1_C2_ALARM);
}

/** C2: baseline = the 7 weeks ending 3 weeks before the current one; alarm when the statistic exceeds 3. */
export function c2(series: readonly number[], options: AberrationOptions = {}): SignalSeries {
  const { s, floor } = parseCommon(series, options);
  return withAlarm(standardisedAgainstBaseline(s, 1 + C2_GAP_WEEKS, floor), C1_C2_ALARM);
}

/**
 * C3: Σ max(0, C2 − 1) over the current and the two preceding weeks; alarm when the sum exceeds 2.
 * Null until three C2 statistics exist (from the 12th week of the series).
 */
export function c3(series: readonly number[], options: AberrationOptions = {}): SignalSeries {
  const { s, floor } = parseCommon(series, options);
  const c2Stat = standardisedAgainstBaseline(s, 1 + C2_GAP_WEEKS, floor);
  const statistic = c2Stat.map((_, t) => {
    if (t < 2) return null;
    let sum = 0;
    for (let i = t - 2; i <= t; i++) {
      const v = c2Stat[i];
      if (v === null) return null;
      sum += Math.max(0, v - 1);
    }
    return sum;
  });
  return withAlarm(statistic, C3_ALARM);
}

/** C1, C2 or C3 by name. */
export function aberration(
  method: AberrationMethod,
  series: readonly number[],
  options: AberrationOptions = {},
): SignalSeries {
  switch (aberrationMethodSchema.parse(method)) {
    case 'c1':
      return c1(series, options);
    case 'c2':
      return c2(series, options);
    case 'c3':
      return c3(series, options);
  }
}
