import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { i18n } from '../i18n';
import { isApiError, type FieldProblem } from './api-client';
import { errorText, problemText } from './error-text';

/** Reads a field's problem after its label, in the interface language (see error-text.ts). */
export { fieldErrorText } from './error-text';

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
    setError(codeField as Path<T>, { type: 'server', message: errorText(error) });
  }
  for (const problem of error.fields) {
    const field = fieldForPath(problem.path, fields);
    if (field) setError(field, { type: 'server', message: problem.message });
    else unmatched.push(problem);
  }
  return unmatched;
}

/** The sentence to show at the top of a form after a failed call, in the interface language. */
export function formErrorText(error: unknown, unmatched: FieldProblem[] = []): string {
  const t = (key: string) => i18n.t(key, { ns: 'app' }) as string;
  if (!isApiError(error)) return t('errors.generic');
  if (error.status === 403) return t('errors.status.403');
  const extra = unmatched.map((p) => (p.path ? `${p.path}: ${problemText(p.message)}` : problemText(p.message)));
  const fieldCode = error.fields.length === 0 && CODE_FIELDS[error.code];
  if ((error.fields.length > 0 || fieldCode) && extra.length === 0) return t('errors.seeFields');
  return [errorText(error), ...extra].join(' ');
}
