import { useMutation, useQueryClient } from '@tanstack/react-query';
import { tierSettingsSaveResponse, type TierSettingsBody } from '../../../../shared/api/tier-settings.schema';
import { api } from '../../../lib/api-client';

/** PUT /api/tier-settings (admin) — save a new version with its reason. */
export function useSaveTierSettings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: TierSettingsBody) => api.put('/api/tier-settings', body, tierSettingsSaveResponse),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['tier-settings'] }),
  });
}
