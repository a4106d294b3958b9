import { useMutation, useQueryClient } from '@tanstack/react-query';
import { fieldTeamDto } from '../../../../shared/api/field.schema';
import { api } from '../../../lib/api-client';
import { fieldTeamsQueryKey } from './field-teams.api';

/** POST /api/field-teams/:id/retire (health officer) — retire a team: kept on past weeks, left out of new proposals. */
export const retireFieldTeam = (id: string) => api.post(`/api/field-teams/${encodeURIComponent(id)}/retire`, undefined, fieldTeamDto);

export function useRetireFieldTeam() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: retireFieldTeam,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: fieldTeamsQueryKey }),
  });
}
