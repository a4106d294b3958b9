import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Me } from '../../../../shared/api/auth.schema';
import { userDto, type UserUpdateBody } from '../../../../shared/api/users.schema';
import { api } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export type UpdateUserVariables = { id: string; changes: UserUpdateBody };

/** PATCH /api/users/:id (admin) — role, districts, display name; `active: false` deactivates. */
export const updateUser = ({ id, changes }: UpdateUserVariables) =>
  api.patch(`/api/users/${encodeURIComponent(id)}`, changes, userDto);

export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateUser,
    onSuccess: async (user) => {
      const me = queryClient.getQueryData<Me>(queryKeys.me);
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: queryKeys.users.all }),
        me?.id === user.id ? queryClient.invalidateQueries({ queryKey: queryKeys.me }) : undefined,
      ]);
    },
  });
}
