import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { fieldSettingsDto, type FieldSettingsBody } from '../../../../shared/api/field.schema';
import { api } from '../../../lib/api-client';

const key = ['field-settings'] as const;

/** GET /api/field-settings (admin) — whether a supervisor must approve the Field week before it is published. */
export const fieldSettingsQueryOptions = () =>
  queryOptions({ queryKey: key, queryFn: ({ signal }) => api.get('/api/field-settings', fieldSettingsDto, signal) });

export const useFieldSettings = () => useQuery(fieldSettingsQueryOptions());

/** PUT /api/field-settings (admin) — change it, with a reason (audited). */
export function useSaveFieldSettings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: FieldSettingsBody) => api.put('/api/field-settings', body, fieldSettingsDto),
    onSuccess: (data) => queryClient.setQueryData(key, data),
  });
}
