import type { Config } from '../server/config';
import type { JobDef } from './job';

/** Every scheduled job of the deployment, built from config. Features add theirs here. */
export function allJobs(_config: Config): JobDef[] {
  return [];
}
