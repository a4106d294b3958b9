/**
 * Plausibility of incoming weather values before they reach the model (issue 16, "Plausibility before the
 * model"; docs/weather-intake.md § Plausibility). Pure: the intake gathers the samples.
 *
 * Method: the modified z-score on the median absolute deviation, Mi = 0.6745 (xi − median) / MAD, with
 * |Mi| > 3.5 named a potential outlier (Iglewicz & Hoaglin 1993, "How to Detect and Handle Outliers",
 * ASQC Basic References in Quality Control vol. 16). The sample is the station's own stored values for
 * the same time of year (± 15 days, every stored year): a climatological limit check as WMO guidance
 * on the quality control of surface observations describes it (WMO-No. 488, Guide to the Global
 * Observing System; WMO-No. 8, Guide to Instruments and Methods of Observation), made robust. With too
 * little history, the sample is the neighbouring stations' values of those days, brought to the station's
 * elevation with the standard environmental lapse rate of 6.5 °C/km (ICAO 1993, Manual of the ICAO
 * Standard Atmosphere, Doc 7488). The broad physical bounds are the intake's row checks (qc.ts LIMITS).
 *
 * Hand-written rather than taken from a package: the median and MAD are a few lines, and the intake
 * calls them per station and block of days on typed arrays, in place, where a general statistics package
 * would copy and sort.
 */

/** |Mi| above this is implausible (Iglewicz & Hoaglin 1993). */
export const MODIFIED_Z_LIMIT = 3.5;
/** 0.6745: the 0.75 quantile of the standard normal, so that E[MAD]/0.6745 = σ for normal data. */
export const MAD_CONSTANT = 0.6745;
/** Days either side of the day of year whose stored values make the sample. */
export const WINDOW_DAYS = 15;
/** Fewest values for a sample to judge by (derived: 30 values, e.g. one month of one year or a day ± 15 in a single year). */
export const MIN_SAMPLE = 30;
/**
 * Smallest MAD used (derived): a sample of nearly equal values (a run of repeated readings) would otherwise
 * call any change implausible. 1 °C for temperatures (then |x − median| > 5.2 °C is needed), 3 % for RH.
 */
export const MAD_FLOOR = { temperature: 1, rh: 3 } as const;

export interface RobustStats {
  median: number;
  mad: number;
  n: number;
}

/** The k-th smallest of a[lo..hi] (Hoare's selection, in place, expected linear time; a sort would be n log n). */
function select(a: Float64Array, lo: number, hi: number, k: number): number {
  while (hi > lo) {
    const pivot = a[(lo + hi) >> 1];
    let i = lo;
    let j = hi;
    while (i <= j) {
      while (a[i] < pivot) i++;
      while (a[j] > pivot) j--;
      if (i <= j) {
        const t = a[i];
        a[i] = a[j];
        a[j] = t;
        i++;
        j--;
      }
    }
    if (k <= j) hi = j;
    else if (k >= i) lo = i;
    else return a[k];
  }
  return a[k];
}

/** Median of the first `n` values of `a` (reordered in place). */
function medianOf(a: Float64Array, n: number): number {
  const hi = select(a, 0, n - 1, n >> 1);
  if (n % 2) return hi;
  // The lower middle is the largest of the values left of n/2 after the selection.
  let lo = -Infinity;
  for (let i = 0; i < n >> 1; i++) if (a[i] > lo) lo = a[i];
  return (lo + hi) / 2;
}

/** Median and median absolute deviation of the first `n` values of `sample` (the array is reordered). */
export function robustStats(sample: Float64Array, n: number): RobustStats {
  if (n === 0) return { median: Number.NaN, mad: Number.NaN, n };
  const median = medianOf(sample, n);
  for (let i = 0; i < n; i++) sample[i] = Math.abs(sample[i] - median);
  return { median, mad: medianOf(sample, n), n };
}

/** Modified z-score of x against the stats, the MAD floored at `floor`. */
export const modifiedZ = (x: number, s: RobustStats, floor: number) => (MAD_CONSTANT * (x - s.median)) / Math.max(s.mad, floor);

/** Day of the year, 0-based, from a day number (days since 1970-01-01). */
export function dayOfYear(day: number): number {
  const year = new Date(day * 86_400_000).getUTCFullYear();
  return day - Date.UTC(year, 0, 1) / 86_400_000;
}

/** Circular distance between two days of the year (0-based), on a 365.25-day year. */
export function doyDistance(a: number, b: number): number {
  const d = Math.abs(a - b);
  return Math.min(d, 365.25 - d);
}

export type PlausibilityBasis = 'station' | 'neighbours';
export type HeldReason = 'looks_fahrenheit' | 'looks_celsius' | 'unlike_station_history' | 'unlike_neighbours';

/** One implausible value of a row, with the figures its report line names. */
export interface HeldFinding {
  column: 'tmin' | 'tmax' | 'rh';
  value: number;
  median: number;
  mad: number;
  z: number;
  n: number;
  basis: PlausibilityBasis;
  /** The value read in the other temperature unit (°C), when that reading is plausible. */
  alternative: number | null;
}

/**
 * The reason a held row gets: when every implausible value is a temperature and each fits far better read
 * in the other unit, the unit is named (looks_fahrenheit for a °C upload, looks_celsius for a °F one);
 * otherwise the basis of the check.
 */
export function heldReason(findings: HeldFinding[], tempUnit: 'C' | 'F'): HeldReason {
  if (findings.length && findings.every((f) => f.column !== 'rh' && f.alternative !== null))
    return tempUnit === 'C' ? 'looks_fahrenheit' : 'looks_celsius';
  return findings.some((f) => f.basis === 'station') ? 'unlike_station_history' : 'unlike_neighbours';
}

/**
 * A temperature as entered, read in the other unit, in °C: a °C upload's value read as °F ((x − 32) × 5/9),
 * or a °F upload's value (stored in °C) read back as the °C it may have been meant as (x × 9/5 + 32).
 */
export const otherUnitReading = (celsius: number, tempUnit: 'C' | 'F') =>
  tempUnit === 'C' ? ((celsius - 32) * 5) / 9 : (celsius * 9) / 5 + 32;

/**
 * Judge one value against its sample: implausible when |Mi| > 3.5. For a temperature, the other unit's
 * reading is judged too; `alternative` is that reading when it is plausible.
 */
export function judge(
  x: number, stats: RobustStats, kind: 'temperature' | 'rh', tempUnit: 'C' | 'F',
): { implausible: boolean; z: number; alternative: number | null } {
  const floor = MAD_FLOOR[kind];
  const z = modifiedZ(x, stats, floor);
  if (Math.abs(z) <= MODIFIED_Z_LIMIT) return { implausible: false, z, alternative: null };
  if (kind !== 'temperature') return { implausible: true, z, alternative: null };
  const alt = otherUnitReading(x, tempUnit);
  const altZ = modifiedZ(alt, stats, floor);
  return { implausible: true, z, alternative: Math.abs(altZ) <= MODIFIED_Z_LIMIT ? Math.round(alt * 100) / 100 : null };
}
