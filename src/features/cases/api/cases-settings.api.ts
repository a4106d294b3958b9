import { queryOptions, useQuery } from '@tanstack/react-query';
import { casesSettingsResponse } from '../../../../shared/api/cases.schema';
import { api } from '../../../lib/api-client';
import { casesKeys } from './cases-keys';

/** GET /api/cases/settings — the deployment's week system, channel method, CUSUM settings, deadline and today's week. */
export const casesSettingsQueryOptions = () =>
  queryOptions({
    queryKey: casesKeys.settings,
    queryFn: ({ signal }) => api.get('/api/cases/settings', casesSettingsResponse, signal),
    staleTime: 10 * 60_000,
  });
export const useCasesSettings = () => useQuery(casesSettingsQueryOptions());
