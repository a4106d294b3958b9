import { z } from 'zod';
import { districtRef } from './auth.schema';
import { uuid } from './common.schema';
import { isoDate } from './date.schema';
import { indicesDto } from './surveys.schema';
import { WORK_KINDS } from '../field/work-kinds';
import { AMOUNT_UNITS } from '../field/field-records';

/**
 * Field records (issue 19, item 3): a piece of vector-control work as a team member recorded it, online
 * or not. Coverage, product and notes are optional; an empty field is stored as "not given", never as 0.
 */

const count = z
  .number({ message: 'must be a number' })
  .int({ message: 'must be a whole number' })
  .min(0, { message: 'cannot be negative' })
  .max(100_000, { message: 'is implausibly large' });

const optionalText = (max: number) => z.string().trim().max(max, { message: 'is too long' }).nullable().optional();

const fields = {
  /** Made in the browser when the record is first saved, so a resubmission is recognised (as surveys). */
  id: uuid,
  districtId: uuid,
  locality: z.string({ message: 'is required' }).trim().min(1, { message: 'is required' }).max(120, { message: 'is too long' }),
  date: isoDate,
  kind: z.enum(WORK_KINDS, { message: 'is not a known kind of work' }),
  housesVisited: count.nullable().optional(),
  /** Containers treated or removed. */
  containers: count.nullable().optional(),
  /** Area covered, in square metres. */
  areaM2: z
    .number({ message: 'must be a number' })
    .min(0, { message: 'cannot be negative' })
    .max(100_000_000, { message: 'is implausibly large' })
    .nullable()
    .optional(),
  product: optionalText(120),
  amount: z
    .number({ message: 'must be a number' })
    .positive({ message: 'must be more than 0' })
    .max(1_000_000, { message: 'is implausibly large' })
    .nullable()
    .optional(),
  amountUnit: z.enum(AMOUNT_UNITS, { message: 'is not a known unit (ml, l, g, kg)' }).nullable().optional(),
  notes: optionalText(1000),
};

/** An amount needs its unit and the product it measures. */
function checkProduct(r: { product?: string | null; amount?: number | null; amountUnit?: string | null }, ctx: z.RefinementCtx) {
  const hasAmount = r.amount !== null && r.amount !== undefined;
  if (hasAmount && !r.amountUnit) ctx.addIssue({ code: 'custom', path: ['amountUnit'], message: 'is required with an amount' });
  if (hasAmount && !r.product) ctx.addIssue({ code: 'custom', path: ['product'], message: 'is required with an amount' });
}

export const fieldRecordBody = z.strictObject(fields).superRefine(checkProduct);
export type FieldRecordBody = z.input<typeof fieldRecordBody>;

/** GET /api/field-records: the week starting `weekStart` (a Monday or any day: 7 days from it), or the latest; `mine` = the caller's own. */
export const fieldRecordsQuery = z.strictObject({
  weekStart: isoDate.optional(),
  mine: z.enum(['true', 'false']).optional(),
  districtId: uuid.optional(),
});

export const fieldRecordDto = z.object({
  id: uuid,
  district: districtRef,
  locality: z.string(),
  date: z.string(),
  kind: z.enum(WORK_KINDS),
  housesVisited: z.number().nullable(),
  containers: z.number().nullable(),
  areaM2: z.number().nullable(),
  product: z.string().nullable(),
  amount: z.number().nullable(),
  amountUnit: z.enum(AMOUNT_UNITS).nullable(),
  notes: z.string().nullable(),
  submittedBy: z.object({ id: uuid, name: z.string() }).nullable(),
  submittedAt: z.string(),
});
export type FieldRecordDto = z.infer<typeof fieldRecordDto>;

export const fieldRecordsResponse = z.object({ records: z.array(fieldRecordDto) });
export type FieldRecordsResponse = z.infer<typeof fieldRecordsResponse>;

const side = z.object({ surveys: z.number(), indices: indicesDto });

/** GET /api/districts/:id/field-work: the District file's timeline of work, with the surveys before and after each piece. */
export const districtFieldWorkResponse = z.object({
  district: districtRef,
  rule: z.object({ windowDays: z.number(), minSurveysPerSide: z.number() }),
  records: z.array(
    fieldRecordDto.extend({
      before: side,
      after: side,
      /** Both sides have enough surveys to put the indices side by side (BEFORE_AFTER_RULE). */
      comparable: z.boolean(),
    }),
  ),
});
export type DistrictFieldWorkResponse = z.infer<typeof districtFieldWorkResponse>;
