import { z } from 'zod';

/** The four tiers, lowest first. Ids are stored; labels are shown, always with the tier word. */
export const TIERS = ['baseline', 'raised', 'high', 'critical'] as const;
export type Tier = (typeof TIERS)[number];
export const TIER_LABELS: Record<Tier, string> = { baseline: 'Baseline', raised: 'Raised', high: 'High', critical: 'Critical' };

export const DRIVERS = ['climate', 'vectorClock', 'larval', 'cases'] as const;
export type DriverId = (typeof DRIVERS)[number];
export const DRIVER_LABELS: Record<DriverId, string> = {
  climate: 'Climate suitability',
  vectorClock: 'Vector clock',
  larval: 'Larval indices',
  cases: 'Case signal',
};

const weight = z.number().min(0, { message: 'must be 0 or more' }).max(10, { message: 'must be 10 or less' });
const cut = z.number().gt(0, { message: 'must be above 0' }).lt(1, { message: 'must be below 1' });

/**
 * The weights and cut points an admin edits (each change recorded with a reason). Defaults are
 * Broodcast's starting choice (common practice in composite indices: equal-ish weights, quarter cuts),
 * not a published calibration; docs/tier.md says so.
 */
export const tierSettingsSchema = z
  .strictObject({
    weights: z.strictObject({ climate: weight, vectorClock: weight, larval: weight, cases: weight }),
    /** Scores at or above each cut reach the next tier: raised, high, critical. */
    cuts: z.strictObject({ raised: cut, high: cut, critical: cut }),
    /** Breteau index at which the larval driver reaches its full score. */
    breteauFull: z.number().gt(0).max(500),
    /** Weather older than this many days makes the tier "stale". */
    staleWeatherDays: z.number().int().min(1).max(60),
    /** Case counts older than this many weeks make the case driver "stale". */
    staleCaseWeeks: z.number().int().min(1).max(12),
  })
  .refine((s) => s.cuts.raised < s.cuts.high && s.cuts.high < s.cuts.critical, {
    message: 'cut points must rise: raised < high < critical',
    path: ['cuts'],
  })
  .refine((s) => Object.values(s.weights).some((w) => w > 0), { message: 'at least one weight must be above 0', path: ['weights'] });
export type TierSettings = z.infer<typeof tierSettingsSchema>;

export const DEFAULT_TIER_SETTINGS: TierSettings = {
  weights: { climate: 0.3, vectorClock: 0.2, larval: 0.15, cases: 0.35 },
  cuts: { raised: 0.25, high: 0.5, critical: 0.75 },
  breteauFull: 50,
  staleWeatherDays: 3,
  staleCaseWeeks: 2,
};
