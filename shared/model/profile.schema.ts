import { z } from 'zod';
import { CUTOFFS, DEGREE_DAY_METHODS } from './degree-days';
import { DAY_LENGTH_DEFINITIONS } from './day-length';

/**
 * The profile contract: a vector–pathogen pair as DATA. Every parameter carries its provenance:
 * a tag ('pub' read in the publication, 'derived' computed from a published formula or figure,
 * 'memory' recalled and not confirmed, 'common practice' a convention of the trade without a single
 * source) and a source (author, year, title, journal, where = table/page/equation). A source may be
 * left out only for 'common practice'. The server stores profiles and lets an admin amend them; this
 * schema is what every stored or amended profile must satisfy.
 */

export const PROVENANCE_TAGS = ['pub', 'derived', 'memory', 'common practice'] as const;
export const provenanceTagSchema = z.enum(PROVENANCE_TAGS);
export type ProvenanceTag = z.infer<typeof provenanceTagSchema>;

export const sourceSchema = z.strictObject({
  author: z.string().min(1),
  year: z.number().int().min(1800).max(2100),
  title: z.string().min(1),
  journal: z.string().min(1).optional(),
  /** Table, figure, page or equation. */
  where: z.string().min(1).optional(),
});
export type Source = z.infer<typeof sourceSchema>;

const provenanceShape = {
  tag: provenanceTagSchema,
  source: sourceSchema.optional(),
  note: z.string().min(1).optional(),
};

function requireSource(v: { tag: ProvenanceTag; source?: Source }, ctx: z.RefinementCtx): void {
  if (v.tag !== 'common practice' && v.source === undefined) {
    ctx.addIssue({ code: 'custom', path: ['source'], message: `a '${v.tag}' value needs its source` });
  }
}

/** A single value with its provenance. */
export const pointParamSchema = z
  .strictObject({ value: z.number().finite(), unit: z.string().min(1), ...provenanceShape })
  .superRefine(requireSource);
export type PointParam = z.infer<typeof pointParamSchema>;

/** A value with an optional low / high range from the literature. */
export const rangedParamSchema = z
  .strictObject({
    value: z.number().finite(),
    low: z.number().finite().optional(),
    high: z.number().finite().optional(),
    unit: z.string().min(1),
    ...provenanceShape,
  })
  .superRefine((v, ctx) => {
    requireSource(v, ctx);
    if (v.low !== undefined && v.low > v.value) ctx.addIssue({ code: 'custom', path: ['low'], message: 'low must not exceed value' });
    if (v.high !== undefined && v.high < v.value) ctx.addIssue({ code: 'custom', path: ['high'], message: 'high must not be below value' });
  });
export type RangedParam = z.infer<typeof rangedParamSchema>;

/**
 * A thermal response curve (°C → trait), zero outside its domain:
 *  briere     c·T·(T − t0)·√(tm − T) for t0 < T < tm
 *  quadratic  −c·(T − t0)·(T − tm)   for t0 < T < tm
 *  polynomial Σ coefficients[i]·T^i, floored at 0
 */
export const thermalCurveSchema = z.discriminatedUnion('form', [
  z
    .strictObject({ form: z.literal('briere'), c: z.number().positive(), t0: z.number(), tm: z.number(), unit: z.string().min(1), ...provenanceShape })
    .superRefine((v, ctx) => {
      requireSource(v, ctx);
      if (!(v.t0 < v.tm)) ctx.addIssue({ code: 'custom', path: ['tm'], message: 'tm must be above t0' });
    }),
  z
    .strictObject({ form: z.literal('quadratic'), c: z.number().positive(), t0: z.number(), tm: z.number(), unit: z.string().min(1), ...provenanceShape })
    .superRefine((v, ctx) => {
      requireSource(v, ctx);
      if (!(v.t0 < v.tm)) ctx.addIssue({ code: 'custom', path: ['tm'], message: 'tm must be above t0' });
    }),
  z
    .strictObject({ form: z.literal('polynomial'), coefficients: z.array(z.number().finite()).min(1).max(6), unit: z.string().min(1), ...provenanceShape })
    .superRefine(requireSource),
]);
export type ThermalCurve = z.infer<typeof thermalCurveSchema>;

const choice = <T extends readonly [string, ...string[]]>(values: T) =>
  z.strictObject({ value: z.enum(values), ...provenanceShape }).superRefine(requireSource);

export const developmentSchema = z
  .strictObject({
    /** What one generation spans: egg to emerging adult, or egg to the next egg. */
    span: z.enum(['egg-to-adult', 'egg-to-egg']),
    lowerThreshold: pointParamSchema,
    upperThreshold: pointParamSchema,
    degreeDaysPerGeneration: rangedParamSchema,
    method: choice(DEGREE_DAY_METHODS),
    cutoff: choice(CUTOFFS),
  })
  .superRefine((v, ctx) => {
    if (!(v.lowerThreshold.value < v.upperThreshold.value)) {
      ctx.addIssue({ code: 'custom', path: ['upperThreshold'], message: 'upper threshold must be above the lower threshold' });
    }
    if (!(v.degreeDaysPerGeneration.value > 0) || (v.degreeDaysPerGeneration.low ?? 1) <= 0) {
      ctx.addIssue({ code: 'custom', path: ['degreeDaysPerGeneration'], message: 'degree-days per generation must be positive' });
    }
  });

/** Gonotrophic cycle length U (days). */
export const gonotrophicSchema = z.discriminatedUnion('model', [
  /** Detinova 1962 degree-day form: U = offsetDays + k / (T − threshold), for T > threshold. */
  z.strictObject({ model: z.literal('degree-days'), k: rangedParamSchema, threshold: pointParamSchema, offsetDays: pointParamSchema }),
  /** U = 1 / a(T), from the profile's biting-rate curve. */
  z.strictObject({ model: z.literal('inverse-biting-rate'), ...provenanceShape }).superRefine(requireSource),
]);

/** Daily biting rate a (per day). */
export const bitingRateSchema = z.discriminatedUnion('model', [
  /** a = 1 / U (one blood meal per gonotrophic cycle). */
  z.strictObject({ model: z.literal('inverse-gonotrophic-cycle'), ...provenanceShape }).superRefine(requireSource),
  z.strictObject({ model: z.literal('curve'), curve: thermalCurveSchema }),
]);

/** Daily survival p. */
export const survivalSchema = z.discriminatedUnion('model', [
  /** p = exp(−1 / L(T)), L the expected adult lifespan in days (0 where L ≤ 0). */
  z.strictObject({ model: z.literal('lifespan'), lifespan: thermalCurveSchema }),
]);

/** Extrinsic incubation period n (days) at a temperature. */
export const eipSchema = z.discriminatedUnion('model', [
  /**
   * n = k / (T − threshold) for threshold < T < upperLimit. The optional upper limit is where the
   * pathogen stops developing (the Tm of a published development-rate fit); at or above it there is no EIP.
   */
  z.strictObject({ model: z.literal('degree-days'), k: rangedParamSchema, threshold: rangedParamSchema, upperLimit: pointParamSchema.optional() }),
  /** mean n = exp(intercept + slope·T). */
  z.strictObject({ model: z.literal('log-linear'), intercept: pointParamSchema, slope: pointParamSchema }),
  /** n = 1 / rate(T), rate a thermal curve (per day). */
  z.strictObject({ model: z.literal('rate-curve'), rate: thermalCurveSchema }),
]);

export const DAY_LENGTH_DEFINITION_NAMES = Object.keys(DAY_LENGTH_DEFINITIONS) as [keyof typeof DAY_LENGTH_DEFINITIONS, ...(keyof typeof DAY_LENGTH_DEFINITIONS)[]];

export const seasonWindowSchema = z.discriminatedUnion('model', [
  /** No diapause: the window is always open. */
  z.strictObject({ model: z.literal('none'), ...provenanceShape }).superRefine(requireSource),
  /**
   * Diapause: open while day length ≥ criticalPhotoperiod AND the temperature state is warm; the
   * temperature state turns warm when the recent mean reaches openMeanTemperature and cold when it
   * falls below closeMeanTemperature (hysteresis).
   */
  z
    .strictObject({
      model: z.literal('photoperiod-temperature'),
      criticalPhotoperiod: pointParamSchema,
      dayLengthDefinition: choice(DAY_LENGTH_DEFINITION_NAMES),
      openMeanTemperature: pointParamSchema,
      closeMeanTemperature: pointParamSchema,
      rule: z.strictObject({ ...provenanceShape }).superRefine(requireSource),
    })
    .superRefine((v, ctx) => {
      if (v.closeMeanTemperature.value > v.openMeanTemperature.value) {
        ctx.addIssue({ code: 'custom', path: ['closeMeanTemperature'], message: 'must not be above openMeanTemperature' });
      }
    }),
]);

export const profileSchema = z
  .strictObject({
    schemaVersion: z.literal(1),
    id: z.string().regex(/^[a-z0-9]+(-[a-z0-9]+)*$/, 'kebab-case id'),
    name: z.string().min(1),
    vector: z.string().min(1),
    pathogen: z.string().min(1),
    summary: z.string().min(1),
    development: developmentSchema,
    gonotrophicCycle: gonotrophicSchema,
    bitingRate: bitingRateSchema,
    survival: survivalSchema,
    eip: eipSchema,
    seasonWindow: seasonWindowSchema,
    biofix: z.strictObject({ monthDay: z.string().regex(/^(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/, 'MM-DD'), ...provenanceShape }).superRefine(requireSource),
    /** Days in the trailing window whose mean temperature drives the daily traits. */
    recentWindowDays: pointParamSchema.refine((p) => Number.isInteger(p.value) && p.value >= 1 && p.value <= 60, 'an integer 1…60'),
    /**
     * Optional thermal trait fits of the Mordecai et al. R0 form: a, b, c (or bc), efd, pea, mdr, lf (or p,
     * daily survival), pdr. Used by thermalR0, and by the vectorial capacity when `capacity` says so.
     */
    thermalTraits: z.record(z.string(), thermalCurveSchema).optional(),
    /**
     * What the relative vectorial capacity multiplies beyond a²·pⁿ/(−ln p). Default 'garrett-jones': nothing
     * (density m left out). 'mordecai': the vector competence (thermalTraits bc, or b·c; left out when
     * the profile has neither) and the
     * equilibrium density m ∝ EFD·pEA·MDR·L² (thermalTraits efd, pea, mdr; L the profile's lifespan),
     * as in the R0 of Mordecai et al. 2013 / 2017 — so the capacity is zero wherever one of those
     * published curves is zero (their thermal limits).
     */
    capacity: z
      .strictObject({ model: z.enum(['garrett-jones', 'mordecai']), ...provenanceShape })
      .superRefine(requireSource)
      .optional(),
    notes: z.array(z.string().min(1)).optional(),
  })
  .superRefine((v, ctx) => {
    if (v.capacity?.model === 'mordecai') {
      const t = v.thermalTraits ?? {};
      const missing = ['efd', 'pea', 'mdr'].filter((k) => t[k] === undefined);
      if ((t.b === undefined) !== (t.c === undefined)) missing.push(t.b === undefined ? 'b' : 'c');
      if (missing.length) ctx.addIssue({ code: 'custom', path: ['capacity'], message: `the 'mordecai' capacity needs thermalTraits ${missing.join(', ')}` });
    }
    if (v.eip.model === 'degree-days' && v.eip.upperLimit && !(v.eip.upperLimit.value > (v.eip.threshold.high ?? v.eip.threshold.value))) {
      ctx.addIssue({ code: 'custom', path: ['eip', 'upperLimit'], message: 'must be above the threshold' });
    }
    if (v.gonotrophicCycle.model === 'inverse-biting-rate' && v.bitingRate.model === 'inverse-gonotrophic-cycle') {
      ctx.addIssue({ code: 'custom', path: ['bitingRate'], message: 'gonotrophic cycle and biting rate cannot both be defined by each other' });
    }
  });

export type Profile = z.infer<typeof profileSchema>;
export type ProfileInput = z.input<typeof profileSchema>;

/** Validate unknown data as a profile; throws a ZodError listing every problem. */
export function parseProfile(data: unknown): Profile {
  return profileSchema.parse(data);
}
