import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { polygonGeometry } from '../../../../shared/api/districts.schema';
import { api } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/**
 * The answer of GET /api/districts/boundaries. The contract has no shared schema for it yet, so it is
 * described here from the server's presenter (a FeatureCollection of the districts' Polygon/MultiPolygon).
 */
export const boundariesResponse = z.object({
  type: z.literal('FeatureCollection'),
  features: z.array(
    z.object({
      type: z.literal('Feature'),
      id: z.string(),
      properties: z.object({ id: z.string(), code: z.string(), name: z.string() }),
      geometry: polygonGeometry,
    }),
  ),
});
export type BoundariesResponse = z.infer<typeof boundariesResponse>;

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
