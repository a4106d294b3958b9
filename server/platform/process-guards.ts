import type { Logger } from 'pino';

/** What the guards need of a process: Node's `process` in the server, a stand-in in tests. */
export interface GuardedProcess {
  on(event: 'unhandledRejection', listener: (reason: unknown) => void): unknown;
  on(event: 'uncaughtException', listener: (err: Error) => void): unknown;
  exitCode?: number | string | undefined;
}

/**
 * A promise nobody awaited that rejects, or an exception nobody caught, leaves the server in a state no
 * one has reasoned about. Log it (scrubbed, like every log line) and stop cleanly: close the HTTP server
 * and the jobs, release the database, then exit 1 so `npm start` or a supervisor restarts a known state.
 * Node's default would print and exit at once, without closing the pool or logging in our format.
 */
export function installProcessGuards(proc: GuardedProcess, logger: Pick<Logger, 'fatal'>, stop: (code: number) => Promise<void>) {
  let fired = false;
  const fail = (kind: string, err: unknown) => {
    const detail = err instanceof Error ? { err } : { reason: String(err) };
    logger.fatal({ kind, ...detail }, 'the server met an error no part of it handled; stopping');
    if (fired) return;
    fired = true;
    proc.exitCode = 1;
    void stop(1).catch(() => undefined);
  };
  proc.on('unhandledRejection', (reason) => fail('unhandledRejection', reason));
  proc.on('uncaughtException', (err) => fail('uncaughtException', err));
}
