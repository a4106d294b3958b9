import type { Profile, RangedParam, ThermalCurve } from './profile.schema';
import { CUTOFF_CODE, METHOD_CODE } from './degree-days';
import { DAY_LENGTH_DEFINITIONS } from './day-length';

/**
 * Temperature-driven traits of a profile, compiled once into plain functions.
 *
 * Variants: 0 = 'slow' (the slow end of every ranged parameter: more degree-days per generation, longer
 * EIP, longer gonotrophic cycle), 1 = 'central', 2 = 'fast' (the other end). Only parameters that carry
 * a low / high in the profile make the variants differ. Season outputs report the numeric low / high
 * of the slow and fast results.
 */

export type Variant = 0 | 1 | 2;
export const VARIANT_NAMES = ['slow', 'central', 'fast'] as const;
export type VariantName = (typeof VARIANT_NAMES)[number];

/** Brière 1999 form: c·T·(T − t0)·√(tm − T) on (t0, tm), else 0. */
export function briere(c: number, t0: number, tm: number, t: number): number {
  return t > t0 && t < tm ? c * t * (t - t0) * Math.sqrt(tm - t) : 0;
}

/** Symmetric quadratic: −c·(T − t0)·(T − tm) on (t0, tm), else 0. */
export function quadratic(c: number, t0: number, tm: number, t: number): number {
  return t > t0 && t < tm ? -c * (t - t0) * (t - tm) : 0;
}

/** A thermal curve as a function of temperature (°C). */
export function curveFunction(curve: ThermalCurve): (t: number) => number {
  switch (curve.form) {
    case 'briere': {
      const { c, t0, tm } = curve;
      return (t) => briere(c, t0, tm, t);
    }
    case 'quadratic': {
      const { c, t0, tm } = curve;
      return (t) => quadratic(c, t0, tm, t);
    }
    case 'polynomial': {
      const k = curve.coefficients.slice();
      return (t) => {
        let v = 0;
        for (let i = k.length - 1; i >= 0; i--) v = v * t + k[i];
        return v > 0 ? v : 0;
      };
    }
  }
}

/**
 * Garrett-Jones 1964 vectorial capacity C = m·a²·pⁿ / (−ln p). Returns 0 when p ≤ 0 or n is not finite.
 */
export function vectorialCapacity(m: number, a: number, p: number, n: number): number {
  if (!(p > 0) || !(n < Infinity) || !(a > 0)) return 0;
  if (p >= 1) return Infinity;
  return (m * a * a * Math.pow(p, n)) / -Math.log(p);
}

/** [slow, central, fast] values of a ranged parameter where a higher value is slower. */
function slowFast(p: RangedParam): [number, number, number] {
  return [p.high ?? p.value, p.value, p.low ?? p.value];
}

export interface SeasonWindowRule {
  criticalPhotoperiod: number;
  definitionDeg: number;
  openMeanTemperature: number;
  closeMeanTemperature: number;
}

export interface CompiledProfile {
  readonly profile: Profile;
  readonly methodCode: number;
  readonly cutoffCode: number;
  readonly isDouble: boolean;
  readonly lower: number;
  readonly upper: number;
  /** Degree-days per generation for variants 0, 1, 2. */
  readonly degreeDaysPerGeneration: readonly [number, number, number];
  readonly recentWindowDays: number;
  /** True when any ranged parameter has a low or high (development or traits). */
  readonly hasRanges: boolean;
  /** True when a ranged parameter changes the traits (gonotrophic cycle or EIP), not only development. */
  readonly hasTraitRanges: boolean;
  /**
   * Trait table for the season path: for each variant (null when it equals central), TRAIT_FIELDS
   * values at T = from + k·step, k = 0…size−1, interpolated linearly (see traitsFromTable).
   */
  readonly table: {
    from: number;
    step: number;
    size: number;
    data: [Float64Array | null, Float64Array, Float64Array | null];
    /** 1 for a cell [k, k+1] where interpolation would miss the exact value (a kink or end of a curve): evaluate exactly there. */
    exact: [Uint8Array | null, Uint8Array, Uint8Array | null];
  };
  /** Exact traits at t for variant v into out (TRAIT_FIELDS order), the window taken as open. */
  evaluate(t: number, v: Variant, out: Float64Array): void;
  readonly window: SeasonWindowRule | null;
  gonotrophicCycleDays(t: number, v: Variant): number;
  bitingRate(t: number, v: Variant): number;
  /** Expected adult lifespan L (days); p = exp(−1/L). */
  lifespanDays(t: number): number;
  survival(t: number): number;
  /** EIP in days (Infinity where the pathogen does not develop). */
  eipDays(t: number, v: Variant): number;
  /** a²·pⁿ/(−ln p) with m left out, unscaled. */
  vectorialCapacityRaw(t: number, v: Variant): number;
  /** Maximum of the central unscaled vectorial capacity over the temperature grid, and where. */
  readonly optimum: { temperature: number; value: number };
}

const cache = new WeakMap<Profile, CompiledProfile>();

/**
 * The capacity's factor beyond a²·pⁿ/(−ln p) at temperature t with lifespan l (see profile.schema
 * `capacity`): 1, or competence(t)·EFD(t)·pEA(t)·MDR(t)·l² for the 'mordecai' form — with
 * m ∝ EFD·pEA·MDR/μ² (Mordecai et al. 2017, PLoS Negl. Trop. Dis. 11:e0005568, eq. 1), the capacity
 * m·a²·bc·pⁿ/μ is then proportional to R0², so it is zero exactly where their R0 is zero.
 */
function capacityFactor(profile: Profile): (t: number, l: number) => number {
  if (profile.capacity?.model !== 'mordecai') return () => 1;
  const tt = profile.thermalTraits!;
  const efd = curveFunction(tt.efd);
  const pea = curveFunction(tt.pea);
  const mdr = curveFunction(tt.mdr);
  const bc = tt.bc ? curveFunction(tt.bc) : null;
  const b = tt.b ? curveFunction(tt.b) : null;
  const c = tt.c ? curveFunction(tt.c) : null;
  return (t, l) => {
    const comp = bc ? bc(t) : b && c ? b(t) * c(t) : 1;
    const m = efd(t) * pea(t) * mdr(t);
    // Each fit is floored at 0 outside its limits, so the product is 0 there (never negative).
    return comp > 0 && m > 0 ? comp * m * l * l : 0;
  };
}

/**
 * Probability of surviving the EIP below which the EIP counts as not completed: fewer than 1 in 100
 * infected mosquitoes would live through it (n > ln 100 ≈ 4.6 expected lifetimes). Common practice
 * of this product, not from a source: it keeps the display from extrapolating EIPs of months or years
 * near a threshold, where no mosquito lives that long.
 */
export const EIP_MIN_SURVIVAL = 0.01;
/** An EIP longer than this (days, a season) counts as not completed whatever the survival. */
export const EIP_MAX_DAYS = 365;

/** Why an EIP is not completed: the pathogen does not develop at that temperature, or not within the mosquito's life or a season. */
export type EipNotCompleted = 'no-development' | 'beyond-lifetime';
/** Codes of the season's eipState column: 0 completed (or unknown), 1 no development, 2 beyond the lifetime or a season. */
export const EIP_STATE = { completed: 0, 'no-development': 1, 'beyond-lifetime': 2 } as const;

/**
 * Whether an EIP of n days (Infinity: no development) completes, given pⁿ (survival through it):
 * null when it does, else the reason.
 */
export function eipCompletion(n: number, survivalThroughEip: number): EipNotCompleted | null {
  if (!(n < Infinity) || !(n > 0)) return 'no-development';
  if (n > EIP_MAX_DAYS || !(survivalThroughEip >= EIP_MIN_SURVIVAL)) return 'beyond-lifetime';
  return null;
}

/** Fields of a trait row: biting rate a, 1/gonotrophic cycle, survival p, 1/EIP, pⁿ, relative VC, EIP share. */
export const TRAIT_FIELDS = ['bitingRate', 'gonotrophicRate', 'survival', 'eipRate', 'survivalThroughEip', 'relativeVectorialCapacity', 'eipShareInLifetime'] as const;
export const T_A = 0;
export const T_GONO_RATE = 1;
export const T_P = 2;
export const T_EIP_RATE = 3;
export const T_PN = 4;
export const T_VC = 5;
export const T_SHARE = 6;
export const TRAIT_COUNT = 7;

/**
 * Temperature grid of the trait table (°C). Rates (1/U, 1/n) are tabulated rather than durations, so
 * every tabulated quantity is continuous. Linear interpolation is used where it stays within
 * `tolerance` × the field's largest value of the exact result; the few cells where it would not
 * (curve ends, kinks) and temperatures outside the grid use the exact functions.
 */
export const TRAIT_TABLE = { from: -40, to: 60, step: 0.005, tolerance: 1e-6 } as const;

/**
 * Traits at t for variant v from the compiled table (exact outside the grid), into out (TRAIT_FIELDS order).
 */
export function traitsFromTable(cp: CompiledProfile, t: number, v: Variant, out: Float64Array): void {
  const tb = cp.table;
  const vv = tb.data[v] === null ? 1 : v;
  const data = tb.data[vv]!;
  const x = (t - tb.from) / tb.step;
  const k = Math.floor(x);
  if (!(k >= 0 && k < tb.size - 1) || tb.exact[vv]![k] === 1) {
    cp.evaluate(t, vv, out);
    return;
  }
  const w = x - k;
  const b = k * TRAIT_COUNT;
  for (let j = 0; j < TRAIT_COUNT; j++) {
    const y0 = data[b + j];
    out[j] = y0 + w * (data[b + TRAIT_COUNT + j] - y0);
  }
}

/** Temperature grid over which the optimum is searched (°C). */
export const OPTIMUM_GRID = { from: -10, to: 50, step: 0.01 } as const;

/** Compile (once per profile object) the profile's trait functions and its vectorial-capacity optimum. */
export function compileProfile(profile: Profile): CompiledProfile {
  const hit = cache.get(profile);
  if (hit) return hit;
  const dev = profile.development;
  const kGen = slowFast(dev.degreeDaysPerGeneration);
  const devRanges = kGen[0] !== kGen[2];
  let hasRanges = false; // trait ranges

  // Gonotrophic cycle and biting rate.
  const g = profile.gonotrophicCycle;
  const b = profile.bitingRate;
  let gono: (t: number, v: Variant) => number;
  let bite: (t: number, v: Variant) => number;
  if (g.model === 'degree-days') {
    const k = slowFast(g.k);
    hasRanges ||= k[0] !== k[2];
    const th = g.threshold.value;
    const off = g.offsetDays.value;
    gono = (t, v) => (t > th ? off + k[v] / (t - th) : Infinity);
  } else {
    if (b.model !== 'curve') throw new Error(`${profile.id}: inverse-biting-rate needs a biting-rate curve`);
    const a = curveFunction(b.curve);
    gono = (t) => {
      const r = a(t);
      return r > 0 ? 1 / r : Infinity;
    };
  }
  if (b.model === 'curve') {
    const a = curveFunction(b.curve);
    bite = (t) => a(t);
  } else {
    bite = (t, v) => {
      const u = gono(t, v);
      return u < Infinity && u > 0 ? 1 / u : 0;
    };
  }

  // Survival.
  const lifespan = curveFunction(profile.survival.lifespan);
  const survival = (t: number): number => {
    const l = lifespan(t);
    return l > 0 ? Math.exp(-1 / l) : 0;
  };

  // EIP.
  const e = profile.eip;
  let eip: (t: number, v: Variant) => number;
  if (e.model === 'degree-days') {
    const k = slowFast(e.k);
    const th = slowFast(e.threshold);
    hasRanges ||= k[0] !== k[2] || th[0] !== th[2];
    const top = e.upperLimit?.value ?? Infinity;
    eip = (t, v) => (t > th[v] && t < top ? k[v] / (t - th[v]) : Infinity);
  } else if (e.model === 'log-linear') {
    const i0 = e.intercept.value;
    const s = e.slope.value;
    eip = (t) => Math.exp(i0 + s * t);
  } else {
    const r = curveFunction(e.rate);
    eip = (t) => {
      const x = r(t);
      return x > 0 ? 1 / x : Infinity;
    };
  }

  // Factors of the capacity beyond a²·pⁿ/(−ln p): 1 (Garrett-Jones, m left out), or the 'mordecai'
  // vector competence × equilibrium density EFD·pEA·MDR·L² (Mordecai et al. 2013, 2017), each a
  // published thermal curve that is zero outside its limits.
  const factor = capacityFactor(profile);

  // a²·pⁿ/(−ln p) with p = exp(−1/L): a²·L·exp(−n/L), times the factor.
  const vcRaw = (t: number, v: Variant): number => {
    const l = lifespan(t);
    if (!(l > 0)) return 0;
    const n = eip(t, v);
    if (!(n < Infinity)) return 0;
    const a = bite(t, v);
    return a * a * l * Math.exp(-n / l) * factor(t, l);
  };

  // Optimum: grid search, then golden-section refinement around the best grid point.
  let bestT = Number.NaN;
  let best = 0;
  const steps = Math.round((OPTIMUM_GRID.to - OPTIMUM_GRID.from) / OPTIMUM_GRID.step);
  for (let i = 0; i <= steps; i++) {
    const t = OPTIMUM_GRID.from + i * OPTIMUM_GRID.step;
    const v = vcRaw(t, 1);
    if (v > best) {
      best = v;
      bestT = t;
    }
  }
  if (!(best > 0)) throw new Error(`${profile.id}: vectorial capacity is zero at every temperature of the grid`);
  let lo = bestT - OPTIMUM_GRID.step;
  let hi = bestT + OPTIMUM_GRID.step;
  const gr = (Math.sqrt(5) - 1) / 2;
  for (let i = 0; i < 40; i++) {
    const x1 = hi - gr * (hi - lo);
    const x2 = lo + gr * (hi - lo);
    if (vcRaw(x1, 1) >= vcRaw(x2, 1)) hi = x2;
    else lo = x1;
  }
  const tOpt = (lo + hi) / 2;
  const vOpt = Math.max(best, vcRaw(tOpt, 1));

  const evaluate = (t: number, v: Variant, out: Float64Array): void => {
    const l = lifespan(t);
    const a = bite(t, v);
    const u = gono(t, v);
    const n = eip(t, v);
    out[T_A] = a;
    out[T_GONO_RATE] = u < Infinity && u > 0 ? 1 / u : 0;
    out[T_P] = l > 0 ? Math.exp(-1 / l) : 0;
    out[T_EIP_RATE] = n < Infinity && n > 0 ? 1 / n : 0;
    if (l > 0 && n < Infinity) {
      const e = Math.exp(-n / l);
      out[T_PN] = e;
      out[T_VC] = (a * a * l * e * factor(t, l)) / vOpt;
      out[T_SHARE] = l >= n ? 1 : l / n;
    } else {
      out[T_PN] = 0;
      out[T_VC] = 0;
      out[T_SHARE] = 0;
    }
  };
  const size = Math.round((TRAIT_TABLE.to - TRAIT_TABLE.from) / TRAIT_TABLE.step) + 1;
  const buildTable = (v: Variant): Float64Array => {
    const data = new Float64Array(size * TRAIT_COUNT);
    const row = new Float64Array(TRAIT_COUNT);
    for (let k = 0; k < size; k++) {
      evaluate(TRAIT_TABLE.from + k * TRAIT_TABLE.step, v, row);
      data.set(row, k * TRAIT_COUNT);
    }
    return data;
  };
  // Cells where linear interpolation is not within TRAIT_TABLE.tolerance of the exact value at the
  // quarter points (ends of Brière curves, zero crossings, the cap of the EIP share) are flagged, and
  // read exactly instead.
  const flagCells = (v: Variant, data: Float64Array): Uint8Array => {
    const max = new Float64Array(TRAIT_COUNT);
    for (let i = 0; i < data.length; i++) max[i % TRAIT_COUNT] = Math.max(max[i % TRAIT_COUNT], Math.abs(data[i]));
    const flags = new Uint8Array(size - 1);
    const row = new Float64Array(TRAIT_COUNT);
    for (let k = 0; k < size - 1; k++) {
      for (const w of [0.25, 0.5, 0.75]) {
        evaluate(TRAIT_TABLE.from + (k + w) * TRAIT_TABLE.step, v, row);
        for (let j = 0; j < TRAIT_COUNT && flags[k] === 0; j++) {
          const y0 = data[k * TRAIT_COUNT + j];
          const y = y0 + w * (data[(k + 1) * TRAIT_COUNT + j] - y0);
          if (Math.abs(y - row[j]) > TRAIT_TABLE.tolerance * max[j]) flags[k] = 1;
        }
      }
    }
    return flags;
  };
  const d1 = buildTable(1);
  const d0 = hasRanges ? buildTable(0) : null;
  const d2 = hasRanges ? buildTable(2) : null;
  const table = {
    from: TRAIT_TABLE.from,
    step: TRAIT_TABLE.step,
    size,
    data: [d0, d1, d2] as [Float64Array | null, Float64Array, Float64Array | null],
    exact: [d0 && flagCells(0, d0), flagCells(1, d1), d2 && flagCells(2, d2)] as [Uint8Array | null, Uint8Array, Uint8Array | null],
  };

  const w = profile.seasonWindow;
  const window: SeasonWindowRule | null =
    w.model === 'none'
      ? null
      : {
          criticalPhotoperiod: w.criticalPhotoperiod.value,
          definitionDeg: DAY_LENGTH_DEFINITIONS[w.dayLengthDefinition.value],
          openMeanTemperature: w.openMeanTemperature.value,
          closeMeanTemperature: w.closeMeanTemperature.value,
        };

  const compiled: CompiledProfile = {
    profile,
    methodCode: METHOD_CODE[dev.method.value],
    cutoffCode: CUTOFF_CODE[dev.cutoff.value],
    isDouble: dev.method.value === 'double-sine' || dev.method.value === 'double-triangle',
    lower: dev.lowerThreshold.value,
    upper: dev.upperThreshold.value,
    degreeDaysPerGeneration: kGen,
    recentWindowDays: profile.recentWindowDays.value,
    hasRanges: hasRanges || devRanges,
    hasTraitRanges: hasRanges,
    table,
    evaluate,
    window,
    gonotrophicCycleDays: gono,
    bitingRate: bite,
    lifespanDays: lifespan,
    survival,
    eipDays: eip,
    vectorialCapacityRaw: vcRaw,
    optimum: { temperature: tOpt, value: vOpt },
  };
  cache.set(profile, compiled);
  return compiled;
}

export interface TraitsAt {
  temperature: number;
  gonotrophicCycleDays: number | null;
  bitingRate: number;
  lifespanDays: number;
  survival: number;
  /** Null when the EIP is not completed (see eipNotCompleted). */
  eipDays: number | null;
  /** Why eipDays is null: no development at this temperature, or beyond the mosquito's life or a season; null when it completes. */
  eipNotCompleted: EipNotCompleted | null;
  /** pⁿ */
  survivalThroughEip: number;
  /** a²pⁿ/(−ln p) divided by the profile's optimum (1 at the optimum temperature). */
  relativeVectorialCapacity: number;
  /** Expected life (1/(−ln p)) over the EIP, at most 1. */
  eipShareInLifetime: number;
}

const finiteOrNull = (x: number): number | null => (Number.isFinite(x) ? x : null);

/** The profile's traits at a constant temperature (°C). */
export function traitsAt(profile: Profile, temperature: number, variant: VariantName = 'central'): TraitsAt {
  const c = compileProfile(profile);
  const v = VARIANT_NAMES.indexOf(variant) as Variant;
  const l = c.lifespanDays(temperature);
  const p = c.survival(temperature);
  const n = c.eipDays(temperature, v);
  const pn = n < Infinity && p > 0 ? Math.pow(p, n) : 0;
  const notCompleted = eipCompletion(n, pn);
  return {
    temperature,
    gonotrophicCycleDays: finiteOrNull(c.gonotrophicCycleDays(temperature, v)),
    bitingRate: c.bitingRate(temperature, v),
    lifespanDays: l,
    survival: p,
    eipDays: notCompleted === null ? n : null,
    eipNotCompleted: notCompleted,
    survivalThroughEip: pn,
    relativeVectorialCapacity: c.vectorialCapacityRaw(temperature, v) / c.optimum.value,
    eipShareInLifetime: n < Infinity && l > 0 ? Math.min(1, l / n) : 0,
  };
}

/**
 * EIP in days at a constant temperature, or null where the pathogen does not develop (outside the
 * limits of the profile's EIP model). Not clamped by survival: see traitsAt for "not completed".
 */
export function eipDays(profile: Profile, temperature: number, variant: VariantName = 'central'): number | null {
  const v = VARIANT_NAMES.indexOf(variant) as Variant;
  return finiteOrNull(compileProfile(profile).eipDays(temperature, v));
}

/** Temperature (°C) at which the profile's central vectorial capacity peaks, and the peak (unscaled). */
export function vectorialCapacityOptimum(profile: Profile): { temperature: number; value: number } {
  return compileProfile(profile).optimum;
}

const R0_TRAITS = ['a', 'efd', 'pea', 'mdr', 'pdr'] as const;

/**
 * Thermal R0 in the form of Mordecai et al. 2017 (PLoS Negl. Trop. Dis. 11:e0005568, eq. 1) and
 * Mordecai et al. 2013 (Ecol. Lett. 16:22–30, eq. 2), with density, human and recovery terms left out:
 *   R0(T) ∝ [a² bc e^(−μ/PDR) EFD pEA MDR / μ³]^½,
 * bc the product of the `b` and `c` fits or one `bc` fit; μ = 1/lf (lifespan fit) or −ln p (daily
 * survival fit `p`). Needs the profile's `thermalTraits`; returns null without them.
 */
export function thermalR0(profile: Profile, temperature: number): number | null {
  const traits = profile.thermalTraits;
  if (!traits || R0_TRAITS.some((k) => traits[k] === undefined)) return null;
  const at = (k: string): number => curveFunction(traits[k])(temperature);
  let bc: number;
  // Only ratios of R0 are used, so a bc fit in per cent (as Mordecai et al. 2013) needs no rescaling.
  if (traits.bc) bc = at('bc');
  else if (traits.b && traits.c) bc = at('b') * at('c');
  else return null;
  let mu: number;
  if (traits.lf) {
    const lf = at('lf');
    if (!(lf > 0)) return 0;
    mu = 1 / lf;
  } else if (traits.p) {
    const p = at('p');
    if (!(p > 0 && p < 1)) return 0;
    mu = -Math.log(p);
  } else return null;
  const f = Object.fromEntries(R0_TRAITS.map((k) => [k, at(k)])) as Record<(typeof R0_TRAITS)[number], number>;
  if (!(f.pdr > 0) || !(bc > 0)) return 0;
  return Math.sqrt((f.a * f.a * bc * Math.exp(-mu / f.pdr) * f.efd * f.pea * f.mdr) / (mu * mu * mu));
}
