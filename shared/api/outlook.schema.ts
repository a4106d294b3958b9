import { z } from 'zod';
import { uuid } from './common.schema';

/**
 * GET /api/districts/:id/outlook?disease=… — the Case outlook of one district (docs/outlook.md): weekly
 * cases 1–8 weeks ahead with predictive quantiles, ONLY for the weeks ahead at which the outlook beat the
 * seasonal null on past seasons, together with that skill. Without `disease`, the district's disease with
 * the most reported cases.
 */
export const outlookQuery = z.strictObject({ disease: uuid.optional() });
export type OutlookQuery = z.infer<typeof outlookQuery>;

const week = z.object({ year: z.number().int(), week: z.number().int(), weekStart: z.string(), weekEnd: z.string() });

export const outlookForecastDto = week.extend({
  horizon: z.number().int().min(1).max(8),
  mean: z.number(),
  q10: z.number().int(),
  q25: z.number().int(),
  q50: z.number().int(),
  q75: z.number().int(),
  q90: z.number().int(),
});
export type OutlookForecastDto = z.infer<typeof outlookForecastDto>;

export const outlookHorizonSkillDto = z.object({
  horizon: z.number().int(),
  /** Past forecasts scored at this horizon (the same weeks for the outlook and the null). */
  scored: z.number().int(),
  logScore: z.number().nullable(),
  nullLogScore: z.number().nullable(),
  crps: z.number().nullable(),
  nullCrps: z.number().nullable(),
  /** 1 − CRPS / null CRPS (above 0: closer to what happened than the seasonal null). */
  crpsSkill: z.number().nullable(),
  /** Mean log score minus the null's, per forecast. */
  logScoreGain: z.number().nullable(),
  coverage80: z.number().nullable(),
  coverage50: z.number().nullable(),
  beatsNull: z.boolean(),
});
export type OutlookHorizonSkillDto = z.infer<typeof outlookHorizonSkillDto>;

export const OUTLOOK_STATUSES = ['ok', 'too_little_data', 'no_cases', 'failed'] as const;

export const districtOutlookResponse = z.object({
  districtId: uuid,
  disease: z.object({ id: uuid, name: z.string() }).nullable(),
  diseases: z.array(z.object({ id: uuid, name: z.string() })),
  /** ok; too_little_data (under two seasons of counts); no_cases (no counts for the disease); failed (the fit failed: a warning was logged). */
  status: z.enum(OUTLOOK_STATUSES),
  /** The last finished week with a count: the forecast starts after it. */
  origin: week.extend({ cases: z.number().int() }).nullable(),
  /** The weeks ahead with a fan: 1…fanHorizons (0: the outlook did not beat the seasonal null, no fan). */
  fanHorizons: z.number().int().min(0).max(8),
  /** Only the weeks ahead 1…fanHorizons. */
  forecast: z.array(outlookForecastDto),
  /** The finished weeks before the origin (up to 16), for the chart. */
  recent: z.array(week.extend({ cases: z.number().int().nullable() })),
  skill: z
    .object({
      horizons: z.array(outlookHorizonSkillDto),
      origins: z.number().int(),
      firstOrigin: z.object({ year: z.number().int(), week: z.number().int() }).nullable(),
      lastOrigin: z.object({ year: z.number().int(), week: z.number().int() }).nullable(),
    })
    .nullable(),
  model: z
    .object({
      terms: z.array(z.string()),
      coefficients: z.array(z.number()),
      theta: z.number(),
      drivers: z.array(z.enum(['rvc', 'eipShare', 'rain'])),
      weeks: z.number().int(),
      profileId: z.string().nullable(),
    })
    .nullable(),
  computedAt: z.string(),
});
export type DistrictOutlookResponse = z.infer<typeof districtOutlookResponse>;
