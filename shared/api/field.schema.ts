import { z } from 'zod';
import { WORK_KINDS } from '../field/work-kinds';
import { districtRef } from './auth.schema';
import { uniqueArray, uniqueIds, uuid } from './common.schema';

const teamName = z
  .string()
  .trim()
  .min(1, { message: 'is required' })
  .max(80, { message: 'is too long (80 characters at most)' })
  .refine((s) => !/[\p{Cc}\u2028\u2029]/u.test(s), { message: 'must not contain control characters such as line breaks' });

export const workKind = z.enum(WORK_KINDS, { message: 'must be one of: ' + WORK_KINDS.join(', ') });

/** POST /api/field-teams and PUT /api/field-teams/:id: a field team as the officer keeps it. */
export const fieldTeamBody = z.strictObject({
  name: teamName,
  baseDistrictId: uuid,
  /** Officers and community workers (the people who record work in the Field log). */
  memberIds: uniqueIds(50).default([]),
  kinds: uniqueArray(workKind, { max: WORK_KINDS.length }).min(1, { message: 'names at least one kind of work' }),
  /** District-days the team can work in a week. */
  daysPerWeek: z.number().int({ message: 'must be a whole number' }).min(1, { message: 'must be at least 1' }).max(7, { message: 'must be at most 7' }),
});
export type FieldTeamBody = z.infer<typeof fieldTeamBody>;

export const fieldTeamDto = z.object({
  id: uuid,
  name: z.string(),
  baseDistrict: districtRef,
  members: z.array(z.object({ id: uuid, displayName: z.string(), role: z.string(), language: z.string() })),
  kinds: z.array(workKind),
  daysPerWeek: z.number().int(),
  updatedAt: z.string(),
});
export type FieldTeamDto = z.infer<typeof fieldTeamDto>;

/** GET /api/field-teams */
export const fieldTeamsResponse = z.object({ teams: z.array(fieldTeamDto) });
export type FieldTeamsResponse = z.infer<typeof fieldTeamsResponse>;
