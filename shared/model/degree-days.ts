/**
 * Degree-days for one day from the day's minimum and maximum temperature (°C).
 *
 * Every sine and triangle method uses one general form (see docs/model.md):
 *   horizontal cutoff   DD = A(TL) − A(TU)
 *   vertical cutoff     DD = A(TL) − A(TU) − (TU − TL)·F(TU)
 *   intermediate cutoff DD = max(0, A(TL) − 2·A(TU))
 * where A(X) is the day's mean of max(0, T(t) − X) under the assumed daily curve and F(X) the share
 * of the day with T(t) > X. Sources: Baskerville & Emin 1969 (single sine); Allen 1976 (double sine,
 * cutoffs); Lindsey & Newman 1956, Sevacherian, Stern & Mueller 1977 (triangles); Zalom et al. 1983
 * (all cases); McMaster & Wilhelm 1997 (the two average interpretations).
 *
 * Double methods: the first half of the day runs on today's Tmin and Tmax, the second half on today's
 * Tmax and tomorrow's Tmin. When tomorrow's Tmin is not known (last day of a series, or a gap), today's
 * Tmin stands in, which is exactly the single method; the result says so (`nextTminFallback`).
 */

export const DEGREE_DAY_METHODS = [
  'average',
  'average-clamped',
  'single-sine',
  'double-sine',
  'single-triangle',
  'double-triangle',
] as const;
export type DegreeDayMethod = (typeof DEGREE_DAY_METHODS)[number];

export const CUTOFFS = ['horizontal', 'vertical', 'intermediate'] as const;
export type Cutoff = (typeof CUTOFFS)[number];

/** Integer codes for the fast path. */
export const METHOD_CODE: Readonly<Record<DegreeDayMethod, number>> = {
  average: 0,
  'average-clamped': 1,
  'single-sine': 2,
  'double-sine': 3,
  'single-triangle': 4,
  'double-triangle': 5,
};
export const CUTOFF_CODE: Readonly<Record<Cutoff, number>> = { horizontal: 0, vertical: 1, intermediate: 2 };

export function isDoubleMethod(method: DegreeDayMethod): boolean {
  return method === 'double-sine' || method === 'double-triangle';
}

const PI = Math.PI;
const HALF_PI = Math.PI / 2;

/** Sine curve between lo and hi: mean of max(0, T − x) over the day. */
export function sineExcess(lo: number, hi: number, x: number): number {
  if (x <= lo) return (lo + hi) / 2 - x;
  if (x >= hi) return 0;
  const mean = (lo + hi) / 2;
  const amp = (hi - lo) / 2;
  const s = (x - mean) / amp;
  // cos(asin(s)) = √(1 − s²)
  return ((mean - x) * (HALF_PI - Math.asin(s)) + amp * Math.sqrt(1 - s * s)) / PI;
}

/** Sine curve between lo and hi: share of the day with T > x. */
export function sineShareAbove(lo: number, hi: number, x: number): number {
  if (x < lo) return 1;
  if (x >= hi) return 0;
  const theta = Math.asin((x - (lo + hi) / 2) / ((hi - lo) / 2));
  return (HALF_PI - theta) / PI;
}

/** Triangle (linear rise and fall) between lo and hi: mean of max(0, T − x) over the day. */
export function triangleExcess(lo: number, hi: number, x: number): number {
  if (x <= lo) return (lo + hi) / 2 - x;
  if (x >= hi) return 0;
  const d = hi - x;
  return (d * d) / (2 * (hi - lo));
}

/** Triangle between lo and hi: share of the day with T > x. */
export function triangleShareAbove(lo: number, hi: number, x: number): number {
  if (x < lo) return 1;
  if (x >= hi) return 0;
  return (hi - x) / (hi - lo);
}

/**
 * One half-day (or a whole day for the single methods) on a curve between a and b, before the
 * intermediate floor: returns the horizontal amount, minus the part above TU for vertical and
 * intermediate cutoffs.
 */
function curvePart(triangle: boolean, cutoff: number, a: number, b: number, lower: number, upper: number): number {
  const lo = a < b ? a : b;
  const hi = a < b ? b : a;
  let h: number;
  let aboveUpper: number;
  if (triangle) {
    h = triangleExcess(lo, hi, lower) - triangleExcess(lo, hi, upper);
    if (cutoff === 0) return h;
    aboveUpper = cutoff === 1 ? (upper - lower) * triangleShareAbove(lo, hi, upper) : triangleExcess(lo, hi, upper);
  } else {
    h = sineExcess(lo, hi, lower) - sineExcess(lo, hi, upper);
    if (cutoff === 0) return h;
    aboveUpper = cutoff === 1 ? (upper - lower) * sineShareAbove(lo, hi, upper) : sineExcess(lo, hi, upper);
  }
  return h - aboveUpper;
}

/**
 * Fast path: degree-days from integer method and cutoff codes. `tminNext` NaN means "not known"
 * (the double methods then use today's Tmin). Returns NaN when Tmin or Tmax is NaN.
 * Expects lower < upper (upper may be Infinity).
 */
export function degreeDaysFast(
  methodCode: number,
  cutoffCode: number,
  lower: number,
  upper: number,
  tmin: number,
  tmax: number,
  tminNext: number,
): number {
  switch (methodCode) {
    case 0: {
      const v = (tmin + tmax) / 2 - lower;
      return v > 0 ? v : v === v ? 0 : Number.NaN;
    }
    case 1: {
      const lo = tmin < lower ? lower : tmin > upper ? upper : tmin;
      const hi = tmax < lower ? lower : tmax > upper ? upper : tmax;
      return (lo + hi) / 2 - lower;
    }
    case 2:
    case 4: {
      const v = curvePart(methodCode === 4, cutoffCode, tmin, tmax, lower, upper);
      return v > 0 ? v : v === v ? 0 : Number.NaN;
    }
    case 3:
    case 5: {
      const next = tminNext === tminNext ? tminNext : tmin;
      const tri = methodCode === 5;
      const v = 0.5 * (curvePart(tri, cutoffCode, tmin, tmax, lower, upper) + curvePart(tri, cutoffCode, tmax, next, lower, upper));
      return v > 0 ? v : v === v ? 0 : Number.NaN;
    }
    default:
      return Number.NaN;
  }
}

export interface DegreeDayInput {
  method: DegreeDayMethod;
  /** Ignored by the two average methods; default horizontal. */
  cutoff?: Cutoff;
  /** Lower developmental threshold, °C. */
  lower: number;
  /** Upper developmental threshold, °C (Infinity for none). */
  upper: number;
  tmin: number;
  tmax: number;
  /** Tomorrow's Tmin, for the double methods. */
  tminNext?: number | null;
}

export interface DegreeDayResult {
  degreeDays: number;
  /** True when a double method had no next-day Tmin and used today's (i.e. the single method). */
  nextTminFallback: boolean;
}

/**
 * Degree-days for one day. Tmin and Tmax are taken as the two ends of the day's curve (their order
 * does not change the result; the weather intake rejects Tmin > Tmax before the model sees it).
 * Throws RangeError for non-finite temperatures or lower ≥ upper.
 */
export function degreeDays(input: DegreeDayInput): DegreeDayResult {
  const { method, lower, upper, tmin, tmax } = input;
  const code = METHOD_CODE[method];
  if (code === undefined) throw new RangeError(`unknown degree-day method: ${String(method)}`);
  const cutoff = input.cutoff ?? 'horizontal';
  const cutoffCode = CUTOFF_CODE[cutoff];
  if (cutoffCode === undefined) throw new RangeError(`unknown cutoff: ${String(cutoff)}`);
  if (!Number.isFinite(tmin) || !Number.isFinite(tmax)) throw new RangeError('tmin and tmax must be finite numbers');
  if (!Number.isFinite(lower) || Number.isNaN(upper) || !(lower < upper)) {
    throw new RangeError('lower must be a finite number below upper');
  }
  const next = input.tminNext;
  if (next !== undefined && next !== null && !Number.isFinite(next)) throw new RangeError('tminNext must be finite');
  const hasNext = next !== undefined && next !== null;
  return {
    degreeDays: degreeDaysFast(code, cutoffCode, lower, upper, tmin, tmax, hasNext ? next : Number.NaN),
    nextTminFallback: isDoubleMethod(method) && !hasNext,
  };
}
