import { useMutation, useQueryClient } from '@tanstack/react-query';
import { fieldWeekDto, type FieldWeekDaysBody } from '../../../../shared/api/field.schema';
import { api } from '../../../lib/api-client';
import { fieldWeekQueryKey } from './field-week.api';

/** PUT /api/field-weeks/:id/days (health officer) — the officer's edit of the draft. */
export const saveFieldWeekDays = (id: string, body: FieldWeekDaysBody) => api.put(`/api/field-weeks/${encodeURIComponent(id)}/days`, body, fieldWeekDto);

export function useSaveFieldWeekDays(weekStart: string | null) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: string; body: FieldWeekDaysBody }) => saveFieldWeekDays(id, body),
    onSuccess: (week) => queryClient.setQueryData(fieldWeekQueryKey(weekStart), { week }),
  });
}
