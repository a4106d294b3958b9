import { queryOptions, useQuery } from '@tanstack/react-query';
import { regionsResponse } from '../../../../shared/api/regions.schema';
import { api } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** GET /api/regions — the regions (one level above the district) with how many districts each holds. */
export const regionsQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.regions.all,
    queryFn: ({ signal }) => api.get('/api/regions', regionsResponse, signal),
    select: (r) => r.regions,
  });

export const useRegions = () => useQuery(regionsQueryOptions());
