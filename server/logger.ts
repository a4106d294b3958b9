import pino from 'pino';
import type { Config } from './config';

/** Structured logs. Passwords, tokens and cookies are redacted wherever they appear. */
export const createLogger = (config: Pick<Config, 'LOG_LEVEL'>) =>
  pino({
    level: config.LOG_LEVEL,
    redact: {
      paths: ['password', '*.password', 'token', '*.token', 'req.headers.cookie', 'headers.cookie', '*.passwordHash'],
      censor: '[redacted]',
    },
  });
