import { queryOptions, useQuery } from '@tanstack/react-query';
import { districtSurveysResponse } from '../../../../shared/api/surveys.schema';
import { api } from '../../../lib/api-client';

/** GET /api/districts/:id/surveys — a district's recent larval surveys and the indices pooled per week. */
export const districtSurveysQueryOptions = (districtId: string) =>
  queryOptions({
    queryKey: ['surveys', districtId],
    queryFn: ({ signal }) => api.get(`/api/districts/${encodeURIComponent(districtId)}/surveys`, districtSurveysResponse, signal),
  });

export const useDistrictSurveys = (districtId: string | undefined) =>
  useQuery({ ...districtSurveysQueryOptions(districtId ?? ''), enabled: !!districtId });
