import { z } from 'zod';
import { voidedDto } from './void.schema';
import { larvalSurveySchema } from '../signals/schemas';
import { districtRef } from './auth.schema';
import { uuid } from './common.schema';
import { isoDate } from './date.schema';

/**
 * Larval surveys (docs/case-ledger.md, "Field surveys"). The cross-field rules (positive houses within
 * houses inspected, …) are the ones of shared/signals' `larvalSurveySchema`, applied to the same fields.
 */

/** Types of water-holding container a survey may record (the form's checkboxes). */
export const CONTAINER_TYPES = [
  'drum or barrel',
  'tank or cistern',
  'bucket or jar',
  'tyre',
  'flower pot or vase',
  'plant saucer',
  'discarded can or bottle',
  'gutter or drain',
  'other',
] as const;

const count = z
  .number({ message: 'must be a number' })
  .int({ message: 'must be a whole number' })
  .min(0, { message: 'cannot be negative' })
  .max(100_000, { message: 'is implausibly large' });

const fields = {
  /** Made in the browser when the survey is first saved, so a resubmission is recognised. */
  id: uuid,
  districtId: uuid,
  locality: z.string().trim().min(1, { message: 'is required' }).max(120, { message: 'is too long' }),
  date: isoDate,
  housesInspected: count,
  housesPositive: count,
  containersInspected: count,
  containersPositive: count,
  pupae: count.nullable().optional(),
  containerTypes: z.array(z.enum(CONTAINER_TYPES, { message: 'is not a known container type' })).max(CONTAINER_TYPES.length).default([]),
  notes: z.string().trim().max(1000, { message: 'is too long' }).nullable().optional(),
};

/** The larval-index rules of shared/signals, reported on the form's own field names. */
function checkCounts(
  s: { housesInspected: number; housesPositive: number; containersInspected: number; containersPositive: number; pupae?: number | null },
  ctx: z.RefinementCtx,
) {
  const parsed = larvalSurveySchema.safeParse({ ...s, pupae: s.pupae ?? undefined });
  if (parsed.success) return;
  for (const issue of parsed.error.issues) ctx.addIssue({ code: 'custom', path: issue.path, message: issue.message });
}

export const surveyBody = z.strictObject(fields).superRefine(checkCounts);
export type SurveyBody = z.input<typeof surveyBody>;

/** What the field form holds (the id and district are added when the survey is saved). */
export const surveyFormSchema = (today: string) =>
  z
    .object({
      districtId: uuid,
      locality: fields.locality,
      date: isoDate.refine((d) => d <= today, { message: 'cannot be in the future' }),
      housesInspected: count,
      housesPositive: count,
      containersInspected: count,
      containersPositive: count,
      pupae: count.nullable().optional(),
      containerTypes: z.array(z.enum(CONTAINER_TYPES)),
      notes: z.string().max(1000).optional(),
    })
    .superRefine(checkCounts);
export type SurveyForm = z.infer<ReturnType<typeof surveyFormSchema>>;

export const indicesDto = z.object({
  house: z.number().nullable(),
  container: z.number().nullable(),
  breteau: z.number().nullable(),
  pupa: z.number().nullable(),
});
export type IndicesDto = z.infer<typeof indicesDto>;

export const surveyDto = z.object({
  id: uuid,
  district: districtRef,
  locality: z.string(),
  date: z.string(),
  year: z.number(),
  week: z.number(),
  housesInspected: z.number(),
  housesPositive: z.number(),
  containersInspected: z.number(),
  containersPositive: z.number(),
  pupae: z.number().nullable(),
  containerTypes: z.array(z.string()),
  notes: z.string().nullable(),
  submittedAt: z.string(),
  indices: indicesDto,
  /** Set when the survey was voided (entered in error): it no longer counts in any index. */
  voided: voidedDto.optional(),
});
export type SurveyDto = z.infer<typeof surveyDto>;

export const districtSurveysResponse = z.object({
  district: districtRef,
  surveys: z.array(surveyDto),
  /** `pupaSurveys`: how many of the week's surveys counted pupae (the pupa index pools those alone). */
  weeks: z.array(z.object({ year: z.number(), week: z.number(), surveys: z.number(), pupaSurveys: z.number(), houses: z.number(), indices: indicesDto })),
});
export type DistrictSurveysResponse = z.infer<typeof districtSurveysResponse>;
