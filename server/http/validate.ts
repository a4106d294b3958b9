import type { ZodType } from 'zod';
import { badRequest } from './errors';

/** Paths of the strings holding a NUL character (PostgreSQL text cannot store one). */
function nulPaths(value: unknown, path: string[] = [], out: string[] = []): string[] {
  if (typeof value === 'string') {
    if (value.includes('\u0000')) out.push(path.join('.'));
  } else if (value && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) nulPaths(v, [...path, k], out);
  }
  return out;
}

/** Parse one part of a request with its shared zod schema; a failure is a 400 naming each field. */
export function parseInput<T>(schema: ZodType<T> | undefined, value: unknown, part: 'body' | 'query' | 'params'): T {
  if (!schema) return undefined as T;
  const nul = nulPaths(value);
  if (nul.length > 0) {
    const fields = nul.map((path) => ({ path: path || part, message: 'must not contain a NUL character' }));
    throw badRequest('invalid_input', `The ${part} is not valid: ${fields.map((f) => `${f.path} ${f.message}`).join('; ')}`, fields);
  }
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
