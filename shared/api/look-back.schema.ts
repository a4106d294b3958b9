import { z } from 'zod';
import { TIERS } from '../tier/tier-settings';
import { idParams, uuid } from './common.schema';
import { runWarning } from './problems.schema';

/** At most this many seasons in one Look-back (the issue's "10 seasons"). */
export const LOOK_BACK_MAX_SEASONS = 10;
/** Lead times scored, in weeks (issue 18: 1–12). */
export const LOOK_BACK_LEADS = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12] as const;

const year = z
  .number({ message: 'must be a year' })
  .int({ message: 'must be a whole year' })
  .min(1900, { message: 'must be 1900 or later' })
  .max(2100, { message: 'must be 2100 or earlier' });

/** POST /api/look-back/runs: replay the epidemiological years fromYear…toYear (weeks after today are left out). */
export const startLookBackBody = z
  .strictObject({ fromYear: year, toYear: year })
  .superRefine((b, ctx) => {
    if (b.toYear < b.fromYear) ctx.addIssue({ code: 'custom', path: ['toYear'], message: 'must not be before fromYear' });
    else if (b.toYear - b.fromYear + 1 > LOOK_BACK_MAX_SEASONS)
      ctx.addIssue({ code: 'custom', path: ['toYear'], message: `spans too many seasons (${LOOK_BACK_MAX_SEASONS} at most)` });
  });
export type StartLookBackBody = z.infer<typeof startLookBackBody>;

export const lookBackRunDto = z.object({
  id: uuid,
  fromYear: z.number().int(),
  toYear: z.number().int(),
  status: z.enum(['running', 'succeeded', 'failed']),
  districtsTotal: z.number().int(),
  districtsDone: z.number().int(),
  weeksWritten: z.number().int(),
  /** Districts left out because their data failed (each named by a `district_failed` warning). */
  districtsFailed: z.number().int(),
  byPerson: z.boolean(),
  startedAt: z.string(),
  finishedAt: z.string().nullable(),
  warnings: z.array(runWarning),
  error: z.string().nullable(),
});
export type LookBackRunDto = z.infer<typeof lookBackRunDto>;
export const lookBackRunsResponse = z.object({ runs: z.array(lookBackRunDto) });
export type LookBackRunsResponse = z.infer<typeof lookBackRunsResponse>;

export const lookBackRunParams = idParams;

/**
 * GET /api/look-back/runs/:id/scores. `lead` (weeks) limits the answer to one lead time (default all
 * of 1–12); `level` groups the scores overall, by region or by district (`districtId` picks one);
 * `warnAt` is the lowest tier that counts as a warning (default `high`).
 */
export const lookBackScoresQuery = z
  .strictObject({
    lead: z.coerce.number({ message: 'must be a number of weeks' }).int({ message: 'must be whole weeks' }).min(1, { message: 'must be 1 to 12' }).max(12, { message: 'must be 1 to 12' }).optional(),
    level: z.enum(['overall', 'region', 'district'], { message: 'must be overall, region or district' }).default('overall'),
    districtId: uuid.optional(),
    warnAt: z.enum(TIERS.filter((t) => t !== 'baseline') as ['raised', 'high', 'critical'], { message: 'must be raised, high or critical' }).default('high'),
  })
  .superRefine((q, ctx) => {
    if (q.districtId && q.level !== 'district') ctx.addIssue({ code: 'custom', path: ['districtId'], message: 'needs level=district' });
  });
export type LookBackScoresQuery = z.infer<typeof lookBackScoresQuery>;

const rate = z.number().nullable();
const interval = z.object({ estimate: rate, lower: rate, upper: rate, replicates: z.number().int() });
const modelScores = z.object({
  table: z.object({ hits: z.number().int(), falseAlarms: z.number().int(), misses: z.number().int(), correctNegatives: z.number().int() }),
  hitRate: rate,
  falseAlarmRatio: rate,
  falseAlarmRate: rate,
  auc: rate,
  brier: rate,
  hitRateInterval: interval,
  falseAlarmRatioInterval: interval,
  aucInterval: interval,
  falseAlarmRateInterval: interval,
});
export type ModelScoresDto = z.infer<typeof modelScores>;
export const leadSkillDto = z.object({
  lead: z.number().int(),
  pairs: z.number().int(),
  tier: modelScores,
  climatology: modelScores,
  persistence: modelScores,
  channel: modelScores,
});
export type LeadSkillDto = z.infer<typeof leadSkillDto>;

/** One group of scores: the whole run, one region or one district. */
export const skillGroupDto = z.object({
  level: z.enum(['overall', 'region', 'district']),
  /** The region's or district's id; null overall (and for districts without a region). */
  id: z.string().nullable(),
  name: z.string().nullable(),
  districts: z.number().int(),
  leads: z.array(leadSkillDto),
  /** Weeks of unbroken warning before each event onset (capped at 12). */
  leadTimes: z.array(z.number().int()),
});
export type SkillGroupDto = z.infer<typeof skillGroupDto>;

export const lookBackScoresResponse = z.object({
  runId: uuid,
  warnAt: z.enum(TIERS),
  /** Which line of the endemic channel a week's cases must exceed to be an event. */
  event: z.object({ method: z.string(), line: z.literal('upper') }),
  groups: z.array(skillGroupDto),
});
export type LookBackScoresResponse = z.infer<typeof lookBackScoresResponse>;
