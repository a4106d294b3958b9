import { queryOptions, useQuery } from '@tanstack/react-query';
import { diseasesResponse } from '../../../../shared/api/cases.schema';
import { api } from '../../../lib/api-client';
import { casesKeys } from './cases-keys';

/** GET /api/diseases — the diseases the ledger counts. */
export const diseasesQueryOptions = () =>
  queryOptions({
    queryKey: casesKeys.diseases,
    queryFn: ({ signal }) => api.get('/api/diseases', diseasesResponse, signal),
    select: (r) => r.diseases,
    staleTime: 10 * 60_000,
  });
export const useDiseases = () => useQuery(diseasesQueryOptions());
