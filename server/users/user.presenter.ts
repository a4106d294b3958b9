import type { UserDto } from '../../shared/api/users.schema';
import type { UserWithDistricts } from './users.repository';

export const presentUser = ({ user, districts }: UserWithDistricts): UserDto => ({
  id: user.id,
  email: user.email,
  displayName: user.displayName,
  role: user.role,
  active: user.active,
  invitePending: user.passwordHash === null,
  districts,
  createdAt: user.createdAt.toISOString(),
});
