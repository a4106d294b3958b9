import { queryOptions, useQuery } from '@tanstack/react-query';
import { tierSettingsResponse } from '../../../../shared/api/tier-settings.schema';
import { api } from '../../../lib/api-client';

/** GET /api/tier-settings — the weights and cut points in force and the history of versions. */
export const tierSettingsQueryOptions = () =>
  queryOptions({ queryKey: ['tier-settings'] as const, queryFn: ({ signal }) => api.get('/api/tier-settings', tierSettingsResponse, signal) });
export const useTierSettings = () => useQuery(tierSettingsQueryOptions());
