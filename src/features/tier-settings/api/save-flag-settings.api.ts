import { useMutation, useQueryClient } from '@tanstack/react-query';
import { flagSettingsDto, type FlagSettingsBody } from '../../../../shared/api/flags.schema';
import { api } from '../../../lib/api-client';

/** PUT /api/flag-settings (admin) — a new lapse period with its reason (audited). */
export function useSaveFlagSettings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: FlagSettingsBody) => api.put('/api/flag-settings', body, flagSettingsDto),
    onSuccess: (data) => {
      queryClient.setQueryData(['flag-settings'], data);
      // The queue and the lapsed list are decided with this setting when read.
      return queryClient.invalidateQueries({ queryKey: ['flags'] });
    },
  });
}
