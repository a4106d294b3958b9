import { queryOptions, useQuery } from '@tanstack/react-query';
import { flagDetailResponse, flagsResponse, type FlagStatus } from '../../../../shared/api/flags.schema';
import { api } from '../../../lib/api-client';

export const flagsKeys = {
  all: ['flags'] as const,
  list: (status: FlagStatus | 'all') => ['flags', 'list', status] as const,
  detail: (id: string) => ['flags', id] as const,
};
export const advisoriesKey = ['advisories'] as const;

/**
 * GET /api/flags?status= — the sign-off queue (open: highest tier, then newest), the lapsed list (open
 * flags older than the flag settings' lapse, `lapseWeeks`) or decided flags.
 */
export const flagsQueryOptions = (status: FlagStatus | 'all' = 'open') =>
  queryOptions({
    queryKey: flagsKeys.list(status),
    queryFn: ({ signal }) => api.get(`/api/flags?status=${status}`, flagsResponse, signal),
  });
export const useFlags = (status: FlagStatus | 'all' = 'open') => useQuery(flagsQueryOptions(status));

/** GET /api/flags/:id — one flag and its history (every audit event of it and its advisory). */
export const flagQueryOptions = (id: string) =>
  queryOptions({
    queryKey: flagsKeys.detail(id),
    queryFn: ({ signal }) => api.get(`/api/flags/${encodeURIComponent(id)}`, flagDetailResponse, signal),
  });
export const useFlag = (id: string) => useQuery(flagQueryOptions(id));
