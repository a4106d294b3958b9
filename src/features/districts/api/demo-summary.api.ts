import { queryOptions, useQuery } from '@tanstack/react-query';
import { demoSummaryResponse } from '../../../../shared/api/demo.schema';
import { api } from '../../../lib/api-client';

/** GET /api/demo (admin) — how many demo districts, stations and active demo accounts are in the installation. */
export const demoSummaryQueryOptions = () =>
  queryOptions({
    queryKey: ['demo'] as const,
    queryFn: ({ signal }) => api.get('/api/demo', demoSummaryResponse, signal),
  });

export const useDemoSummary = () => useQuery(demoSummaryQueryOptions());
