import type { z } from 'zod';

/** One field the server (or the client's own check) rejected, with why. */
export type FieldProblem = { path: string; message: string };

/**
 * Every failed call to the Broodcast API ends as an ApiError: the HTTP status (0 when the server was not
 * reached), the server's stable code, a message a person can read, and the fields that failed.
 */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields: FieldProblem[];
  /** The values the server's message names (a line number, a limit), for a client that words it itself. */
  readonly params: Record<string, string | number | boolean | null>;

  constructor(status: number, code: string, message: string, fields: FieldProblem[] = [], params: Record<string, string | number | boolean | null> = {}) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.fields = fields;
    this.params = params;
  }

  /** The server's problem for one field, if it named that field. */
  fieldMessage(path: string): string | undefined {
    return this.fields.find((f) => f.path === path)?.message;
  }
}

export const isApiError = (e: unknown): e is ApiError => e instanceof ApiError;
export const isUnauthorized = (e: unknown): boolean => isApiError(e) && e.status === 401;
export const isForbidden = (e: unknown): boolean => isApiError(e) && e.status === 403;

const FALLBACK_MESSAGES: Record<number, string> = {
  400: 'The request was not accepted. Check the form and try again.',
  401: 'Sign in to continue.',
  403: 'Your role may not do this.',
  404: 'That was not found.',
  409: 'That conflicts with something that already exists.',
  413: 'That is too large to send.',
  429: 'Too many attempts. Wait a little, then try again.',
};

function fallbackMessage(status: number): string {
  return (
    FALLBACK_MESSAGES[status] ??
    (status >= 500 ? 'The Broodcast server had a problem. Try again in a moment.' : `The request failed (HTTP ${status}).`)
  );
}

/** Turns a failed response into an ApiError, whatever its body holds (JSON error, HTML page, nothing). */
export async function errorFromResponse(response: Response): Promise<ApiError> {
  let raw: unknown;
  try {
    const text = await response.text();
    raw = text ? JSON.parse(text) : undefined;
  } catch {
    raw = undefined;
  }
  // The error contract is fetched with zod on the first failure (see SchemaLoader).
  const { errorBody } = await import('../../shared/api/common.schema');
  const parsed = errorBody.safeParse(raw);
  if (parsed.success) {
    const { code, message, fields, params } = parsed.data.error;
    return new ApiError(response.status, code, message || fallbackMessage(response.status), fields ?? [], params ?? {});
  }
  return new ApiError(response.status, `http_${response.status}`, fallbackMessage(response.status));
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

/**
 * A shared schema fetched on first use (`() => import('…schema').then((m) => m.x)`): zod is ~26 kB gzipped,
 * and the first screen (sign-in) needs no contract before the person submits. The import starts beside
 * the request, so it costs no extra round trip.
 */
export type SchemaLoader<S extends z.ZodType> = () => Promise<S>;

export type RequestOptions<S extends z.ZodType | undefined> = {
  method?: Method;
  /** Sent as JSON. */
  body?: unknown;
  /** The shared zod schema of the answer (or its loader); without one the answer body is ignored. */
  schema?: S | SchemaLoader<Extract<S, z.ZodType>>;
  signal?: AbortSignal;
};

type Result<S> = S extends z.ZodType ? z.output<S> : void;

/**
 * The one fetch wrapper of the client. Same-origin cookie session, JSON in and out, answers parsed with the
 * shared zod schemas, failures thrown as ApiError.
 */
export async function apiRequest<S extends z.ZodType | undefined = undefined>(
  path: string,
  { method = 'GET', body, schema, signal }: RequestOptions<S> = {},
): Promise<Result<S>> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  const schemaReady: Promise<z.ZodType | undefined> | undefined = typeof schema === 'function' ? (schema as SchemaLoader<z.ZodType>)() : undefined;
  if (body !== undefined) headers['Content-Type'] = 'application/json';

  let response: Response;
  try {
    response = await fetch(path, {
      method,
      headers,
      body: body === undefined ? undefined : JSON.stringify(body),
      credentials: 'same-origin',
      signal,
    });
  } catch (e) {
    if (e instanceof DOMException && e.name === 'AbortError') throw e;
    throw new ApiError(0, 'network_error', 'Broodcast could not reach its server. Check the connection and try again.');
  }

  if (!response.ok) throw await errorFromResponse(response);
  if (!schema) return undefined as Result<S>;

  let json: unknown;
  try {
    json = await response.json();
  } catch {
    throw new ApiError(response.status, 'invalid_response', 'The server sent an answer Broodcast could not read.');
  }
  const parsed = (schemaReady ? await schemaReady : (schema as z.ZodType))!.safeParse(json);
  if (!parsed.success) {
    console.error(`Unexpected answer from ${method} ${path}`, parsed.error.issues);
    throw new ApiError(response.status, 'invalid_response', 'The server sent an answer Broodcast could not read.');
  }
  return parsed.data as Result<S>;
}

export const api = {
  get: <S extends z.ZodType>(path: string, schema: S | SchemaLoader<S>, signal?: AbortSignal) =>
    apiRequest<S>(path, { schema: schema as RequestOptions<S>['schema'], signal }),
  post: <S extends z.ZodType | undefined = undefined>(path: string, body?: unknown, schema?: RequestOptions<S>['schema']) =>
    apiRequest<S>(path, { method: 'POST', body, schema }),
  put: <S extends z.ZodType | undefined = undefined>(path: string, body?: unknown, schema?: S) =>
    apiRequest<S>(path, { method: 'PUT', body, schema }),
  patch: <S extends z.ZodType | undefined = undefined>(path: string, body?: unknown, schema?: S) =>
    apiRequest<S>(path, { method: 'PATCH', body, schema }),
};
