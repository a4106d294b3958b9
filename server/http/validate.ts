import type { ZodType } from 'zod';
import { badRequest } from './errors';
import { LIMITS } from './limits';

/** Paths of the strings holding a NUL character, at most `max` of them. */
export function nulPaths(value: unknown, max: number = LIMITS.FIELDS_MAX): string[] {
  // An explicit stack rather than recursion: no input can overflow it, and each value is visited once
  // (the path is built only for a string that holds a NUL). The body's depth is already bounded
  // (LIMITS.JSON_MAX_DEPTH), but query and params come through here too.
  const out: string[] = [];
  type Node = { value: unknown; key: string; parent: Node | null };
  const stack: Node[] = [{ value, key: '', parent: null }];
  while (stack.length > 0 && out.length < max) {
    const node = stack.pop()!;
    const v = node.value;
    if (typeof v === 'string') {
      if (v.includes('\u0000')) {
        const keys: string[] = [];
        for (let n: Node | null = node; n && n.parent; n = n.parent) keys.push(n.key);
        out.push(keys.reverse().join('.'));
      }
    } else if (v && typeof v === 'object') {
      const entries = Object.entries(v);
      for (let i = entries.length - 1; i >= 0; i--) stack.push({ value: entries[i][1], key: entries[i][0], parent: node });
    }
  }
  return out;
}

/** Parse one part of a request with its shared zod schema; a failure is a 400 naming each field. */
export function parseInput<T>(schema: ZodType<T> | undefined, value: unknown, part: 'body' | 'query' | 'params'): T {
  if (!schema) return undefined as T;
  const nul = nulPaths(value);
  if (nul.length > 0) {
    const fields = nul.map((path) => ({ path: path || part, message: 'must not contain a NUL character' }));
    throw badRequest('invalid_input', `The ${part} is not valid: ${fields.slice(0, LIMITS.FIELDS_MAX).map((f) => `${f.path} ${f.message}`).join('; ')}`, fields);
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
  const summary = fields.slice(0, LIMITS.FIELDS_MAX).map((f) => `${f.path} ${f.message}`).join('; ');
  throw badRequest('invalid_input', `The ${part} is not valid: ${summary}`, fields);
}
