import { z } from 'zod';
import { WORK_KINDS } from '../field/work-kinds';
import { TIERS } from '../tier/tier-settings';
import { isoDate } from './date.schema';
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
  /** Set once the team is retired. */
  retiredAt: z.string().nullable().default(null),
});
export type FieldTeamDto = z.infer<typeof fieldTeamDto>;

/** GET /api/field-teams */
export const fieldTeamsResponse = z.object({ teams: z.array(fieldTeamDto) });
export type FieldTeamsResponse = z.infer<typeof fieldTeamsResponse>;

/** GET /api/field-teams/candidates: the people who may be put on a team (active officers and community workers). */
export const fieldTeamCandidatesResponse = z.object({
  people: z.array(z.object({ id: uuid, displayName: z.string(), role: z.string() })),
});

// ── The Field week ──────────────────────────────────────────────────────────────────────────────

export const FIELD_WEEK_STATUSES = ['draft', 'awaiting_approval', 'published'] as const;
const tierEnum = z.enum(TIERS);
const reasonCode = z.enum(['planned', 'partly_planned', 'no_tier', 'not_needed', 'no_population', 'no_location', 'no_teams', 'no_trained_team', 'out_of_reach', 'capacity_spent']);

/** POST /api/field-weeks/proposal: propose the week starting `weekStart` (a Monday; the coming one when left out). */
export const fieldWeekProposalBody = z.strictObject({
  weekStart: isoDate.optional().refine((d) => d === undefined || new Date(`${d}T00:00:00Z`).getUTCDay() === 1, { message: 'must be a Monday' }),
  /** Travel limit from a team's base: straight-line km between district centroids. */
  maxTravelKm: z.number().positive({ message: 'must be more than 0' }).max(2000, { message: 'must be at most 2000' }).optional(),
});
export type FieldWeekProposalBody = z.infer<typeof fieldWeekProposalBody>;

/** GET /api/field-weeks?weekStart=… (the coming week when left out). */
export const fieldWeekQuery = z.strictObject({ weekStart: isoDate.optional() });

export const plannedDay = z.strictObject({ teamId: uuid, districtId: uuid, day: isoDate });

/** PUT /api/field-weeks/:id/days: the officer's edit, the whole week's days at once. */
export const fieldWeekDaysBody = z.strictObject({
  days: uniqueArray(plannedDay, { max: 2000, key: (d) => `${d.teamId} ${d.day}` }),
});
export type FieldWeekDaysBody = z.infer<typeof fieldWeekDaysBody>;

export const districtDecisionDto = z.object({
  districtId: uuid,
  code: z.string(),
  name: z.string(),
  rank: z.number().int(),
  tier: tierEnum.nullable(),
  /** Tier score × population at risk × visit weight. */
  risk: z.number(),
  daysNeeded: z.number().int(),
  /** Days the solver proposed (the officer's edits are in `days`). */
  daysProposed: z.number().int(),
  workNeeded: z.array(workKind),
  reason: z.object({ code: reasonCode, params: z.record(z.string(), z.union([z.string(), z.number(), z.array(z.string())])) }),
});

/** What the solver said, stored with the week. */
export const fieldWeekProposalRecord = z.object({
  ladderWeek: z.object({ year: z.number().int(), week: z.number().int() }).nullable(),
  maxTravelKm: z.number(),
  visitWeight: z.number(),
  coveredRisk: z.number(),
  /** The same data planned by taking the top districts in Ladder order per team. */
  ladderOrderRisk: z.number(),
  totalRisk: z.number(),
  districts: z.array(districtDecisionDto),
});
export type FieldWeekProposalRecord = z.infer<typeof fieldWeekProposalRecord>;

export const fieldWeekDto = fieldWeekProposalRecord.extend({
  id: uuid,
  weekStart: z.string(),
  /** The working days of the week (Monday–Friday). */
  workingDays: z.array(z.string()),
  /** `awaiting_approval`: published by the officer while approval is required, waiting for a supervisor. */
  status: z.enum(FIELD_WEEK_STATUSES),
  edited: z.boolean(),
  teams: z.array(z.object({ id: uuid, name: z.string(), baseDistrict: districtRef, kinds: z.array(workKind), daysPerWeek: z.number().int() })),
  days: z.array(plannedDay),
  publishedAt: z.string().nullable(),
  /** When approval is required: who sent the week to the supervisors and when. */
  submittedAt: z.string().nullable().default(null),
  submittedBy: z.string().nullable().default(null),
  /** The supervisor's last decision (approved, or sent back with its reason). */
  review: z.object({ decision: z.enum(['approved', 'sent_back']), by: z.string().nullable(), at: z.string(), reason: z.string().nullable() }).nullable().default(null),
  /** Mails queued to team members when it was published. */
  mailed: z.number().int().optional(),
});
export type FieldWeekDto = z.infer<typeof fieldWeekDto>;

export const fieldWeekResponse = z.object({ week: fieldWeekDto.nullable() });
export type FieldWeekResponse = z.infer<typeof fieldWeekResponse>;

/** POST /api/field-weeks/:id/send-back (supervisor): the reason the officer reads. */
export const sendBackFieldWeekBody = z.strictObject({
  reason: z.string().trim().min(3, { message: 'must say why (3 characters or more)' }).max(500, { message: 'is too long (500 characters at most)' }),
});
export type SendBackFieldWeekBody = z.infer<typeof sendBackFieldWeekBody>;

/** GET /api/field-weeks/awaiting (supervisor): the weeks waiting for approval, oldest first. */
export const awaitingFieldWeeksResponse = z.object({
  weeks: z.array(z.object({ id: uuid, weekStart: z.string(), submittedAt: z.string().nullable(), submittedBy: z.string().nullable(), days: z.number().int(), teams: z.number().int() })),
});
export type AwaitingFieldWeeksResponse = z.infer<typeof awaitingFieldWeeksResponse>;

/** GET/PUT /api/field-settings (admin): whether a supervisor must approve the week's plan before it is published. */
export const fieldSettingsDto = z.object({
  approvalRequired: z.boolean(),
  updatedAt: z.string().nullable(),
  updatedBy: z.object({ id: uuid, displayName: z.string() }).nullable(),
});
export type FieldSettingsDto = z.infer<typeof fieldSettingsDto>;

export const fieldSettingsBody = z.strictObject({
  approvalRequired: z.boolean({ message: 'must be true or false' }),
  /** Why the setting changes (kept with the audit event, as every admin change). */
  reason: z.string().trim().min(3, { message: 'must say why (3 characters or more)' }).max(500, { message: 'is too long (500 characters at most)' }),
});
export type FieldSettingsBody = z.infer<typeof fieldSettingsBody>;
