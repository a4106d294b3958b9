import { queryOptions, useQuery } from '@tanstack/react-query';
import { fieldTeamCandidatesResponse } from '../../../../shared/api/field.schema';
import { api } from '../../../lib/api-client';
import { fieldTeamsQueryKey } from './field-teams.api';

/** GET /api/field-teams/candidates (health officer) — active officers and community workers. */
export const fieldTeamCandidatesQueryOptions = () =>
  queryOptions({
    queryKey: [...fieldTeamsQueryKey, 'candidates'] as const,
    queryFn: ({ signal }) => api.get('/api/field-teams/candidates', fieldTeamCandidatesResponse, signal),
    select: (r) => r.people,
  });

export const useFieldTeamCandidates = () => useQuery(fieldTeamCandidatesQueryOptions());
