import { z } from 'zod';
import { voidedDto } from './void.schema';
import { epiWeekEnd, epiWeekStart, weeksInYear, type EpiWeekSystem } from '../model/epi-week';
import { channelBandSchema, channelMethodSchema, channelZoneSchema } from '../signals/schemas';
import { districtRef } from './auth.schema';
import { uniqueArray, uuid } from './common.schema';

/**
 * The Case ledger's API contract (docs/case-ledger.md): diseases, weekly counts with their revisions,
 * week closing, the upload report and the signals of one district. The week rules that depend on the
 * deployment (the week system, today's date) are in `weekProblem`, used by the server and the form alike.
 */

/** A weekly count: a whole number of cases, never negative. */
export const caseNumber = z
  .number({ message: 'must be a number' })
  .int({ message: 'must be a whole number' })
  .min(0, { message: 'cannot be negative' })
  .max(1_000_000, { message: 'is implausibly large (over 1,000,000)' });

export const epiYear = z
  .number({ message: 'must be a year' })
  .int({ message: 'must be a whole year' })
  .min(1990, { message: 'must be 1990 or later' })
  .max(2100, { message: 'must be 2100 or earlier' });

export const epiWeekNumber = z
  .number({ message: 'must be a week number' })
  .int({ message: 'must be a whole week number' })
  .min(1, { message: 'must be between 1 and 53' })
  .max(53, { message: 'must be between 1 and 53' });

/** The age bands of the optional split (years). Cases of unknown age are the remainder. */
export const AGE_BANDS = ['0-4', '5-14', '15-44', '45-64', '65+'] as const;
export type AgeBand = (typeof AGE_BANDS)[number];

const reason = z
  .string()
  .trim()
  .min(3, { message: 'must say why (at least 3 characters)' })
  .max(500, { message: 'is too long (500 characters at most)' });

/**
 * Why a week may not be reported, or null when it may: a week that does not exist in that year
 * (53 in a 52-week year), a week that has not started yet, or one before the district reported.
 * `today` and `activeFrom` are YYYY-MM-DD.
 */
export function weekProblem(
  year: number,
  week: number,
  system: EpiWeekSystem,
  today: string,
  activeFrom?: string | null,
): { path: 'week' | 'year'; message: string } | null {
  const n = weeksInYear(year, system);
  if (week > n) return { path: 'week', message: `${week} does not exist in ${year} (that year has ${n} weeks)` };
  const start = epiWeekStart(year, week, system);
  if (start > today) return { path: 'week', message: `has not started yet (week ${week} of ${year} begins ${start})` };
  // The week must end on or after the day the district started reporting.
  if (activeFrom && epiWeekEnd(year, week, system) < activeFrom)
    return { path: 'week', message: `is before the district started reporting (${activeFrom})` };
  return null;
}

const splitFields = {
  confirmed: caseNumber.nullable().optional(),
  probable: caseNumber.nullable().optional(),
  ageBands: z
    .partialRecord(z.enum(AGE_BANDS, { message: `must be one of ${AGE_BANDS.join(', ')}` }), caseNumber)
    .nullable()
    .optional(),
};

function checkSplits(
  b: { cases: number; confirmed?: number | null; probable?: number | null; ageBands?: Partial<Record<AgeBand, number>> | null },
  ctx: z.RefinementCtx,
) {
  if ((b.confirmed ?? 0) + (b.probable ?? 0) > b.cases)
    ctx.addIssue({ code: 'custom', path: ['confirmed'], message: 'and probable together exceed the cases' });
  const ages = Object.values(b.ageBands ?? {}).reduce<number>((a, n) => a + (n ?? 0), 0);
  if (ages > b.cases) ctx.addIssue({ code: 'custom', path: ['ageBands'], message: 'add up to more than the cases' });
}

/**
 * Enter or correct one weekly count (PUT /districts/:id/cases). A count that exists and differs is a
 * correction and needs a reason; so does any change to a closed week.
 */
export const caseCountBody = z
  .strictObject({
    diseaseId: uuid,
    year: epiYear,
    week: epiWeekNumber,
    cases: caseNumber,
    ...splitFields,
    reason: reason.optional(),
    /** Where the entry came from, for the revision history. */
    source: z.enum(['form', 'grid']).default('form'),
  })
  .superRefine(checkSplits);
export type CaseCountBody = z.input<typeof caseCountBody>;

/** The entry form's schema: the body plus the district and the deployment's week rules. */
export const caseEntryFormSchema = (system: EpiWeekSystem, today: string) =>
  z
    .object({
      districtId: uuid,
      diseaseId: uuid,
      year: epiYear,
      week: epiWeekNumber,
      cases: caseNumber,
      confirmed: caseNumber.nullable().optional(),
      probable: caseNumber.nullable().optional(),
      reason: z.string().trim().max(500).optional(),
    })
    .superRefine((b, ctx) => {
      checkSplits(b, ctx);
      const problem = weekProblem(b.year, b.week, system, today);
      if (problem) ctx.addIssue({ code: 'custom', path: [problem.path], message: problem.message });
    });
export type CaseEntryForm = z.infer<ReturnType<typeof caseEntryFormSchema>>;

export const closeWeekBody = z.strictObject({ year: epiYear, week: epiWeekNumber });
export type CloseWeekBody = z.infer<typeof closeWeekBody>;
/** Reopening a closed week undoes a closing; it needs a reason, kept in the audit trail. */
export const reopenWeekBody = z.strictObject({ year: epiYear, week: epiWeekNumber, reason });
export type ReopenWeekBody = z.infer<typeof reopenWeekBody>;

export const channelSettingsBody = z.strictObject({
  diseaseId: uuid,
  excludedYears: z.array(epiYear).max(30, { message: 'lists too many years' }),
});
export type ChannelSettingsBody = z.infer<typeof channelSettingsBody>;

const diseaseCode = z
  .string()
  .trim()
  .regex(/^[A-Z0-9-]{2,16}$/, { message: 'must be 2–16 capital letters, digits or hyphens' });

export const diseaseCreateBody = z.strictObject({
  code: diseaseCode,
  name: z.string().trim().min(1, { message: 'is required' }).max(120, { message: 'is too long' }),
  profileIds: uniqueArray(z.string().regex(/^[a-z0-9-]{2,60}$/, { message: 'is not a profile id' }), { max: 20 }).default([]),
});
export type DiseaseCreateBody = z.input<typeof diseaseCreateBody>;

const coerceInt = (schema: z.ZodNumber) => z.coerce.number().pipe(schema);

export const gridQuery = z.strictObject({
  diseaseId: uuid,
  weeks: coerceInt(z.number().int().min(1).max(52)).default(12),
  /** `mine`: an epidemiologist's assigned districts (everybody else: every district they see). */
  scope: z.enum(['mine', 'all']).default('mine'),
});

/** One stored weekly count (GET /districts/:id/cases/count): what the entry form loads before a correction. */
export const countQuery = z.strictObject({
  diseaseId: uuid,
  year: coerceInt(epiYear),
  week: coerceInt(epiWeekNumber),
});

export const districtCasesQuery = z.strictObject({
  diseaseId: uuid,
  year: coerceInt(epiYear).optional(),
});

// ---- answers ----

export const diseaseDto = z.object({ id: uuid, code: z.string(), name: z.string(), profileIds: z.array(z.string()) });
export type DiseaseDto = z.infer<typeof diseaseDto>;
export const diseasesResponse = z.object({ diseases: z.array(diseaseDto) });

const weekRef = z.object({ year: z.number(), week: z.number(), start: z.string(), end: z.string() });
export type WeekRef = z.infer<typeof weekRef>;

export const casesSettingsResponse = z.object({
  epiWeekSystem: z.enum(['mmwr', 'iso']),
  channelMethod: channelMethodSchema,
  cusum: z.object({ k: z.number(), h: z.number() }),
  deadlineDays: z.number(),
  today: z.string(),
  currentWeek: weekRef,
});
export type CasesSettings = z.infer<typeof casesSettingsResponse>;

export const caseCountDto = z.object({
  id: uuid,
  districtId: uuid,
  diseaseId: uuid,
  year: z.number(),
  week: z.number(),
  cases: z.number(),
  confirmed: z.number().nullable(),
  probable: z.number().nullable(),
  ageBands: z.record(z.string(), z.number()).nullable(),
  version: z.number(),
  late: z.boolean(),
  reportedAt: z.string(),
  updatedAt: z.string(),
  /** Set when the count was voided (entered in error): it stays readable here and in its history, and counts nowhere. */
  voided: voidedDto.optional(),
});
export type CaseCountDto = z.infer<typeof caseCountDto>;

/** The stored count of one district, disease and week, or null when none was entered. */
export const countResponse = z.object({ count: caseCountDto.nullable() });
export type CountResponse = z.infer<typeof countResponse>;

export const caseCountResult = z.object({
  outcome: z.enum(['created', 'corrected', 'unchanged']),
  count: caseCountDto,
  closed: z.boolean(),
});

export const gridCell = z.object({
  year: z.number(),
  week: z.number(),
  count: caseCountDto.nullable(),
  closed: z.boolean(),
  /** Reporting is still open (the deadline has not passed and the week is not closed): the count may be partial. */
  open: z.boolean(),
});
export const gridRow = z.object({
  district: districtRef,
  editable: z.boolean(),
  cells: z.array(gridCell),
  completeness: z.object({ expected: z.number(), received: z.number(), onTime: z.number(), share: z.number().nullable() }),
});
export type GridRow = z.infer<typeof gridRow>;
export const gridResponse = z.object({ disease: diseaseDto, weeks: z.array(weekRef), rows: z.array(gridRow) });
export type GridResponse = z.infer<typeof gridResponse>;

const countValues = z.object({
  cases: z.number(),
  confirmed: z.number().nullable(),
  probable: z.number().nullable(),
  ageBands: z.record(z.string(), z.number()).nullable(),
});
export const revisionDto = z.object({
  version: z.number(),
  at: z.string(),
  kind: z.enum(['entry', 'correction', 'void']),
  source: z.string(),
  actor: z.object({ id: uuid, displayName: z.string() }).nullable(),
  old: countValues.nullable(),
  new: countValues,
  reason: z.string().nullable(),
});
export type RevisionDto = z.infer<typeof revisionDto>;
export const revisionsResponse = z.object({ count: caseCountDto, revisions: z.array(revisionDto) });

export const reopenResponse = z.object({
  districtId: uuid,
  year: z.number(),
  week: z.number(),
  /** False when the week was not closed (nothing was changed). */
  reopened: z.boolean(),
});

export const closureResponse = z.object({
  districtId: uuid,
  year: z.number(),
  week: z.number(),
  closedAt: z.string(),
  alreadyClosed: z.boolean(),
});

/** One problem of an uploaded file: where (row, column), what was there, and why it was refused. */
export const uploadProblem = z.object({
  row: z.number(),
  column: z.string().nullable(),
  value: z.string().nullable(),
  reason: z.string(),
});
export type UploadProblem = z.infer<typeof uploadProblem>;
export const uploadReport = z.object({
  accepted: z.boolean(),
  rows: z.number(),
  created: z.number(),
  corrected: z.number(),
  unchanged: z.number(),
  late: z.number(),
  problems: z.array(uploadProblem),
});
export type UploadReport = z.infer<typeof uploadReport>;

export const signalWeek = z.object({
  week: z.number(),
  start: z.string(),
  countId: uuid.nullable(),
  cases: z.number().nullable(),
  /** The week's count was voided: `cases` is null (it counts nowhere) and `countId` still opens its history. */
  voided: z.boolean().optional(),
  late: z.boolean(),
  closed: z.boolean(),
  /**
   * Reporting is still open (its deadline, `deadline`, has not passed and nobody closed it): `cases` is
   * partial, and zone, C1–C3, CUSUM and growth are null — an open week enters no signal.
   */
  open: z.boolean(),
  /** The last day the week's counts are on time (the week's last day plus the deadline in days). */
  deadline: z.string(),
  incidence: z.number().nullable(),
  channel: channelBandSchema.nullable(),
  seasons: z.number(),
  zone: channelZoneSchema.nullable(),
  c1: z.object({ statistic: z.number().nullable(), alarm: z.boolean().nullable() }),
  c2: z.object({ statistic: z.number().nullable(), alarm: z.boolean().nullable() }),
  c3: z.object({ statistic: z.number().nullable(), alarm: z.boolean().nullable() }),
  cusum: z.object({ statistic: z.number().nullable(), alarm: z.boolean().nullable() }),
  growth: z.object({ ratio: z.number().nullable(), percent: z.number().nullable(), doublingWeeks: z.number().nullable() }),
});
export type SignalWeek = z.infer<typeof signalWeek>;

/**
 * A note on a district's case signals, sent as a code with its parameters (never an English sentence):
 * the client words it in the reader's language (cases.json `district.notes.*`).
 */
export const signalNote = z.discriminatedUnion('code', [
  /** Fewer than two prior seasons: no endemic channel can be drawn. */
  z.object({ code: z.literal('channel-too-few-seasons'), params: z.object({ seasons: z.number().int() }) }),
  /** Fewer prior seasons than recommended (`recommended` to `most`): the channel is wide and unsteady. */
  z.object({ code: z.literal('channel-few-seasons'), params: z.object({ seasons: z.number().int(), recommended: z.number().int(), most: z.number().int() }) }),
  /** Seasons left out of the channel as epidemic years. */
  z.object({ code: z.literal('channel-excluded-years'), params: z.object({ years: z.array(z.number().int()) }) }),
  /** No population on record: no incidence per 100,000. */
  z.object({ code: z.literal('no-population'), params: z.object({}) }),
]);
export type SignalNote = z.infer<typeof signalNote>;

export const signalsResponse = z.object({
  district: districtRef,
  disease: diseaseDto,
  year: z.number(),
  channelMethod: channelMethodSchema,
  epiWeekSystem: z.enum(['mmwr', 'iso']),
  priorSeasons: z.array(z.object({ year: z.number(), weeks: z.array(z.number().nullable()) })),
  seasonsUsed: z.array(z.number()),
  excludedYears: z.array(z.number()),
  population: z.number().nullable(),
  weeks: z.array(signalWeek),
  fittedGrowth: z.object({ weeks: z.number(), ratio: z.number(), doublingWeeks: z.number().nullable() }).nullable(),
  /** The newest complete week of the season (null when none is yet): the headline reads this week. */
  lastCompleteWeek: z.number().nullable(),
  /** CASE_REPORT_DEADLINE_DAYS: days after a week's end until its reporting closes. */
  deadlineDays: z.number(),
  completeness: z.object({ expected: z.number(), received: z.number(), onTime: z.number(), share: z.number().nullable() }),
  notes: z.array(signalNote),
  canEnter: z.boolean(),
  canReadHistory: z.boolean(),
  canClose: z.boolean(),
});
export type SignalsResponse = z.infer<typeof signalsResponse>;

/** The text fields sent with an uploaded file (multipart/form-data). */
export const caseUploadFields = z.strictObject({ reason: reason.optional() });

/** `POST /api/cases/counts/:id/void`: the count, now voided. */
export const voidCountResponse = z.object({ count: caseCountDto });
