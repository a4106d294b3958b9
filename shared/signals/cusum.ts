import type { SignalSeries } from './aberration';
import { cusumInputSchema, type CusumInput } from './schemas';

/**
 * One-sided upper CUSUM of a standardised weekly series (Page 1954, "Continuous inspection schemes",
 * Biometrika 41:100–115, in its tabular form): S_0 = 0, S_t = max(0, S_{t−1} + (x_t − μ)/σ − k),
 * alarm when S_t > h. The sum is not reset after an alarm; a caller that wants a restart after a
 * signed-off flag starts a new series. k = 0.5 and h of 4 to 5 are common practice.
 * Every week has a value (no baseline to wait for), so no entry is null.
 */
export function cusum(input: CusumInput): SignalSeries {
  const { series, mean, sd, k, h } = cusumInputSchema.parse(input);
  const statistic: number[] = [];
  let s = 0;
  for (const x of series) {
    s = Math.max(0, s + (x - mean) / sd - k);
    statistic.push(s);
  }
  return { statistic, alarm: statistic.map((v) => v > h) };
}
