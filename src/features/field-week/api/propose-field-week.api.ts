import { useMutation, useQueryClient } from '@tanstack/react-query';
import { fieldWeekDto, type FieldWeekProposalBody } from '../../../../shared/api/field.schema';
import { api } from '../../../lib/api-client';
import { fieldWeekQueryKey } from './field-week.api';

/** POST /api/field-weeks/proposal (health officer) — the solver's proposal, stored as the week's draft. */
export const proposeFieldWeek = (body: FieldWeekProposalBody) => api.post('/api/field-weeks/proposal', body, fieldWeekDto);

export function useProposeFieldWeek(weekStart: string | null) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: proposeFieldWeek,
    onSuccess: (week) => queryClient.setQueryData(fieldWeekQueryKey(weekStart), { week }),
  });
}
