import { queryOptions, useQuery } from '@tanstack/react-query';
import { seasonRunsResponse } from '../../../../shared/api/board.schema';
import { api } from '../../../lib/api-client';

export const seasonRunsQueryKey = ['season-runs'] as const;

/** GET /api/season-runs (admin, health officer) — the history of season runs, newest first. */
export const seasonRunsQueryOptions = () =>
  queryOptions({
    queryKey: seasonRunsQueryKey,
    queryFn: ({ signal }) => api.get('/api/season-runs', seasonRunsResponse, signal),
    select: (r) => r.runs,
  });

export const useSeasonRuns = () => useQuery(seasonRunsQueryOptions());
