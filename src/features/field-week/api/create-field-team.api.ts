import { useMutation, useQueryClient } from '@tanstack/react-query';
import { fieldTeamDto, type FieldTeamBody } from '../../../../shared/api/field.schema';
import { api } from '../../../lib/api-client';
import { fieldTeamsQueryKey } from './field-teams.api';

/** POST /api/field-teams (health officer) — add a team. */
export const createFieldTeam = (body: FieldTeamBody) => api.post('/api/field-teams', body, fieldTeamDto);

export function useCreateFieldTeam() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createFieldTeam,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: fieldTeamsQueryKey }),
  });
}
