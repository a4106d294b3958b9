import { useMutation, useQueryClient } from '@tanstack/react-query';
import { fieldTeamDto, type FieldTeamBody } from '../../../../shared/api/field.schema';
import { api } from '../../../lib/api-client';
import { fieldTeamsQueryKey } from './field-teams.api';

/** PUT /api/field-teams/:id (health officer) — change a team's name, base, members, training or days. */
export const updateFieldTeam = ({ id, body }: { id: string; body: FieldTeamBody }) =>
  api.put(`/api/field-teams/${encodeURIComponent(id)}`, body, fieldTeamDto);

export function useUpdateFieldTeam() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateFieldTeam,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: fieldTeamsQueryKey }),
  });
}
