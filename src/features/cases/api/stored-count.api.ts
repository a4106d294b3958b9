import { queryOptions, useQuery } from '@tanstack/react-query';
import { countResponse } from '../../../../shared/api/cases.schema';
import { api } from '../../../lib/api-client';
import { casesKeys } from './cases-keys';

export type StoredCountKey = { districtId: string; diseaseId: string; year: number; week: number };

/** GET /api/districts/:id/cases/count — the stored count of one week (null when none), loaded before a correction. */
export const storedCountQueryOptions = ({ districtId, diseaseId, year, week }: StoredCountKey) =>
  queryOptions({
    queryKey: casesKeys.count(districtId, diseaseId, year, week),
    queryFn: ({ signal }) =>
      api.get(
        `/api/districts/${encodeURIComponent(districtId)}/cases/count?diseaseId=${encodeURIComponent(diseaseId)}&year=${year}&week=${week}`,
        countResponse,
        signal,
      ),
  });

/** The stored count, asked only once district, disease, year and week are all valid. */
export const useStoredCount = (key: StoredCountKey, enabled: boolean) => useQuery({ ...storedCountQueryOptions(key), enabled });
