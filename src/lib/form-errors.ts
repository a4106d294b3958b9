import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { isApiError, type FieldProblem } from './api-client';

/**
 * Reads a server (or schema) message in the context of its field's label. The shared schemas word their
 * messages as predicates ("is required", "must be at least 10 characters"), so they read after the label;
 * a message that is already a sentence is shown as it is.
 */
export function fieldErrorText(label: string, message: string | undefined): string | undefined {
  if (!message) return undefined;
  const first = message.charAt(0);
  const text = first === first.toLowerCase() && first !== first.toUpperCase() ? `${label} ${message}` : message;
  return /[.!?]$/.test(text) ? text : `${text}.`;
}

/** The form field a server path belongs to: "body.districtIds.3" → "districtIds" when that is a field. */
export function fieldForPath<F extends string>(path: string, fields: readonly F[]): F | undefined {
  const parts = path.split(/[.[\]]+/).filter(Boolean);
  if (parts[0] === 'body') parts.shift();
  for (let n = parts.length; n > 0; n--) {
    const candidate = parts.slice(0, n).join('.');
    if ((fields as readonly string[]).includes(candidate)) return candidate as F;
  }
  return undefined;
}

/** Server codes that are about one field, though the answer names no field (a 409, for instance). */
const CODE_FIELDS: Record<string, string> = { email_taken: 'email', code_taken: 'code' };

/**
 * Puts each field error of a failed call next to its field. Returns the problems that match no field,
 * so the form can show them at its top.
 */
export function applyServerFieldErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fields: readonly Path<T>[],
): FieldProblem[] {
  if (!isApiError(error)) return [];
  const unmatched: FieldProblem[] = [];
  const codeField = CODE_FIELDS[error.code];
  if (error.fields.length === 0 && codeField && (fields as readonly string[]).includes(codeField)) {
    setError(codeField as Path<T>, { type: 'server', message: error.message });
  }
  for (const problem of error.fields) {
    const field = fieldForPath(problem.path, fields);
    if (field) setError(field, { type: 'server', message: problem.message });
    else unmatched.push(problem);
  }
  return unmatched;
}

/** The sentence to show at the top of a form after a failed call. */
export function formErrorText(error: unknown, unmatched: FieldProblem[] = []): string {
  if (!isApiError(error)) return 'Something went wrong. Try again.';
  if (error.status === 403) return 'Your role may not do this.';
  const extra = unmatched.map((p) => (p.path ? `${p.path}: ${p.message}` : p.message));
  const fieldCode = error.fields.length === 0 && CODE_FIELDS[error.code];
  if ((error.fields.length > 0 || fieldCode) && extra.length === 0) return 'Some fields need attention; see the messages beside them.';
  return [error.message, ...extra].join(' ');
}
