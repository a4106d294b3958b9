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
    /** What the message says, as data (a limit, a line number), for a client that words it itself. */
    params: z.record(z.string(), z.union([z.string(), z.number(), z.boolean(), z.null()])).optional(),
    fields: z.array(z.object({ path: z.string(), message: z.string() })).optional(),
    /** Field problems past the listed ones (an answer lists at most 50). */
    fieldsNotListed: z.number().optional(),
  }),
});
export type ErrorBody = z.infer<typeof errorBody>;

/**
 * A list of ids (or of items keyed by an id) that refuses repeats: the same id twice is a 400 naming
 * the list and the id, rather than a unique-index failure (500) in the database. Every id list of the
 * API's bodies is one of these (`districtIds`, subscription districts, profile ids, flag actions).
 */
export function uniqueArray<T extends z.ZodType>(
  item: T,
  opts: { max: number; key?: (value: z.output<T>) => string | number },
) {
  return z
    .array(item)
    .max(opts.max, { message: `lists too many (${opts.max.toLocaleString('en')} at most)` })
    .superRefine((list, ctx) => {
      const seen = new Set<unknown>();
      for (const value of list) {
        const k = opts.key ? opts.key(value) : value;
        if (seen.has(k)) {
          ctx.addIssue({ code: 'custom', message: `lists ${String(k)} more than once` });
          return;
        }
        seen.add(k);
      }
    });
}

/** A list of ids (UUIDs) without repeats. */
export const uniqueIds = (max: number) => uniqueArray(uuid, { max });

/** `GET /api/health`: 200 when the database answers (a 503 names it down). */
export const healthResponse = z.object({ status: z.enum(['ok', 'degraded']), database: z.enum(['up', 'down']) });
