import type { ZodType } from 'zod';
import { badRequest } from './errors';

/** Parse one part of a request with its shared zod schema; a failure is a 400 naming each field. */
export function parseInput<T>(schema: ZodType<T> | undefined, value: unknown, part: 'body' | 'query' | 'params'): T {
  if (!schema) return undefined as T;
  const result = schema.safeParse(value ?? (part === 'body' ? undefined : {}));
  if (result.success) return result.data;
  const fields = result.error.issues.map((issue) => {
    const keys = issue.code === 'unrecognized_keys' ? issue.keys : [];
    const where = [...issue.path.map(String), ...(keys.length === 1 ? keys : [])].join('.') || part;
    const message =
      issue.code === 'unrecognized_keys' ? `is not a known field${keys.length > 1 ? `s: ${keys.join(', ')}` : ''}` : issue.message;
    return { path: where, message };
  });
  const summary = fields.map((f) => `${f.path} ${f.message}`).join('; ');
  throw badRequest('invalid_input', `The ${part} is not valid: ${summary}`, fields);
}
