import { z } from 'zod';
import { ROLES } from '../roles';
import { email, newPassword, uuid } from './common.schema';

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
});
export type Me = z.infer<typeof meResponse>;

export const passwordResetRequestBody = z.strictObject({ email });
export const passwordResetConfirmBody = z.strictObject({
  token: z.string().min(20, { message: 'is not a valid link token' }).max(200),
  password: newPassword,
});
export const inviteAcceptBody = passwordResetConfirmBody;
export type PasswordResetConfirmBody = z.infer<typeof passwordResetConfirmBody>;
