import { CholeskyDecomposition, Matrix, QrDecomposition, inverse } from 'ml-matrix';
import digamma from '@stdlib/math-base-special-digamma';
import gammaln from '@stdlib/math-base-special-gammaln';

/**
 * Negative binomial regression (NB2, log link), fitted as R's MASS::glm.nb does (Venables & Ripley,
 * Modern Applied Statistics with S, 4th ed., Springer 2002, §7.4):
 *
 *   Y_i ~ NB(μ_i, θ),  log μ_i = offset_i + β0 + Σ_j β_j x_ij,  Var Y_i = μ_i + μ_i²/θ.
 *
 * 1. A Poisson GLM by iteratively reweighted least squares (IRLS) gives the first μ.
 * 2. θ by maximum likelihood given μ (Newton's method on the score, MASS::theta.ml).
 * 3. Alternate: IRLS for β with θ fixed (working weights μ/(1 + μ/θ), working response
 *    η − offset + (y − μ)/μ), then θ by maximum likelihood, until the log-likelihood and θ stop
 *    changing (glm.nb's criterion |ΔL|/√(2·max(1, n − p)) + |Δθ| < ε, with Δθ taken relative to max(1, θ)).
 *
 * The linear algebra (Cholesky solve of XᵀWX·β = XᵀWz, QR rank check, inverse of XᵀWX) is ml-matrix's.
 * Pure: no I/O, no state.
 * Bad input throws a RangeError whose message names the field.
 */

export interface NegativeBinomialData {
  /** Counts (non-negative integers). */
  y: readonly number[];
  /** Covariates, one row per count, WITHOUT an intercept column (the fit adds it). May have 0 columns. */
  x: readonly (readonly number[])[];
  /** Optional log offsets (e.g. log exposure), one per count. */
  offset?: readonly number[];
}

export interface NegativeBinomialOptions {
  /** Outer-loop tolerance (glm.nb's epsilon; glm.nb's default is 1e-8). */
  epsilon?: number;
  /** Most outer iterations (and most IRLS / Newton steps within each). */
  maxIterations?: number;
}

export interface NegativeBinomialFit {
  /** Intercept first, then one per covariate column. */
  coefficients: number[];
  /** Standard errors of the coefficients, from (XᵀWX)⁻¹ at the fit with θ taken as known (as summary.negbin). */
  standardErrors: number[];
  /** Dispersion θ: Var = μ + μ²/θ (larger θ = closer to Poisson). */
  theta: number;
  /** Standard error of θ from the observed information (as theta.ml). */
  thetaStandardError: number;
  /** Log-likelihood at the fit (as logLik() of a glm.nb fit). */
  logLik: number;
  /** Outer iterations (alternations of IRLS and θ), as glm.nb's `iter`. */
  iterations: number;
  converged: boolean;
  /** Fitted means μ_i. */
  fitted: number[];
}

/** θ above this is taken as "no overdispersion left to estimate" (the fit does not converge in θ). */
export const THETA_LIMIT = 1e8;

/**
 * Trigamma ψ′(x) for x > 0. Hand-written because no listed package provides it: the recurrence
 * ψ′(x) = ψ′(x + 1) + 1/x² up to x ≥ 10, then the asymptotic series
 * 1/x + 1/(2x²) + Σ B_2k / x^(2k+1) (Abramowitz & Stegun 1964, 6.4.12) to the x⁻¹¹ term; the first term left out is below 3e-14 there.
 */
export function trigamma(x: number): number {
  if (!(x > 0)) return Number.NaN;
  let acc = 0;
  while (x < 10) {
    acc += 1 / (x * x);
    x += 1;
  }
  const r = 1 / x;
  const r2 = r * r;
  return acc + r + r2 / 2 + r * r2 * (1 / 6 - r2 * (1 / 30 - r2 * (1 / 42 - r2 * (1 / 30 - (r2 * 5) / 66))));
}

/** log P(Y = y) for NB(μ, θ). */
export function negativeBinomialLogPmf(y: number, mu: number, theta: number): number {
  if (!(y >= 0) || !Number.isInteger(y)) return -Infinity;
  if (mu === 0) return y === 0 ? 0 : -Infinity;
  return gammaln(theta + y) - gammaln(theta) - gammaln(y + 1) + theta * Math.log(theta / (theta + mu)) + y * Math.log(mu / (theta + mu));
}

/** Smallest count q with P(Y ≤ q) ≥ p, for NB(μ, θ) and 0 < p < 1 (predictive quantiles). */
export function negativeBinomialQuantile(p: number, mu: number, theta: number): number {
  if (!(p > 0 && p < 1)) throw new RangeError('p: expected a probability strictly between 0 and 1');
  if (!(mu >= 0) || !(theta > 0)) throw new RangeError('mu and theta: expected mu ≥ 0 and theta > 0');
  if (mu === 0) return 0;
  // P(0) = (θ/(θ+μ))^θ, then P(k+1) = P(k)·(k + θ)/(k + 1)·μ/(θ + μ).
  const q = mu / (theta + mu);
  let pk = Math.exp(theta * Math.log(theta / (theta + mu)));
  let cdf = pk;
  let k = 0;
  while (cdf < p && k < 1e7) {
    pk *= ((k + theta) / (k + 1)) * q;
    k += 1;
    cdf += pk;
    if (pk === 0 && k > mu) break;
  }
  return k;
}

/** Σ log P(y_i) at μ, θ — MASS's loglik (the y·log(μ + [y = 0]) term keeps μ = 0 rows finite). */
function logLikelihood(y: Float64Array, mu: Float64Array, theta: number): number {
  let s = 0;
  const lt = theta * Math.log(theta);
  const lgt = gammaln(theta);
  for (let i = 0; i < y.length; i++) {
    const yi = y[i];
    s += gammaln(theta + yi) - lgt - gammaln(yi + 1) + lt + yi * Math.log(mu[i] + (yi === 0 ? 1 : 0)) - (theta + yi) * Math.log(theta + mu[i]);
  }
  return s;
}

/** Deviance of the NB (θ finite) or Poisson (θ = Infinity) family at μ. */
function deviance(y: Float64Array, mu: Float64Array, theta: number): number {
  let d = 0;
  for (let i = 0; i < y.length; i++) {
    const yi = y[i];
    const m = mu[i];
    const a = yi > 0 ? yi * Math.log(yi / m) : 0;
    d += theta === Infinity ? a - (yi - m) : a - (yi + theta) * Math.log((yi + theta) / (m + theta));
  }
  return 2 * d;
}

/**
 * θ by maximum likelihood for fixed μ: Newton's method on the score, started at the moment estimate
 * n / Σ(y/μ − 1)² (MASS::theta.ml). Returns θ and its standard error √(1/information).
 */
function thetaMl(y: Float64Array, mu: Float64Array, limit: number): { theta: number; se: number; ok: boolean } {
  const n = y.length;
  let s2 = 0;
  for (let i = 0; i < n; i++) s2 += (y[i] / mu[i] - 1) ** 2;
  let t0 = n / s2;
  if (!Number.isFinite(t0)) return { theta: THETA_LIMIT, se: Number.NaN, ok: false };
  let info = Number.NaN;
  let del = 1;
  let it = 0;
  const eps = 1e-10;
  while (++it < limit && Math.abs(del) > eps * Math.max(1, t0)) {
    t0 = Math.abs(t0);
    let score = 0;
    info = 0;
    const dg = digamma(t0);
    const tg = trigamma(t0);
    const lt = Math.log(t0);
    for (let i = 0; i < n; i++) {
      const tm = t0 + mu[i];
      score += digamma(t0 + y[i]) - dg + lt + 1 - Math.log(tm) - (y[i] + t0) / tm;
      info += -trigamma(t0 + y[i]) + tg - 1 / t0 + 2 / tm - (y[i] + t0) / (tm * tm);
    }
    del = score / info;
    t0 += del;
    if (!(t0 < THETA_LIMIT) || !Number.isFinite(t0)) return { theta: THETA_LIMIT, se: Number.NaN, ok: false };
  }
  if (!(t0 > 0)) return { theta: 0, se: Number.NaN, ok: false };
  return { theta: t0, se: Math.sqrt(1 / info), ok: it < limit };
}

interface IrlsResult {
  beta: number[];
  eta: Float64Array;
  mu: Float64Array;
  weights: Float64Array;
  converged: boolean;
}

/** XᵀWX (p × p) and XᵀWz (p) for the rows of X (each a Float64Array of p values). */
function normalEquations(X: readonly Float64Array[], w: Float64Array, z: Float64Array, p: number): { A: Matrix; b: Matrix } {
  const a = Array.from({ length: p }, () => new Array<number>(p).fill(0));
  const b = new Array<number>(p).fill(0);
  for (let i = 0; i < X.length; i++) {
    const row = X[i];
    const wi = w[i];
    for (let j = 0; j < p; j++) {
      const wx = wi * row[j];
      b[j] += wx * z[i];
      for (let k = 0; k <= j; k++) a[j][k] += wx * row[k];
    }
  }
  for (let j = 0; j < p; j++) for (let k = j + 1; k < p; k++) a[j][k] = a[k][j];
  return { A: new Matrix(a), b: Matrix.columnVector(b) };
}

/**
 * IRLS for a log-link GLM with variance μ + μ²/θ (Poisson when θ = Infinity), as R's glm.fit: each
 * step solves the weighted least squares XᵀWX·β = XᵀWz (Cholesky, p × p: R solves the same system by
 * QR on √W·X, which costs an n × p matrix per step; the design's rank is checked once by QR in
 * `prepare`); stop when |Δdeviance|/(|deviance| + 0.1) < ε; a step that makes the deviance non-finite
 * is halved.
 */
function irls(X: readonly Float64Array[], y: Float64Array, offset: Float64Array, theta: number, etaStart: Float64Array, maxit: number, eps: number): IrlsResult {
  const n = y.length;
  const p = X[0].length;
  let eta = Float64Array.from(etaStart);
  let mu = eta.map(Math.exp);
  let devOld = deviance(y, mu, theta);
  let beta: number[] | null = null;
  const weights = new Float64Array(n);
  let converged = false;
  const z = new Float64Array(n);
  for (let iter = 0; iter < maxit; iter++) {
    for (let i = 0; i < n; i++) {
      const m = mu[i];
      weights[i] = theta === Infinity ? m : m / (1 + m / theta);
      z[i] = eta[i] - offset[i] + (y[i] - m) / m;
    }
    const { A, b } = normalEquations(X, weights, z, p);
    const chol = new CholeskyDecomposition(A);
    if (!chol.isPositiveDefinite()) throw new RangeError('x: the weighted covariates are collinear, so the coefficients are not identifiable');
    let next = chol.solve(b).getColumn(0);
    let etaNew = new Float64Array(n);
    let muNew = new Float64Array(n);
    let dev = Number.NaN;
    for (let half = 0; half < 30; half++) {
      for (let i = 0; i < n; i++) {
        let s = offset[i];
        const row = X[i];
        for (let j = 0; j < p; j++) s += row[j] * next[j];
        etaNew[i] = s;
        muNew[i] = Math.exp(s);
      }
      dev = deviance(y, muNew, theta);
      if (Number.isFinite(dev) || beta === null) break;
      next = next.map((b, j) => (b + beta![j]) / 2);
    }
    if (!Number.isFinite(dev)) throw new RangeError('y: the fit diverged (no finite deviance); check the counts and covariates');
    beta = next;
    eta = etaNew;
    mu = muNew;
    if (Math.abs(dev - devOld) / (Math.abs(dev) + 0.1) < eps) {
      converged = true;
      break;
    }
    devOld = dev;
  }
  // Weights at the final μ, for the covariance.
  for (let i = 0; i < n; i++) weights[i] = theta === Infinity ? mu[i] : mu[i] / (1 + mu[i] / theta);
  return { beta: beta!, eta, mu, weights, converged };
}

/** Check the data and build the design matrix with its intercept column. */
function prepare(data: NegativeBinomialData): { X: Float64Array[]; y: Float64Array; offset: Float64Array } {
  const { y, x, offset } = data;
  const n = y.length;
  if (n === 0) throw new RangeError('y: expected at least one count');
  y.forEach((v, i) => {
    if (!(Number.isInteger(v) && v >= 0)) throw new RangeError(`y[${i}]: expected a non-negative integer count (got ${JSON.stringify(v)})`);
  });
  if (x.length !== n) throw new RangeError(`x: expected one row per count (${n} rows, got ${x.length})`);
  const k = n > 0 ? x[0].length : 0;
  x.forEach((row, i) => {
    if (row.length !== k) throw new RangeError(`x[${i}]: expected ${k} covariates like the first row (got ${row.length})`);
    row.forEach((v, j) => {
      if (!Number.isFinite(v)) throw new RangeError(`x[${i}][${j}]: expected a finite number`);
    });
  });
  if (offset !== undefined) {
    if (offset.length !== n) throw new RangeError(`offset: expected one log offset per count (${n}, got ${offset.length})`);
    offset.forEach((v, i) => {
      if (!Number.isFinite(v)) throw new RangeError(`offset[${i}]: expected a finite number`);
    });
  }
  const p = k + 1;
  if (n <= p) throw new RangeError(`y: expected more counts than coefficients (${n} counts, ${p} coefficients with the intercept)`);
  if (y.every((v) => v === 0)) throw new RangeError('y: every count is zero, so there is nothing to fit');
  const X = x.map((row) => Float64Array.of(1, ...row));
  if (!new QrDecomposition(new Matrix(X.map((r) => Array.from(r)))).isFullRank()) {
    throw new RangeError('x: the covariates are collinear (or constant like the intercept), so the coefficients are not identifiable');
  }
  return { X, y: Float64Array.from(y), offset: offset ? Float64Array.from(offset) : new Float64Array(n) };
}

/** Fit an NB2 regression with log link (see the module comment). */
export function fitNegativeBinomial(data: NegativeBinomialData, options: NegativeBinomialOptions = {}): NegativeBinomialFit {
  const epsilon = options.epsilon ?? 1e-10;
  const maxit = options.maxIterations ?? 50;
  const { X, y, offset } = prepare(data);
  const n = y.length;
  const p = X[0].length;

  // 1. Poisson start, from μ = y + 0.1 (glm.fit's start for the Poisson family).
  let fit = irls(X, y, offset, Infinity, y.map((v) => Math.log(v + 0.1)), maxit, epsilon);
  let mu = fit.mu;
  // 2. θ given the Poisson μ.
  let th = thetaMl(y, mu, maxit);
  let theta = th.theta;
  // 3. Alternate, with glm.nb's stopping rule.
  const d1 = Math.sqrt(2 * Math.max(1, n - p));
  // glm.nb divides Δθ by 1; here by max(1, θ), so a large θ can meet the same relative precision.
  let del = 1;
  let lm = logLikelihood(y, mu, theta);
  let lm0 = lm + 2 * d1;
  let iterations = 0;
  let converged = false;
  while (th.ok) {
    if (Math.abs(lm0 - lm) / d1 + Math.abs(del) / Math.max(1, theta) <= epsilon) {
      converged = true;
      break;
    }
    if (++iterations > maxit) {
      iterations = maxit;
      break;
    }
    fit = irls(X, y, offset, theta, fit.eta, maxit, epsilon);
    const t0 = theta;
    // glm.nb takes θ at the μ from before this refit; using the new μ converges to the same point.
    th = thetaMl(y, fit.mu, maxit);
    theta = th.theta;
    mu = fit.mu;
    del = t0 - theta;
    lm0 = lm;
    lm = logLikelihood(y, mu, theta);
  }
  converged = converged && fit.converged && th.ok;

  // Covariance (XᵀWX)⁻¹ at the final μ with θ taken as known.
  const cov = inverse(normalEquations(X, fit.weights, new Float64Array(n), p).A);
  const standardErrors = Array.from({ length: p }, (_, j) => Math.sqrt(cov.get(j, j)));

  return {
    coefficients: fit.beta,
    standardErrors,
    theta,
    thetaStandardError: th.se,
    logLik: logLikelihood(y, mu, theta),
    iterations,
    converged,
    fitted: Array.from(mu),
  };
}
