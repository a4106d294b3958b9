import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

/** POST /api/auth/sign-out — 204; the cookie is cleared. */
export const signOut = () => api.post('/api/auth/sign-out');

/**
 * Signs out, then forgets everything cached for this user. `leave` runs first (navigate to the sign-in
 * page), so no signed-in screen is left on show with an empty cache behind it.
 */
export function useSignOut({ leave }: { leave?: () => void | Promise<void> } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSettled: async () => {
      await leave?.();
      queryClient.clear();
    },
  });
}
