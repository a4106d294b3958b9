import { z } from 'zod';
import { ROLES } from '../roles';
import { districtRef, language } from './auth.schema';

export { DEFAULT_PREFERENCES, LANGUAGES, preferencesBody, preferencesDto } from './auth.schema';
export { RAIN_UNITS, TEMPERATURE_UNITS } from '../units';
export type { Language, PreferencesBody, PreferencesDto } from './auth.schema';
import { email, uniqueIds, uuid } from './common.schema';

/** A person's name as shown and mailed: one line of text. Control characters (CR, LF, tab, NUL…) are
 * refused, so a name cannot add a line such as a fake "Bcc:" to a mail (issue 14, item 10). */
const displayName = z
  .string()
  .trim()
  .min(1, { message: 'is required' })
  .max(120, { message: 'is too long' })
  .refine((s) => !/[\p{Cc}\u2028\u2029]/u.test(s), { message: 'must not contain control characters such as line breaks' });

export const userInviteBody = z.strictObject({
  email,
  displayName,
  role: z.enum(ROLES, { message: 'must be one of: ' + ROLES.join(', ') }),
  districtIds: uniqueIds(500).default([]),
  /** Regions the user is scoped to: their session holds every district of these regions as well. */
  regionIds: uniqueIds(200).default([]),
  /** The invitee's language (their invite mail is written in it); English when left out. */
  language: language.optional(),
});
export type UserInviteBody = z.infer<typeof userInviteBody>;

export const userUpdateBody = z
  .strictObject({
    displayName: displayName.optional(),
    role: z.enum(ROLES, { message: 'must be one of: ' + ROLES.join(', ') }).optional(),
    districtIds: uniqueIds(500).optional(),
    regionIds: uniqueIds(200).optional(),
    active: z.boolean().optional(),
  })
  .refine((b) => Object.keys(b).length > 0, { message: 'nothing to change' });
export type UserUpdateBody = z.infer<typeof userUpdateBody>;

export const userDto = z.object({
  id: uuid,
  email: z.string(),
  displayName: z.string(),
  role: z.enum(ROLES),
  active: z.boolean(),
  invitePending: z.boolean(),
  districts: z.array(districtRef),
  regions: z.array(districtRef).default([]),
  createdAt: z.string(),
});
export type UserDto = z.infer<typeof userDto>;
export const usersResponse = z.object({ users: z.array(userDto) });
