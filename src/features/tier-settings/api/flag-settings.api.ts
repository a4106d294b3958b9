import { queryOptions, useQuery } from '@tanstack/react-query';
import { flagSettingsDto } from '../../../../shared/api/flags.schema';
import { api } from '../../../lib/api-client';

/** GET /api/flag-settings (admin) — how many weeks an open flag waits for sign-off before it lapses. */
export const flagSettingsQueryOptions = () =>
  queryOptions({ queryKey: ['flag-settings'] as const, queryFn: ({ signal }) => api.get('/api/flag-settings', flagSettingsDto, signal) });
export const useFlagSettings = () => useQuery(flagSettingsQueryOptions());
