import type { UserDto } from '../../../shared/api/users.schema';

export type UserStatus = 'active' | 'invite pending' | 'deactivated';

export function userStatus(user: Pick<UserDto, 'active' | 'invitePending'>): UserStatus {
  if (!user.active) return 'deactivated';
  if (user.invitePending) return 'invite pending';
  return 'active';
}

export const STATUS_CLASS: Record<UserStatus, string> = {
  active: 'status status-active',
  'invite pending': 'status status-pending',
  deactivated: 'status status-deactivated',
};
