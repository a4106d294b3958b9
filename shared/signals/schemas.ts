import { z } from 'zod';

/**
 * Input contracts of the case-signal and larval-index statistics (docs/signals.md).
 * The functions in this folder parse their input with these schemas, and the server's API and the
 * `model` CLI reuse them, so a value that passes here never turns into NaN further on.
 */

/** A count of cases, houses, containers or pupae: a non-negative integer. */
export const countSchema = z.number().int().nonnegative();

/** A finite, non-negative number: a count or a rate (e.g. incidence per 100,000). */
export const nonNegativeNumberSchema = z.number().nonnegative();

/** A weekly series: finite numbers, oldest week first. */
export const seriesSchema = z.array(z.number());

/** The methods of the endemic channel (docs/signals.md, "Endemic channel"). */
export const channelMethodSchema = z.enum(['geometric', 'quartile', 'mean-2sd']);
export type ChannelMethod = z.infer<typeof channelMethodSchema>;

/**
 * Fewest prior seasons a channel accepts: two is the least a sample SD needs. Bortman (1999)
 * recommends 5 to 7; the season run warns below that, the statistic itself does not refuse.
 */
export const CHANNEL_MIN_SEASONS = 2;

/** Counts (or rates) of the same week in each prior season, in any order; epidemic years already left out. */
export const channelHistorySchema = z.array(nonNegativeNumberSchema).min(CHANNEL_MIN_SEASONS, {
  message: `history needs at least ${CHANNEL_MIN_SEASONS} prior seasons (5 to 7 recommended)`,
});

/** Two-sided confidence level of the geometric band. */
export const confidenceLevelSchema = z.number().gt(0).lt(1);

export const channelInputSchema = z.object({
  method: channelMethodSchema,
  history: channelHistorySchema,
});
export type ChannelInput = z.infer<typeof channelInputSchema>;

/** The band of the endemic channel for one week. */
export const channelBandSchema = z
  .object({
    lower: nonNegativeNumberSchema,
    centre: nonNegativeNumberSchema,
    upper: nonNegativeNumberSchema,
  })
  .refine((b) => b.lower <= b.centre && b.centre <= b.upper, {
    message: 'a band needs lower <= centre <= upper',
  });

export const channelZoneSchema = z.enum(['below', 'within', 'above']);
export type ChannelZoneId = z.infer<typeof channelZoneSchema>;

/** Aberration tests of Hutwagner et al. (2003). */
export const aberrationMethodSchema = z.enum(['c1', 'c2', 'c3']);
export type AberrationMethod = z.infer<typeof aberrationMethodSchema>;

/**
 * Smallest SD the aberration tests divide by (docs/signals.md, "Zero SD"). In the series' own unit
 * (cases per week by default). Must be positive so the statistic is always finite.
 */
export const DEFAULT_SD_FLOOR = 0.5;
export const sdFloorSchema = z.number().positive();

export const aberrationInputSchema = z.object({
  method: aberrationMethodSchema,
  series: seriesSchema,
  sdFloor: sdFloorSchema.optional(),
});
export type AberrationInput = z.infer<typeof aberrationInputSchema>;

export const cusumInputSchema = z.object({
  series: seriesSchema,
  /** Expected weekly value μ (in-control mean). */
  mean: z.number(),
  /** Standard deviation σ of the in-control series; must be positive. */
  sd: z.number().positive(),
  /** Reference value k in SD units (0.5 is common practice). */
  k: z.number().nonnegative(),
  /** Decision interval h in SD units (4 to 5 is common practice). */
  h: z.number().positive(),
  /**
   * Restart the sum at 0 on the week after an alarm (common practice once a signal has been acted on;
   * Montgomery, Introduction to Statistical Quality Control, CUSUM chapter [from memory]). Off by
   * default, which is Page's (1954) plain form; the Case outlook and the season run turn it on.
   */
  restart: z.boolean().optional(),
});
export type CusumInput = z.infer<typeof cusumInputSchema>;

/** Per-week statistic and alarm; `null` where the baseline is not yet complete. */
export const signalSeriesResultSchema = z.object({
  statistic: z.array(z.number().nullable()),
  alarm: z.array(z.boolean().nullable()),
});

export const growthInputSchema = z.object({
  previous: nonNegativeNumberSchema,
  current: nonNegativeNumberSchema,
});

/** Weekly counts for a log-linear doubling-time fit: at least two weeks, all positive. */
export const doublingFitSeriesSchema = z
  .array(z.number().positive({ message: 'a log-linear fit needs counts above zero' }))
  .min(2, { message: 'a log-linear fit needs at least two weeks' });

export const incidenceInputSchema = z.object({
  count: nonNegativeNumberSchema,
  population: countSchema,
});

/**
 * One larval survey (WHO definitions; docs/signals.md, "Larval indices"). `containersInspected`
 * counts water-holding containers only. `pupae` is optional (not every survey counts pupae): left
 * out and null mean the same thing (a stored survey without pupae reads back as null).
 */
export const larvalSurveySchema = z
  .object({
    housesInspected: countSchema,
    housesPositive: countSchema,
    containersInspected: countSchema,
    containersPositive: countSchema,
    pupae: countSchema.nullish(),
  })
  .superRefine((s, ctx) => {
    if (s.housesPositive > s.housesInspected) {
      ctx.addIssue({ code: 'custom', path: ['housesPositive'], message: 'positive houses exceed houses inspected' });
    }
    if (s.containersPositive > s.containersInspected) {
      ctx.addIssue({
        code: 'custom',
        path: ['containersPositive'],
        message: 'positive containers exceed containers inspected',
      });
    }
    // A house is positive because larvae or pupae were found in one of its containers, so every
    // positive house brings at least one positive container, and a positive container a positive house.
    if (s.containersPositive < s.housesPositive) {
      ctx.addIssue({
        code: 'custom',
        path: ['containersPositive'],
        message: 'each positive house needs at least one positive container',
      });
    }
    if (s.housesPositive === 0 && s.containersPositive > 0) {
      ctx.addIssue({ code: 'custom', path: ['housesPositive'], message: 'positive containers but no positive house' });
    }
    if (s.housesPositive === 0 && (s.pupae ?? 0) > 0) {
      ctx.addIssue({ code: 'custom', path: ['housesPositive'], message: 'pupae found but no positive house' });
    }
  });
export type LarvalSurvey = z.infer<typeof larvalSurveySchema>;

export const larvalSurveysSchema = z.array(larvalSurveySchema).min(1, { message: 'at least one survey' });
