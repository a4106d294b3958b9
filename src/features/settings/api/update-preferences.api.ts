import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Me } from '../../../../shared/api/auth.schema';
import { preferencesDto, type PreferencesBody } from '../../../../shared/api/users.schema';
import { api } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** PATCH /api/me/preferences — the signed-in user's language and display units; answers all three. */
export const updatePreferences = (body: PreferencesBody) => api.patch('/api/me/preferences', body, preferencesDto);

/**
 * Saves the preferences, puts them in the cached signed-in user at once (so the language and units
 * switch without waiting), then refetches the me query.
 */
export function useUpdatePreferences() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updatePreferences,
    onSuccess: async (preferences) => {
      queryClient.setQueryData<Me>(queryKeys.me, (me) => (me ? { ...me, preferences } : me));
      await queryClient.invalidateQueries({ queryKey: queryKeys.me });
    },
  });
}
