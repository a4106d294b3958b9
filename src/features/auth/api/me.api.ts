import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';
import { loadAuthSchemas } from './auth-schemas';

/** GET /api/me — the signed-in user, or a 401 ApiError when there is no session. */
export const meQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.me,
    queryFn: ({ signal }) => api.get('/api/me', () => loadAuthSchemas().then((m) => m.meResponse), signal),
    staleTime: 5 * 60_000,
    retry: false,
  });

export const useMe = () => useQuery(meQueryOptions());
