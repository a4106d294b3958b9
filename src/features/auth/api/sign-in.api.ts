import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Me, SignInBody, meResponse } from '../../../../shared/api/auth.schema';
import { api } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';
import { loadAuthSchemas } from './auth-schemas';

/** POST /api/auth/sign-in — sets the session cookie and answers with the user. */
export const signIn = (body: SignInBody) => api.post<typeof meResponse>('/api/auth/sign-in', body, () => loadAuthSchemas().then((m) => m.meResponse));

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (me: Me) => {
      // A new session: nothing cached for an earlier user may survive.
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== queryKeys.me[0] });
      queryClient.setQueryData(queryKeys.me, me);
    },
  });
}
