import { capText, LIMITS } from './limits';

export type ErrorParams = Record<string, string | number | boolean | null>;

/**
 * An error that carries its HTTP meaning: a status and a stable code, with the parameters a client needs
 * to say it in words. One middleware renders them. The message, each field problem and each parameter
 * are capped (LIMITS), and at most LIMITS.FIELDS_MAX field problems are listed; the rest are counted in
 * `fieldsNotListed`, so an error about a 12 MB input stays small.
 */
export class HttpError extends Error {
  readonly fields?: { path: string; message: string }[];
  readonly fieldsNotListed: number;
  readonly params?: ErrorParams;
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    fields?: { path: string; message: string }[],
    params?: ErrorParams,
  ) {
    super(capText(message));
    this.fields = fields?.slice(0, LIMITS.FIELDS_MAX).map((f) => ({
      path: capText(f.path, LIMITS.VALUE_MAX_CHARS),
      message: capText(f.message),
    }));
    this.fieldsNotListed = Math.max(0, (fields?.length ?? 0) - LIMITS.FIELDS_MAX);
    this.params = params
      ? Object.fromEntries(Object.entries(params).map(([k, v]) => [k, typeof v === 'string' ? capText(v, LIMITS.VALUE_MAX_CHARS) : v]))
      : undefined;
  }
}

export const badRequest = (code: string, message: string, fields?: { path: string; message: string }[]) =>
  new HttpError(400, code, message, fields);
export const unauthorized = (message = 'Sign in to continue.') => new HttpError(401, 'unauthorized', message);
export const forbidden = (message = 'Your role may not do this.') => new HttpError(403, 'forbidden', message);
export const notFound = (what = 'That') => new HttpError(404, 'not_found', `${what} was not found.`);
export const conflict = (code: string, message: string, params?: ErrorParams) => new HttpError(409, code, message, undefined, params);
export const serviceUnavailable = (code: string, message: string) => new HttpError(503, code, message);
/** A request understood but refused as a whole for what it holds (a weather file that cannot be loaded). */
export const unprocessable = (code: string, message: string, params?: ErrorParams) => new HttpError(422, code, message, undefined, params);
