import pino, { type DestinationStream } from 'pino';
import type { Config } from './config';

/**
 * Keys whose values never reach a log line, at any depth: credentials, tokens, cookies, and the SQL
 * parameters and detail of a database error (they carry the row's values: e-mail addresses, counts).
 */
const SECRET_KEYS = new Set([
  'password', 'passwordhash', 'password_hash', 'newpassword', 'token', 'jwt', 'secret', 'jwt_secret', 'cookie', 'cookies',
  'set-cookie', 'authorization', 'parameters', 'detail', 'body',
]);
const EMAIL = /[A-Za-z0-9._%+-]+@[A-Za-z0-9.-]+\.[A-Za-z]{2,}/g;
const JWT = /eyJ[A-Za-z0-9_-]{4,}\.[A-Za-z0-9_-]{4,}\.[A-Za-z0-9_-]*/g;
const TOKEN_IN_URL = /([?&;](?:token|key|sig)=)[^&\s"';]+/gi;
const SESSION_IN_TEXT = /(broodcast_session=)[^;\s"']+/g;

/** Masks e-mail addresses, JWTs, session cookies and link tokens inside free text (messages, error texts). */
export function scrubText(text: string): string {
  return text
    .replace(JWT, '[jwt]')
    .replace(SESSION_IN_TEXT, '$1[redacted]')
    .replace(TOKEN_IN_URL, '$1[redacted]')
    .replace(EMAIL, '[email]');
}

function scrub(value: unknown, depth: number): unknown {
  if (typeof value === 'string') return scrubText(value);
  if (value === null || typeof value !== 'object' || depth > 6) return value;
  if (value instanceof Error) return scrub(pino.stdSerializers.err(value), depth + 1);
  if (Array.isArray(value)) return value.map((v) => scrub(v, depth + 1));
  if (value instanceof Date || Buffer.isBuffer(value)) return value;
  const out: Record<string, unknown> = {};
  for (const [key, v] of Object.entries(value)) out[key] = SECRET_KEYS.has(key.toLowerCase()) ? '[redacted]' : scrub(v, depth + 1);
  return out;
}

/**
 * Structured logs (pino, one JSON object a line, UTC epoch-millisecond `time`). Passwords, tokens,
 * cookies, SQL parameters and e-mail addresses are removed wherever they appear, in the logged
 * object and in the message (tests/api/security-logs.test.ts greps a captured run). `destination`
 * is for tests; the server writes to standard output.
 */
export const createLogger = (config: Pick<Config, 'LOG_LEVEL'>, destination?: DestinationStream) =>
  pino(
    {
      level: config.LOG_LEVEL,
      redact: {
        paths: ['password', '*.password', 'token', '*.token', 'req.headers.cookie', 'headers.cookie', '*.passwordHash'],
        censor: '[redacted]',
      },
      formatters: { log: (object) => scrub(object, 0) as Record<string, unknown> },
      hooks: {
        logMethod(args, method) {
          method.apply(this, args.map((a) => (typeof a === 'string' ? scrubText(a) : a)) as Parameters<typeof method>);
        },
      },
    },
    destination,
  );
