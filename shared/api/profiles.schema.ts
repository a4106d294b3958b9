import { z } from 'zod';
import { sourceSchema, provenanceTagSchema } from '../model/profile.schema';
import { uniqueArray, uniqueIds } from './common.schema';

/** A month-day "MM-DD" that exists in some year (02-29 is allowed: leap years have it). */
const DAYS_IN_MONTH = [31, 29, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];
export const monthDay = z
  .string({ message: 'must be a month-day MM-DD' })
  .regex(/^\d{2}-\d{2}$/, { message: 'must be a month-day MM-DD' })
  .refine((s) => {
    const [m, d] = s.split('-').map(Number);
    return m >= 1 && m <= 12 && d >= 1 && d <= DAYS_IN_MONTH[m - 1];
  }, { message: 'is not a real month-day' });

/** One parameter of a profile, flattened: its path in the profile, value(s) and where it comes from. */
export const profileParameterDto = z.object({
  path: z.string(),
  value: z.union([z.number(), z.string(), z.array(z.number())]).nullable(),
  low: z.number().nullable(),
  high: z.number().nullable(),
  unit: z.string().nullable(),
  tag: provenanceTagSchema,
  source: sourceSchema.nullable(),
  note: z.string().nullable(),
});
export type ProfileParameterDto = z.infer<typeof profileParameterDto>;

export const profileDto = z.object({
  id: z.string(),
  name: z.string(),
  vector: z.string(),
  pathogen: z.string(),
  summary: z.string(),
  /** Shipped with Broodcast (published, never edited in place) or a local variant of one. */
  kind: z.enum(['published', 'variant']),
  baseProfileId: z.string().nullable(),
  defaultBiofix: z.string(),
  parameters: z.array(profileParameterDto),
  createdBy: z.string().nullable(),
  createdAt: z.string().nullable(),
});
export type ProfileDto = z.infer<typeof profileDto>;
export const profilesResponse = z.object({ profiles: z.array(profileDto) });
export type ProfilesResponse = z.infer<typeof profilesResponse>;

export const MAX_ASSIGN_DISTRICTS = 10_000;

/** Assign profiles (each with an optional biofix) to many districts at once; replaces their assignment. */
export const assignProfilesBody = z
  .strictObject({
    districtIds: uniqueIds(MAX_ASSIGN_DISTRICTS).optional(),
    regionCodes: uniqueArray(z.string().trim().min(1).max(64), { max: 1_000 }).optional(),
    profiles: uniqueArray(
      z.strictObject({ profileId: z.string({ message: 'is required' }).min(1).max(100), biofix: monthDay.nullable() }),
      { max: 10, key: (p) => p.profileId },
    ),
    reason: z.string({ message: 'is required' }).trim().min(3, { message: 'must say why (3 characters at least)' }).max(500),
  })
  .superRefine((v, ctx) => {
    if (v.districtIds === undefined && v.regionCodes === undefined) {
      ctx.addIssue({ code: 'custom', path: ['districtIds'], message: 'name districtIds or regionCodes' });
    } else if ((v.districtIds?.length ?? 0) + (v.regionCodes?.length ?? 0) === 0) {
      ctx.addIssue({ code: 'custom', path: ['districtIds'], message: 'must list at least one district' });
    }
  });
export type AssignProfilesBody = z.infer<typeof assignProfilesBody>;
export const assignProfilesResponse = z.object({ updated: z.number().int() });

/** A local variant: a copy of a published profile under a new id and name, each change with its source. */
export const profileVariantBody = z.strictObject({
  id: z.string({ message: 'is required' }).regex(/^[a-z0-9]+(-[a-z0-9]+)*$/, { message: 'must be a kebab-case id' }).max(100),
  name: z.string({ message: 'is required' }).trim().min(1).max(200),
  changes: uniqueArray(
    z.strictObject({
      /** A parameter path as GET /api/profiles lists it, e.g. development.lowerThreshold. */
      path: z.string({ message: 'is required' }).min(1).max(200),
      value: z.number({ message: 'must be a number' }).finite().optional(),
      low: z.number().finite().optional(),
      high: z.number().finite().optional(),
      source: z.string({ message: 'is required' }).trim().min(3, { message: 'must say where the value comes from' }).max(500),
    }),
    { max: 50, key: (c) => c.path },
  ).min(1, { message: 'must change at least one parameter' }),
  reason: z.string({ message: 'is required' }).trim().min(3, { message: 'must say why (3 characters at least)' }).max(500),
});
export type ProfileVariantBody = z.infer<typeof profileVariantBody>;
