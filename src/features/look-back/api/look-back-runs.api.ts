import { queryOptions, useQuery } from '@tanstack/react-query';
import { lookBackRunsResponse } from '../../../../shared/api/look-back.schema';
import { api } from '../../../lib/api-client';

export const lookBackRunsQueryKey = ['look-back', 'runs'] as const;

/** GET /api/look-back/runs — the Look-backs, newest first. */
export const lookBackRunsQueryOptions = () =>
  queryOptions({
    queryKey: lookBackRunsQueryKey,
    queryFn: ({ signal }) => api.get('/api/look-back/runs', lookBackRunsResponse, signal),
    select: (r) => r.runs,
  });

export const useLookBackRuns = () => useQuery(lookBackRunsQueryOptions());
