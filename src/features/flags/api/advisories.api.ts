import { queryOptions, useQuery } from '@tanstack/react-query';
import { advisoriesResponse } from '../../../../shared/api/flags.schema';
import { api } from '../../../lib/api-client';
import { advisoriesKey } from './flags.api';

/** GET /api/advisories — every advisory the signed-in role may see (a community worker: their district's). */
export const advisoriesQueryOptions = () =>
  queryOptions({
    queryKey: advisoriesKey,
    queryFn: ({ signal }) => api.get('/api/advisories', advisoriesResponse, signal),
    select: (r) => r.advisories,
  });
export const useAdvisories = () => useQuery(advisoriesQueryOptions());
