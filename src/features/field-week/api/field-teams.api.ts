import { queryOptions, useQuery } from '@tanstack/react-query';
import { fieldTeamsResponse } from '../../../../shared/api/field.schema';
import { api } from '../../../lib/api-client';

export const fieldTeamsQueryKey = ['field-teams'] as const;

/** GET /api/field-teams (health officer, supervisor; a community worker: their own teams). */
export const fieldTeamsQueryOptions = () =>
  queryOptions({
    queryKey: fieldTeamsQueryKey,
    queryFn: ({ signal }) => api.get('/api/field-teams', fieldTeamsResponse, signal),
    select: (r) => r.teams,
  });

export const useFieldTeams = () => useQuery(fieldTeamsQueryOptions());
