import type { SurveyDto } from '../../shared/api/surveys.schema';
import { larvalIndices } from '../../shared/signals';
import type { LarvalSurveyEntity } from './larval-survey.entity';

export const surveyCounts = (s: LarvalSurveyEntity) => ({
  housesInspected: s.housesInspected,
  housesPositive: s.housesPositive,
  containersInspected: s.containersInspected,
  containersPositive: s.containersPositive,
  ...(s.pupae === null ? {} : { pupae: s.pupae }),
});

export const presentSurvey = (s: LarvalSurveyEntity, district: { id: string; code: string; name: string }): SurveyDto => ({
  id: s.id,
  district,
  locality: s.locality,
  date: s.surveyDate,
  year: s.epiYear,
  week: s.epiWeek,
  housesInspected: s.housesInspected,
  housesPositive: s.housesPositive,
  containersInspected: s.containersInspected,
  containersPositive: s.containersPositive,
  pupae: s.pupae,
  containerTypes: s.containerTypes,
  notes: s.notes,
  submittedAt: s.submittedAt.toISOString(),
  indices: larvalIndices(surveyCounts(s)),
  voided: voidedOf(s),
});

export const voidedOf = (s: { voidedAt: Date | null; voidedBy: string | null; voidReason: string | null }) =>
  s.voidedAt ? { at: s.voidedAt.toISOString(), by: s.voidedBy, reason: s.voidReason ?? '' } : null;
