import { queryOptions, useQuery } from '@tanstack/react-query';
import { usersResponse } from '../../../../shared/api/users.schema';
import { api } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** GET /api/users (admin) — every account with its role, districts and status. */
export const usersQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.users.all,
    queryFn: ({ signal }) => api.get('/api/users', usersResponse, signal),
    select: (r) => r.users,
  });

export const useUsers = () => useQuery(usersQueryOptions());
