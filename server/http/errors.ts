/** An error that carries its HTTP meaning: a status and a stable code. One middleware renders them. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: { path: string; message: string }[],
    /** Values the client words the code with (numbers, names), so no one parses the English message. */
    readonly params?: Record<string, string | number | boolean>,
  ) {
    super(message);
  }
}

export const badRequest = (code: string, message: string, fields?: { path: string; message: string }[]) =>
  new HttpError(400, code, message, fields);
export const unauthorized = (message = 'Sign in to continue.') => new HttpError(401, 'unauthorized', message);
export const forbidden = (message = 'Your role may not do this.') => new HttpError(403, 'forbidden', message);
export const notFound = (what = 'That') => new HttpError(404, 'not_found', `${what} was not found.`);
export const conflict = (code: string, message: string) => new HttpError(409, code, message);
export const serviceUnavailable = (code: string, message: string) => new HttpError(503, code, message);
