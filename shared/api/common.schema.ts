import { z } from 'zod';

export const uuid = z.uuid({ message: 'must be an id (UUID)' });
export const idParams = z.strictObject({ id: uuid });

export const email = z
  .string({ message: 'is required' })
  .trim()
  .toLowerCase()
  .max(254, { message: 'is too long (254 characters at most)' })
  .pipe(z.email({ message: 'is not an e-mail address' }));

/** A new password. The common-password list and the demo-password rule are checked on the server. */
export const newPassword = z
  .string({ message: 'is required' })
  .min(10, { message: 'must be at least 10 characters' })
  .max(200, { message: 'must be at most 200 characters' });

/** The body of every 4xx/5xx answer. `fields` names each field that failed and why. */
export const errorBody = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fields: z.array(z.object({ path: z.string(), message: z.string() })).optional(),
    /** The values a code is worded with (a distance, a district code), when it has any. */
    params: z.record(z.string(), z.union([z.string(), z.number(), z.boolean()])).optional(),
  }),
});
export type ErrorBody = z.infer<typeof errorBody>;
