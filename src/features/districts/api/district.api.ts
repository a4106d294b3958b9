import { queryOptions, useQuery } from '@tanstack/react-query';
import { districtDto } from '../../../../shared/api/districts.schema';
import { api } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** GET /api/districts/:id — one district (the head of its District file). */
export const districtQueryOptions = (id: string) =>
  queryOptions({
    queryKey: queryKeys.districts.detail(id),
    queryFn: ({ signal }) => api.get(`/api/districts/${encodeURIComponent(id)}`, districtDto, signal),
  });

export const useDistrict = (id: string) => useQuery(districtQueryOptions(id));
