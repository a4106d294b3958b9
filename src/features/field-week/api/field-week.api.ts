import { queryOptions, useQuery } from '@tanstack/react-query';
import { fieldWeekResponse } from '../../../../shared/api/field.schema';
import { api } from '../../../lib/api-client';

export const fieldWeeksQueryKey = ['field-weeks'] as const;
export const fieldWeekQueryKey = (weekStart: string | null) => [...fieldWeeksQueryKey, weekStart ?? 'coming'] as const;

/** GET /api/field-weeks?weekStart=… (health officer, supervisor, team members) — the week's plan, or null. */
export const fieldWeekQueryOptions = (weekStart: string | null) =>
  queryOptions({
    queryKey: fieldWeekQueryKey(weekStart),
    queryFn: ({ signal }) => api.get(`/api/field-weeks${weekStart ? `?weekStart=${encodeURIComponent(weekStart)}` : ''}`, fieldWeekResponse, signal),
    select: (r) => r.week,
  });

export const useFieldWeek = (weekStart: string | null) => useQuery(fieldWeekQueryOptions(weekStart));
