import type { Config } from '../server/config';
import type { JobDef } from './job';
import { seasonRunJob } from './season-run.job';
import { weatherJobs } from './weather-feed.job';
import { bulletinJob } from './bulletin.job';
import { outboxJob } from './outbox.job';

/** Every scheduled job of the deployment, built from config. Features add theirs here. */
export function allJobs(config: Config): JobDef[] {
  return [seasonRunJob(config), ...weatherJobs(config), bulletinJob(config), outboxJob(config)];
}
