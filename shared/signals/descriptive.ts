/**
 * Small descriptive statistics shared by the channel and aberration functions. Callers validate
 * first; these assume finite numbers and the lengths stated.
 */

/** Arithmetic mean; needs at least one value. */
export function mean(values: readonly number[]): number {
  let sum = 0;
  for (const v of values) sum += v;
  return sum / values.length;
}

/** Sample standard deviation (divisor n − 1); needs at least two values. */
export function sampleSd(values: readonly number[]): number {
  const m = mean(values);
  let ss = 0;
  for (const v of values) ss += (v - m) * (v - m);
  return Math.sqrt(ss / (values.length - 1));
}

/**
 * Quantile p of a sample by linear interpolation between order statistics: Hyndman & Fan 1996,
 * "Sample quantiles in statistical packages", The American Statistician 50:361–365, definition 7:
 * h = (n − 1)·p, Q(p) = x₍⌊h⌋₎ + (h − ⌊h⌋)·(x₍⌊h⌋+1₎ − x₍⌊h⌋₎) on the sorted sample (0-based).
 */
export function quantileType7(values: readonly number[], p: number): number {
  const sorted = [...values].sort((a, b) => a - b);
  const h = (sorted.length - 1) * p;
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, sorted.length - 1);
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}
