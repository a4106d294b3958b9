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
  /** The region the deployment serves: named in the weekly digest and its PDF (broodcast-<region>-<year>-w<week>.pdf). */
  REGION_NAME: z.string().trim().min(1, { message: 'must name the region' }).max(80).default('Halvern'),
  CLIENT_DIST: z.string().default('dist/client'),
  BCRYPT_COST: z.coerce.number().int().min(4).max(15).default(12),
  /**
   * Check every JSON answer of the API against its route's response schema (server/http/route.ts) and answer
   * 500 response_contract_violation when it does not match. On by default in tests, off otherwise.
   */
  CHECK_RESPONSES: z.enum(['true', 'false']).optional().transform((v) => (v === undefined ? undefined : v === 'true')),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  TRUST_PROXY: z.enum(['true', 'false']).default('false').transform((v) => v === 'true'),
  SIGN_IN_LIMIT_PER_ACCOUNT: z.coerce.number().int().min(1).default(10),
  SIGN_IN_LIMIT_PER_ADDRESS: z.coerce.number().int().min(1).default(50),
  SIGN_IN_WINDOW_MINUTES: z.coerce.number().min(1).default(15),
  EPI_WEEK_SYSTEM: z.enum(['mmwr', 'iso']).default('mmwr'),
  /** Band of the endemic channel (docs/signals.md): geometric (Bortman 1999), quartile or mean-2sd. */
  CHANNEL_METHOD: z.enum(['geometric', 'quartile', 'mean-2sd']).default('geometric'),
  /** CUSUM reference value k and decision interval h, in SD units (docs/case-ledger.md). */
  CUSUM_K: z.coerce.number().min(0).max(5).default(0.5),
  CUSUM_H: z.coerce.number().gt(0).max(20).default(4),
  /** Days after a week ends by which its counts are due; later entries are marked late. */
  CASE_REPORT_DEADLINE_DAYS: z.coerce.number().int().min(0).max(60).default(3),
  /** Time zone of the scheduled jobs (IANA name). */
  TIMEZONE: z.string().default('UTC'),
  /** When the nightly season run starts (node-cron syntax, in TIMEZONE); empty turns it off. */
  SEASON_RUN_CRON: z.string().default('30 2 * * *'),
  /** Run the (incremental) season computation once at start, so a fresh demo shows a ranked Ladder. */
  SEASON_RUN_ON_START: z.enum(['true', 'false']).default('true').transform((v) => v === 'true'),
  // Flags, advisories, bulletins and the mail outbox (docs/flags-and-bulletins.md).
  /** When the weekly bulletin is written and queued (node-cron syntax, in TIMEZONE); empty turns it off. */
  BULLETIN_CRON: z.string().default('0 7 * * 1'),
  /** How often the outbox worker looks for mail to send (node-cron, six fields: seconds first). */
  OUTBOX_CRON: z.string().default('*/5 * * * * *'),
  /** Attempts before a message is marked failed; the wait doubles from OUTBOX_BACKOFF_SECONDS up to the cap. */
  OUTBOX_MAX_ATTEMPTS: z.coerce.number().int().min(1).max(50).default(8),
  OUTBOX_BACKOFF_SECONDS: z.coerce.number().min(1).max(3600).default(30),
  OUTBOX_BACKOFF_MAX_SECONDS: z.coerce.number().min(1).max(7 * 86_400).default(6 * 3600),
  /** How long an advisory stays current (shown in bulletins as an open advisory). */
  ADVISORY_DAYS: z.coerce.number().int().min(1).max(365).default(28),
  // Weather intake (docs/weather-intake.md).
  /** Largest weather file accepted, in bytes (a national year is about 70 MB). */
  WEATHER_UPLOAD_MAX_BYTES: z.coerce.number().int().min(1).default(200 * 1024 * 1024),
  /** Where multer writes uploads under generated names while they are checked (default: the checkout's
   * `.local/uploads/<pid>`; folders of processes that are gone are swept when a server starts). */
  WEATHER_UPLOAD_DIR: z.string().optional(),
  /** Gaps of up to this many days are filled by linear interpolation; longer ones stay missing. */
  WEATHER_FILL_MAX_DAYS: z.coerce.number().int().min(0).max(30).default(3),
  WEATHER_QC_JUMP_C: z.coerce.number().positive().default(15),
  WEATHER_QC_RUN_DAYS: z.coerce.number().int().min(2).default(5),
  WEATHER_QC_SPATIAL_C: z.coerce.number().positive().default(8),
  /** Years of a station's stored history the plausibility check reads (docs/weather-intake.md § Plausibility). */
  WEATHER_PLAUS_HISTORY_YEARS: z.coerce.number().int().min(1).max(100).default(15),
  WEATHER_QC_NEIGHBOUR_KM: z.coerce.number().positive().default(150),
  WEATHER_IDW_STATIONS: z.coerce.number().int().min(1).max(10).default(3),
  /**
   * The farthest a station may be from a district's centre and still feed its interpolated series
   * (docs/weather-intake.md § District series; common practice: a plausibility bound, not a published figure).
   */
  WEATHER_IDW_MAX_KM: z.coerce.number().positive().max(5000).default(300),
  /** How often a running intake reports its progress (and that it is alive), in milliseconds. */
  WEATHER_HEARTBEAT_MS: z.coerce.number().int().min(10).max(10_000).default(1000),
  /** An upload whose process has not touched it for this long is marked failed. */
  WEATHER_UPLOAD_STALE_SECONDS: z.coerce.number().int().min(1).default(60),
  WEATHER_REPORT_MAX_ISSUES: z.coerce.number().int().min(100).default(100_000),
  WEATHER_SWEEP_CRON: z.string().default('* * * * *'),
  /** The station-data feed (JSON or CSV over HTTP); unset: no feed. */
  WEATHER_FEED_URL: z.url({ message: 'must be a URL' }).optional(),
  WEATHER_FEED_KEY: z.string().optional(),
  WEATHER_FEED_CRON: z.string().optional(),
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
  // Tests lower the bcrypt cost for speed; a real installation never goes under 12 (docs/security.md).
  if (config.NODE_ENV === 'production' && config.BCRYPT_COST < 12) {
    throw new ConfigError('Bad configuration — BCRYPT_COST: must be at least 12 in production');
  }
  return config;
}
