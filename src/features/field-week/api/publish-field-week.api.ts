import { useMutation, useQueryClient } from '@tanstack/react-query';
import { fieldWeekDto } from '../../../../shared/api/field.schema';
import { api } from '../../../lib/api-client';
import { fieldWeekQueryKey } from './field-week.api';

/** POST /api/field-weeks/:id/publish (health officer) — publish; every team member is mailed their days. */
export const publishFieldWeek = (id: string) => api.post(`/api/field-weeks/${encodeURIComponent(id)}/publish`, undefined, fieldWeekDto);

export function usePublishFieldWeek(weekStart: string | null) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: publishFieldWeek,
    onSuccess: (week) => queryClient.setQueryData(fieldWeekQueryKey(weekStart), { week }),
  });
}
