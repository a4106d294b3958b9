import { queryOptions, useQuery } from '@tanstack/react-query';
import { districtsResponse } from '../../../../shared/api/districts.schema';
import { api } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** GET /api/districts — every district the signed-in role may see (a community worker: only their own). */
export const districtsQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.districts.all,
    queryFn: ({ signal }) => api.get('/api/districts', districtsResponse, signal),
    select: (r) => r.districts,
  });

export const useDistricts = () => useQuery(districtsQueryOptions());
