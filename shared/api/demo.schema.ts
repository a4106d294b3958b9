import { z } from 'zod';

/** `GET /api/demo`: what of the invented demo region is in this installation (what a removal would take). */
export const demoSummaryResponse = z.object({
  districts: z.number().int(),
  stations: z.number().int(),
  /** Demo accounts (the demo's people) that are still active. */
  users: z.number().int(),
});
export type DemoSummaryResponse = z.infer<typeof demoSummaryResponse>;

/** `POST /api/demo/remove`: the admin confirmed on screen; the reason goes in the audit trail. */
export const demoRemoveBody = z.strictObject({
  confirm: z.literal(true, { message: 'must be true: confirm the removal on screen' }),
  reason: z.string().trim().min(1, { message: 'is required' }).max(500, { message: 'is too long' }),
});
export type DemoRemoveBody = z.infer<typeof demoRemoveBody>;

export const demoRemovedResponse = z.object({
  districts: z.number().int(),
  stations: z.number().int(),
  /** Demo accounts deactivated (kept, so the audit trail still names them); the admin removing it is never one. */
  usersDeactivated: z.number().int(),
});
export type DemoRemovedResponse = z.infer<typeof demoRemovedResponse>;
