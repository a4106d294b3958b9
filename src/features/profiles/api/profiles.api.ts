import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { assignProfilesResponse, profilesResponse, type AssignProfilesBody } from '../../../../shared/api/profiles.schema';
import { api } from '../../../lib/api-client';

/** GET /api/profiles — the profile library with every parameter and its source. */
export const profilesQueryOptions = () =>
  queryOptions({
    queryKey: ['profiles'] as const,
    queryFn: ({ signal }) => api.get('/api/profiles', profilesResponse, signal),
    select: (r) => r.profiles,
  });

export const useProfiles = () => useQuery(profilesQueryOptions());

/** PUT /api/districts/profiles (admin) — replace the profile assignment of many districts at once. */
export const assignProfiles = (body: AssignProfilesBody) => api.put('/api/districts/profiles', body, assignProfilesResponse);

export function useAssignProfiles() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: assignProfiles,
    // The District files of the changed districts now show another assignment.
    onSuccess: () => queryClient.invalidateQueries(),
  });
}
