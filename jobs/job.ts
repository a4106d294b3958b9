import type { AppContext } from '../server/app-context';

/** A scheduled job: a cron expression (node-cron syntax), a time zone, and a call into a service. */
export interface JobDef {
  name: string;
  /** Read from config by the job module, e.g. '15 2 * * *'. Null: the job is off in this deployment. */
  cron: string | null;
  timezone: string;
  /** Take the job's advisory lock around run (default true); false when the service takes it itself. */
  lock?: boolean;
  run(ctx: AppContext): Promise<unknown>;
}
