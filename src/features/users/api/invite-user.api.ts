import type { z } from 'zod';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { userDto, userInviteBody } from '../../../../shared/api/users.schema';
import { api } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** POST /api/users (admin) — creates the account and mails the invitation. */
export const inviteUser = (body: z.input<typeof userInviteBody>) => api.post('/api/users', body, userDto);

export function useInviteUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: inviteUser,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.users.all }),
  });
}
