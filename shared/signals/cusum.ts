import type { SignalSeries } from './aberration';
import { cusumInputSchema, type CusumInput } from './schemas';

/**
 * One-sided upper CUSUM of a standardised weekly series (Page 1954, "Continuous inspection schemes",
 * Biometrika 41:100–115, in its tabular form): S_0 = 0, S_t = max(0, S_{t−1} + (x_t − μ)/σ − k),
 * alarm when S_t > h. With `restart`, the week after an alarm starts again from S = 0 (common
 * practice once a signal has been acted on, so a falling series leaves the alarm instead of carrying
 * the old excess for weeks; Montgomery, Introduction to Statistical Quality Control, CUSUM chapter
 * [from memory]). Without it the sum is never reset (Page's plain form).
 * k = 0.5 and h of 4 to 5 are common practice.
 * Every week has a value (no baseline to wait for), so no entry is null.
 */
export function cusum(input: CusumInput): SignalSeries {
  const { series, mean, sd, k, h, restart } = cusumInputSchema.parse(input);
  const statistic: number[] = [];
  let s = 0;
  for (const x of series) {
    s = Math.max(0, s + (x - mean) / sd - k);
    statistic.push(s);
    if (restart && s > h) s = 0;
  }
  return { statistic, alarm: statistic.map((v) => v > h) };
}
