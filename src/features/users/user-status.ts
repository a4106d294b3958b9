import type { UserDto } from '../../../shared/api/users.schema';

/** An account's state; shown as `users:status.<id>` in the interface language. */
export type UserStatus = 'active' | 'invitePending' | 'deactivated';

export function userStatus(user: Pick<UserDto, 'active' | 'invitePending'>): UserStatus {
  if (!user.active) return 'deactivated';
  if (user.invitePending) return 'invitePending';
  return 'active';
}

export const STATUS_CLASS: Record<UserStatus, string> = {
  active: 'status status-active',
  invitePending: 'status status-pending',
  deactivated: 'status status-deactivated',
};
