import { z } from 'zod';

const port = z.coerce.number().int().min(1).max(65535);

/** Every setting the server reads, parsed once at start. A bad value stops the server with its name. */
export const configSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  PORT: port.default(5180),
  HOST: z.string().default('127.0.0.1'),
  DATABASE_URL: z.string().regex(/^postgres(ql)?:\/\//, { message: 'must be a postgres:// URL' }),
  DATABASE_POOL_SIZE: z.coerce.number().int().min(1).max(200).default(10),
  JWT_SECRET: z.string().min(32, { message: 'must be at least 32 characters' }),
  SESSION_TTL_HOURS: z.coerce.number().min(0.1).max(24 * 30).default(12),
  COOKIE_SECURE: z.enum(['true', 'false']).default('false').transform((v) => v === 'true'),
  APP_URL: z.url({ message: 'must be a URL such as http://127.0.0.1:5180' }).default('http://127.0.0.1:5180'),
  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: port.default(1025),
  MAIL_FROM: z.string().default('Broodcast <no-reply@broodcast.invalid>'),
  CLIENT_DIST: z.string().default('dist/client'),
  BCRYPT_COST: z.coerce.number().int().min(4).max(15).default(12),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  TRUST_PROXY: z.enum(['true', 'false']).default('false').transform((v) => v === 'true'),
  SIGN_IN_LIMIT_PER_ACCOUNT: z.coerce.number().int().min(1).default(10),
  SIGN_IN_LIMIT_PER_ADDRESS: z.coerce.number().int().min(1).default(50),
  SIGN_IN_WINDOW_MINUTES: z.coerce.number().min(1).default(15),
  EPI_WEEK_SYSTEM: z.enum(['mmwr', 'iso']).default('mmwr'),
  /** Time zone of the scheduled jobs (IANA name). */
  TIMEZONE: z.string().default('UTC'),
});
export type Config = z.infer<typeof configSchema>;

export class ConfigError extends Error {}

export function parseConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = configSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
    throw new ConfigError(`Bad configuration — ${lines.join('; ')}`);
  }
  const config = parsed.data;
  if (config.NODE_ENV === 'production' && !config.COOKIE_SECURE) {
    throw new ConfigError('Bad configuration — COOKIE_SECURE: must be true in production');
  }
  return config;
}
