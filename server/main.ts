import 'reflect-metadata';
import { createApp } from './app';
import { ConfigError, parseConfig } from './config';
import { createDataSource } from './db/data-source';
import { createLogger } from './logger';
import { createMailer } from './mail/mailer';
import { allJobs } from '../jobs/index';
import { startScheduler } from '../jobs/scheduler';
import { startupRuns } from './season/season-run.service';
import { installProcessGuards } from './platform/process-guards';

let config;
try {
  config = parseConfig();
} catch (err) {
  if (err instanceof ConfigError) {
    console.error(err.message);
    process.exit(78);
  }
  throw err;
}
const logger = createLogger(config);
const ds = createDataSource(config.DATABASE_URL, config.DATABASE_POOL_SIZE);
await ds.initialize();
const mailer = createMailer(config);
const ctx = { config, ds, mailer, logger };
const app = createApp(ctx);
const scheduler = startScheduler(ctx, allJobs(config));
if (config.SEASON_RUN_ON_START) {
  // Incremental: districts whose inputs did not change since the last run are skipped.
  void startupRuns(ctx).catch((err) => logger.error({ err: err.message }, 'start-up season run failed'));
}
const server = app.listen(config.PORT, config.HOST, () => {
  logger.info({ port: config.PORT, host: config.HOST }, 'Broodcast API listening');
});

let stopping = false;
async function shutdown(signal: string, code = 0) {
  if (stopping) return;
  stopping = true;
  logger.info({ signal }, 'shutting down');
  scheduler.stop();
  // Requests in flight get a few seconds to finish; then the process goes anyway.
  const closed = new Promise<void>((resolve) => server.close(() => resolve()));
  server.closeIdleConnections();
  await Promise.race([closed, new Promise((resolve) => setTimeout(resolve, 5_000).unref())]);
  mailer.close();
  await ds.destroy().catch(() => undefined);
  process.exit(code);
}
process.on('SIGINT', () => void shutdown('SIGINT'));
process.on('SIGTERM', () => void shutdown('SIGTERM'));
installProcessGuards(process, logger, (code) => shutdown('fatal', code));
