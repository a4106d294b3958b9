import type { Config } from '../server/config';
import { SeasonRunService } from '../server/season/season-run.service';
import type { JobDef } from './job';

/** The nightly season run (incremental). The lock is taken inside the service, so this job runs it bare. */
export const seasonRunJob = (config: Config): JobDef => ({
  name: 'season-run',
  cron: config.SEASON_RUN_CRON || null,
  timezone: config.TIMEZONE,
  lock: false,
  run: (ctx) => new SeasonRunService(ctx).runLocked({ kind: 'nightly' }),
});
