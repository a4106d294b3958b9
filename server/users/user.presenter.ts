import type { PreferencesDto, UserDto } from '../../shared/api/users.schema';
import type { UserEntity } from './user.entity';
import type { UserWithDistricts } from './users.repository';

export const presentUser = ({ user, districts, regions }: UserWithDistricts): UserDto => ({
  id: user.id,
  email: user.email,
  displayName: user.displayName,
  role: user.role,
  active: user.active,
  invitePending: user.passwordHash === null,
  districts,
  regions,
  createdAt: user.createdAt.toISOString(),
});

/** A user's language and display units, as GET /api/me and PATCH /api/me/preferences answer them. */
export const preferencesOf = (user: Pick<UserEntity, 'language' | 'temperatureUnit' | 'rainUnit'>): PreferencesDto => ({
  language: user.language,
  temperatureUnit: user.temperatureUnit,
  rainUnit: user.rainUnit,
});
