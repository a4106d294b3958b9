import { z } from 'zod';
import { TIERS, tierSettingsSchema } from '../tier/tier-settings';

/** PUT /api/tier-settings (admin): a new version of the weights and cut points, with why. */
export const tierSettingsBody = z.strictObject({
  settings: tierSettingsSchema,
  reason: z.string().trim().min(3, { message: 'must say why (3 characters or more)' }).max(500),
});
export type TierSettingsBody = z.infer<typeof tierSettingsBody>;

/** POST /api/tier-settings/preview (admin): how this week's Ladder would change under these settings. Nothing is written. */
export const tierSettingsPreviewBody = z.strictObject({ settings: tierSettingsSchema });
export type TierSettingsPreviewBody = z.infer<typeof tierSettingsPreviewBody>;

const tier = z.enum(TIERS);

export const tierSettingsVersionDto = z.object({
  version: z.number().int(),
  settings: tierSettingsSchema,
  changedBy: z.string().nullable(),
  /** The display name of who saved it (null for the default or a deleted user). */
  changedByName: z.string().nullable().optional(),
  reason: z.string(),
  createdAt: z.string(),
});
export type TierSettingsVersionDto = z.infer<typeof tierSettingsVersionDto>;

export const tierSettingsResponse = z.object({
  settings: tierSettingsSchema,
  /** null while the defaults are in force (no version saved yet). */
  version: z.number().int().nullable(),
  history: z.array(tierSettingsVersionDto),
});
export type TierSettingsResponse = z.infer<typeof tierSettingsResponse>;

export const tierSettingsSaveResponse = z.object({ version: z.number().int(), settings: tierSettingsSchema });

export const tierSettingsPreviewResponse = z.object({
  /** The Ladder's week the preview recomputes (null before any season run). */
  epiYear: z.number().int().nullable(),
  epiWeek: z.number().int().nullable(),
  districts: z.number().int(),
  /** Districts whose tier would change, from → to, with their score now and under the new settings. */
  changes: z.array(z.object({
    districtId: z.string(), code: z.string(), name: z.string(), from: tier, to: tier, scoreFrom: z.number(), scoreTo: z.number(),
  })),
});
export type TierSettingsPreviewResponse = z.infer<typeof tierSettingsPreviewResponse>;
