import { z } from 'zod';
import { DRIVERS, TIERS } from '../tier/tier-settings';
import { uuid } from './common.schema';
import { runWarning } from './problems.schema';

const tier = z.enum(TIERS);
const driverId = z.enum(DRIVERS);
const confidence = z.enum(['ok', 'stale', 'insufficient']);
const zone = z.enum(['below', 'within', 'above']);

export const driverDto = z.object({
  id: driverId,
  label: z.string(),
  score: z.number().nullable(),
  weight: z.number(),
  contribution: z.number(),
  detail: z.record(z.string(), z.union([z.number(), z.boolean(), z.string(), z.null()])),
});
export type DriverDto = z.infer<typeof driverDto>;

/** One row of the Ladder. */
export const ladderRow = z.object({
  districtId: uuid,
  code: z.string(),
  name: z.string(),
  isDemo: z.boolean(),
  /** The region the district belongs to (one level above it), or null. */
  region: z.object({ id: uuid, code: z.string(), name: z.string() }).nullable(),
  rank: z.number().int(),
  tier,
  tierLow: tier,
  tierHigh: tier,
  score: z.number(),
  /** Tier steps since last week (+1 = one tier up); null when last week has no tier. */
  tierChange: z.number().int().nullable(),
  scoreChange: z.number().nullable(),
  leadingDriver: driverId.nullable(),
  changedDriver: driverId.nullable(),
  confidence,
  /** Cases of the newest complete week (`casesWeek`: its reporting is over), summed over `casesDiseases`. */
  casesThisWeek: z.number().int().nullable(),
  /** The week `casesThisWeek` counts; null when no complete week has a count (or the tier predates this field). */
  casesWeek: z.object({ year: z.number().int(), week: z.number().int() }).nullable(),
  /** The diseases counted in `casesThisWeek`. */
  casesDiseases: z.array(z.object({ code: z.string(), name: z.string() })),
  channelZone: zone.nullable(),
  latestWeather: z.string().nullable(),
  profileId: z.string().nullable(),
});
export type LadderRow = z.infer<typeof ladderRow>;

export const boardResponse = z.object({
  epiYear: z.number().int().nullable(),
  epiWeek: z.number().int().nullable(),
  asOf: z.string().nullable(),
  computedAt: z.string().nullable(),
  rows: z.array(ladderRow),
});
export type BoardResponse = z.infer<typeof boardResponse>;

const nullableNumbers = z.array(z.number().nullable());

/** Everything the District file shows, in one answer. Daily series are parallel arrays over `dates`. */
export const districtFileResponse = z.object({
  district: z.object({ id: uuid, code: z.string(), name: z.string(), isDemo: z.boolean(), lat: z.number().nullable(), lon: z.number().nullable() }),
  seasonYear: z.number().int(),
  seasons: z.array(z.number().int()),
  /** The district's profile assignment: which profiles the season run computes, the biofix, who assigned them and when. */
  profiles: z.array(z.object({
    profileId: z.string(),
    profileName: z.string(),
    biofix: z.string().nullable(),
    defaultBiofix: z.string().nullable(),
    assignedBy: z.string().nullable(),
    assignedAt: z.string().nullable(),
  })),
  weather: z.object({
    dates: z.array(z.string()),
    tmin: nullableNumbers,
    tmax: nullableNumbers,
    rh: nullableNumbers,
    rain: nullableNumbers,
    filled: z.array(z.boolean()),
    /** Where the series comes from: its own stations, or interpolated from the nearest ones. */
    source: z.string().nullable(),
  }),
  vectorClock: z.array(
    z.object({
      profileId: z.string(),
      profileName: z.string(),
      dates: z.array(z.string()),
      cumulativeDegreeDays: nullableNumbers,
      generations: nullableNumbers,
      eipDays: nullableNumbers,
      survivalThroughEip: nullableNumbers,
      rvc: nullableNumbers,
      rvcLow: nullableNumbers,
      rvcHigh: nullableNumbers,
      seasonOpen: z.array(z.boolean()),
      complete: z.array(z.boolean()),
    }),
  ),
  cases: z.array(
    z.object({
      diseaseId: uuid,
      diseaseName: z.string(),
      weeks: z.array(z.number().int()),
      counts: nullableNumbers,
      channel: z.object({ lower: nullableNumbers, centre: nullableNumbers, upper: nullableNumbers, method: z.string() }),
      priorSeasons: z.array(z.object({ year: z.number().int(), counts: nullableNumbers })),
      /**
       * The first week still open for reporting (its deadline has not passed and it is not closed); from it
       * on counts are partial: drawn as incomplete, given no channel zone. Null when every week is complete.
       */
      openFrom: z.number().int().nullable().default(null),
    }),
  ),
  larval: z.array(
    z.object({ epiYear: z.number().int(), epiWeek: z.number().int(), surveys: z.number().int(), pupaSurveys: z.number().int(), house: z.number().nullable(), container: z.number().nullable(), breteau: z.number().nullable(), pupa: z.number().nullable() }),
  ),
  tiers: z.array(
    z.object({ epiYear: z.number().int(), epiWeek: z.number().int(), tier, tierLow: tier, tierHigh: tier, score: z.number(), confidence, drivers: z.array(driverDto), notes: z.array(z.string()), leadingDriver: driverId.nullable(), changedDriver: driverId.nullable() }),
  ),
});
export type DistrictFileResponse = z.infer<typeof districtFileResponse>;

export const seasonRunDto = z.object({
  id: uuid,
  kind: z.enum(['nightly', 'manual']),
  /** True when a person started the run (a manual run without one was started by the system, e.g. at start-up). */
  byPerson: z.boolean().default(false),
  full: z.boolean(),
  status: z.enum(['running', 'succeeded', 'failed']),
  startedAt: z.string(),
  finishedAt: z.string().nullable(),
  asOf: z.string(),
  districtsTotal: z.number().int(),
  districtsDone: z.number().int(),
  districtsSkipped: z.number().int(),
  rowsWritten: z.number().int(),
  /** Districts left out because their data failed (each named by a `district_failed` warning). */
  districtsFailed: z.number().int(),
  /** At most 1,000 warnings are listed (failed districts first). */
  warnings: z.array(runWarning),
  /** How many more warnings the run raised than `warnings` lists (0 when all are listed). */
  warningsNotListed: z.number().int().nonnegative().default(0),
  /** Why the run as a whole stopped, as a code (`interrupted`, `drill_stopped`, …). */
  error: z.string().nullable(),
});
export type SeasonRunDto = z.infer<typeof seasonRunDto>;
export const seasonRunsResponse = z.object({ runs: z.array(seasonRunDto) });
export const startSeasonRunBody = z.strictObject({ full: z.boolean().default(false) });
export const districtFileQuery = z.strictObject({ season: z.coerce.number().int().min(1900).max(2100).optional() });
