import cron, { type ScheduledTask } from 'node-cron';
import type { AppContext } from '../server/app-context';
import { HttpError } from '../server/http/errors';
import { withAdvisoryLock } from './advisory-lock';
import type { JobDef } from './job';

/**
 * Start every job with a schedule. node-cron prevents overlap inside this process; the advisory
 * lock makes each run happen once across several server processes. Failures are reported through
 * the same error shape as the API (an HttpError's status and code, or 'internal').
 */
export function startScheduler(ctx: AppContext, jobs: JobDef[]): { stop(): void; tasks: ScheduledTask[] } {
  const tasks: ScheduledTask[] = [];
  for (const job of jobs) {
    if (!job.cron) continue;
    const task = cron.createTask(job.cron, () => runJob(ctx, job), { name: job.name, timezone: job.timezone, noOverlap: true });
    // An in-process task starts synchronously; a background one returns a promise, whose failure is logged.
    void Promise.resolve(task.start()).catch((err: unknown) => ctx.logger.error({ job: job.name, err: (err as Error).message }, 'job could not be scheduled'));
    tasks.push(task);
    ctx.logger.info({ job: job.name, cron: job.cron, timezone: job.timezone }, 'job scheduled');
  }
  return { tasks, stop: () => tasks.forEach((t) => t.stop()) };
}

export async function runJob(ctx: AppContext, job: JobDef) {
  try {
    const { ran } = job.lock === false
      ? { ran: (await job.run(ctx)) !== null }
      : await withAdvisoryLock(ctx.ds, job.name, () => job.run(ctx));
    if (!ran) ctx.logger.info({ job: job.name }, 'job skipped: another process holds its lock');
    return ran;
  } catch (err) {
    const code = err instanceof HttpError ? err.code : 'internal';
    ctx.logger.error({ job: job.name, code, err: (err as Error).message }, 'job failed');
    return false;
  }
}
