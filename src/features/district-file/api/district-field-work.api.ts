import { queryOptions, useQuery } from '@tanstack/react-query';
import { districtFieldWorkResponse } from '../../../../shared/api/field-records.schema';
import { api } from '../../../lib/api-client';

/** GET /api/districts/:id/field-work — the work done in the district, with the larval indices before and after each piece. */
export const districtFieldWorkQueryOptions = (id: string) =>
  queryOptions({
    queryKey: ['field-records', 'district', id] as const,
    queryFn: ({ signal }) => api.get(`/api/districts/${encodeURIComponent(id)}/field-work`, districtFieldWorkResponse, signal),
  });

export const useDistrictFieldWork = (id: string) => useQuery(districtFieldWorkQueryOptions(id));
