import { ZodError } from 'zod';
import type { ProblemReason } from '../../shared/api/problems.schema';
import { HttpError } from './errors';

/** A fault in one district's (or one row's) stored data, with a stable code and its parameters. */
export class DataProblem extends Error {
  constructor(readonly code: string, readonly params: Record<string, string | number | null> = {}) {
    super(code);
  }
}

/**
 * The reason to record when one district, message or row fails inside a region-wide job: a code and
 * parameters, never the error's English text or a validation dump (the log keeps the full error).
 */
export function reasonOf(err: unknown): ProblemReason {
  if (err instanceof DataProblem) return { code: err.code, params: err.params };
  if (err instanceof HttpError) return { code: err.code, params: {} };
  if (err instanceof ZodError) {
    const fields = [...new Set(err.issues.map((i) => i.path.filter((p) => typeof p === 'string').join('.') || '(value)'))];
    return { code: 'invalid_value', params: { fields: fields.slice(0, 10).join(', ') } };
  }
  const pgCode = (err as { code?: unknown })?.code;
  if (typeof pgCode === 'string' && /^[0-9A-Z]{5}$/.test(pgCode)) return { code: 'database_error', params: { sqlState: pgCode } };
  const kind = err instanceof Error ? err.name : typeof err;
  return { code: 'unexpected_error', params: { kind: kind.slice(0, 40) } };
}
