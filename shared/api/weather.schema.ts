import { z } from 'zod';
import { voidBody } from './void.schema';
import { RAIN_UNITS, TEMPERATURE_UNITS } from '../units';
import { uuid } from './common.schema';
import { isoDate } from './date.schema';

const stationCode = z.string().trim().regex(/^[A-Za-z0-9_.-]{2,32}$/, {
  message: 'must be 2–32 letters, digits, dots, hyphens or underscores',
});

export const stationCreateBody = z.strictObject({
  code: stationCode,
  name: z.string().trim().min(1, { message: 'is required' }).max(120, { message: 'is too long' }),
  latitude: z.number({ message: 'must be a number' }).min(-90).max(90),
  longitude: z.number({ message: 'must be a number' }).min(-180).max(180),
  elevation: z.number({ message: 'must be a number of metres' }).min(-500).max(9000).nullable().default(null),
  activeFrom: isoDate.nullable().default(null),
  activeTo: isoDate.nullable().default(null),
}).refine((b) => !b.activeFrom || !b.activeTo || b.activeFrom <= b.activeTo, {
  message: 'must not be before the first active date', path: ['activeTo'],
});
export type StationCreateBody = z.infer<typeof stationCreateBody>;

export const stationUpdateBody = z.strictObject({
  name: z.string().trim().min(1).max(120).optional(),
  latitude: z.number().min(-90).max(90).optional(),
  longitude: z.number().min(-180).max(180).optional(),
  elevation: z.number().min(-500).max(9000).nullable().optional(),
  activeFrom: isoDate.nullable().optional(),
  activeTo: isoDate.nullable().optional(),
}).refine((b) => Object.keys(b).length > 0, { message: 'nothing to change' });
export type StationUpdateBody = z.infer<typeof stationUpdateBody>;

export const stationDto = z.object({
  id: uuid,
  code: z.string(),
  name: z.string(),
  latitude: z.number(),
  longitude: z.number(),
  elevation: z.number().nullable(),
  activeFrom: z.string().nullable(),
  activeTo: z.string().nullable(),
  isDemo: z.boolean(),
  district: z.object({ id: uuid, code: z.string(), name: z.string() }).nullable(),
  lastDate: z.string().nullable(),
  days: z.number(),
});
export type StationDto = z.infer<typeof stationDto>;
export const stationsResponse = z.object({ stations: z.array(stationDto) });

export const rangeQuery = z.strictObject({ from: isoDate.optional(), to: isoDate.optional() });

export const observationDto = z.object({
  date: z.string(),
  tmin: z.number(),
  tmax: z.number(),
  rh: z.number().nullable(),
  rain: z.number().nullable(),
  flags: z.array(z.string()),
  uploadId: z.string().nullable(),
  revisions: z.number(),
});
export const stationDaysResponse = z.object({ station: stationDto, days: z.array(observationDto) });

export const revisionDto = z.object({
  date: z.string(),
  tmin: z.number(),
  tmax: z.number(),
  rh: z.number().nullable(),
  rain: z.number().nullable(),
  flags: z.array(z.string()),
  previousUploadId: z.string().nullable(),
  replacedByUploadId: z.string().nullable(),
  replacedBy: z.string().nullable(),
  replacedAt: z.string(),
  /** 'void': the day was voided with `reason` (it counts nowhere); 'replaced': a later intake wrote other values. */
  kind: z.enum(['replaced', 'void']).optional(),
  reason: z.string().nullable().optional(),
});
export const revisionsQuery = z.strictObject({ date: isoDate.optional() });

/** Void one station-day entered in error (admin, health officer): its values stay in the revisions, and count nowhere. */
export const voidDayBody = z.strictObject({
  /** The station's code, as in an upload or a correction. */
  station: z.string().trim().min(1, { message: 'is required' }),
  date: isoDate,
  reason: voidBody.shape.reason,
});
export type VoidDayBody = z.infer<typeof voidDayBody>;
export const revisionsResponse = z.object({ revisions: z.array(revisionDto) });


/** The form fields beside the file (multipart). */
export const uploadForm = z.strictObject({
  tempUnit: z.enum(TEMPERATURE_UNITS, { message: 'must be C or F' }).default('C'),
  rainUnit: z.enum(RAIN_UNITS, { message: 'must be mm or in' }).default('mm'),
});
export const uploadQuery = z.strictObject({ wait: z.enum(['true', 'false']).optional() });

export const uploadDto = z.object({
  id: uuid,
  source: z.enum(['upload', 'feed', 'correction']),
  fileName: z.string().nullable(),
  /** refused: the file cannot be loaded (reasonCode says why); failed: a fault on the server's side. */
  status: z.enum(['processing', 'done', 'failed', 'refused']),
  tempUnit: z.enum(TEMPERATURE_UNITS),
  rainUnit: z.enum(RAIN_UNITS),
  bytesTotal: z.number(),
  bytesProcessed: z.number(),
  rowsProcessed: z.number(),
  rowsAccepted: z.number(),
  rowsFlagged: z.number(),
  rowsRejected: z.number(),
  rowsReplaced: z.number(),
  /** Rows held as implausible: stored, left out of the model and the tier until confirmed or corrected. */
  rowsHeld: z.number().optional(),
  /** Rows not applied because a person had corrected the day by hand (listed as conflicts to resolve). */
  rowsConflicting: z.number().optional(),
  issueCount: z.number(),
  message: z.string().nullable(),
  /** Why the upload was refused or failed, as a stable code, and the values it names (a line, a limit). */
  reasonCode: z.string().nullable().default(null),
  reasonParams: z.record(z.string(), z.union([z.string(), z.number()])).nullable().default(null),
  createdAt: z.string(),
  finishedAt: z.string().nullable(),
});
export type UploadDto = z.infer<typeof uploadDto>;
export const uploadsResponse = z.object({ uploads: z.array(uploadDto) });

/** The values stored now for a report line's station and day (°C, %, mm), and whether the day is still held. */
export const storedDayDto = z.object({
  tmin: z.number(),
  tmax: z.number(),
  rh: z.number().nullable(),
  rain: z.number().nullable(),
  held: z.boolean(),
});
export type StoredDayDto = z.infer<typeof storedDayDto>;

export const issueDto = z.object({
  rowNumber: z.number().nullable(),
  station: z.string().nullable(),
  date: z.string().nullable(),
  column: z.string(),
  value: z.string().nullable(),
  /** held: stored but left out of the model until a person confirms or corrects it (rule: the reason code). */
  severity: z.enum(['rejected', 'flagged', 'filled', 'held']),
  rule: z.string(),
  reason: z.string(),
  /** The figures a held line names: column, value, median, mad, z, n, basis ('station' | 'neighbours'), alternative. */
  params: z.record(z.string(), z.union([z.string(), z.number(), z.null()])).nullish(),
  /** The day as stored now (null: nothing stored), so a correction starts from every value of the row. */
  stored: storedDayDto.nullish(),
});
export type IssueDto = z.infer<typeof issueDto>;
export const issuesQuery = z.strictObject({
  offset: z.coerce.number().int().min(0).default(0),
  limit: z.coerce.number().int().min(1).max(5000).default(500),
});
/** The row report as a page of JSON, or whole as CSV in the reader's units (SI by default). */
export const issuesReportQuery = issuesQuery.extend({
  format: z.enum(['json', 'csv']).default('json'),
  temperature: z.enum(TEMPERATURE_UNITS, { message: 'must be C or F' }).default('C'),
  rain: z.enum(RAIN_UNITS, { message: 'must be mm or in' }).default('mm'),
});
export const issuesResponse = z.object({ total: z.number(), issues: z.array(issueDto) });

/** One corrected day of one station, in the units given; it goes through the same checks as an upload. */
export const correctionBody = z.strictObject({
  station: z.string().trim().min(1, { message: 'is required' }),
  date: z.string({ message: 'is required' }).trim().pipe(isoDate),
  tmin: z.number({ message: 'must be a number' }),
  tmax: z.number({ message: 'must be a number' }),
  rh: z.number().nullable().optional(),
  dewpoint: z.number().nullable().optional(),
  rain: z.number().nullable().optional(),
  tempUnit: z.enum(TEMPERATURE_UNITS).default('C'),
  rainUnit: z.enum(RAIN_UNITS).default('mm'),
});
export type CorrectionBody = z.infer<typeof correctionBody>;

const sourceStation = z.object({ id: uuid, code: z.string(), name: z.string(), distanceKm: z.number(), weight: z.number() });
export const districtWeatherSource = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('stations'), stations: z.array(sourceStation) }),
  z.object({ kind: z.literal('interpolated'), stations: z.array(sourceStation) }),
  z.object({ kind: z.literal('none'), stations: z.array(sourceStation) }),
]);
export type DistrictWeatherSource = z.infer<typeof districtWeatherSource>;

export const seriesDayDto = z.object({
  date: z.string(),
  tmin: z.number().nullable(),
  tmax: z.number().nullable(),
  rh: z.number().nullable(),
  rain: z.number().nullable(),
  filled: z.boolean(),
  missing: z.boolean(),
  stationCount: z.number(),
});
export type SeriesDayDto = z.infer<typeof seriesDayDto>;
export const districtSeriesResponse = z.object({
  district: z.object({ id: uuid, code: z.string(), name: z.string(), isDemo: z.boolean() }),
  source: districtWeatherSource,
  summary: z.object({ days: z.number(), filled: z.number(), missing: z.number(), first: z.string().nullable(), last: z.string().nullable() }),
  days: z.array(seriesDayDto),
});
export type DistrictSeriesResponse = z.infer<typeof districtSeriesResponse>;

export const feedPullResponse = uploadDto;

/** Confirm held station-days as true values (admin, health officer): they then count in the series and the tier. */
export const confirmBody = z.strictObject({
  station: z.string().trim().min(1, { message: 'is required' }),
  date: isoDate,
  reason: voidBody.shape.reason,
});
export type ConfirmBody = z.infer<typeof confirmBody>;
export const confirmResponse = z.object({ stationId: uuid, date: z.string(), districtsRecomputed: z.number() });

const dayValues = z.object({ tmin: z.number(), tmax: z.number(), rh: z.number().nullable(), rain: z.number().nullable() });

/** A held station-day and why it is held (the report lines of the intake that wrote it). */
export const heldDayDto = dayValues.extend({
  stationId: uuid,
  station: z.string(),
  date: z.string(),
  uploadId: z.string().nullable(),
  reasons: z.array(z.object({ rule: z.string(), column: z.string(), params: z.record(z.string(), z.union([z.string(), z.number(), z.null()])).nullable() })),
});
export type HeldDayDto = z.infer<typeof heldDayDto>;
export const heldResponse = z.object({ total: z.number(), held: z.array(heldDayDto) });

/** An open conflict: the hand-corrected values that stand, and the values a feed or an upload brought since. */
export const conflictDto = z.object({
  id: z.string(),
  stationId: uuid,
  station: z.string(),
  date: z.string(),
  current: dayValues.nullable(),
  incoming: dayValues,
  uploadId: z.string(),
  source: z.enum(['upload', 'feed', 'correction']),
  createdAt: z.string(),
});
export type ConflictDto = z.infer<typeof conflictDto>;
export const conflictsResponse = z.object({ conflicts: z.array(conflictDto) });
export const conflictParams = z.strictObject({ id: z.string().regex(/^[1-9][0-9]{0,17}$/, { message: 'must be a conflict number' }) });
export const resolveConflictBody = z.strictObject({
  choice: z.enum(['keep', 'take'], { message: 'must be keep or take' }),
  reason: voidBody.shape.reason,
});
export type ResolveConflictBody = z.infer<typeof resolveConflictBody>;
export const resolveConflictResponse = z.object({ id: z.string(), choice: z.enum(['keep', 'take']), districtsRecomputed: z.number() });
