import { queryOptions, useQuery } from '@tanstack/react-query';
import { conflictsResponse } from '../../../../shared/api/weather.schema';
import { api } from '../../../lib/api-client';
import { weatherKeys } from './weather-keys';

/** GET /api/weather/conflicts — hand corrections standing against newer values from a feed or an upload. */
export const conflictsQueryOptions = () =>
  queryOptions({
    queryKey: weatherKeys.conflicts,
    queryFn: ({ signal }) => api.get('/api/weather/conflicts', conflictsResponse, signal),
    select: (r) => r.conflicts,
  });
export const useConflicts = () => useQuery(conflictsQueryOptions());
