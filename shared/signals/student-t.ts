/**
 * Two-sided quantile of Student's t distribution for integer degrees of freedom.
 *
 * Why hand-written: the project carries no statistics library, and the geometric endemic channel
 * needs only t for small integer df (n − 1 with n prior seasons). For integer ν the two-sided
 * probability A(t | ν) = P(|T| ≤ t) has a closed, finite form in θ = arctan(t / √ν)
 * (Abramowitz & Stegun 1964, Handbook of Mathematical Functions, 26.7.3 and 26.7.4):
 *
 *   ν = 1:      A = 2θ / π
 *   ν odd > 1:  A = (2/π)·[θ + sin θ·(cos θ + (2/3)cos³θ + … + (2·4···(ν−3))/(1·3···(ν−2))·cos^(ν−2)θ)]
 *   ν even:     A = sin θ·[1 + (1/2)cos²θ + (1·3)/(2·4)cos⁴θ + … + (1·3···(ν−3))/(2·4···(ν−2))·cos^(ν−2)θ]
 *
 * A rises monotonically from 0 to 1 as θ goes from 0 to π/2, so the quantile is found by bisection
 * on θ (no bracket to guess, no derivative), then t = √ν·tan θ. Sixty halvings of [0, π/2] reach
 * double precision. Exact to rounding for every integer ν; the series has ν/2 terms, which is cheap
 * for the df a channel sees. Checked against the NIST/SEMATECH table in tests/signals.
 */

/** P(|T| ≤ t) for T ~ Student t with `df` degrees of freedom, written in θ = arctan(t/√df). */
function twoSidedCoverageAt(theta: number, df: number): number {
  const s = Math.sin(theta);
  const c = Math.cos(theta);
  const c2 = c * c;
  if (df % 2 === 1) {
    if (df === 1) return (2 * theta) / Math.PI;
    // term_j = (2·4···(2j)) / (1·3···(2j+1)) · cos^(2j+1) θ, j = 0 … (df−3)/2
    let term = c;
    let sum = c;
    for (let j = 1; j <= (df - 3) / 2; j++) {
      term *= ((2 * j) / (2 * j + 1)) * c2;
      sum += term;
    }
    return (2 / Math.PI) * (theta + s * sum);
  }
  // term_j = (1·3···(2j−1)) / (2·4···(2j)) · cos^(2j) θ, j = 0 … (df−2)/2
  let term = 1;
  let sum = 1;
  for (let j = 1; j <= (df - 2) / 2; j++) {
    term *= ((2 * j - 1) / (2 * j)) * c2;
    sum += term;
  }
  return s * sum;
}

/**
 * The t value with P(|T| ≤ t) = `level` on `df` degrees of freedom, e.g. df 4 → 2.776 at 0.95.
 * @param df positive integer degrees of freedom
 * @param level two-sided coverage, strictly between 0 and 1 (default 0.95)
 */
export function studentTTwoSided(df: number, level = 0.95): number {
  if (!Number.isInteger(df) || df < 1) throw new RangeError(`df must be a positive integer, got ${df}`);
  if (!(level > 0 && level < 1)) throw new RangeError(`level must lie strictly between 0 and 1, got ${level}`);
  let lo = 0;
  let hi = Math.PI / 2;
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2;
    if (twoSidedCoverageAt(mid, df) < level) lo = mid;
    else hi = mid;
  }
  return Math.sqrt(df) * Math.tan((lo + hi) / 2);
}
