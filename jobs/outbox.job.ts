import type { Config } from '../server/config';
import { OutboxWorker } from '../server/outbox/outbox.worker';
import type { JobDef } from './job';

/**
 * The outbox worker, every few seconds (OUTBOX_CRON). No advisory lock: every process may drain at
 * once, because each message is claimed with SELECT … FOR UPDATE SKIP LOCKED (server/outbox/outbox.worker.ts).
 */
export const outboxJob = (config: Config): JobDef => ({
  name: 'outbox',
  cron: config.OUTBOX_CRON || null,
  timezone: config.TIMEZONE,
  lock: false,
  run: (ctx) => new OutboxWorker(ctx).drain(),
});
