/**
 * Proper scores of a predictive distribution of a count (docs/outlook.md § Scores). Pure.
 *
 * - Log score: log p(y), the log of the probability the forecast gave to what happened (higher is better;
 *   Gneiting & Raftery 2007, JASA 102:359, §4.1; Czado, Gneiting & Held 2009, Biometrics 65:1254, Table 1).
 * - CRPS for a count: Σ_{k ≥ 0} (F(k) − 1{y ≤ k})² (Czado, Gneiting & Held 2009, §2.2, the ranked
 *   probability score with infinitely many categories; lower is better, in cases).
 *
 * Hand-written: no listed package scores a count distribution given as a probability table.
 */

/** Probabilities P(Y = 0 … K) of a predictive count distribution (the mass above K is below 1e-9). */
export interface CountDistribution {
  pmf: Float64Array;
}

/** The log score log p(y); −Infinity when the forecast gave y no probability. */
export function logScore(d: CountDistribution, y: number): number {
  const p = y < d.pmf.length ? d.pmf[y] : 0;
  return p > 0 ? Math.log(p) : -Infinity;
}

/** CRPS of a count distribution at y: Σ_k (F(k) − 1{y ≤ k})², summed until F reaches 1 (within 1e-12) beyond y. */
export function crpsCount(d: CountDistribution, y: number): number {
  let cdf = 0;
  let s = 0;
  const K = d.pmf.length;
  for (let k = 0; k < K || k < y; k++) {
    cdf += k < K ? d.pmf[k] : 0;
    const ind = y <= k ? 1 : 0;
    s += (cdf - ind) * (cdf - ind);
  }
  return s;
}

/** The smallest k with F(k) ≥ p. */
export function countQuantile(d: CountDistribution, p: number): number {
  let cdf = 0;
  for (let k = 0; k < d.pmf.length; k++) {
    cdf += d.pmf[k];
    if (cdf >= p - 1e-12) return k;
  }
  return d.pmf.length - 1;
}

/** The mean Σ k·p(k). */
export function countMean(d: CountDistribution): number {
  let m = 0;
  for (let k = 0; k < d.pmf.length; k++) m += k * d.pmf[k];
  return m;
}

/**
 * The equal-weight mixture of NB(μ_j, θ) over the given means (the predictive of a simulated path
 * ensemble; one mean gives the NB itself), tabulated from 0 until the mass left is below `tailMass`
 * and at least up to `atLeast`. Each component by the recurrence P(0) = (θ/(θ+μ))^θ,
 * P(k+1) = P(k)·(k + θ)/(k + 1)·μ/(θ + μ).
 */
export function negativeBinomialMixture(mus: ArrayLike<number>, theta: number, atLeast = 0, tailMass = 1e-9): CountDistribution {
  const m = mus.length;
  const w = 1 / m;
  let size = Math.max(16, atLeast + 1);
  let pmf = new Float64Array(size);
  // Identical means (the first week ahead) are one component.
  let same = true;
  for (let j = 1; j < m && same; j++) if (mus[j] !== mus[0]) same = false;
  const comps = same ? [mus[0]] : Array.from(mus);
  const weight = same ? 1 : w;
  for (const mu of comps) {
    if (!(mu > 0)) {
      pmf[0] += weight;
      continue;
    }
    const q = mu / (theta + mu);
    let pk = Math.exp(theta * Math.log(theta / (theta + mu)));
    let cdf = pk;
    let k = 0;
    if (pk > 0) pmf[0] += weight * pk;
    // Run until this component's own mass left is tiny and past the mode; stop at a hard cap.
    while ((1 - cdf > tailMass || k < mu || k < atLeast) && k < 2_000_000) {
      pk *= ((k + theta) / (k + 1)) * q;
      k += 1;
      cdf += pk;
      if (k >= size) {
        const grown = new Float64Array(Math.max(size * 2, k + 1));
        grown.set(pmf);
        pmf = grown;
        size = grown.length;
      }
      pmf[k] += weight * pk;
      if (pk === 0 && k > mu) break;
    }
  }
  // Trim trailing zeros beyond atLeast.
  let last = pmf.length - 1;
  while (last > atLeast && pmf[last] === 0) last--;
  return { pmf: pmf.subarray(0, last + 1) };
}
