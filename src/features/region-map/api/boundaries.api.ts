import { queryOptions, useQuery } from '@tanstack/react-query';
import { boundariesResponse } from '../../../../shared/api/districts.schema';
import { api } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export type { BoundariesResponse } from '../../../../shared/api/districts.schema';

/** Under the districts family, so any district change (a new boundary) refreshes the map too. */
export const boundariesQueryKey = [...queryKeys.districts.all, 'boundaries'] as const;

/** GET /api/districts/boundaries — the boundaries of the districts in view, for the region map. */
export const boundariesQueryOptions = () =>
  queryOptions({
    queryKey: boundariesQueryKey,
    queryFn: ({ signal }) => api.get('/api/districts/boundaries', boundariesResponse, signal),
    staleTime: 10 * 60_000,
  });

export const useBoundaries = () => useQuery(boundariesQueryOptions());
