import { z } from 'zod';
import { LANGUAGES } from '../languages';
import { RAIN_UNITS, TEMPERATURE_UNITS } from '../units';
import { ROLES } from '../roles';
import { email, newPassword, uuid } from './common.schema';

/**
 * Each user's language (shared/languages.ts) and display units (shared/units.ts); stored and exchanged
 * values stay SI whatever the units chosen.
 */
export { LANGUAGES, type Language } from '../languages';
export const DEFAULT_PREFERENCES = { language: 'en', temperatureUnit: 'C', rainUnit: 'mm' } as const;

export const language = z.enum(LANGUAGES, { message: 'must be one of: ' + LANGUAGES.join(', ') });
const temperatureUnit = z.enum(TEMPERATURE_UNITS, { message: 'must be C or F' });
const rainUnit = z.enum(RAIN_UNITS, { message: 'must be mm or in' });

export const preferencesDto = z.object({ language, temperatureUnit, rainUnit });
export type PreferencesDto = z.infer<typeof preferencesDto>;

/** PATCH /api/me/preferences: any of the three; unknown fields are refused. */
export const preferencesBody = z
  .strictObject({ language: language.optional(), temperatureUnit: temperatureUnit.optional(), rainUnit: rainUnit.optional() })
  .refine((b) => Object.keys(b).length > 0, { message: 'nothing to change' });
export type PreferencesBody = z.infer<typeof preferencesBody>;

export const signInBody = z.strictObject({
  email,
  password: z.string({ message: 'is required' }).min(1, { message: 'is required' }).max(200),
});
export type SignInBody = z.infer<typeof signInBody>;

export const districtRef = z.object({ id: uuid, code: z.string(), name: z.string() });
export type DistrictRef = z.infer<typeof districtRef>;

export const meResponse = z.object({
  id: uuid,
  email: z.string(),
  displayName: z.string(),
  role: z.enum(ROLES),
  districts: z.array(districtRef),
  /** The regions the user is scoped to (their districts are in their session too). */
  regions: z.array(districtRef).default([]),
  /** Language and display units (a server answer without them reads as the defaults). */
  preferences: preferencesDto.default({ ...DEFAULT_PREFERENCES }),
});
export type Me = z.infer<typeof meResponse>;

export const passwordResetRequestBody = z.strictObject({ email });
export const passwordResetConfirmBody = z.strictObject({
  token: z.string().min(20, { message: 'is not a valid link token' }).max(200),
  password: newPassword,
});
export const inviteAcceptBody = passwordResetConfirmBody;
export type PasswordResetConfirmBody = z.infer<typeof passwordResetConfirmBody>;

/** `POST /api/auth/password-reset` (202): the same answer whether or not the address is known. */
export const passwordResetRequestedResponse = z.object({ status: z.literal('sent-if-known') });
