import { useMutation, useQueryClient } from '@tanstack/react-query';
import { fieldWeekDto } from '../../../../shared/api/field.schema';
import { api } from '../../../lib/api-client';
import { fieldWeekQueryKey } from './field-week.api';

/** POST /api/field-weeks/:id/approve or /send-back (supervisor) — publish the week, or return it to the officer with a reason. */
export const reviewFieldWeek = ({ id, reason }: { id: string; reason?: string }) =>
  reason === undefined
    ? api.post(`/api/field-weeks/${encodeURIComponent(id)}/approve`, undefined, fieldWeekDto)
    : api.post(`/api/field-weeks/${encodeURIComponent(id)}/send-back`, { reason }, fieldWeekDto);

export function useReviewFieldWeek(weekStart: string | null) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: reviewFieldWeek,
    onSuccess: (week) => queryClient.setQueryData(fieldWeekQueryKey(weekStart), { week }),
  });
}
