import { z } from 'zod';

/**
 * Void, never delete: an entry made in error (a larval survey, a weekly case count, a station's weather
 * day) is voided with a reason. It stays readable in lists, history and the audit trail, and counts nowhere.
 */
export const VOID_REASON_MAX = 500;
export const voidBody = z.strictObject({
  reason: z.string({ message: 'is required' }).trim().min(1, { message: 'is required' }).max(VOID_REASON_MAX, { message: 'is too long' }),
});
export type VoidBody = z.infer<typeof voidBody>;

/** Who voided an entry, when and why; null while it counts. */
export const voidedDto = z.object({ at: z.string(), by: z.string().nullable(), reason: z.string() }).nullable();
export type VoidedDto = z.infer<typeof voidedDto>;
