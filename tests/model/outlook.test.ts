/**
 * The Case outlook (docs/outlook.md): its scores against hand-computed values, and its forecast and
 * rolling-origin evaluation on simulated data from a known negative binomial process.
 */
import negativeBinomialRandom from '@stdlib/random-base-negative-binomial';
import { describe, expect, it } from 'vitest';
import {
  climatologyNull, countQuantile, crpsCount, districtOutlook, evaluateOutlook, fitOutlook, forecastOutlook, logScore,
  negativeBinomialMixture, type OutlookWeek,
} from '../../shared/outlook';
import { seededRandom } from '../../shared/stats/random';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(1e-12, Math.abs(b));

describe('Scores of a count forecast', () => {
  // Derived by hand from the definitions in Czado, Gneiting & Held 2009 (Biometrics 65:1254, §2.2, Table 1):
  // CRPS(P, y) = Σ_k (F(k) − 1{y ≤ k})², log score = log p(y).
  const table = { pmf: Float64Array.from([0.2, 0.5, 0.3]) }; // F = 0.2, 0.7, 1.0

  it('when the count is 1 under P = (0.2, 0.5, 0.3), then the CRPS is 0.2² + 0.3² = 0.13 and the log score log 0.5 (derived)', () => {
    expect(rel(crpsCount(table, 1), 0.13)).toBeLessThan(1e-12);
    expect(rel(logScore(table, 1), Math.log(0.5))).toBeLessThan(1e-12);
  });

  it('when the count is 4, beyond the table, then the CRPS adds 1 for each of k = 0…3 (0.04 + 0.49 + 1 + 1) and the log score is −∞ (derived)', () => {
    expect(rel(crpsCount(table, 4), 2.53)).toBeLessThan(1e-12);
    expect(logScore(table, 4)).toBe(-Infinity);
  });

  it('when the forecast is a point mass at the count, then the CRPS is 0; a point mass 3 away scores 3 (derived: CRPS of a point forecast is the absolute error)', () => {
    expect(crpsCount({ pmf: Float64Array.from([0, 0, 1]) }, 2)).toBe(0);
    expect(rel(crpsCount({ pmf: Float64Array.from([0, 0, 1]) }, 5), 3)).toBeLessThan(1e-12);
  });

  it('when an NB(μ = 4, θ = 2) is tabulated, then it sums to 1, has mean 4 and P(0) = (θ/(θ+μ))^θ = 1/9 (derived)', () => {
    const d = negativeBinomialMixture([4], 2);
    const sum = d.pmf.reduce((a, b) => a + b, 0);
    const mean = d.pmf.reduce((a, p, k) => a + k * p, 0);
    expect(Math.abs(sum - 1)).toBeLessThan(1e-8);
    expect(rel(mean, 4)).toBeLessThan(1e-6);
    expect(rel(d.pmf[0], 1 / 9)).toBeLessThan(1e-12);
    // CRPS at y = 0 is Σ_k (1 − F(k))² over k ≥ 0 … equal to E|X − 0| − ½E|X − X′| (Gneiting & Raftery 2007, eq. 21); checked by that identity.
    let eAbs = 0;
    let eAbs2 = 0;
    for (let i = 0; i < d.pmf.length; i++) {
      eAbs += i * d.pmf[i];
      for (let j = 0; j < d.pmf.length; j++) eAbs2 += Math.abs(i - j) * d.pmf[i] * d.pmf[j];
    }
    expect(rel(crpsCount(d, 0), eAbs - eAbs2 / 2)).toBeLessThan(1e-6);
    expect(rel(crpsCount(d, 7), (() => { let e = 0; for (let i = 0; i < d.pmf.length; i++) e += Math.abs(i - 7) * d.pmf[i]; return e - eAbs2 / 2; })())).toBeLessThan(1e-6);
  });
});

/** Weekly series from a known NB process of the outlook's own form (seasonal + AR + one lagged driver). */
function simulate(seasons: number, seed: number, truth = { b0: 0.9, sin: 0.5, cos: -0.4, ar: 0.45, rvc: 0.35, theta: 6 }): OutlookWeek[] {
  const u = seededRandom(seed);
  const draw = negativeBinomialRandom.factory({ prng: seededRandom(seed + 1) });
  const out: OutlookWeek[] = [];
  const n = seasons * 52;
  const rvc = Array.from({ length: n }, (_, t) => 0.5 + 0.3 * Math.sin((2 * Math.PI * (t - 6)) / 52) + 0.15 * (u() - 0.5));
  const mean = rvc.reduce((a, b) => a + b, 0) / n;
  const sd = Math.sqrt(rvc.reduce((a, b) => a + (b - mean) ** 2, 0) / (n - 1));
  let prev = 5;
  for (let t = 0; t < n; t++) {
    const week = (t % 52) + 1;
    const ph = (2 * Math.PI * (week - 0.5)) / 52;
    const z = t >= 8 ? (rvc[t - 8] - mean) / sd : 0;
    const mu = Math.exp(truth.b0 + truth.sin * Math.sin(ph) + truth.cos * Math.cos(ph) + truth.ar * Math.log(prev + 1) + truth.rvc * z);
    const y = draw(truth.theta, truth.theta / (truth.theta + mu));
    out.push({ year: 2010 + Math.floor(t / 52), week, weeksInYear: 52, cases: y, rvc: rvc[t], eipShare: null, rain: null });
    prev = y;
  }
  return out;
}

describe('The outlook on simulated data from a known negative binomial process', () => {
  it('when eight seasons are fitted, then the autoregressive and driver coefficients are near the truth', () => {
    const s = simulate(8, 11);
    const fit = fitOutlook(s);
    expect(fit.drivers).toEqual(['rvc']);
    expect(Math.abs(fit.coefficients[3] - 0.45)).toBeLessThan(5 * fit.standardErrors[3]);
  });

  it('when forecasts are scored by rolling origin, then the central 80 % and 50 % intervals cover within sampling error and the outlook beats the seasonal null', () => {
    const s = simulate(6, 21);
    const ev = evaluateOutlook(s, { paths: 200, refitEvery: 8 });
    for (const h of ev.horizons) {
      // Discrete intervals [q10, q90] include their end points, so they cover at least 80 %; the AR paths
      // and the refit make neighbouring weeks dependent: ±4 binomial standard errors plus 0.05 for the
      // discreteness (derived).
      const se80 = Math.sqrt((0.8 * 0.2) / h.scored);
      expect(h.coverage80!).toBeGreaterThan(0.8 - 4 * se80);
      expect(h.coverage80!).toBeLessThan(0.8 + 4 * se80 + 0.05);
      const se50 = Math.sqrt((0.5 * 0.5) / h.scored);
      expect(h.coverage50!).toBeGreaterThan(0.5 - 4 * se50);
      expect(h.coverage50!).toBeLessThan(0.5 + 4 * se50 + 0.08);
    }
    expect(ev.horizons[0].beatsNull).toBe(true);
    expect(ev.horizons[0].crpsSkill!).toBeGreaterThan(0.05);
  });

  it('when a district has cases unrelated to anything (NB noise around a constant), then the outlook claims no skill at any horizon and shows no fan', () => {
    const draw = negativeBinomialRandom.factory({ prng: seededRandom(5) });
    const s: OutlookWeek[] = Array.from({ length: 6 * 52 }, (_, t) => ({ year: 2010 + Math.floor(t / 52), week: (t % 52) + 1, weeksInYear: 52, cases: draw(3, 3 / (3 + 8)), rvc: Math.sin(t), eipShare: null, rain: null }));
    const o = districtOutlook(s, { paths: 200, evaluationPaths: 100 });
    expect(o.status).toBe('ok');
    expect(o.evaluation!.horizons.every((h) => !h.beatsNull)).toBe(true);
    expect(o.fanHorizons).toBe(0);
    expect(o.forecast).toHaveLength(8);
  });

  it('when a district has one season of counts, then it gets no outlook (too little data), without throwing', () => {
    const o = districtOutlook(simulate(1, 3));
    expect(o.status).toBe('too_little_data');
    expect(o.forecast).toEqual([]);
    expect(o.fanHorizons).toBe(0);
  });

  it('when the same series is forecast twice with the same seed, then the quantiles are identical (seeded)', () => {
    const s = simulate(4, 7);
    const fit = fitOutlook(s);
    const a = forecastOutlook(s, fit, s.length - 1, { paths: 300, seed: 9 });
    const b = forecastOutlook(s, fit, s.length - 1, { paths: 300, seed: 9 });
    expect(a.map((f) => countQuantile(f.distribution, 0.9))).toEqual(b.map((f) => countQuantile(f.distribution, 0.9)));
    expect(a).toHaveLength(8);
  });

  it('when the null is asked for a week with fewer than two earlier seasons, then there is none', () => {
    const s = simulate(3, 1);
    expect(climatologyNull(s, 60, 59)).toBeNull();
    expect(climatologyNull(s, 120, 119)).not.toBeNull();
  });
});
