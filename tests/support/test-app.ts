import type { DataSource } from 'typeorm';
import { createApp } from '../../server/app';
import type { AppContext } from '../../server/app-context';
import { type Config, parseConfig } from '../../server/config';
import { createDataSource } from '../../server/db/data-source';
import { createLogger } from '../../server/logger';
import { createMailer } from '../../server/mail/mailer';

export const TEST_JWT_SECRET = 'test-secret-that-is-long-enough-for-hs256-signing';

export function testConfig(overrides: Record<string, string> = {}): Config {
  return parseConfig({
    NODE_ENV: 'test',
    DATABASE_URL: process.env.DATABASE_URL,
    JWT_SECRET: TEST_JWT_SECRET,
    BCRYPT_COST: '4',
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: process.env.TEST_SMTP_PORT ?? '1026',
    LOG_LEVEL: 'silent',
    CLIENT_DIST: 'dist/client',
    ...overrides,
  });
}

export interface TestApp {
  app: ReturnType<typeof createApp>;
  ds: DataSource;
  ctx: AppContext;
  close(): Promise<void>;
}

/** The real app on the file's own database, in-process (supertest drives it without a port). */
export async function createTestApp(overrides: Record<string, string> = {}): Promise<TestApp> {
  const config = testConfig(overrides);
  const ds = createDataSource(config.DATABASE_URL, 5);
  await ds.initialize();
  const mailer = createMailer(config);
  const ctx: AppContext = { config, ds, mailer, logger: createLogger(config) };
  return {
    app: createApp(ctx),
    ds,
    ctx,
    async close() {
      mailer.close();
      await ds.destroy();
    },
  };
}
